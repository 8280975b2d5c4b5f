/**
 * Words and names for what leaves or enters the phone on the Send screen: the label a file name carries (site and
 * date), and the days and sites an incoming file holds, so the crew knows what they are about to merge.
 */
import type { LogRecord } from '../log';

/** The part of a day list entry these names need. */
export interface DayName {
  id: string;
  date: string;
  site_name: string | null;
}

/** Sites as they go into a file name: one site by its name, more by the first and how many others. */
function sitesLabel(names: readonly string[]): string {
  const distinct = [...new Set(names)];
  if (distinct.length === 0) return 'no-site';
  if (distinct.length === 1) return distinct[0]!;
  return `${distinct[0]}-and-${distinct.length - 1}-more`;
}

/**
 * The date and the label of an export's file name: a day by its own date and site; the whole log by today's date
 * and its sites (the latest day's site first); the catalogue as such.
 */
export function exportNaming(part: string, days: readonly DayName[], today: string): { date: string; label: string } {
  if (part === 'catalogue') return { date: today, label: 'catalogue' };
  const day = days.find((d) => d.id === part);
  if (day) return { date: day.date, label: sitesLabel([day.site_name ?? 'unknown-site']) };
  const latestFirst = [...days].sort((a, b) => b.date.localeCompare(a.date));
  return { date: today, label: sitesLabel(latestFirst.map((d) => d.site_name ?? 'unknown-site')) };
}

/** The stem of the two CSV files' names ("plummet-2026-06-14-Tower_Hill"), safe in any file system. */
export function tablesFileStem(date: string, label: string): string {
  return `plummet-${date}-${label}`.replace(/[^A-Za-z0-9_.~-]/g, '_');
}

/** One day an incoming file holds: its date, its site's name (from the file or this phone), and whether it is new here. */
export interface IncomingDay {
  id: string;
  date: string;
  site: string;
  isNew: boolean;
}

/** The days (with their sites) in an incoming file, newest first; removed days are left out. */
export function incomingDays(incoming: readonly LogRecord[], local: readonly LogRecord[]): IncomingDay[] {
  const siteNames = new Map<string, string>();
  for (const r of [...local, ...incoming]) if (r.kind === 'site' && !r.deleted) siteNames.set(r.id, r.name);
  const localIds = new Set(local.map((r) => r.id));
  return incoming
    .filter((r): r is Extract<LogRecord, { kind: 'day' }> => r.kind === 'day' && !r.deleted)
    .map((d) => ({ id: d.id, date: d.date, site: siteNames.get(d.site_id) ?? 'a site not in the file', isNew: !localIds.has(d.id) }))
    .sort((a, b) => b.date.localeCompare(a.date) || a.site.localeCompare(b.site));
}

/** The names of the sites an incoming file holds. */
export function incomingSites(incoming: readonly LogRecord[]): string[] {
  return [...new Set(incoming.filter((r) => r.kind === 'site' && !r.deleted).map((r) => (r as Extract<LogRecord, { kind: 'site' }>).name))].sort();
}
