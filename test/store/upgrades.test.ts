import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { deleteDB, openDB, type IDBPDatabase } from 'idb';
import { webcrypto } from 'node:crypto';
import { HybridLogicalClock } from '../../src/log/hlc';
import { createRecord, deleteRecord, reviseRecord } from '../../src/log/records';
import type { LogRecord } from '../../src/log/types';
import { DB_VERSION, StoreError, UPGRADES, openLogDatabase, openLogStore, type LogDB, type Upgrade } from '../../src/store';
import { whereBucketV5 } from '../../src/store/upgrades';
import * as demo from '../log/demo-bodies';
import { fakeEnvironment } from './fake-environment';

const DEVICE = '0011223344556677';
let n = 0;
const names: string[] = [];
const freshName = () => {
  const name = `plummet-upgrade-${++n}`;
  names.push(name);
  return name;
};

afterEach(async () => {
  while (names.length) await deleteDB(names.pop()!);
});

/**
 * A log as version 1 stored it: 3 days (one deleted), readings, 7 series (one deleted), 2 600 drops
 * (more than one page of the v2 step's counting; some deleted, some revised), a draft and the meta entries.
 */
function versionOneLog() {
  const clock = new HybridLogicalClock(DEVICE);
  let t = Date.UTC(2026, 3, 1, 8, 0, 0);
  const ctx = () => ({ device: DEVICE, clock, now: (t += 1000), random: (b: Uint8Array) => webcrypto.getRandomValues(b) });
  const site = createRecord('site', demo.site(), ctx());
  const specimen = createRecord('specimen', demo.steelBall(), ctx());
  const records: LogRecord[] = [site, specimen];
  const expected = new Map<string, { reading_count: number; series_count: number; drop_count: number }>();
  ['2026-04-01', '2026-04-02', '2026-04-03'].forEach((date, d) => {
    let day = createRecord('day', { ...demo.day(), site_id: site.id, date }, ctx());
    const counts = { reading_count: 0, series_count: 0, drop_count: 0 };
    for (let r = 0; r < 2; r++) {
      records.push(createRecord('reading', { ...demo.reading(), day_id: day.id, taken_at: `${date}T0${8 + r}:00:00.000Z` }, ctx()));
      counts.reading_count++;
    }
    for (let s = 0; s < (d === 1 ? 3 : 2); s++) {
      let series = createRecord('series', { ...demo.series(), day_id: day.id, specimen_id: specimen.id }, ctx());
      const deletedSeries = d === 1 && s === 2;
      for (let k = 1; k <= 370; k++) {
        let drop = createRecord('drop', { ...demo.drop(k), series_id: series.id, time_s: 1.1 + (k % 7) / 100 }, ctx());
        if (k % 50 === 0) drop = deleteRecord(drop, { ...ctx(), reason: 'released by hand' });
        else if (k % 45 === 0) drop = reviseRecord(drop, { time_s: 1.15 }, { ...ctx(), reason: 'read off the video' });
        records.push(drop);
        if (!drop.deleted && !deletedSeries) counts.drop_count++;
      }
      if (deletedSeries) series = deleteRecord(series, { ...ctx(), reason: 'wrong specimen' });
      else counts.series_count++;
      records.push(series);
    }
    if (d === 2) day = deleteRecord(day, { ...ctx(), reason: 'rained off' });
    else expected.set(day.id, counts);
    records.push(day);
  });
  return { records, expected, clock };
}

async function fillVersionOne(name: string) {
  const log = versionOneLog();
  const db = await openLogDatabase(name, { version: 1 });
  expect(db.version).toBe(1);
  expect([...db.objectStoreNames]).not.toContain('day_summary');
  const tx = db.transaction(['site', 'specimen', 'day', 'reading', 'series', 'drop', 'draft', 'meta'], 'readwrite');
  await Promise.all([
    ...log.records.map((r) => (tx.objectStore(r.kind) as unknown as { put(v: unknown): Promise<unknown> }).put(r)),
    tx.objectStore('draft').put({ key: 'drop-form', value: { typed: '1.1' }, saved_at: '2026-04-03T10:00:00.000Z' }),
    tx.objectStore('meta').put({ key: 'device_id', value: DEVICE }),
    tx.objectStore('meta').put({ key: 'clock', value: log.clock.latest }),
    tx.objectStore('meta').put({ key: 'unsent_changes', value: 17 }),
    tx.done,
  ]);
  db.close();
  return log;
}

function structureOf(db: IDBPDatabase<LogDB>) {
  const names = [...db.objectStoreNames].sort();
  const tx = db.transaction(names);
  return names.map((name) => {
    const store = tx.objectStore(name);
    return {
      name,
      keyPath: store.keyPath,
      indexes: [...store.indexNames].sort().map((i) => [i, store.index(i as never).keyPath, store.index(i as never).unique]),
    };
  });
}

const byKindAndId = (a: LogRecord, b: LogRecord) => (a.kind + a.id < b.kind + b.id ? -1 : 1);

describe('schema upgrades', () => {
  it('ships one upgrade function per version, and the current version is the last', () => {
    expect(UPGRADES).toHaveLength(5);
    expect(DB_VERSION).toBe(5);
  });

  it('opens a database filled by version 1 under the current version with every record, draft and meta entry intact', async () => {
    const name = freshName();
    const { records, expected } = await fillVersionOne(name);
    const fake = fakeEnvironment();
    const store = await openLogStore({ name, environment: fake.environment });
    expect([...(await store.allRecords())].sort(byKindAndId)).toEqual([...records].sort(byKindAndId));
    expect((await store.getDraft('drop-form'))?.value).toEqual({ typed: '1.1' });
    expect(await store.deviceId()).toBe(DEVICE);
    expect((await store.status()).unsentChanges).toBe(17);
    store.close();
    const db = await openDB<LogDB>(name);
    expect(db.version).toBe(DB_VERSION);
    db.close();
  });

  it('fills the day counts of version 2 from what version 1 stored, leaving deleted records out', async () => {
    const name = freshName();
    const { expected } = await fillVersionOne(name);
    const db = await openLogDatabase(name);
    const summaries = await db.getAll('day_summary');
    db.close();
    expect(Object.fromEntries(summaries.map(({ day_id, ...counts }) => [day_id, counts]))).toEqual(Object.fromEntries(expected));
    const store = await openLogStore({ name, environment: fakeEnvironment().environment });
    // Per live series 370 drops less the 7 deleted (every 50th) = 363; the third day is deleted, and so is
    // the third series of the second day.
    expect((await store.listDays()).map((d) => [d.date, d.reading_count, d.series_count, d.drop_count])).toEqual([
      ['2026-04-02', 2, 2, 726],
      ['2026-04-01', 2, 2, 726],
    ]);
    store.close();
  });

  it('gives an upgraded database the same stores and indexes as a new one', async () => {
    const upgraded = freshName();
    await fillVersionOne(upgraded);
    const fresh = freshName();
    const a = await openLogDatabase(upgraded);
    const b = await openLogDatabase(fresh);
    expect(structureOf(a)).toEqual(structureOf(b));
    expect(structureOf(b).map((s) => s.name)).toEqual(['day', 'day_summary', 'draft', 'drop_pack', 'drop_where', 'meta', 'reading', 'series', 'site', 'specimen']);
    a.close();
    b.close();
  });

  it('leaves the database at the old version with everything in it when an upgrade step fails', async () => {
    const name = freshName();
    const { records } = await fillVersionOne(name);
    const broken: Upgrade = () => {
      throw new Error('a step that cannot work');
    };
    let error: unknown;
    try {
      await openLogDatabase(name, { upgrades: [UPGRADES[0]!, broken] });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(StoreError);
    expect((error as StoreError).code).toBe('open-failed');
    expect(((error as StoreError).cause as Error).message).toBe('a step that cannot work');
    const db = await openLogDatabase(name, { version: 1 });
    expect(db.version).toBe(1);
    expect(await db.count('drop')).toBe(records.filter((r) => r.kind === 'drop').length);
    db.close();
  });

  it('refuses a database written by a newer version of the app and says so', async () => {
    const name = freshName();
    const noop: Upgrade = () => undefined;
    (await openLogDatabase(name, { upgrades: [...UPGRADES, noop] })).close();
    let error: unknown;
    try {
      await openLogStore({ name, environment: fakeEnvironment().environment });
    } catch (e) {
      error = e;
    }
    expect((error as StoreError).code).toBe('database-newer');
  });

  it('gives way to a newer version opened in another tab and refuses further calls', async () => {
    const name = freshName();
    let told = 0;
    const store = await openLogStore({ name, environment: fakeEnvironment().environment, onVersionChange: () => told++ });
    await store.create('site', demo.site());
    const noop: Upgrade = () => undefined;
    const newer = await openLogDatabase(name, { upgrades: [...UPGRADES, noop] });
    expect(newer.version).toBe(DB_VERSION + 1);
    expect(told).toBe(1);
    await expect(store.list('site')).rejects.toMatchObject({ code: 'store-closed' });
    expect(await newer.count('site')).toBe(1);
    newer.close();
  });

  it('gives every sound-timed drop stored by version 2 a sound_travel of null (in its history too), and changes nothing else', async () => {
    const name = freshName();
    const clock = new HybridLogicalClock(DEVICE);
    let t = Date.UTC(2026, 3, 1, 8, 0, 0);
    const ctx = () => ({ device: DEVICE, clock, now: (t += 1000), random: (b: Uint8Array) => webcrypto.getRandomValues(b) });
    // Version 2 stored sound captures without sound_travel (log format 1): written here as they were.
    const formatOne = (record: LogRecord): LogRecord => JSON.parse(JSON.stringify(record, (key, value) => (key === 'sound_travel' ? undefined : value)));
    const raw = { kind: 'sound' as const, onsets_s: [1.5, 2.62], sample_rate_Hz: 44_100, sound_travel: null };
    const heard = createRecord('drop', { ...demo.drop(1), raw, time_s: 1.12, note: 'sound travel correction 29.1 ms (phone 10 m from release, 0 m from landing)' }, ctx());
    const revised = reviseRecord(createRecord('drop', { ...demo.drop(2), raw, time_s: 1.12 }, ctx()), { time_s: 1.121 }, { ...ctx(), reason: 'rounding' });
    const tapped = createRecord('drop', demo.drop(3), ctx());
    const stored = [heard, revised, tapped].map(formatOne);
    expect(JSON.stringify(stored)).not.toContain('sound_travel');
    const old = await openLogDatabase(name, { version: 2 });
    const tx = old.transaction('drop', 'readwrite');
    await Promise.all([...stored.map((r) => tx.objectStore('drop').put(r as never)), tx.done]);
    old.close();

    const store = await openLogStore({ name, environment: fakeEnvironment().environment });
    const after = new Map((await store.list('drop', { includeDeleted: true })).map((d) => [d.id, d]));
    store.close();
    // The records as log format 2 writes them: exactly what was created, sound_travel null included.
    expect(after.get(heard.id)).toEqual(heard);
    expect(after.get(revised.id)).toEqual(revised);
    expect(after.get(revised.id)!.history[0]!.body.raw).toEqual(raw);
    expect(after.get(tapped.id)).toEqual(tapped);
  });

  it('gives readings and series stored by version 3 the fields of log format 3 at the values they meant (history too), and changes nothing else', async () => {
    const name = freshName();
    const clock = new HybridLogicalClock(DEVICE);
    let t = Date.UTC(2026, 3, 1, 8, 0, 0);
    const ctx = () => ({ device: DEVICE, clock, now: (t += 1000), random: (b: Uint8Array) => webcrypto.getRandomValues(b) });
    const added = new Set(['u_wind_speed_m_s', 'vertical_wind_m_s', 'u_vertical_wind_m_s', 'height_m', 'reading_aloft_id', 'timing_delay_s', 'u_timing_delay_s']);
    // Version 3 stored readings and series without them (log format 2): written here as they were. A series'
    // own height_m was there already and stays.
    const formatTwo = (record: LogRecord): LogRecord =>
      JSON.parse(JSON.stringify(record, function (this: Record<string, unknown>, key, value) {
        const isSeries = this['specimen_id'] !== undefined;
        return added.has(key) && !(isSeries && key === 'height_m') ? undefined : value;
      }));
    const reading = reviseRecord(createRecord('reading', demo.reading(), ctx()), { temperature_C: 12.5 }, { ...ctx(), reason: 'read the wrong line' });
    const series = reviseRecord(createRecord('series', demo.series(), ctx()), { height_m: 9.5 }, { ...ctx(), reason: 'remeasured' });
    const drop = createRecord('drop', demo.drop(1), ctx());
    const [oldReading, oldSeries] = [reading, series].map(formatTwo);
    const oldDrop = drop;
    expect(oldReading).not.toHaveProperty('height_m');
    expect(oldReading!.history[0]!.body).not.toHaveProperty('vertical_wind_m_s');
    expect(oldSeries).not.toHaveProperty('reading_aloft_id');
    expect(oldSeries).toHaveProperty('height_m', 9.5);
    const old = await openLogDatabase(name, { version: 3 });
    const tx = old.transaction(['reading', 'series', 'drop'], 'readwrite');
    await Promise.all([tx.objectStore('reading').put(oldReading as never), tx.objectStore('series').put(oldSeries as never), tx.objectStore('drop').put(oldDrop as never), tx.done]);
    old.close();

    const store = await openLogStore({ name, environment: fakeEnvironment().environment });
    const [r, s, d] = await Promise.all([store.get('reading', reading.id), store.get('series', series.id), store.get('drop', drop.id)]);
    store.close();
    // Demo bodies hold the defaults, so the upgraded records are exactly what was created, rev included.
    expect(demo.reading()).toMatchObject({ height_m: 0, vertical_wind_m_s: null, u_vertical_wind_m_s: null, u_wind_speed_m_s: null });
    expect(demo.series()).toMatchObject({ reading_aloft_id: null, timing_delay_s: null, u_timing_delay_s: null });
    expect(r).toEqual(reading);
    expect(s).toEqual(series);
    expect(d).toEqual(drop);
  });

  it('moves every drop stored by version 4 into the pack of its series (history and tombstones too), and the store reads them as before', async () => {
    const name = freshName();
    const { records } = versionOneLog();
    const old = await openLogDatabase(name, { version: 4 });
    const tx = old.transaction(['site', 'specimen', 'day', 'reading', 'series', 'drop'], 'readwrite');
    await Promise.all([...records.map((r) => (tx.objectStore(r.kind) as unknown as { put(v: unknown): Promise<unknown> }).put(r)), tx.done]);
    old.close();
    const drops = records.filter((r) => r.kind === 'drop');
    expect(drops.length).toBe(2590);
    expect(drops.some((d) => d.deleted) && drops.some((d) => d.history.length > 0)).toBe(true);

    const store = await openLogStore({ name, environment: fakeEnvironment().environment });
    expect([...(await store.allRecords())].sort(byKindAndId)).toEqual([...records].sort(byKindAndId));
    for (const d of drops.filter((_, i) => i % 37 === 0)) expect(await store.get('drop', d.id)).toEqual(d);
    const day = records.find((r) => r.kind === 'day' && !r.deleted)!;
    const liveSeries = new Set(records.filter((r) => r.kind === 'series' && r.day_id === day.id && !r.deleted).map((r) => r.id));
    const view = await store.loadDay(day.id);
    expect(view.drops.map((d) => d.id).sort()).toEqual(drops.filter((d) => liveSeries.has(d.series_id) && !d.deleted).map((d) => d.id).sort());
    store.close();

    const db = await openLogDatabase(name);
    expect([...db.objectStoreNames]).not.toContain('drop');
    const [packs, wheres] = await Promise.all([db.getAll('drop_pack'), db.getAll('drop_where')]);
    db.close();
    // One pack per series that has drops, each sorted by id; every drop in exactly one, and its place in its bucket.
    expect(packs.map((p) => p.series_id).sort()).toEqual([...new Set(drops.map((d) => d.series_id))].sort());
    for (const pack of packs) {
      expect(pack.drops.every((d) => d.series_id === pack.series_id)).toBe(true);
      expect(pack.drops.map((d) => d.id)).toEqual(pack.drops.map((d) => d.id).sort());
    }
    expect(Object.assign({}, ...wheres.map((w) => w.places))).toEqual(Object.fromEntries(drops.map((d) => [d.id, (d as { series_id: string }).series_id])));
    for (const w of wheres) expect(Object.keys(w.places).every((id) => whereBucketV5(id) === w.bucket)).toBe(true);
    expect(packs.flatMap((p) => p.drops).length).toBe(drops.length);
  });
});
