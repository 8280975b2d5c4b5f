/**
 * The storage interface of the log. The IndexedDB adapter (openLogStore) and the in-memory twin
 * (createMemoryStore) both implement it; test/store/suite.ts holds the one test suite both must pass.
 */
import type { BodyOf, LogRecord, PutRecordsOptions, RecordKind, RecordOf, Revision } from '../log';
import type {
  DayListItem,
  DayView,
  DraftEntry,
  LogAction,
  MetaKey,
  MetaValues,
  RemovedInDay,
  ReviseOptions,
  StoreStatus,
  WriteOptions,
} from './types';

export interface LogStore {
  get<K extends RecordKind>(kind: K, id: string): Promise<RecordOf[K] | undefined>;
  /** Records of one kind; tombstones only when asked for. */
  list<K extends RecordKind>(kind: K, options?: { includeDeleted?: boolean }): Promise<RecordOf[K][]>;
  /** The days, newest first, with their site's name and their counts. */
  listDays(): Promise<DayListItem[]>;
  /** One day with everything needed to show it; 'not-found' when there is no such day or it is deleted. */
  loadDay(dayId: string): Promise<DayView>;
  /** The removed readings, series and drops of one day (tombstones), to list as removed and restore. */
  loadRemoved(dayId: string): Promise<RemovedInDay>;

  /** A drop's `seq` is the one asked for or, if a live drop of its series already has it or a higher one, the next
   *  after the highest: derived inside the write, so two tabs adding to one series never give one number twice. */
  create<K extends RecordKind>(kind: K, body: BodyOf[K], options?: WriteOptions & { id?: string }): Promise<RecordOf[K]>;
  /** With `expectedRev`, refused ('changed-elsewhere') when the record is no longer at that revision. */
  revise<K extends RecordKind>(kind: K, id: string, patch: Partial<BodyOf[K]>, reason?: string | null, options?: ReviseOptions): Promise<RecordOf[K]>;
  /** Leaves a tombstone. Removing a day or a series removes what is inside it in the same transaction. */
  remove<K extends RecordKind>(kind: K, id: string, reason: string, options?: WriteOptions): Promise<RecordOf[K]>;
  /** Brings a removed record back as a new version (a reason is kept); a day or a series brings back what was
   *  removed together with it. Refused ('reference-missing') while what it points at is removed. */
  restore<K extends RecordKind>(kind: K, id: string, reason: string, options?: WriteOptions): Promise<RecordOf[K]>;
  /** Undoes an action that wrote `written` (as it left them), as one new action: nothing is erased. Refused
   *  ('changed-elsewhere') when one of the records has changed since. Returns what the undo wrote. */
  undo(written: readonly LogRecord[], reason: string): Promise<LogRecord[]>;
  /** Several steps of one user action in one transaction: all are written or none. Returns what was written. */
  commit(actions: LogAction[], options?: WriteOptions): Promise<LogRecord[]>;
  history<K extends RecordKind>(kind: K, id: string): Promise<Revision<BodyOf[K]>[]>;

  /** Every record as stored, for export and sync; tombstones included unless asked otherwise. */
  allRecords(options?: { includeDeleted?: boolean }): Promise<LogRecord[]>;
  /** Already-merged records written as they are, in one transaction (import, merge, sync): all or nothing, also
   *  when cancelled through `options.signal`. */
  putRecords(records: LogRecord[], options?: PutRecordsOptions): Promise<void>;

  getDraft<T = unknown>(key: string): Promise<DraftEntry<T> | undefined>;
  putDraft<T>(key: string, value: T): Promise<void>;
  deleteDraft(key: string): Promise<void>;

  getMeta<K extends MetaKey>(key: K): Promise<MetaValues[K] | undefined>;
  setMeta<K extends MetaKey>(key: K, value: MetaValues[K]): Promise<void>;
  /** This phone's id: made once at random and kept. */
  deviceId(): Promise<string>;
  /** A fresh record id, for actions whose records point at each other (a series and its drops). */
  newId(): string;

  status(): Promise<StoreStatus>;
  /**
   * Record that the log was exported or synced at `now`. With `sentChanges` (the unsentChanges read when
   * the snapshot was taken), changes made while sending stay counted; without it the count goes to zero.
   */
  markSent(now?: Date | number, sentChanges?: number): Promise<void>;
  /** Ask the browser to keep the storage (navigator.storage.persist); done by itself at the first save. */
  requestPersistence(): Promise<boolean | null>;

  close(): void;
}
