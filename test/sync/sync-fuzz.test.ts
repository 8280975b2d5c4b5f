// Hostile colleague files through a real sync: the same mutations as the import fuzz suite, each put in a real
// office folder (Apache httpd and nginx, started by the test) beside the phone's own file. Whatever the file, the
// run goes on: the phone's own log is uploaded and reads back equal to what the phone holds, and the hostile file
// is either merged (leaving a log that still saves and exports) or skipped and named on the phone with the
// reason, leaving the phone's records as they were. Fewer cases than the import suite: each is a whole sync.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readdir, rm, writeFile, chmod } from 'node:fs/promises';
import { join } from 'node:path';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { readLogFile } from '../../src/log/export-parse';
import { createMemoryStore, MemoryDatabase } from '../../src/store';
import { deviceFileName, syncFolder } from '../../src/sync/sync-run';
import { loadSkippedFiles } from '../../src/sync/sync-state';
import { apacheMissing, startApache } from '../servers/apache';
import { readFolderFile, type DavServer } from '../servers/dav-server';
import { nginxMissing, startNginx } from '../servers/nginx';
import { MUTATIONS, T0, copyOf, demoDay, environment } from './hostile-logs';
import { seeded } from './sample-log';
import * as demo from '../log/demo-bodies';

const PEER = 'plummet-log-fuzz.json';
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
        await writeFile(join(server.dataDir, PEER), data);
        await chmod(join(server.dataDir, PEER), 0o666);
        const store = await createMemoryStore({ database: copyOf(base), environment: environment(3 + n, T0 + 2 * 86_400_000) });
        const before = canonicalJson(await store.allRecords({ includeDeleted: true }));
        const report = await syncFolder({ source: store, settings, appVersion: '0.1.0' });
        const label = `${category} #${k}`;
        try {
          expect(report.error, `${label}: ${JSON.stringify(report.error)}`).toBeNull();
          expect(report.uploaded, label).toBe(true);
          const held = await store.allRecords({ includeDeleted: true });
          // The phone's own file holds exactly what the phone holds.
          const own = readLogFile(await readFolderFile(server, deviceFileName(await store.deviceId()))).records;
          expect(canonicalJson([...own].sort((x, y) => (x.id < y.id ? -1 : 1))), label).toBe(canonicalJson([...held].sort((x, y) => (x.id < y.id ? -1 : 1))));
          const skipped = (await loadSkippedFiles(store)).find((s) => s.name === PEER);
          if (skipped) {
            tally.skipped++;
            // Named with its reason, and nothing of it reached the phone's records.
            expect(skipped.message.length, label).toBeGreaterThan(0);
            expect(skipped.code, label).toMatch(/\S/);
            expect(canonicalJson(held), label).toBe(before);
          } else {
            tally.merged++;
            expect(report.merged.some((m) => m.name === PEER) || report.problems.length === 0, label).toBe(true);
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
});
