/**
 * The counts kept per day (live readings, live series, and the live drops of those series), so the list of
 * days opens without reading every drop. One algorithm keeps them, for a user action and for a merged batch
 * alike: the counts stored before a write plus what the write changes (dayCountsAfter). countDay, a count
 * made afresh from the stored records, only gives the starting point of a day that had no counts (new,
 * revived, or missing them by a fault, which listDays also survives this way). The upgrade to version 2
 * (upgrades.ts) fills the counts once with its own frozen copy of the rule, as upgrades use no app code.
 * test/store/day-counts.property.test.ts checks that the kept counts always equal a recount.
 */
import type { LogRecord, SeriesRecord } from '../log';
import type { StoreTx } from './backend';
import { isLive } from './live-records';
import type { DaySummary } from './types';

/** A day's counts made afresh from the records stored for it. */
export async function countDay(tx: StoreTx, dayId: string): Promise<DaySummary> {
  const [readings, series] = await Promise.all([tx.getAllByIndex('reading', 'by_day', dayId), tx.getAllByIndex('series', 'by_day', dayId)]);
  const liveSeries = series.filter(isLive);
  const drops = await Promise.all(liveSeries.map((s) => tx.getAllByIndex('drop', 'by_series', s.id)));
  return {
    day_id: dayId,
    reading_count: readings.filter(isLive).length,
    series_count: liveSeries.length,
    drop_count: drops.reduce((n, list) => n + list.filter(isLive).length, 0),
  };
}

/** What a write does to the stored counts: days whose counts to put, days (no longer live) whose counts go. */
export interface DayCountChanges {
  put: DaySummary[];
  remove: string[];
}

/**
 * The day counts after `records` are written, from the counts stored before plus what the records change.
 * `previous[i]` is the stored version of `records[i]` before the write (undefined for a new record).
 * Reads only the state before the write, so it must run before the write's puts (in the same transaction).
 *
 * The records may come in any order (a drop may come before its series). So a series that becomes live, dies
 * or moves to another day carries the drops already stored for it; those are the only drops read. A day that
 * was not live before (new, revived) or whose counts are missing starts from a count of what was stored for it.
 */
export async function dayCountsAfter(tx: StoreTx, records: readonly LogRecord[], previous: readonly (LogRecord | undefined)[]): Promise<DayCountChanges> {
  const readingDelta = new Map<string, number>();
  const seriesDelta = new Map<string, number>();
  const dropDelta = new Map<string, number>();
  const add = (map: Map<string, number>, key: string | null, n: number) => {
    if (key !== null && n !== 0) map.set(key, (map.get(key) ?? 0) + n);
  };
  const dayBefore = new Map<string, LogRecord | undefined>();
  const dayAfter = new Map<string, LogRecord | undefined>();
  const seriesBefore = new Map<string, SeriesRecord | undefined>();
  const seriesAfter = new Map<string, SeriesRecord | undefined>();
  /** Live drops gained (or lost) by each series in this write. */
  const dropsGained = new Map<string, number>();
  const liveReadingDay = (r: LogRecord | undefined) => (isLive(r) && r.kind === 'reading' ? r.day_id : null);
  const asSeries = (r: LogRecord | undefined) => (r?.kind === 'series' ? r : undefined);
  records.forEach((record, i) => {
    const prior = previous[i];
    switch (record.kind) {
      case 'day':
        dayBefore.set(record.id, prior);
        dayAfter.set(record.id, record);
        break;
      case 'reading': {
        const from = liveReadingDay(prior);
        const to = liveReadingDay(record);
        if (from !== to) {
          add(readingDelta, from, -1);
          add(readingDelta, to, 1);
        }
        break;
      }
      case 'series':
        seriesBefore.set(record.id, asSeries(prior));
        seriesAfter.set(record.id, record);
        break;
      case 'drop':
        if (isLive(prior) && prior.kind === 'drop') add(dropsGained, prior.series_id, -1);
        if (isLive(record)) add(dropsGained, record.series_id, 1);
        break;
      case 'site':
      case 'specimen':
        break;
    }
  });
  // Series not written whose drops changed: stored, and the same before and after.
  const otherSeries = [...dropsGained.keys()].filter((id) => !seriesAfter.has(id));
  (await tx.getMany('series', otherSeries)).forEach((s, i) => {
    seriesBefore.set(otherSeries[i]!, s);
    seriesAfter.set(otherSeries[i]!, s);
  });
  const dayOf = (s: SeriesRecord | undefined) => (isLive(s) ? s.day_id : null);
  const moved: { id: string; from: string | null; to: string | null }[] = [];
  for (const [id, after] of seriesAfter) {
    const from = dayOf(seriesBefore.get(id));
    const to = dayOf(after);
    const gained = dropsGained.get(id) ?? 0;
    if (from === to) add(dropDelta, to, gained);
    else {
      add(seriesDelta, from, -1);
      add(seriesDelta, to, 1);
      moved.push({ id, from, to });
    }
  }
  // The drops stored before the write go with a series that changes day or liveness.
  const storedDrops = await Promise.all(moved.map(({ id }) => tx.getAllByIndex('drop', 'by_series', id)));
  moved.forEach(({ id, from, to }, i) => {
    const had = storedDrops[i]!.filter(isLive).length;
    add(dropDelta, from, -had);
    add(dropDelta, to, had + (dropsGained.get(id) ?? 0));
  });

  const days = new Set([...dayAfter.keys(), ...readingDelta.keys(), ...seriesDelta.keys(), ...dropDelta.keys()]);
  const otherDays = [...days].filter((id) => !dayAfter.has(id));
  (await tx.getMany('day', otherDays)).forEach((d, i) => {
    dayBefore.set(otherDays[i]!, d);
    dayAfter.set(otherDays[i]!, d);
  });
  const remove = [...days].filter((id) => !isLive(dayAfter.get(id)));
  const put = await Promise.all(
    [...days]
      .filter((id) => isLive(dayAfter.get(id)))
      .map(async (dayId): Promise<DaySummary> => {
        const stored = isLive(dayBefore.get(dayId)) ? await tx.getSummary(dayId) : undefined;
        const base = stored ?? (await countDay(tx, dayId));
        return {
          day_id: dayId,
          reading_count: base.reading_count + (readingDelta.get(dayId) ?? 0),
          series_count: base.series_count + (seriesDelta.get(dayId) ?? 0),
          drop_count: base.drop_count + (dropDelta.get(dayId) ?? 0),
        };
      }),
  );
  return { put, remove };
}

/** The requests that store the changed counts (to be awaited with the rest of the write). */
export function writeDayCounts(tx: StoreTx, changes: DayCountChanges): Promise<void>[] {
  return [...changes.put.map((summary) => tx.putSummary(summary)), ...changes.remove.map((dayId) => tx.deleteSummary(dayId))];
}
