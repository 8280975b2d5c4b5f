// How soon a sync stops after Cancel, against the real Apache (mod_dav) and nginx (dav) servers the tests start:
// a phone (the store's in-memory twin) with a log of many days first syncs, then another phone's log of the same
// size is put in the folder and the first phone's next sync is cancelled at a phase: while it reads the folder,
// while the store is written, and while its parts go up. Prints the time from abort() to the run's rejection, and
// what the phase was doing, with the load. Speeds are measured here, never in tests.
// A run whose MKCOL meets a dropped connection (Apache's keep-alive on a loaded machine) writes the single file
// for that run instead of parts (sync-run.ts makePartFolder): its upload then reports no part count.
// Run: npx tsx bench/sync-cancel.bench.ts [days] [drops per day]   (BENCH_PHASE=uploading,writing picks phases)
import { loadavg } from 'node:os';
import { chmod, mkdir } from 'node:fs/promises';
import { join } from 'node:path';
import { partFileName, splitLog } from '../src/log/log-parts';
import { TransferCancelled, type TransferPhase } from '../src/log/transfer-progress';
import type { DayRecord, LogRecord } from '../src/log/types';
import { createMemoryStore, type LogStore } from '../src/store';
import { syncFolder } from '../src/sync/sync-run';
import { apacheMissing, startApache } from '../test/servers/apache';
import { putFolderFile, type DavServer } from '../test/servers/dav-server';
import { nginxMissing, startNginx } from '../test/servers/nginx';
import { partsOf } from '../test/sync/folder-log';
import { sampleLog } from '../test/sync/sample-log';

const DAYS = Number(process.argv[2] ?? 60);
const DROPS_PER_DAY = Number(process.argv[3] ?? 200);
const load = () => loadavg().map((x) => x.toFixed(2)).join(' ');

/** A demo log (our own invented data) with each day on its own date. */
function demoLog(device: string, seed: number, year: number): LogRecord[] {
  let d = 0;
  return sampleLog({ device, seed, days: DAYS, seriesPerDay: 4, dropsPerSeries: Math.max(1, Math.round(DROPS_PER_DAY / 4)) }).map((r) => {
    if (r.kind !== 'day') return r;
    const date = new Date(Date.UTC(year, 0, 1 + d++)).toISOString().slice(0, 10);
    return { ...r, date } as DayRecord;
  });
}

async function phoneWith(records: LogRecord[]): Promise<LogStore> {
  const store = await createMemoryStore();
  await store.putRecords(structuredClone(records));
  return store;
}

async function cancelAt(server: DavServer, phase: TransferPhase, done: number, seed: number): Promise<string> {
  const settings = { folder_url: server.folderUrl, ...server.credentials, enabled: true, timeout_ms: 60_000 };
  const phone = await phoneWith(demoLog('benchA', 11, 2025));
  // A run that fails on a passing network fault (a dropped connection on this loaded machine) is run again, as
  // the phone's back-off would.
  for (let attempt = 1; ; attempt++) {
    const first = await syncFolder({ source: phone, settings, appVersion: 'bench' });
    if (first.ok) break;
    if (!first.error?.retryable || attempt >= 3) throw new Error(JSON.stringify(first.error));
  }
  // Another phone's log of the same size, new to the folder, as its own sync would have left it.
  const other = splitLog(demoLog('benchB', seed, 2026), { device: `b${phase}${done}`, app_version: 'bench' });
  const folder = partsOf(`b${phase}${done}`);
  await mkdir(join(server.dataDir, folder), { recursive: true });
  await chmod(join(server.dataDir, folder), 0o777);
  for (const part of other.parts) await putFolderFile(server, `${folder}/${partFileName(part.key)}`, part.text);
  await putFolderFile(server, `plummet-log-b${phase}${done}.index`, other.indexText);

  const controller = new AbortController();
  let abortedAt = 0;
  let total = 0;
  let last = '';
  const t0 = performance.now();
  try {
    const report = await syncFolder({
      source: phone,
      settings,
      appVersion: 'bench',
      signal: controller.signal,
      onProgress(p) {
        last = `${p.phase} ${p.done}/${p.total}`;
        if (!abortedAt && p.phase === phase && p.done >= done) {
          total = p.total;
          abortedAt = performance.now();
          controller.abort();
        }
      },
    });
    return `  ${phase}: not cancelled (the phase was not reached${report.error ? `: ${report.error.message}` : ''}; last report: ${last})`;
  } catch (error) {
    if (!(error instanceof TransferCancelled)) throw error;
    const stopped = performance.now();
    return `  cancelled while ${phase} (${done} of ${total}), ${((abortedAt - t0) / 1000).toFixed(2)} s into the run: stopped ${(stopped - abortedAt).toFixed(1)} ms after abort(); load ${load()}`;
  }
}

async function one(name: string, start: () => Promise<DavServer>): Promise<void> {
  const server = await start();
  try {
    console.log(`${name}: two phones of ${DAYS} days, about ${DAYS * DROPS_PER_DAY} drops each`);
    let seed = 100;
    const phases = [
      ['downloading', 10],
      ['writing', 0],
      ['uploading', 3],
    ] as const;
    for (const [phase, done] of phases.filter(([p]) => !process.env.BENCH_PHASE || process.env.BENCH_PHASE.split(',').includes(p))) {
      console.log(await cancelAt(server, phase, done, seed++));
    }
  } finally {
    await server.dispose();
  }
}

console.log(`Node ${process.version}, load ${load()}`);
if (!apacheMissing()) await one('Apache mod_dav', () => startApache({}));
if (!nginxMissing()) await one('nginx dav', () => startNginx({}));
