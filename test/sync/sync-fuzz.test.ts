// Hostile colleague files through a real sync: the same mutations as the import fuzz suite, each put in a real
// office folder (Apache httpd and nginx, started by the test) beside the phone's own log, in turn as an old
// single-file log and as a day's part named (with its hash) by a colleague's part index; and hostile part indexes. Whatever the file, the
// run goes on: the phone's own log is uploaded and reads back equal to what the phone holds, and the hostile file
// is either merged (leaving a log that still saves and exports) or skipped and named on the phone with the
// reason, leaving the phone's records as they were. Fewer cases than the import suite: each is a whole sync.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdir, readdir, rm, writeFile, chmod } from 'node:fs/promises';
import { join } from 'node:path';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { readLogFile } from '../../src/log/export-parse';
import { createMemoryStore, MemoryDatabase } from '../../src/store';
import { contentHash } from '../../src/log/content-hash';
import { PART_INDEX_FORMAT } from '../../src/log/log-parts';
import { syncFolder } from '../../src/sync/sync-run';
import { loadSkippedFiles } from '../../src/sync/sync-state';
import { apacheMissing, startApache } from '../servers/apache';
import type { DavServer } from '../servers/dav-server';
import { folderLog } from './folder-log';
import { nginxMissing, startNginx } from '../servers/nginx';
import { MUTATIONS, T0, copyOf, demoDay, environment } from './hostile-logs';
import { seeded } from './sample-log';
import * as demo from '../log/demo-bodies';

const PEER = 'plummet-log-fuzz.json';
const PEER_INDEX = 'plummet-log-fuzz.index';
const PEER_PART = 'plummet-log-fuzz.parts/2026-06-14.json';

/** A colleague's index naming one part, `text`, by its hash. */
function indexFor(text: string): string {
  return JSON.stringify({ app_version: '0.1.0', device: 'fuzz', format: PART_INDEX_FORMAT, format_version: 1, parts: [{ hash: contentHash(text), key: '2026-06-14', records: 1 }] });
}
const PER_CATEGORY = 8;
const SEED = 0x2b;

const kinds = [
  ['Apache mod_dav', apacheMissing(), startApache],
  ['nginx dav', nginxMissing(), startNginx],
] as const;

describe.each(kinds)('hostile colleague files synced through %s', (_name, missing, start) => {
  if (missing && process.env.CI === 'true') throw new Error(missing);
  let server: DavServer;

  beforeAll(async () => {
    if (!missing) server = await start({});
  });
  afterAll(async () => {
    await server?.dispose();
  });

  it.skipIf(missing)(`never stop the run, and are merged or skipped and named (${PER_CATEGORY} per category, seed ${SEED})`, async () => {
    const { early, file } = await demoDay();
    const base = new MemoryDatabase();
    const b = await createMemoryStore({ database: base, environment: environment(2, T0 + 86_400_000) });
    await b.putRecords(early);
    b.close();
    const random = seeded(SEED);
    const tally = { merged: 0, skipped: 0 };
    const failures: string[] = [];
    const settings = { folder_url: server.folderUrl, ...server.credentials, enabled: true, timeout_ms: 5000 };

    let n = 0;
    for (const category of Object.keys(MUTATIONS)) {
      for (let k = 0; k < PER_CATEGORY; k++, n++) {
        let data: string | Uint8Array;
        try {
          data = MUTATIONS[category]!(file, random);
        } catch {
          data = file;
        }
        for (const f of await readdir(server.dataDir)) await rm(join(server.dataDir, f), { recursive: true, force: true });
        // Every other case as a day's part behind a colleague's index, the rest as an old single file.
        const asPart = k % 2 === 1;
        const peer = asPart ? PEER_PART : PEER;
        if (asPart) {
          await mkdir(join(server.dataDir, 'plummet-log-fuzz.parts'));
          await chmod(join(server.dataDir, 'plummet-log-fuzz.parts'), 0o777);
          const text = typeof data === 'string' ? data : new TextDecoder().decode(data);
          await writeFile(join(server.dataDir, PEER_INDEX), indexFor(text));
          await chmod(join(server.dataDir, PEER_INDEX), 0o666);
        }
        await writeFile(join(server.dataDir, peer), data);
        await chmod(join(server.dataDir, peer), 0o666);
        const store = await createMemoryStore({ database: copyOf(base), environment: environment(3 + n, T0 + 2 * 86_400_000) });
        const before = canonicalJson(await store.allRecords({ includeDeleted: true }));
        const report = await syncFolder({ source: store, settings, appVersion: '0.1.0' });
        const label = `${category} #${k}${asPart ? ' (as a part)' : ''}`;
        try {
          expect(report.error, `${label}: ${JSON.stringify(report.error)}`).toBeNull();
          expect(report.uploaded, label).toBe(true);
          const held = await store.allRecords({ includeDeleted: true });
          // The phone's own parts hold exactly what the phone holds.
          const own = await folderLog(server, await store.deviceId());
          expect(canonicalJson([...own].sort((x, y) => (x.id < y.id ? -1 : 1))), label).toBe(canonicalJson([...held].sort((x, y) => (x.id < y.id ? -1 : 1))));
          const skipped = (await loadSkippedFiles(store)).find((s) => s.name === peer);
          if (skipped) {
            tally.skipped++;
            // Named with its reason, and nothing of it reached the phone's records.
            expect(skipped.message.length, label).toBeGreaterThan(0);
            expect(skipped.code, label).toMatch(/\S/);
            expect(canonicalJson(held), label).toBe(before);
          } else {
            tally.merged++;
            expect(report.merged.some((m) => m.name === peer) || report.problems.length === 0, label).toBe(true);
            await store.create('site', { ...demo.site(), name: `saved after ${label}` });
            readLogFile(exportLog(await store.allRecords({ includeDeleted: true }), { device: await store.deviceId(), app_version: '0.1.0' }));
          }
        } catch (error) {
          failures.push(String((error as Error).message ?? error).slice(0, 300));
        }
        store.close();
      }
    }
    console.log(`${_name}: ${n} hostile colleague files: ${tally.merged} merged, ${tally.skipped} skipped and named, ${failures.length} failures`);
    expect(failures, failures.join('\n')).toEqual([]);
    expect(tally.skipped).toBeGreaterThan(0);
    expect(tally.merged).toBeGreaterThan(0);
  }, 600_000);

  it.skipIf(missing)('skip and name a hostile part index, never reading past the folder, and the run goes on', async () => {
    const { early, file } = await demoDay();
    const settings = { folder_url: server.folderUrl, ...server.credentials, enabled: true, timeout_ms: 5000 };
    const good = JSON.parse(indexFor(file)) as { parts: Record<string, unknown>[] };
    const hostile: [string, string][] = [
      ['not JSON', '{"format":"plummet-log-parts",'],
      ['a log in place of an index', file],
      ['a key leading out of the folder', JSON.stringify({ ...good, parts: [{ ...good.parts[0], key: '../../etc/passwd' }] })],
      ['a key with an encoded slash', JSON.stringify({ ...good, parts: [{ ...good.parts[0], key: '2026-06-14%2F..%2F..' }] })],
      ['a field named twice', indexFor(file).replace('"device":"fuzz"', '"device":"fuzz","device":"other"')],
      ['nesting past any index', `${'['.repeat(5000)}${']'.repeat(5000)}`],
      ['a newer format', JSON.stringify({ ...good, format_version: 7 })],
    ];
    for (const [what, text] of hostile) {
      for (const f of await readdir(server.dataDir)) await rm(join(server.dataDir, f), { recursive: true, force: true });
      await writeFile(join(server.dataDir, PEER_INDEX), text);
      await chmod(join(server.dataDir, PEER_INDEX), 0o666);
      const store = await createMemoryStore({ environment: environment(900, T0 + 2 * 86_400_000) });
      await store.putRecords(early);
      const before = canonicalJson(await store.allRecords({ includeDeleted: true }));
      const seen: string[] = [];
      const watching: typeof fetch = (input, init) => {
        seen.push(`${init?.method ?? 'GET'} ${new URL(String(input)).pathname}`);
        return fetch(input, init);
      };
      const report = await syncFolder({ source: store, settings, appVersion: '0.1.0', fetch: watching });
      expect(report.error, `${what}: ${JSON.stringify(report.error)}`).toBeNull();
      expect(report.uploaded, what).toBe(true);
      expect(report.problems, what).toEqual([expect.objectContaining({ name: PEER_INDEX })]);
      expect(canonicalJson(await store.allRecords({ includeDeleted: true })), what).toBe(before);
      // Only the index itself was read of the colleague's; nothing outside the folder was asked for.
      expect(seen.filter((r) => r.startsWith('GET') && r.includes('fuzz')), what).toEqual([`GET /dav/${PEER_INDEX}`]);
      expect(seen.every((r) => r.split(' ')[1]!.startsWith('/dav/')), what).toBe(true);
      expect((await loadSkippedFiles(store)).map((s) => s.name), what).toEqual([PEER_INDEX]);
      store.close();
    }
  }, 120_000);
});
