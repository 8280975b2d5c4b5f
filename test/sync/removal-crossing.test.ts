// A removal on one phone and a correction on another, crossing on the way to the office: as a log file sent by
// hand (export, then the Send screen's preview and import) and through a real office folder (Apache mod_dav and
// nginx dav). Each phone's clock is set by the test (a fake wall time per phone, seeded device ids), so which
// version wins is chosen here, both ways, never by how fast the machine runs. Both phones end with the same
// log, both list the crossing, and nothing either phone did is lost.
import { readdir, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { compareHlc } from '../../src/log/hlc';
import type { LogRecord } from '../../src/log/types';
import { syncFolder } from '../../src/sync/sync-run';
import type { SyncSettings } from '../../src/sync/settings';
import { applyPreviewedImport, loadConflicts, previewImport } from '../../src/sync/import-log';
import { createMemoryStore, type LogStore } from '../../src/store';
import { fakeEnvironment, type FakeEnvironment } from '../store/fake-environment';
import { apacheMissing, startApache } from '../servers/apache';
import { nginxMissing, startNginx } from '../servers/nginx';
import type { DavServer } from '../servers/dav-server';
import { byKind, sampleLog, seeded } from './sample-log';

const T0 = Date.UTC(2026, 5, 14, 9, 0, 0);

interface Phone {
  name: string;
  store: LogStore;
  clock: FakeEnvironment;
}

/** A phone whose wall clock the test sets, with a device id drawn from a seeded source. */
async function phone(name: string, seed: number): Promise<Phone> {
  const clock = fakeEnvironment(T0);
  const next = seeded(seed);
  const random = (bytes: Uint8Array) => {
    for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(next() * 256);
    return bytes;
  };
  const store = await createMemoryStore({ environment: { ...clock.environment, random } });
  return { name, store, clock };
}

const sorted = (records: Iterable<LogRecord>) => [...records].sort((a, b) => (a.id < b.id ? -1 : 1));
const logText = async (p: Phone) => canonicalJson(sorted(await p.store.allRecords({ includeDeleted: true })));

/** How the phones' logs travel: `send` takes one phone's changes to the folder (or to the other phone). */
interface Transport {
  /** One phone's part of an exchange: a folder sync, or its whole log sent as a file to the other phone. */
  send(from: Phone, to: Phone): Promise<void>;
}

function fileTransport(): Transport {
  return {
    async send(from, to) {
      const text = exportLog(await from.store.allRecords({ includeDeleted: true }), { device: await from.store.deviceId(), app_version: '0.1.0' });
      await applyPreviewedImport(to.store, await previewImport(to.store, text, `plummet-log-${from.name}.json`));
    },
  };
}

function folderTransport(settings: () => SyncSettings): Transport {
  return {
    async send(from) {
      const report = await syncFolder({ source: from.store, settings: settings(), appVersion: '0.1.0' });
      expect(report.error, JSON.stringify(report.error)).toBeNull();
      expect(report.problems).toEqual([]);
    },
  };
}

/** Both phones sync (or send) in turn, the first one again at the end, so each has the other's changes. */
async function exchange(transport: Transport, first: Phone, second: Phone): Promise<void> {
  await transport.send(first, second);
  await transport.send(second, first);
  await transport.send(first, second);
}

const CASES = [
  // [which version is newer, phone one's wall time, phone two's wall time, which phone syncs first]
  ['the removal is newer', 20_000, 10_000, 'one'],
  ['the removal is newer', 20_000, 10_000, 'two'],
  ['the correction is newer', 10_000, 20_000, 'one'],
  ['the correction is newer', 10_000, 20_000, 'two'],
] as const;

function crossingCases(transport: () => Transport) {
  it.each(CASES)('%s (phone one at +%i ms, phone two at +%i ms, phone %s first): both list it, nothing is lost', async (newer, oneAt, twoAt, firstName) => {
    const one = await phone('one', 11);
    const two = await phone('two', 22);
    const [first, second] = firstName === 'one' ? [one, two] : [two, one];
    // The day was typed the day before, and both phones hold it.
    await one.store.putRecords(sampleLog({ device: 'office0000000001', seed: 5, startMs: T0 - 86_400_000 }));
    await exchange(transport(), one, two);
    expect(await logText(two)).toBe(await logText(one));

    const series = byKind(await one.store.allRecords(), 'series')[0]!;
    const drop = byKind(await one.store.allRecords(), 'drop').find((d) => d.series_id === series.id)!;
    // Phone one removes the series (its drops go with it); phone two, not knowing, corrects one of its drops.
    one.clock.setNow(T0 + oneAt);
    await one.store.remove('series', series.id, 'wrong specimen picked');
    two.clock.setNow(T0 + twoAt);
    await two.store.revise('drop', drop.id, { time_s: drop.time_s + 0.1 }, 'typed a wrong digit');
    const removed = (await one.store.get('drop', drop.id))!;
    const corrected = (await two.store.get('drop', drop.id))!;
    expect([removed.deleted, corrected.deleted]).toEqual([true, false]);
    expect(removed.device).not.toBe(corrected.device);
    const [kept, other] = compareHlc(removed.rev, corrected.rev) > 0 ? [removed, corrected] : [corrected, removed];
    expect(kept).toBe(newer === 'the removal is newer' ? removed : corrected);

    await exchange(transport(), first, second);
    expect(await logText(two)).toBe(await logText(one));

    for (const p of [one, two]) {
      // The drop's two versions that did not know each other are one conflict, listed on both phones.
      expect(await loadConflicts(p.store), `conflicts on phone ${p.name}`).toEqual([
        { id: drop.id, kind: 'drop', kept_rev: kept.rev, kept_device: kept.device, other_rev: other.rev, other_device: other.device, fields: ['deleted', 'time_s'], measured: true },
      ]);
      // Nothing lost: the removal and the correction are both among the drop's versions. The version both changes
      // replaced holds one reason, and of two a merge keeps the later in text order (merge.ts, preferred): here
      // the removal's, while the correction's reason is not kept.
      const versions = await p.store.history('drop', drop.id);
      expect(versions.find((v) => v.rev === removed.rev)?.deleted).toBe(true);
      expect(versions.find((v) => v.rev === corrected.rev)?.body.time_s).toBe(drop.time_s + 0.1);
      expect(versions.map((v) => v.reason)).toContain('wrong specimen picked');
      expect((await p.store.get('drop', drop.id))?.rev).toBe(kept.rev);
    }

    // The series is restored on phone two; after a round phone one has it live again, with its history, and the
    // drop is live on both phones whichever version had won.
    one.clock.setNow(T0 + 60_000);
    two.clock.setNow(T0 + 60_000);
    await two.store.restore('series', series.id, 'right specimen after all');
    await exchange(transport(), two, one);
    expect((await one.store.get('series', series.id))?.deleted).toBe(false);
    expect((await one.store.history('series', series.id)).map((v) => [v.deleted, v.reason])).toEqual([
      [false, 'wrong specimen picked'],
      [true, 'right specimen after all'],
      [false, null],
    ]);
    for (const p of [one, two]) expect((await p.store.get('drop', drop.id))?.deleted, `the drop on phone ${p.name}`).toBe(false);
    expect(await logText(two)).toBe(await logText(one));
  });
}

describe('a removal and a correction crossing in log files sent by hand', () => {
  crossingCases(fileTransport);
});

const servers = [
  ['Apache mod_dav', apacheMissing(), startApache],
  ['nginx dav', nginxMissing(), startNginx],
] as const;

describe.each(servers)('a removal and a correction crossing through %s', (_name, missing, start) => {
  if (missing && process.env.CI === 'true') throw new Error(missing);
  let server: DavServer;
  beforeAll(async () => {
    if (!missing) server = await start({});
  });
  afterAll(async () => {
    await server?.dispose();
  });
  // Each case starts from an empty folder, so one case's phones never meet another's.
  beforeEach(async () => {
    if (missing) return;
    for (const f of await readdir(server.dataDir)) await rm(join(server.dataDir, f), { recursive: true, force: true });
  });
  describe.skipIf(missing)('(server found)', () => {
    crossingCases(() => folderTransport(() => ({ folder_url: server.folderUrl, ...server.credentials, enabled: true, timeout_ms: 5000 })));
  });
});
