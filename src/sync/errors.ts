/**
 * Errors of the office-folder sync. Each has a stable code, the offending value, the HTTP status where there
 * was one, and whether trying again later can help (a server that is down, slow or failing) or not (a wrong
 * password, a URL without HTTPS): the scheduler retries only the first kind.
 */
import { PlummetError, type PlummetErrorOptions } from '../errors';

export type SyncErrorCode =
  | 'sync-url-invalid'
  | 'sync-url-insecure'
  | 'sync-url-credentials'
  | 'sync-username-invalid'
  | 'sync-password-invalid'
  | 'sync-not-configured'
  | 'sync-disabled'
  /** The scheduler was stopped (the app is closing); nothing more is synced by it. */
  | 'sync-stopped'
  | 'sync-timeout'
  | 'sync-network'
  | 'sync-unauthorized'
  | 'sync-forbidden'
  | 'sync-folder-missing'
  | 'sync-server'
  | 'sync-http'
  | 'sync-precondition'
  | 'sync-too-large'
  /** 507 Insufficient Storage (RFC 4918 §11.5): the folder's disk or quota is full; only the office can help. */
  | 'sync-folder-full'
  /** The server answered with a redirect (3xx): not followed, so the log and the password never go elsewhere. */
  | 'sync-redirected'
  /** The server acknowledged an upload but holds something else afterwards (read back and compared). */
  | 'sync-upload-unverified'
  | 'sync-bad-response'
  | 'sync-file-invalid';

const RETRYABLE: ReadonlySet<SyncErrorCode> = new Set([
  'sync-timeout',
  'sync-network',
  'sync-server',
  'sync-http',
  'sync-precondition',
  'sync-bad-response',
  'sync-upload-unverified',
]);

export class SyncError extends PlummetError<SyncErrorCode> {
  readonly retryable: boolean;
  /** The HTTP status of the answer that caused it, or null when there was no answer. */
  readonly status: number | null;

  constructor(options: PlummetErrorOptions<SyncErrorCode> & { status?: number | null }) {
    super(options);
    this.name = 'SyncError';
    this.status = options.status ?? null;
    this.retryable = RETRYABLE.has(options.code);
  }
}

/** A plain object for storing or showing the error (sync state, test pages). */
export function describeError(error: unknown): { code: string; message: string; status: number | null; retryable: boolean } {
  if (error instanceof SyncError) return { code: error.code, message: error.message, status: error.status, retryable: error.retryable };
  const e = error as { code?: unknown; message?: unknown };
  return {
    code: typeof e?.code === 'string' ? e.code : 'sync-failed',
    message: String(e?.message ?? error),
    status: null,
    retryable: true,
  };
}
