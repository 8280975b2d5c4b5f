// The IndexedDB schema of the log, in a file of its own so the database opening and its upgrades both use it
// without importing each other.
import type { DBSchema } from 'idb';
import type { DayRecord, DropRecord, ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from '../log';
import type { DaySummary, DraftEntry } from './types';

export interface LogDB extends DBSchema {
  site: { key: string; value: SiteRecord };
  specimen: { key: string; value: SpecimenRecord };
  day: { key: string; value: DayRecord; indexes: { by_date: string; by_site: string } };
  reading: { key: string; value: ReadingRecord; indexes: { by_day: string } };
  series: { key: string; value: SeriesRecord; indexes: { by_day: string; by_specimen: string } };
  drop: { key: string; value: DropRecord; indexes: { by_series: string } };
  /** Unsaved form input, by form key. */
  draft: { key: string; value: DraftEntry };
  /** Device id, clock stamp, persistence answer, storage estimate, last export, unsent count, settings. */
  meta: { key: string; value: { key: string; value: unknown } };
  /** Since version 2: counts per day, so the list of days opens without reading every drop. */
  day_summary: { key: string; value: DaySummary };
}
