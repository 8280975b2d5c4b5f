// The IndexedDB schema of the log, in a file of its own so the database opening and its upgrades both use it
// without importing each other.
import type { DBSchema } from 'idb';
import type { DayRecord, DropRecord, ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from '../log';
import type { DaySummary, DraftEntry } from './types';

/** The drops of one series, by series id. */
export interface DropPack {
  series_id: string;
  /** Sorted by id. */
  drops: DropRecord[];
}

/** Which series' pack holds each drop, for the drop ids that fall in one bucket (drop-packs.ts, whereBucket). */
export interface DropWhere {
  bucket: number;
  /** Drop id → series id. */
  places: Record<string, string>;
}

export interface LogDB extends DBSchema {
  site: { key: string; value: SiteRecord };
  specimen: { key: string; value: SpecimenRecord };
  day: { key: string; value: DayRecord; indexes: { by_date: string; by_site: string } };
  reading: { key: string; value: ReadingRecord; indexes: { by_day: string } };
  series: { key: string; value: SeriesRecord; indexes: { by_day: string; by_specimen: string } };
  /** Versions 1 to 4: one value per drop. Version 5 moved them into drop_pack and removed this store; it is named
   *  here for the upgrades that ran before (upgrades.ts). */
  drop: { key: string; value: DropRecord; indexes: { by_series: string } };
  /** Since version 5: the drops of one series (every version, tombstones too) in one value, sorted by id. */
  drop_pack: { key: string; value: DropPack };
  /** Since version 5: the series of every drop, in a fixed number of buckets by a hash of the drop id (a drop is
   *  found with one get, the whole log's ids are read in one go, and no index is kept up to date per drop). */
  drop_where: { key: number; value: DropWhere };
  /** Unsaved form input, by form key. */
  draft: { key: string; value: DraftEntry };
  /** Device id, clock stamp, persistence answer, storage estimate, last export, unsent count, settings. */
  meta: { key: string; value: { key: string; value: unknown } };
  /** Since version 2: counts per day, so the list of days opens without reading every drop. */
  day_summary: { key: string; value: DaySummary };
}
