// A removal on one phone and a correction on another, crossing through a real office folder (Apache mod_dav and
// nginx dav): both end on both phones, the pair is listed as a conflict, and nothing either phone did is lost.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { canonicalJson } from '../../src/log/canonical';
import type { DropRecord, LogRecord } from '../../src/log/types';
import { syncFolder, type SyncReport } from '../../src/sync/sync-run';
import type { SyncSettings } from '../../src/sync/settings';
import { loadConflicts } from '../../src/sync/import-log';
import { createMemoryStore, type LogStore } from '../../src/store';
import { apacheMissing, startApache } from '../servers/apache';
import { nginxMissing, startNginx } from '../servers/nginx';
import type { DavServer } from '../servers/dav-server';
import { byKind, sampleLog } from './sample-log';

const sorted = (records: Iterable<LogRecord>) => [...records].sort((a, b) => (a.id < b.id ? -1 : 1));
const logText = async (store: LogStore) => canonicalJson(sorted(await store.allRecords({ includeDeleted: true })));

async function sync(store: LogStore, settings: SyncSettings): Promise<SyncReport> {
  const report = await syncFolder({ source: store, settings, appVersion: '0.1.0' });
  expect(report.error, JSON.stringify(report.error)).toBeNull();
  return report;
}

const kinds = [
  ['Apache mod_dav', apacheMissing(), startApache],
  ['nginx dav', nginxMissing(), startNginx],
] as const;

describe.each(kinds)('a removal and a correction crossing through %s', (_name, missing, start) => {
  if (missing && process.env.CI === 'true') throw new Error(missing);
  let server: DavServer;
  let settings: SyncSettings;
  beforeAll(async () => {
    if (missing) return;
    server = await start({});
    settings = { folder_url: server.folderUrl, ...server.credentials, enabled: true, timeout_ms: 5000 };
  });
  afterAll(async () => {
    await server?.dispose();
  });

  it.skipIf(missing)('keeps both, lists the conflict on each phone, and restores the series everywhere', async () => {
    // Two phones with the real store logic (every write validated, one transaction per action).
    const first = await createMemoryStore();
    const second = await createMemoryStore();
    await first.putRecords(sampleLog({ device: 'office0000000001', seed: 5 }));
    await sync(first, settings);
    await sync(second, settings);
    expect(await logText(second)).toBe(await logText(first));

    const series = byKind(await first.allRecords(), 'series')[0]!;
    const drop = byKind(await first.allRecords(), 'drop').find((d) => d.series_id === series.id)!;
    // Phone one removes the series (its drops go with it); phone two, not knowing, corrects one of its drops.
    await first.remove('series', series.id, 'wrong specimen picked');
    await second.revise('drop', drop.id, { time_s: drop.time_s + 0.1 }, 'typed a wrong digit');

    await sync(first, settings);
    const report = await sync(second, settings);
    await sync(first, settings);
    expect(await logText(second)).toBe(await logText(first));

    // The drop's two versions that did not know each other are a conflict, listed on both phones.
    expect(report.conflicts).toEqual([expect.objectContaining({ id: drop.id, kind: 'drop', measured: true, fields: expect.arrayContaining(['deleted', 'time_s']) })]);
    for (const phone of [first, second]) {
      expect((await loadConflicts(phone)).map((c) => c.id)).toContain(drop.id);
      const merged = (await phone.get('drop', drop.id)) as DropRecord;
      const versions = [...merged.history, merged];
      // Nothing lost: the removal with its reason and the correction with its reason are both in the record.
      expect(versions.some((v) => v.deleted)).toBe(true);
      expect([...merged.history.map((h) => h.body.time_s), merged.time_s]).toContain(drop.time_s + 0.1);
      expect(merged.history.map((h) => h.reason)).toEqual(expect.arrayContaining(['wrong specimen picked']));
    }

    // The series is restored on phone two; after a round phone one has it live again, with its history.
    await second.restore('series', series.id, 'right specimen after all');
    await sync(second, settings);
    await sync(first, settings);
    expect((await first.get('series', series.id))?.deleted).toBe(false);
    expect((await first.history('series', series.id)).map((v) => [v.deleted, v.reason])).toEqual([
      [false, 'wrong specimen picked'],
      [true, 'right specimen after all'],
      [false, null],
    ]);
    expect(await logText(second)).toBe(await logText(first));
  });
});
