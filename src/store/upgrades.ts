/**
 * Schema upgrades, one function per version. UPGRADES[n] takes a database from version n to n + 1.
 *
 * An upgrade is history: once shipped it never changes, and it uses no code of the app that may change
 * later (it reads and writes the stores directly), so a phone that skipped versions replays exactly what the
 * others ran. It awaits nothing but requests of the upgrade transaction.
 */
import type { IDBPDatabase, IDBPTransaction, StoreNames } from 'idb';
import type { LogDB } from './log-db';

export type Upgrade = (
  db: IDBPDatabase<LogDB>,
  tx: IDBPTransaction<LogDB, StoreNames<LogDB>[], 'versionchange'>,
) => void | Promise<void>;

/** Version 1: one store per kind of record, with the indexes the screens look things up by; drafts; meta. */
export const upgradeToV1: Upgrade = (db) => {
  db.createObjectStore('site', { keyPath: 'id' });
  db.createObjectStore('specimen', { keyPath: 'id' });
  const day = db.createObjectStore('day', { keyPath: 'id' });
  day.createIndex('by_date', 'date');
  day.createIndex('by_site', 'site_id');
  db.createObjectStore('reading', { keyPath: 'id' }).createIndex('by_day', 'day_id');
  const series = db.createObjectStore('series', { keyPath: 'id' });
  series.createIndex('by_day', 'day_id');
  series.createIndex('by_specimen', 'specimen_id');
  db.createObjectStore('drop', { keyPath: 'id' }).createIndex('by_series', 'series_id');
  db.createObjectStore('draft', { keyPath: 'key' });
  db.createObjectStore('meta', { keyPath: 'key' });
};

/** Drops are read this many at a time while counting, to keep memory low on a phone with a long log. */
const PAGE = 2000;

/**
 * Version 2: counts per day (readings, series, drops; deleted ones left out), so the list of days no longer
 * reads every drop of the log. Filled here from the records already stored.
 */
export const upgradeToV2: Upgrade = async (db, tx) => {
  db.createObjectStore('day_summary', { keyPath: 'day_id' });
  const [days, readings, series] = await Promise.all([
    tx.objectStore('day').getAll(),
    tx.objectStore('reading').getAll(),
    tx.objectStore('series').getAll(),
  ]);
  const dropsInSeries = new Map<string, number>();
  const drops = tx.objectStore('drop');
  let after: string | null = null;
  for (;;) {
    const page = await drops.getAll(after === null ? null : IDBKeyRange.lowerBound(after, true), PAGE);
    for (const drop of page) if (!drop.deleted) dropsInSeries.set(drop.series_id, (dropsInSeries.get(drop.series_id) ?? 0) + 1);
    if (page.length < PAGE) break;
    after = page[page.length - 1]!.id;
  }
  const summaries = new Map(days.filter((d) => !d.deleted).map((d) => [d.id, { day_id: d.id, reading_count: 0, series_count: 0, drop_count: 0 }]));
  for (const r of readings) if (!r.deleted) summaries.get(r.day_id) && summaries.get(r.day_id)!.reading_count++;
  for (const s of series) {
    const summary = summaries.get(s.day_id);
    if (s.deleted || !summary) continue;
    summary.series_count++;
    summary.drop_count += dropsInSeries.get(s.id) ?? 0;
  }
  const store = tx.objectStore('day_summary');
  await Promise.all([...summaries.values()].map((s) => store.put(s)));
};

type Body = Record<string, unknown>;

/** A sound capture stored before version 3 gets `sound_travel: null`; anything else is left as it is. */
function soundTravelNone(body: Body): Body | null {
  const raw = body['raw'] as Body | null | undefined;
  if (!raw || typeof raw !== 'object' || raw['kind'] !== 'sound' || 'sound_travel' in raw) return null;
  return { ...body, raw: { ...raw, sound_travel: null } };
}

/**
 * Version 3: a drop timed by sound stores the sound-travel correction applied to it (log format 2). Drops
 * stored before did not say, so they get `sound_travel: null`, in their history too; a correction applied
 * then stays in the drop's note, where it was written. Nothing else changes (not the revision stamp: this
 * is the same record in the newer shape, as every phone upgrades it the same way).
 */
export const upgradeToV3: Upgrade = async (_db, tx) => {
  const drops = tx.objectStore('drop');
  let after: string | null = null;
  for (;;) {
    const page = await drops.getAll(after === null ? null : IDBKeyRange.lowerBound(after, true), PAGE);
    const changed = page.flatMap((drop) => {
      const record = drop as unknown as Body & { history: { body: Body }[] };
      const history = record.history.map((entry) => {
        const body = soundTravelNone(entry.body);
        return body ? { ...entry, body } : entry;
      });
      const upgraded = soundTravelNone(record) ?? (history.some((entry, i) => entry !== record.history[i]) ? record : null);
      return upgraded ? [{ ...upgraded, history }] : [];
    });
    await Promise.all(changed.map((drop) => drops.put(drop as unknown as (typeof page)[number])));
    if (page.length < PAGE) break;
    after = page[page.length - 1]!.id;
  }
};

/** Fields log format 3 added, at the values that say what the older records meant (see log/upgrade-export.ts). */
const V4_DEFAULTS = {
  reading: { u_wind_speed_m_s: null, vertical_wind_m_s: null, u_vertical_wind_m_s: null, height_m: 0 },
  series: { reading_aloft_id: null, timing_delay_s: null, u_timing_delay_s: null },
} as const;

function withDefaults(body: Body, defaults: Body): Body | null {
  const missing = Object.keys(defaults).filter((key) => !(key in body));
  return missing.length === 0 ? null : { ...body, ...Object.fromEntries(missing.map((key) => [key, defaults[key]])) };
}

/**
 * Version 4 (log format 3): readings say at what height they were taken and what vertical air motion there was;
 * series may name a second reading aloft and declare a timing delay. Older records get the values that say
 * what they meant (on the landing surface, nothing measured, the method's default), in their history too, with
 * the revision stamp unchanged (every phone upgrades alike).
 */
export const upgradeToV4: Upgrade = async (_db, tx) => {
  for (const kind of ['reading', 'series'] as const) {
    const store = tx.objectStore(kind);
    const defaults: Body = V4_DEFAULTS[kind];
    const all = (await store.getAll()) as unknown as (Body & { history: { body: Body }[] })[];
    const changed = all.flatMap((record) => {
      const history = record.history.map((entry) => {
        const body = withDefaults(entry.body, defaults);
        return body ? { ...entry, body } : entry;
      });
      const upgraded = withDefaults(record, defaults) ?? (history.some((entry, i) => entry !== record.history[i]) ? record : null);
      return upgraded ? [{ ...upgraded, history }] : [];
    });
    await Promise.all(changed.map((record) => store.put(record as never)));
  }
};

/** The bucket of a drop id in drop_where: FNV-1a (32 bits) of its text, modulo 1024. A copy of the rule in
 *  drop-packs.ts (whereBucket), frozen here as upgrades use no app code; a test compares the two. */
export function whereBucketV5(id: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < id.length; i++) h = Math.imul(h ^ id.charCodeAt(i), 0x01000193) >>> 0;
  return h % 1024;
}

/**
 * Version 5: the drops of each series in one value (drop_pack, by series id), and the series of every drop in
 * 1024 values by a hash of its id (drop_where). IndexedDB's cost is mostly per value written: 50 000 drops put
 * one by one took 3.5 to 4.2 s in Chromium, the same drops in 2 000 values 0.4 to 0.6 s. Every drop is moved as
 * it was (every version, tombstones too), then the store of one value per drop is removed.
 */
export const upgradeToV5: Upgrade = async (db, tx) => {
  const packs = db.createObjectStore('drop_pack', { keyPath: 'series_id' });
  const where = db.createObjectStore('drop_where', { keyPath: 'bucket' });
  const bySeries = new Map<string, Body[]>();
  const buckets = new Map<number, Record<string, string>>();
  const drops = tx.objectStore('drop');
  let after: string | null = null;
  for (;;) {
    // In id order, so each pack's drops are sorted by id as they are added.
    const page = (await drops.getAll(after === null ? null : IDBKeyRange.lowerBound(after, true), PAGE)) as unknown as (Body & { id: string; series_id: string })[];
    for (const drop of page) {
      let list = bySeries.get(drop.series_id);
      if (!list) bySeries.set(drop.series_id, (list = []));
      list.push(drop);
      const b = whereBucketV5(drop.id);
      let places = buckets.get(b);
      if (!places) buckets.set(b, (places = {}));
      places[drop.id] = drop.series_id;
    }
    if (page.length < PAGE) break;
    after = page[page.length - 1]!.id;
  }
  const writes: Promise<unknown>[] = [];
  for (const [series_id, list] of bySeries) writes.push(packs.put({ series_id, drops: list } as never));
  for (const [bucket, places] of buckets) writes.push(where.put({ bucket, places }));
  await Promise.all(writes);
  db.deleteObjectStore('drop');
};

export const UPGRADES: readonly Upgrade[] = [upgradeToV1, upgradeToV2, upgradeToV3, upgradeToV4, upgradeToV5];
