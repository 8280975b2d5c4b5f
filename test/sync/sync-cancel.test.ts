// A sync run cancelled at each of its stop points, on the in-memory WebDAV twin and on the real Apache (mod_dav)
// and nginx (dav-ext) servers: the phone's store is as it was or holds everything read from the folder (one
// transaction, never part of it), the folder's indexes name parts that exist and read as logs, no record the
// folder held is lost, the sync state counts no failure, and the next run repairs the rest. The window a
// cancel between two part uploads leaves (an old index naming a part rewritten since) is stated and checked.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { mkdir, readdir, readFile, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { canonicalJson } from '../../src/log/canonical';
import { exportLog } from '../../src/log/export';
import { readLogFile } from '../../src/log/export-parse';
import { partFileName, readPartIndex, type LogPartIndex } from '../../src/log/log-parts';
import { TransferCancelled, type TransferProgress } from '../../src/log/transfer-progress';
import type { DayRecord, DropRecord, LogRecord, SeriesRecord } from '../../src/log/types';
import { createMemoryStore, type LogStore } from '../../src/store';
import { contentHash } from '../../src/sync/content-hash';
import type { SyncSettings } from '../../src/sync/settings';
import { loadSyncState } from '../../src/sync/sync-state';
import { deviceFileName, deviceIndexName, syncFolder, type SyncReport } from '../../src/sync/sync-run';
import { apacheMissing, startApache } from '../servers/apache';
import { putFolderFile, type DavServer } from '../servers/dav-server';
import { nginxMissing, startNginx } from '../servers/nginx';
import { partsOf } from './folder-log';
import { memoryDav, type DavEvent, type MemoryDav } from './memory-dav';
import { byKind, revise, sampleLog } from './sample-log';

const T = Date.UTC(2026, 6, 1, 9);
const DATES = ['2026-06-14', '2026-06-15', '2026-06-16'];

/** A folder to sync with, whichever kind: its settings, its fetch (with a hook at the server), its files. */
interface Folder {
  settings: SyncSettings;
  fetch: typeof fetch;
  hook: ((event: DavEvent) => void) | null;
  /** A file's text, or null. */
  read(path: string): Promise<string | null>;
  write(path: string, text: string): Promise<void>;
  clear(): Promise<void>;
  /** Requests sent since the last clear. */
  requests: { method: string; path: string }[];
}

function abortError(): DOMException {
  return new DOMException('This operation was aborted', 'AbortError');
}

function twinFolder(): Folder {
  let dav: MemoryDav = memoryDav();
  const folder: Folder = {
    settings: { folder_url: dav.folderUrl, username: 'u', password: 'p', enabled: true, timeout_ms: 5000 },
    fetch: (input, init) => dav.fetch(input, init),
    hook: null,
    async read(path) {
      return dav.files.get(path)?.text ?? null;
    },
    async write(path, text) {
      dav.files.set(path, { text, modified: T, etag: `"w${dav.files.size}"` });
    },
    async clear() {
      dav = memoryDav();
      dav.hook = (e) => folder.hook?.(e);
      folder.requests = dav.requests;
    },
    requests: [],
  };
  return folder;
}

/** A real server; the hook sees each request before it leaves and once its answer's head is back (a raised
 *  signal then stops the body being read: the server has acted, the phone never hears). */
function serverFolder(server: DavServer): Folder {
  const folder: Folder = {
    settings: { folder_url: server.folderUrl, ...server.credentials, enabled: true, timeout_ms: 5000 },
    fetch: async (input, init = {}) => {
      const url = new URL(String(input));
      const path = decodeURIComponent(url.pathname.replace(/^\/dav\/?/, '')).replace(/\/$/, '');
      const method = (init.method ?? 'GET').toUpperCase();
      folder.requests.push({ method, path });
      folder.hook?.({ method, path, stage: 'before' });
      if (init.signal?.aborted) throw abortError();
      const response = await fetch(input, init);
      folder.hook?.({ method, path, stage: 'after' });
      return response;
    },
    hook: null,
    async read(path) {
      return readFile(join(server.dataDir, path), 'utf8').catch(() => null);
    },
    async write(path, text) {
      await putFolderFile(server, path, text);
    },
    async clear() {
      for (const f of await readdir(server.dataDir)) await rm(join(server.dataDir, f), { recursive: true, force: true });
      await mkdir(server.dataDir, { recursive: true });
      folder.requests = [];
    },
    requests: [],
  };
  return folder;
}

/** A phone's log with each day on its own date, so its days are parts of their own. */
function phoneLog(device: string, seed: number, startMs?: number): LogRecord[] {
  const log = sampleLog({ device, seed, days: 3, seriesPerDay: 1, dropsPerSeries: 3, ...(startMs ? { startMs } : {}) });
  let d = 0;
  return log.map((r) => (r.kind === 'day' ? ({ ...r, date: DATES[d++] } as DayRecord) : r));
}

async function phone(records: readonly LogRecord[]): Promise<LogStore> {
  const store = await createMemoryStore();
  await store.putRecords(structuredClone([...records]));
  return store;
}

const snapshot = async (store: LogStore) => canonicalJson([...(await store.allRecords({ includeDeleted: true }))].sort((a, b) => (a.id < b.id ? -1 : 1)));

/** A phone's index in the folder and its parts: those that exist and read as logs, and those whose text has
 *  another hash than the index states. Fails when a part the index names is missing or is not a log. */
async function indexedParts(folder: Folder, device: string): Promise<{ index: LogPartIndex | null; records: Set<string>; mismatched: string[] }> {
  const text = await folder.read(deviceIndexName(device));
  if (text === null) return { index: null, records: new Set(), mismatched: [] };
  const index = readPartIndex(text);
  const records = new Set<string>();
  const mismatched: string[] = [];
  for (const entry of index.parts) {
    const part = await folder.read(`${partsOf(device)}/${partFileName(entry.key)}`);
    expect(part, `${device}'s index names ${entry.key}, which must exist`).not.toBeNull();
    for (const r of readLogFile(part!).records) records.add(`${r.id} ${r.rev}`);
    if (contentHash(part!) !== entry.hash) mismatched.push(entry.key);
  }
  return { index, records, mismatched };
}

type StopEvent = ({ kind: 'progress' } & TransferProgress) | ({ kind: 'request' } & DavEvent);

interface StopPoint {
  name: string;
  when(event: StopEvent, dev: Phones): boolean;
  /** What the store holds after the cancel: as it was, or everything read from the folder. */
  store: 'as it was' | 'merged' | 'either';
  /** What the folder holds of this phone: untouched, some parts newer than the old index, or the new index. */
  folder: 'untouched' | 'parts ahead of the index' | 'written';
  /** The run stops (a stop point past the index is too late: the run finishes). */
  cancels?: boolean;
}

/** The phones of the scene by their device ids (a store makes its own). */
interface Phones {
  a: string;
  b: string;
  c: string;
}

const isPut = (e: StopEvent, what: 'part' | 'index', dev: Phones): e is { kind: 'request' } & DavEvent =>
  e.kind === 'request' && e.method === 'PUT' && (what === 'index' ? e.path === deviceIndexName(dev.a) : e.path.startsWith(`${partsOf(dev.a)}/`));

const STOPS: StopPoint[] = [
  { name: 'while the folder is listed', when: (e) => e.kind === 'request' && e.method === 'PROPFIND' && e.stage === 'before', store: 'as it was', folder: 'untouched' },
  { name: 'after the first file is read', when: (e) => e.kind === 'progress' && e.phase === 'downloading' && e.done === 1, store: 'as it was', folder: 'untouched' },
  {
    name: 'while a part is being read',
    when: (e, dev) => e.kind === 'request' && e.method === 'GET' && e.path.startsWith(`${partsOf(dev.c)}/`) && e.stage === 'before',
    store: 'as it was',
    folder: 'untouched',
  },
  { name: 'while the store is read', when: (e) => e.kind === 'progress' && e.phase === 'reading', store: 'as it was', folder: 'untouched' },
  { name: 'while the files are merged', when: (e) => e.kind === 'progress' && e.phase === 'merging', store: 'as it was', folder: 'untouched' },
  // The store's write looks at the signal between its steps and once more before it commits; with a batch this
  // small it may be past that point: either way the store is whole.
  { name: 'while the store is written', when: (e) => e.kind === 'progress' && e.phase === 'writing', store: 'either', folder: 'untouched' },
  { name: 'before the first part is sent', when: (e) => e.kind === 'progress' && e.phase === 'uploading' && e.done === 0, store: 'merged', folder: 'untouched' },
  { name: 'after the first part is sent and read back', when: (e) => e.kind === 'progress' && e.phase === 'uploading' && e.done === 1, store: 'merged', folder: 'parts ahead of the index' },
  { name: 'while a part is with the server (written, never acknowledged)', when: (e, dev) => isPut(e, 'part', dev) && e.stage === 'after', store: 'merged', folder: 'parts ahead of the index' },
  { name: 'after every part, before the index', when: (e) => e.kind === 'progress' && e.phase === 'indexing' && e.done === 0, store: 'merged', folder: 'parts ahead of the index' },
  { name: 'while the index is with the server (written, never acknowledged)', when: (e, dev) => isPut(e, 'index', dev) && e.stage === 'after', store: 'merged', folder: 'written' },
  { name: 'once the index is written (too late: the run finishes)', when: (e) => e.kind === 'progress' && e.phase === 'indexing' && e.done === 1, store: 'merged', folder: 'written', cancels: false },
];

const kinds = [
  ['the in-memory twin', null, null],
  ['Apache mod_dav', apacheMissing(), startApache],
  ['nginx dav', nginxMissing(), startNginx],
] as const;

describe.each(kinds)('a sync cancelled at each stop point, on %s', (_name, missing, start) => {
  if (missing && process.env.CI === 'true') throw new Error(missing);
  let server: DavServer | null = null;
  let folder: Folder;
  const sync = (store: LogStore, extra: Partial<Parameters<typeof syncFolder>[0]> = {}): Promise<SyncReport> =>
    syncFolder({ source: store, settings: folder.settings, appVersion: '0.1.0', fetch: folder.fetch, ...extra });

  beforeAll(async () => {
    if (missing) return;
    if (start) {
      server = await start({});
      folder = serverFolder(server);
    } else folder = twinFolder();
  }, 60_000);
  afterAll(async () => {
    await server?.dispose();
  });

  /** The folder before phone A's run: A's last run, B and C since (their parts), and D's old single file; then
   *  A has changed a drop on each of its three days. Returns phone A. */
  async function scene(): Promise<{ phoneA: LogStore; dev: Phones }> {
    await folder.clear();
    folder.hook = null;
    const phoneA = await phone(phoneLog('phoneA', 1));
    const phoneB = await phone(phoneLog('phoneB', 2, T));
    const phoneC = await phone(phoneLog('phoneC', 3, T + 3_600_000));
    const dev = { a: await phoneA.deviceId(), b: await phoneB.deviceId(), c: await phoneC.deviceId() };
    const ok = (r: SyncReport) => expect(r.error, JSON.stringify(r.error)).toBeNull();
    ok(await sync(phoneA));
    ok(await sync(phoneB));
    ok(await sync(phoneC));
    await folder.write(deviceFileName('phoneD'), exportLog(phoneLog('phoneD', 4, T + 7_200_000), { device: 'phoneD', app_version: '0.0.9' }));
    const drops = byKind(await phoneA.allRecords({ includeDeleted: false }), 'drop');
    const series = byKind(await phoneA.allRecords({ includeDeleted: false }), 'series');
    const edited = series.map((s, i) => revise(drops.find((d) => d.series_id === s.id)!, { time_s: 1.6 + i / 100 } as Partial<DropRecord>, T + 9_000_000 + i, 'phoneA', 'retimed'));
    await phoneA.putRecords(edited);
    return { phoneA, dev };
  }

  for (const stop of STOPS) {
    it.skipIf(missing)(`${stop.name}: the store ${stop.store === 'either' ? 'whole' : stop.store}, the folder consistent, the next run repairs it`, async () => {
      const { phoneA, dev } = await scene();
      const before = await snapshot(phoneA);
      const folderBefore = await indexedParts(folder, dev.a);
      const indexBefore = await folder.read(deviceIndexName(dev.a));
      const stateBefore = await loadSyncState(phoneA, new URL(folder.settings.folder_url).href);

      const controller = new AbortController();
      const seen: string[] = [];
      const watch = (event: StopEvent) => {
        if (!controller.signal.aborted && stop.when(event, dev)) controller.abort();
      };
      folder.hook = (e) => watch({ kind: 'request', ...e });
      let outcome: SyncReport | TransferCancelled;
      let uploads = { done: 0, total: 0 };
      try {
        outcome = await sync(phoneA, {
          signal: controller.signal,
          onProgress: (p) => {
            seen.push(p.phase);
            if (p.phase === 'uploading') uploads = { done: p.done, total: p.total };
            watch({ kind: 'progress', ...p });
          },
        });
      } catch (error) {
        expect(error).toBeInstanceOf(TransferCancelled);
        outcome = error as TransferCancelled;
      }
      folder.hook = null;
      expect(controller.signal.aborted, 'the stop point was reached').toBe(true);
      if (stop.cancels === false) {
        expect((outcome as SyncReport).ok).toBe(true);
      } else {
        expect(outcome, JSON.stringify(outcome)).toBeInstanceOf(TransferCancelled);
        expect((outcome as TransferCancelled).code).toBe('transfer-cancelled');
      }

      // The store: as it was, or everything merged.
      const afterCancel = await snapshot(phoneA);
      // No failure counted, no error remembered: the back-off is not for a Cancel.
      const state = await loadSyncState(phoneA, new URL(folder.settings.folder_url).href);
      expect(state.failures).toBe(stateBefore.failures);
      expect(state.last_error).toBeNull();

      // The folder: every index names parts that exist and read as logs; nothing it held is lost.
      for (const device of [dev.b, dev.c]) expect((await indexedParts(folder, device)).mismatched).toEqual([]);
      const folderAfter = await indexedParts(folder, dev.a);
      for (const record of folderBefore.records) {
        // A part rewritten holds the newer version of its records; the id is there either way.
        const id = record.split(' ')[0]!;
        expect([...folderAfter.records].some((r) => r.startsWith(`${id} `)), `record ${id} still in the folder`).toBe(true);
      }
      if (stop.folder === 'untouched') {
        expect(await folder.read(deviceIndexName(dev.a))).toBe(indexBefore);
        expect(folderAfter.mismatched).toEqual([]);
        expect([...folderAfter.records].sort()).toEqual([...folderBefore.records].sort());
      } else if (stop.folder === 'parts ahead of the index') {
        // The old index, naming every old part; the parts rewritten since hold the newer version of their day.
        expect(await folder.read(deviceIndexName(dev.a))).toBe(indexBefore);
        expect(folderAfter.mismatched.length).toBeGreaterThan(0);
        expect(folderAfter.mismatched.length).toBeLessThanOrEqual(uploads.total);
      } else {
        expect(await folder.read(deviceIndexName(dev.a))).not.toBe(indexBefore);
        expect(folderAfter.mismatched).toEqual([]);
      }

      // The next run repairs whatever is left, and writes no part that is already there.
      folder.requests.length = 0;
      const repair = await sync(phoneA);
      expect(repair.error, JSON.stringify(repair.error)).toBeNull();
      const full = await snapshot(phoneA);
      if (stop.store === 'as it was') expect(afterCancel).toBe(before);
      else if (stop.store === 'merged') expect(afterCancel).toBe(full);
      else expect([before, full]).toContain(afterCancel);
      expect(full).not.toBe(before);
      const repaired = await indexedParts(folder, dev.a);
      expect(repaired.mismatched).toEqual([]);
      // The folder holds this phone's whole log, each record at the version the phone has.
      const local = new Set((await phoneA.allRecords({ includeDeleted: true })).map((r) => `${r.id} ${r.rev}`));
      expect([...repaired.records].sort()).toEqual([...local].sort());
      const partPuts = folder.requests.filter((r) => r.method === 'PUT' && r.path.startsWith(`${partsOf(dev.a)}/`)).length;
      // Only the parts not yet sent and read back (a part the server took but never acknowledged is sent again).
      if (stop.folder === 'written') expect(partPuts).toBe(0);
      else if (uploads.total > 0) expect(partPuts).toBeLessThanOrEqual(uploads.total - uploads.done + (stop.name.includes('never acknowledged') ? 1 : 0));
      else expect(partPuts).toBe(repaired.index!.parts.length);
      if (stop.store === 'as it was') expect(seen).not.toContain('uploading');
    }, 60_000);
  }

  it.skipIf(missing)('reports its phases in order: listing, downloading, reading, merging, writing, uploading, indexing', async () => {
    const { phoneA, dev } = await scene();
    const seen: TransferProgress[] = [];
    const report = await sync(phoneA, { signal: new AbortController().signal, onProgress: (p) => seen.push({ ...p }) });
    expect(report.error).toBeNull();
    const phases = seen.map((p) => p.phase).filter((p, i, all) => p !== all[i - 1]);
    expect(phases).toEqual(['listing', 'downloading', 'reading', 'merging', 'writing', 'uploading', 'indexing']);
    // B's index, C's index and D's file, then B's and C's four parts each (three days, and the part "other":
    // the specimen no day uses); the total grows as each index is read. On a real server A's own index may be
    // read once more: written within the second before the listing, it is not settled yet (sync-state.ts).
    const downloads = seen.filter((p) => p.phase === 'downloading');
    const last = downloads.at(-1)!;
    expect(last.done).toBe(last.total);
    expect([11, 12]).toContain(last.total);
    if (!start) expect(last.total).toBe(11);
    for (const p of downloads) expect(p.done).toBeLessThanOrEqual(p.total);
    // A's three days (each edited, and each now holding B's, C's and D's records of that date) and "other".
    expect(seen.filter((p) => p.phase === 'uploading').at(-1)).toEqual({ phase: 'uploading', done: 4, total: 4 });
    // The three groups merged in one transaction, reported by file and by phone's part folder.
    expect(report.merged.map((m) => m.name).sort()).toEqual([deviceFileName('phoneD'), `${partsOf(dev.b)}/`, `${partsOf(dev.c)}/`].sort());
  }, 60_000);
});

describe('a series moved to another day, and a cancel between the two parts', () => {
  // Every phone writes what it has merged into its own parts, so in a crew the series is also in the parts of
  // any phone that read it before; here phone A is alone in the folder, the case where the window shows.
  it('leaves the series in neither part for a phone new to the folder until the next run; nothing is lost on the phone', async () => {
    const folder = twinFolder();
    await folder.clear();
    const sync = (store: LogStore, extra: Partial<Parameters<typeof syncFolder>[0]> = {}) =>
      syncFolder({ source: store, settings: folder.settings, appVersion: '0.1.0', fetch: folder.fetch, ...extra });
    const phoneA = await phone(phoneLog('phoneA', 1));
    expect((await sync(phoneA)).ok).toBe(true);
    const all = await phoneA.allRecords({ includeDeleted: false });
    const days = byKind(all, 'day').sort((a, b) => (a.date < b.date ? -1 : 1));
    const moved = byKind(all, 'series').find((s) => s.day_id === days[0]!.id)! as SeriesRecord;
    await phoneA.putRecords([revise(moved, { day_id: days[1]!.id } as Partial<SeriesRecord>, T + 9_000_000, 'phoneA', 'wrong day')]);

    // Parts go in the order of their keys: the first day's (which lost the series) before the second's.
    const controller = new AbortController();
    await expect(
      sync(phoneA, { signal: controller.signal, onProgress: (p) => p.phase === 'uploading' && p.done === 1 && controller.abort() }),
    ).rejects.toBeInstanceOf(TransferCancelled);
    const inFolder = await indexedParts(folder, await phoneA.deviceId());
    expect(inFolder.mismatched).toEqual([DATES[0]]);
    expect([...inFolder.records].some((r) => r.startsWith(`${moved.id} `))).toBe(false);

    // A phone new to the folder reads it now: the series is not there for it yet.
    const phoneE = await phone([]);
    expect((await sync(phoneE)).ok).toBe(true);
    expect((await phoneE.allRecords({ includeDeleted: true })).some((r) => r.id === moved.id)).toBe(false);
    // Phone A has it; its next run writes the second day and the index, and E gets it.
    expect(((await phoneA.allRecords({ includeDeleted: true })).find((r) => r.id === moved.id) as SeriesRecord).day_id).toBe(days[1]!.id);
    expect((await sync(phoneA)).ok).toBe(true);
    expect((await indexedParts(folder, await phoneA.deviceId())).mismatched).toEqual([]);
    expect((await sync(phoneE)).ok).toBe(true);
    const got = (await phoneE.allRecords({ includeDeleted: true })).find((r) => r.id === moved.id) as SeriesRecord | undefined;
    expect(got?.day_id).toBe(days[1]!.id);
  });
});
