/** Errors of the store. Each has a stable code and the offending value; `cause` keeps the platform's own error. */
import { PlummetError, type PlummetErrorOptions } from '../errors';

export type StoreErrorCode =
  /** The browser refused to store more (QuotaExceededError). Nothing of the action was written. */
  | 'storage-full'
  | 'not-found'
  | 'already-exists'
  /** A record points at another record that does not exist (or is deleted). */
  | 'reference-missing'
  /** A record that live records still point at cannot be deleted. */
  | 'record-in-use'
  /** The record changed (another tab, a sync) since the form that edits it was opened: "changed elsewhere: reload". */
  | 'changed-elsewhere'
  /** The store was closed: by close(), by a newer version of the app in another tab, or by the browser. */
  | 'store-closed'
  /** The database on this phone was written by a newer version of the app than the one running. */
  | 'database-newer'
  | 'open-failed'
  | 'transaction-failed';

export class StoreError extends PlummetError<StoreErrorCode> {
  constructor(options: PlummetErrorOptions<StoreErrorCode>) {
    super(options);
    this.name = 'StoreError';
  }
}

export const STORAGE_FULL_MESSAGE =
  'The storage this browser gives Plummet is full. Nothing from this action was saved; everything saved before is ' +
  'kept and your unsaved input stays in the form. Export or sync the log and free space on the phone, then save again.';

/**
 * A disk that is full says so in the message of an UnknownError, not as a QuotaExceededError, when it runs out
 * before the browser's quota does (the usual case on a phone that is nearly full). Seen in Chromium:
 * "IO error: …leveldb/000048.log: FILE_ERROR_NO_SPACE". SQLite-based engines say "database or disk is full",
 * Firefox NS_ERROR_FILE_NO_DEVICE_SPACE (from memory), and the C library "No space left on device".
 */
const NO_SPACE = /NO_SPACE|NO_DEVICE_SPACE|disk is full|No space left/i;

export function isQuotaError(error: unknown): boolean {
  if (error instanceof StoreError) return error.code === 'storage-full';
  const e = error as { name?: unknown; message?: unknown; code?: unknown } | null;
  // Old WebKit used code 22 and the name QUOTA_EXCEEDED_ERR; Firefox also reports NS_ERROR_DOM_QUOTA_REACHED.
  if (e?.name === 'QuotaExceededError' || e?.name === 'NS_ERROR_DOM_QUOTA_REACHED' || e?.code === 22) return true;
  return typeof e?.message === 'string' && NO_SPACE.test(e.message);
}

export function storageFull(cause: unknown): StoreError {
  return new StoreError({ code: 'storage-full', field: null, value: (cause as { name?: unknown } | null)?.name ?? null, allowed: null, message: STORAGE_FULL_MESSAGE, cause });
}
