/**
 * The data the store hands to the screens and the sync layer, and the browser facilities it is given.
 */
import type {
  BodyOf,
  DayRecord,
  DropRecord,
  IsoDate,
  IsoInstant,
  ReadingRecord,
  RecordKind,
  SeriesRecord,
  SiteRecord,
  SpecimenRecord,
} from '../log';

/** One line of the list of days. */
export interface DayListItem {
  id: string;
  date: IsoDate;
  site_id: string;
  /** Null when the site record is missing (it may still be on its way from another phone). */
  site_name: string | null;
  crew: string[];
  notes: string;
  reading_count: number;
  series_count: number;
  drop_count: number;
  updated_at: IsoInstant;
}

/** Everything needed to show one day. Deleted records are left out; drops are in series order, then seq. */
export interface DayView {
  day: DayRecord;
  site: SiteRecord | null;
  readings: ReadingRecord[];
  series: SeriesRecord[];
  drops: DropRecord[];
  specimens: SpecimenRecord[];
}

/** The removed records of one day, to show as removed and restore; newest removal first. */
export interface RemovedInDay {
  readings: ReadingRecord[];
  series: SeriesRecord[];
  /** Removed drops of the day's live and removed series. */
  drops: DropRecord[];
}

/** Counts kept per day so the list of days opens without reading every drop (schema version 2). */
export interface DaySummary {
  day_id: string;
  reading_count: number;
  series_count: number;
  drop_count: number;
}

type CreateAction<K extends RecordKind> = { op: 'create'; kind: K; body: BodyOf[K]; id?: string };
type ReviseAction<K extends RecordKind> = { op: 'revise'; kind: K; id: string; patch: Partial<BodyOf[K]>; reason?: string | null; expectedRev?: string };
type RemoveAction<K extends RecordKind> = { op: 'remove'; kind: K; id: string; reason: string; expectedRev?: string };
/** Brings a removed record back (a day or series with what was removed together with it). */
type RestoreAction<K extends RecordKind> = { op: 'restore'; kind: K; id: string; reason: string; expectedRev?: string };

/** One step of a user action; commit() applies a list of them in one transaction. */
export type LogAction = {
  [K in RecordKind]: CreateAction<K> | ReviseAction<K> | RemoveAction<K> | RestoreAction<K>;
}[RecordKind];

export interface WriteOptions {
  /** Delete this draft in the same transaction: if the save fails, the draft stays. */
  clearDraft?: string;
}

export interface ReviseOptions extends WriteOptions {
  /**
   * The record's `rev` when the form was opened. Compared inside the write: if the record changed since (another
   * tab, a sync, an import), the revision is refused with StoreError 'changed-elsewhere' and nothing is written.
   */
  expectedRev?: string;
}

export interface DraftEntry<T = unknown> {
  key: string;
  value: T;
  saved_at: IsoInstant;
}

export interface PersistenceAnswer {
  /** What navigator.storage.persist() answered; null when the browser has no such call. */
  persisted: boolean | null;
  asked_at: IsoInstant;
}

export interface StorageEstimate {
  usage_bytes: number | null;
  quota_bytes: number | null;
  measured_at: IsoInstant;
}

/**
 * What the meta store holds, by key. Other parts of the app may add keys by declaration merging:
 * `declare module '../store/types' { interface MetaValues { my_key: MyType } }`.
 */
export interface MetaValues {
  device_id: string;
  /** The newest clock stamp this device has issued or seen, so stamps keep rising across reloads and tabs. */
  clock: string;
  persistence: PersistenceAnswer;
  storage_estimate: StorageEstimate;
  /** When the log was last exported or synced. */
  last_sent_at: IsoInstant;
  /** Record changes made on this device since then. */
  unsent_changes: number;
  settings: Record<string, unknown>;
  /** Set when a fresh database was opened where a log used to be; cleared by importing its records again. */
  erased_log: ErasedLog | null;
}
export type MetaKey = keyof MetaValues & string;

export type RiskReason = 'log-erased' | 'not-installed' | 'not-persistent' | 'unsent-changes' | 'storage-nearly-full';

/** A log that was on this phone and is gone: the browser erased its database (see LossWitness). */
export interface ErasedLog {
  /** The device id of the erased log: its records carry it, so an import of the last export brings them back. */
  device_id: string;
  noticed_at: IsoInstant;
}

export interface StoreStatus {
  /** Whether the browser promised to keep this site's storage; null when it cannot tell. */
  persistent: boolean | null;
  /** Whether the app runs installed (display-mode standalone or similar); null when it cannot tell. */
  installed: boolean | null;
  usage_bytes: number | null;
  quota_bytes: number | null;
  lastSentAt: IsoInstant | null;
  unsentChanges: number;
  /** The log the browser erased, until its records are imported again; null normally. */
  erasedLog: ErasedLog | null;
  atRisk: boolean;
  reasons: RiskReason[];
}

/** The part of navigator.storage the store uses; every member may be missing in some browser. */
export interface StorageManagerLike {
  persist?(): Promise<boolean>;
  persisted?(): Promise<boolean>;
  estimate?(): Promise<{ usage?: number; quota?: number }>;
}

/**
 * A small note kept outside IndexedDB (localStorage in the browser) that a log with records existed here.
 * Chromium deletes an origin's whole IndexedDB when a write fails because the disk is full; without a note
 * elsewhere the app would simply start again empty. Clearing site data on purpose clears the note too.
 */
export interface LossWitness {
  read(key: string): string | null;
  write(key: string, value: string): void;
}

/** Browser facilities, handed in so the store runs in Node tests too (see browser-environment.ts). */
export interface StoreEnvironment {
  /** Wall-clock milliseconds. */
  now(): number;
  /** Fills the array with random bytes (crypto.getRandomValues). */
  random(bytes: Uint8Array): Uint8Array;
  storage: StorageManagerLike | null;
  /** True when the app runs from the home screen; null when the browser cannot tell. */
  isInstalled(): boolean | null;
  /** Where to note that a log exists, to notice when the browser erased it; null for none. */
  witness?: LossWitness | null;
}
