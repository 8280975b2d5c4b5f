// The export benchmark: a log of 100 000 drops exported to JSON, imported and merged into a store that already
// holds half of it, and written as CSV; in Node (the office command) and in the real Chromium (the phone, with
// the IndexedDB store). Run: npx tsx bench/export.bench.ts [drops]
// Targets: export ≤ 1.5 s, import and merge ≤ 3 s. Figures are medians of the runs in Node, one run in Chromium.
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { exportLog } from '../src/log/export';
import { readLogFile } from '../src/log/export-parse';
import { previewMerge } from '../src/log/merge';
import { logCsv } from '../src/log/csv-tables';
import { physicsSeriesComputer } from '../src/cli/log-to-csv';
import { createMemoryStore } from '../src/store';
import { MemoryRecordSource } from '../test/sync/memory-record-source';
import { startStaticServer } from '../scripts/static-server.mjs';
import { buildSyncPage } from '../test/browser/fixtures/sync-page/build';
import { CHROMIUM_ARGS, findChromium } from '../test/support/chromium';
import { benchLog, tableOnlyResults } from './export-log';

const DROPS = Number(process.argv[2] ?? 100_000);
const RUNS = 3;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const time = <T>(fn: () => T): [T, number] => {
  const t = performance.now();
  const value = fn();
  return [value, performance.now() - t];
};
const timeAsync = async <T>(fn: () => Promise<T>): Promise<[T, number]> => {
  const t = performance.now();
  const value = await fn();
  return [value, performance.now() - t];
};
const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
const mb = (bytes: number) => `${(bytes / 1e6).toFixed(1)} MB`;
const verdict = (ms: number, target: number) => (ms <= target ? `(target ≤ ${s(target)}: met)` : `(target ≤ ${s(target)}: MISSED)`);

async function node(): Promise<void> {
  const records = benchLog(DROPS);
  console.log(`Node ${process.version}: ${DROPS} drops, ${records.length} records`);
  const exports: number[] = [];
  const parses: number[] = [];
  const merges: number[] = [];
  const writes: number[] = [];
  const csvs: number[] = [];
  let text = '';
  for (let run = 0; run < RUNS; run++) {
    [text, exports[run]] = time(() => exportLog(records, { device: 'benchphone', app_version: 'bench' }));
    const [file, parse] = time(() => readLogFile(text));
    parses[run] = parse;
    const store = new MemoryRecordSource('benchphone', records.slice(0, Math.floor(records.length / 2)));
    const [local, read] = await timeAsync(() => store.allRecords());
    const [preview, merge] = time(() => previewMerge(local, file.records));
    merges[run] = merge + read;
    const [, write] = await timeAsync(() => store.putRecords(preview.changes));
    writes[run] = write;
    [, csvs[run]] = time(() => logCsv(records, tableOnlyResults));
  }
  const importTotal = median(parses) + median(merges) + median(writes);
  console.log(`  export to JSON (canonical, ${mb(new TextEncoder().encode(text).length)}):  ${s(median(exports))} ${verdict(median(exports), 1500)}`);
  console.log(`  import: read and check the file (JSON, schema, record rules):  ${s(median(parses))}`);
  console.log(`  import: read the store and merge:  ${s(median(merges))}`);
  console.log(`  import: write the new half (an in-memory record source):  ${s(median(writes))}`);
  console.log(`  import and merge, in all:  ${s(importTotal)} ${verdict(importTotal, 3000)}`);
  console.log(`  CSV of all drops and series (tables only):  ${s(median(csvs))}`);
  // The log store's own in-memory twin, once, at a tenth of the size (it slows more than linearly).
  {
    const tenth = benchLog(DROPS / 10);
    const twin = await createMemoryStore();
    await twin.putRecords(tenth.slice(0, Math.floor(tenth.length / 2)));
    const rest = tenth.slice(Math.floor(tenth.length / 2));
    const [, write] = await timeAsync(() => twin.putRecords(rest));
    console.log(`  (the log store's memory twin: putRecords of ${rest.length} records into ${tenth.length - rest.length}: ${s(write)})`);
    twin.close();
  }
  // With the physics behind it, per series (a Monte Carlo of 20 000 draws each): a sample of 10 series.
  const sample = records.filter((r) => r.kind !== 'drop' || (r as { series_id: string }).series_id).slice(0, 3 + 2 + 5 * 101 + 2);
  const [, physics] = time(() => logCsv(sample, physicsSeriesComputer()));
  console.log(`  CSV with the physics: ${s(physics)} for 5 series of 100 drops (${s(physics / 5)} a series, so ${s((physics / 5) * Math.ceil(DROPS / 100))} for the whole log)`);
}

async function browser(): Promise<void> {
  const found = findChromium();
  if (!found.path) {
    console.log(`Chromium: not run (${found.reason})`);
    return;
  }
  const dir = await mkdtemp(join(tmpdir(), 'plummet-bench-page-'));
  await buildSyncPage(dir);
  const server = await startStaticServer({ root: dir });
  const b = await chromium.launch({ executablePath: found.path, args: CHROMIUM_ARGS });
  try {
    const page = await (await b.newContext({ viewport: { width: 390, height: 844 }, isMobile: true })).newPage();
    await page.goto(`${server.url}/`);
    await page.waitForFunction(() => (window as unknown as { harness?: unknown }).harness !== undefined);
    const f = await page.evaluate((n) => (window as unknown as { harness: { bench(n: number): Promise<Record<string, number>> } }).harness.bench(n), DROPS);
    const version = b.version();
    console.log(`Chromium ${version} (headless, real IndexedDB store): ${DROPS} drops, ${f.records} records`);
    console.log(`  export to JSON (canonical, ${mb(f.file_bytes!)}):  ${s(f.export_json_ms!)} ${verdict(f.export_json_ms!, 1500)}`);
    console.log(`  (reading the store's half first: ${s(f.store_read_half_ms!)})`);
    console.log(`  import: read and check the file:  ${s(f.import_parse_validate_ms!)}`);
    console.log(`  import: merge:  ${s(f.import_merge_ms!)}  (${f.added} added, ${f.unchanged} unchanged)`);
    console.log(`  import: write ${f.added} records to IndexedDB in one transaction:  ${s(f.import_write_ms!)}`);
    console.log(`  import and merge, in all (store read included):  ${s(f.import_total_ms!)} ${verdict(f.import_total_ms!, 3000)}`);
    console.log(`    of which without the store's own write:  ${s(f.import_total_ms! - f.import_write_ms!)}`);
    console.log(`    the same records put into a bare IndexedDB object store, one transaction:  ${s(f.raw_idb_put_ms!)} (durability strict), ${s(f.raw_idb_put_relaxed_ms!)} (relaxed)`);
    console.log(`  CSV of all drops and series (tables only, ${mb(f.csv_bytes!)}):  ${s(f.csv_ms!)}`);
  } finally {
    await b.close();
    await server.close();
    await rm(dir, { recursive: true, force: true });
  }
}

await node();
await browser();
