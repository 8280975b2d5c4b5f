/**
 * What removing a record also removes (a day takes its readings, series and drops; a series its drops), or
 * why it may not be removed (a site, specimen or air reading that live records still use); and what restoring a
 * record brings back with it: what was removed together with it (same phone, same moment, same reason), not what was removed
 * on its own before.
 */
import type { LogRecord } from '../log';
import { StoreError } from './errors';
import type { Staging } from './staging';

export async function removalSet(record: LogRecord, staging: Staging): Promise<LogRecord[]> {
  const inUse = (what: string, n: number) =>
    new StoreError({ code: 'record-in-use', field: null, value: record.id, allowed: null, message: `${record.kind} ${record.id} is used by ${n} ${what}; change or remove those first` });
  switch (record.kind) {
    case 'site': {
      const days = await staging.referrers('day', 'by_site', record.id, (d) => d.site_id);
      if (days.length > 0) throw inUse(days.length === 1 ? 'day' : 'days', days.length);
      return [record];
    }
    case 'specimen': {
      const series = await staging.referrers('series', 'by_specimen', record.id, (s) => s.specimen_id);
      if (series.length > 0) throw inUse('series', series.length);
      return [record];
    }
    case 'reading': {
      const series = (await staging.referrers('series', 'by_day', record.day_id, (s) => s.day_id)).filter((s) => s.reading_id === record.id || s.reading_aloft_id === record.id);
      if (series.length > 0) throw inUse('series', series.length);
      return [record];
    }
    case 'series':
      return [record, ...(await staging.referrers('drop', 'by_series', record.id, (d) => d.series_id))];
    case 'day': {
      const [readings, series] = await Promise.all([
        staging.referrers('reading', 'by_day', record.id, (r) => r.day_id),
        staging.referrers('series', 'by_day', record.id, (s) => s.day_id),
      ]);
      const drops = await Promise.all(series.map((s) => staging.referrers('drop', 'by_series', s.id, (d) => d.series_id)));
      return [record, ...readings, ...series, ...drops.flat()];
    }
    case 'drop':
      return [record];
  }
}

/** Removed in the same action as `container`: the same phone wrote both tombstones at the same moment, for the same reason. */
const removalReason = (r: LogRecord) => r.history[r.history.length - 1]?.reason ?? null;
const removedWith = (container: LogRecord) => (r: LogRecord) =>
  r.device === container.device && r.updated_at === container.updated_at && removalReason(r) === removalReason(container);

/** The record to restore and, for a day or a series, what was removed with it; containers first. */
export async function restorationSet(record: LogRecord, staging: Staging): Promise<LogRecord[]> {
  const together = removedWith(record);
  switch (record.kind) {
    case 'series': {
      const drops = await staging.removedReferrers('drop', 'by_series', record.id, (d) => d.series_id);
      return [record, ...drops.filter(together)];
    }
    case 'day': {
      const [readings, series] = await Promise.all([
        staging.removedReferrers('reading', 'by_day', record.id, (r) => r.day_id),
        staging.removedReferrers('series', 'by_day', record.id, (s) => s.day_id),
      ]);
      const withDay = series.filter(together);
      const drops = await Promise.all(withDay.map((s) => staging.removedReferrers('drop', 'by_series', s.id, (d) => d.series_id)));
      return [record, ...readings.filter(together), ...withDay, ...drops.flat().filter(together)];
    }
    default:
      return [record];
  }
}
