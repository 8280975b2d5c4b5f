/**
 * How a long transfer (importing a file, exporting the log, a sync run) tells how far it is, and how it is
 * stopped. Plain types, so the pure core can report and the screens can show: a phase and a fraction, and a
 * signal the caller may raise (an AbortSignal is one). A transfer stopped on request throws TransferCancelled;
 * whatever it was writing is left as it was before it started.
 */
import { PlummetError } from '../errors';

/**
 * What a transfer is doing: each is worded for people on the screens (ui/progress-text.ts). An import goes
 * checking, reading, merging, writing; a sync run listing, downloading, checking, reading, merging, writing,
 * uploading, indexing (writing the phone's part index); the CSV tables computing.
 */
export type TransferPhase =
  | 'reading'
  | 'checking'
  | 'merging'
  | 'writing'
  | 'exporting'
  | 'listing'
  | 'downloading'
  | 'uploading'
  | 'indexing'
  | 'computing';

export interface TransferProgress {
  phase: TransferPhase;
  /** Units done in this phase (records, files); never above total. */
  done: number;
  /** Units in this phase; 0 when not known yet. */
  total: number;
}

export type ProgressListener = (progress: TransferProgress) => void;

/** What a transfer reads of its caller's signal: an AbortSignal fits, and so does a plain object in tests. */
export interface CancelSignal {
  readonly aborted: boolean;
}

export interface TransferOptions {
  onProgress?: ProgressListener;
  signal?: CancelSignal;
}

/**
 * Writing records merged from elsewhere (LogStore.putRecords, the sync's RecordSource): the transfer's progress and
 * signal, and the records the gate has already checked whole in this transfer (GateOptions.passed).
 */
export interface PutRecordsOptions extends TransferOptions {
  passed?: WeakSet<object>;
  /**
   * Merge each record with the version stored when the write runs (log/merge.ts mergeRecord) instead of replacing
   * it: for records merged against an earlier reading of the store (an import's preview), so an edit made since
   * is kept. A merge is a union of versions, so the result is the merge with the store as it is now.
   */
  mergeStored?: boolean;
}

/** A transfer stopped because its caller asked: nothing it was writing has changed. */
export class TransferCancelled extends PlummetError<'transfer-cancelled'> {
  constructor(phase: TransferPhase | null) {
    super({
      code: 'transfer-cancelled',
      field: null,
      value: phase,
      allowed: null,
      message: `cancelled${phase ? ` while ${phase}` : ''}: nothing was changed`,
    });
    this.name = 'TransferCancelled';
  }
}

/** Throws TransferCancelled when the signal has been raised. */
export function throwIfCancelled(signal: CancelSignal | undefined, phase: TransferPhase | null = null): void {
  if (signal?.aborted) throw new TransferCancelled(phase);
}

/** Records checked, merged or written between two reports (and between two chances to cancel). */
export const PROGRESS_STEP = 2500;
