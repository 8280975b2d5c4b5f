/**
 * Errors of the office-folder sync. Each has a stable code, the offending value, the HTTP status where there
 * was one, and whether trying again later can help (a server that is down, slow or failing) or not (a wrong
 * password, a URL without HTTPS): the scheduler retries only the first kind.
 */

export type SyncErrorCode =
  | 'sync-url-invalid'
  | 'sync-url-insecure'
  | 'sync-url-credentials'
  | 'sync-username-invalid'
  | 'sync-password-invalid'
  | 'sync-not-configured'
  | 'sync-disabled'
  | 'sync-timeout'
  | 'sync-network'
  | 'sync-unauthorized'
  | 'sync-forbidden'
  | 'sync-folder-missing'
  | 'sync-server'
  | 'sync-http'
  | 'sync-precondition'
  | 'sync-too-large'
  | 'sync-bad-response'
  | 'sync-file-invalid';

const RETRYABLE: ReadonlySet<SyncErrorCode> = new Set([
  'sync-timeout',
  'sync-network',
  'sync-server',
  'sync-http',
  'sync-precondition',
  'sync-bad-response',
]);

export class SyncError extends Error {
  readonly retryable: boolean;

  constructor(
    readonly code: SyncErrorCode,
    readonly value: unknown,
    message: string,
    /** The HTTP status of the answer that caused it, or null when there was no answer. */
    readonly status: number | null = null,
  ) {
    super(message);
    this.name = 'SyncError';
    this.retryable = RETRYABLE.has(code);
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
