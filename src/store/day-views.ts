/**
 * What the screens read about days: the list of days with their counts (kept per day, see day-counts.ts),
 * and one day with everything needed to show it, tombstones left out.
 */
import type { RecordOf } from '../log';
import { countDay } from './day-counts';
import { StoreError } from './errors';
import { byCreated, compareKeys, isLive } from './live-records';
import type { LogStore } from './log-store';
import type { StoreContext } from './store-context';
import type { DayListItem, DayView, RemovedInDay } from './types';

export function dayViews(ctx: StoreContext): Pick<LogStore, 'listDays' | 'loadDay' | 'loadRemoved'> {
  const { backend } = ctx;
  return {
    async listDays() {
      ctx.ensureOpen();
      return backend.read(async (tx) => {
        const [days, sites, summaries] = await Promise.all([tx.getAllByIndex('day', 'by_date'), tx.getAll('site'), tx.getAllSummaries()]);
        const siteName = new Map(sites.map((s) => [s.id, s.name]));
        const counts = new Map(summaries.map((s) => [s.day_id, s]));
        const liveDays = days.filter(isLive);
        // A missing summary would be a fault; count that day the slow way rather than show zeros.
        for (const day of liveDays) if (!counts.has(day.id)) counts.set(day.id, await countDay(tx, day.id));
        return liveDays
          .map((day): DayListItem => {
            const c = counts.get(day.id)!;
            return {
              id: day.id,
              date: day.date,
              site_id: day.site_id,
              site_name: siteName.get(day.site_id) ?? null,
              crew: day.crew,
              notes: day.notes,
              reading_count: c.reading_count,
              series_count: c.series_count,
              drop_count: c.drop_count,
              updated_at: day.updated_at,
            };
          })
          .sort((a, b) => compareKeys(b.date, a.date) || compareKeys(b.updated_at, a.updated_at) || compareKeys(a.id, b.id));
      });
    },

    async loadDay(dayId) {
      ctx.ensureOpen();
      return backend.read(async (tx): Promise<DayView> => {
        const day = await tx.get('day', dayId);
        if (!day) throw new StoreError({ code: 'not-found', field: null, value: dayId, allowed: null, message: `no day ${dayId}` });
        if (day.deleted) throw new StoreError({ code: 'not-found', field: null, value: dayId, allowed: null, message: `day ${dayId} is deleted` });
        const [site, readings, series] = await Promise.all([
          tx.get('site', day.site_id),
          tx.getAllByIndex('reading', 'by_day', dayId),
          tx.getAllByIndex('series', 'by_day', dayId),
        ]);
        const liveSeries = series.filter(isLive).sort((a, b) => compareKeys(a.started_at, b.started_at) || byCreated(a, b));
        const specimenIds = [...new Set(liveSeries.map((s) => s.specimen_id))];
        const [dropLists, specimens] = await Promise.all([
          Promise.all(liveSeries.map((s) => tx.getAllByIndex('drop', 'by_series', s.id))),
          Promise.all(specimenIds.map((id) => tx.get('specimen', id))),
        ]);
        return {
          day,
          site: site ?? null,
          readings: readings.filter(isLive).sort((a, b) => compareKeys(a.taken_at, b.taken_at) || byCreated(a, b)),
          series: liveSeries,
          drops: dropLists.flatMap((list) => list.filter(isLive).sort((a, b) => a.seq - b.seq || compareKeys(a.captured_at, b.captured_at))),
          specimens: specimens.filter((s): s is RecordOf['specimen'] => s !== undefined),
        };
      });
    },

    async loadRemoved(dayId) {
      ctx.ensureOpen();
      return backend.read(async (tx): Promise<RemovedInDay> => {
        const [readings, series] = await Promise.all([tx.getAllByIndex('reading', 'by_day', dayId), tx.getAllByIndex('series', 'by_day', dayId)]);
        const dropLists = await Promise.all(series.map((s) => tx.getAllByIndex('drop', 'by_series', s.id)));
        const newestFirst = (a: { updated_at: string; id: string }, b: { updated_at: string; id: string }) => compareKeys(b.updated_at, a.updated_at) || compareKeys(a.id, b.id);
        return {
          readings: readings.filter((r) => r.deleted).sort(newestFirst),
          series: series.filter((s) => s.deleted).sort(newestFirst),
          drops: dropLists.flat().filter((d) => d.deleted).sort(newestFirst),
        };
      });
    },
  };
}
