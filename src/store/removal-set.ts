/**
 * What removing a record also removes (a day takes its readings, series and drops; a series its drops), or
 * why it may not be removed (a site, specimen or air reading that live records still use); and what restoring a
 * record brings back with it: what was removed together with it (same phone, same moment, same reason), not what was removed
 * on its own before.
 */
import type { LogRecord } from '../log';
import { StoreError } from './errors';
import type { Staging } from './staging';

/** How the crew knows a record: a site or specimen by its name, a day by its date, a reading by its time. */
function nameOf(record: LogRecord): string {
  switch (record.kind) {
    case 'site':
      return `The site “${record.name}”`;
    case 'specimen':
      return `The specimen “${record.name}”`;
    case 'reading':
      return `The air reading of ${record.taken_at.slice(0, 16).replace('T', ' ')} UTC`;
    case 'day':
      return `The day ${record.date}`;
    default:
      return `This ${record.kind}`;
  }
}

/** "1 day (2026-05-03)", "3 series", "4 days (2026-05-03, 2026-05-04, 2026-05-05, …)": at most three names. */
function counted(n: number, noun: string, names: readonly string[] = []): string {
  const plural = n === 1 || noun === 'series' ? noun : `${noun}s`;
  const shown = [...new Set(names)].sort();
  const list = shown.length ? ` (${shown.slice(0, 3).join(', ')}${shown.length > 3 ? ', …' : ''})` : '';
  return `${n} ${plural}${list}`;
}

export async function removalSet(record: LogRecord, staging: Staging): Promise<LogRecord[]> {
  // Named as the crew knows it (a site or specimen by its name, a reading by its time), with the records in the way.
  const inUse = (users: string, field: string) =>
    new StoreError({
      code: 'record-in-use',
      field,
      value: record.id,
      allowed: null,
      message: `${nameOf(record)} is still used by ${users}; change or remove ${users.startsWith('1 ') ? 'it' : 'them'} first`,
    });
  switch (record.kind) {
    case 'site': {
      const days = await staging.referrers('day', 'by_site', record.id, (d) => d.site_id);
      if (days.length > 0) throw inUse(counted(days.length, 'day', days.map((d) => d.date)), 'site_id');
      return [record];
    }
    case 'specimen': {
      const series = await staging.referrers('series', 'by_specimen', record.id, (s) => s.specimen_id);
      if (series.length > 0) throw inUse(counted(series.length, 'series'), 'specimen_id');
      return [record];
    }
    case 'reading': {
      const series = (await staging.referrers('series', 'by_day', record.day_id, (s) => s.day_id)).filter((s) => s.reading_id === record.id || s.reading_aloft_id === record.id);
      if (series.length > 0) throw inUse(counted(series.length, 'series'), 'reading_id');
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

/**
 * Removed in the same action as `container`: the same phone wrote both tombstones at the same moment, for the same reason.
 * A removal leaves its reason on the version it replaced; after a merge with an edit that crossed it (kept in the
 * history, with no reason, log/merge.ts), that version is no longer the last before the tombstone, so the reason
 * is the newest one in the history.
 */
const removalReason = (r: LogRecord) => r.history.findLast((h) => h.reason !== null)?.reason ?? null;
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
