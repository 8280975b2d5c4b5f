/**
 * What a storage engine must provide for the log store: atomic transactions over a few named stores.
 * The log logic (create-log-store.ts) is written once over this; IndexedDB and the in-memory twin implement it.
 */
import type { LogRecord, RecordKind, RecordOf } from '../log';
import type { DaySummary, DraftEntry, MetaKey, MetaValues } from './types';

/** The indexes the screens need, by store, and the record field each one is over. */
export const INDEX_FIELDS = {
  day: { by_date: 'date', by_site: 'site_id' },
  reading: { by_day: 'day_id' },
  series: { by_day: 'day_id', by_specimen: 'specimen_id' },
  drop: { by_series: 'series_id' },
} as const;

export type IndexedKind = keyof typeof INDEX_FIELDS;
export type IndexName<K extends IndexedKind> = keyof (typeof INDEX_FIELDS)[K] & string;

export interface StoreTx {
  get<K extends RecordKind>(kind: K, id: string): Promise<RecordOf[K] | undefined>;
  /**
   * The stored versions of many records of one kind, in the order of `ids` (undefined where none is stored).
   * One result per id; a bulk import asks for tens of thousands at once, so an engine should not make one
   * request per id when most of them are absent.
   */
  getMany<K extends RecordKind>(kind: K, ids: readonly string[]): Promise<(RecordOf[K] | undefined)[]>;
  /** All records of a kind in id order. */
  getAll<K extends RecordKind>(kind: K): Promise<RecordOf[K][]>;
  /** Records whose indexed field equals `key` (all of them in index order when `key` is undefined). */
  getAllByIndex<K extends IndexedKind>(kind: K, index: IndexName<K>, key?: string): Promise<RecordOf[K][]>;
  /** `watch.onStep(n)` is called as the first n records are written, every `watch.every`; when it throws, the
   *  promise rejects with its error (and the transaction, failing, writes nothing). */
  putRecords(records: readonly LogRecord[], watch?: PutWatch): Promise<void>;

  getSummary(dayId: string): Promise<DaySummary | undefined>;
  getAllSummaries(): Promise<DaySummary[]>;
  putSummary(summary: DaySummary): Promise<void>;
  deleteSummary(dayId: string): Promise<void>;

  /** Typed by the key (MetaValues): the engine keeps what was put under a key and gives it back as it was. */
  getMeta<K extends MetaKey>(key: K): Promise<MetaValues[K] | undefined>;
  putMeta<K extends MetaKey>(key: K, value: MetaValues[K]): Promise<void>;

  getDraft(key: string): Promise<DraftEntry | undefined>;
  putDraft(entry: DraftEntry): Promise<void>;
  deleteDraft(key: string): Promise<void>;
}

export interface PutWatch {
  every: number;
  onStep(written: number): void;
}

export interface WriteTxOptions {
  /**
   * 'strict' waits until the data is on disk (survives a power cut); 'relaxed' until the operating system has
   * it (survives a crash of the browser). Measured records use strict, drafts and bookkeeping relaxed.
   */
  durability: 'strict' | 'relaxed';
}

export interface StoreBackend {
  /**
   * Run `fn` in one transaction. If `fn` throws or the engine fails, nothing of it is written and the promise
   * rejects: with fn's own error, or a StoreError ('storage-full', 'store-closed', 'transaction-failed').
   *
   * `fn` must await only operations of `tx`: an IndexedDB transaction commits by itself as soon as no request
   * is pending, so awaiting anything else (a fetch, a timer) lets it close halfway (the idb README's
   * "transaction lifetime" warning).
   */
  read<T>(fn: (tx: StoreTx) => Promise<T>): Promise<T>;
  write<T>(fn: (tx: StoreTx) => Promise<T>, options: WriteTxOptions): Promise<T>;
  readonly closed: boolean;
  close(): void;
}
