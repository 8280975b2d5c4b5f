/**
 * What sync and import need from the log's storage. The store (src/store, LogStore) satisfies it; the tests
 * use an in-memory twin. Settings, sync state and the conflict list live in the store's meta entries.
 */
import type { LogRecord, PutRecordsOptions } from '../log';

export interface RecordSource {
  /** Every record as stored, tombstones included. */
  allRecords(options: { includeDeleted: true }): Promise<LogRecord[]>;
  /** Already-merged records, written in one transaction: all or nothing, also when cancelled (options.signal). */
  putRecords(records: LogRecord[], options?: PutRecordsOptions): Promise<void>;
  getMeta(key: string): Promise<unknown>;
  setMeta(key: string, value: unknown): Promise<void>;
  /** This phone's id; it names the phone's file in the office folder. */
  deviceId(): Promise<string>;
  /** Where the store counts changes not yet sent: how many there are now. */
  status?(): Promise<{ unsentChanges: number }>;
  /** Where the store counts changes not yet sent: the log was sent at `now`, with `sentChanges` of them. */
  markSent?(now?: Date | number, sentChanges?: number): Promise<void>;
}

/** The meta keys this folder uses. */
export const SYNC_META = {
  settings: 'sync_settings',
  state: 'sync_state',
  conflicts: 'log_conflicts',
  /** Conflicts a person settled, with the reason (import-log.ts SettledConflict). */
  settled: 'log_conflicts_settled',
} as const;
