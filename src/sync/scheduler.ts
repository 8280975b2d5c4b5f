/**
 * When to sync: on start, when the connection returns (the online event; Background Sync where the browser has
 * it, so the service worker can sync with the page closed), after a change, and again after a failure with a
 * growing, jittered delay (exponential back-off). A failure that waiting cannot cure (a wrong password, no
 * folder set up) is not retried by itself: it waits for the next start, online event or request.
 *
 * One run at a time: a request during a run queues one more run after it, however many requests come.
 *
 * A run may carry its caller's progress listener and Cancel (a "Sync now" on the Send screen). A cancelled run
 * rejects with TransferCancelled: that is no failure, so it neither counts towards the back-off nor schedules a
 * retry, and a retry already waiting keeps waiting.
 */
import type { TransferOptions } from '../log';
import { SyncError } from './errors';
import type { SyncReport } from './sync-run';

export type SyncReason = 'start' | 'online' | 'change' | 'manual' | 'retry' | 'background';

export interface SchedulerOptions {
  run: (reason: SyncReason, transfer?: TransferOptions) => Promise<SyncReport>;
  /** First retry after this long (default 5 s), doubling up to maxDelayMs (default 15 min). */
  baseDelayMs?: number;
  maxDelayMs?: number;
  setTimeout?: (fn: () => void, ms: number) => unknown;
  clearTimeout?: (handle: unknown) => void;
  /** In [0, 1); spreads the retries of many phones after an outage. */
  random?: () => number;
  onReport?: (report: SyncReport) => void;
  /** Called after a failure worth retrying, e.g. to register Background Sync. */
  onRetryableFailure?: (report: SyncReport) => void;
}

/** The delay before retry number `failures` (1, 2, ...): base·2^(failures−1), capped, times a factor in [0.5, 1). */
export function backoffDelay(failures: number, baseMs: number, maxMs: number, random: number): number {
  const raw = Math.min(maxMs, baseMs * 2 ** Math.max(0, failures - 1));
  return Math.round(raw * (0.5 + random / 2));
}

export class SyncScheduler {
  private current: Promise<SyncReport> | null = null;
  private queued: Promise<SyncReport> | null = null;
  /** The progress listener and Cancel of the latest request waiting in the queue. */
  private queuedTransfer: TransferOptions | undefined;
  private retryTimer: unknown = null;
  private failures = 0;
  private stopped = false;
  /** The delay of the retry waiting now, if any (for the screens and tests). */
  nextRetryMs: number | null = null;
  lastReport: SyncReport | null = null;

  constructor(private readonly options: SchedulerOptions) {}

  get running(): boolean {
    return this.current !== null;
  }

  /** Sync now, or right after the run in progress; `transfer` follows that run (its progress, its Cancel). */
  request(reason: SyncReason, transfer?: TransferOptions): Promise<SyncReport> {
    if (this.stopped) return Promise.reject(new SyncError({ code: 'sync-stopped', field: null, value: null, allowed: null, message: 'the sync scheduler is stopped' }));
    if (reason !== 'retry') this.cancelRetry();
    if (!this.current) return this.start(reason, transfer);
    if (transfer) this.queuedTransfer = transfer;
    if (!this.queued) {
      const next = () => {
        const waiting = this.queuedTransfer;
        this.queuedTransfer = undefined;
        return this.start(reason, waiting);
      };
      this.queued = this.current.then(next, next);
      this.queued.finally(() => (this.queued = null)).catch(() => undefined);
    }
    return this.queued;
  }

  stop(): void {
    this.stopped = true;
    this.cancelRetry();
  }

  private cancelRetry(): void {
    if (this.retryTimer !== null) (this.options.clearTimeout ?? ((h) => clearTimeout(h as ReturnType<typeof setTimeout>)))(this.retryTimer);
    this.retryTimer = null;
    this.nextRetryMs = null;
  }

  private start(reason: SyncReason, transfer?: TransferOptions): Promise<SyncReport> {
    // A run rejects only when its caller cancelled it (TransferCancelled): not a failure, so `after` does not
    // count it and no retry is scheduled; the caller gets the rejection.
    const run = this.options.run(reason, transfer).then((report) => {
      this.after(report);
      return report;
    });
    this.current = run;
    run.finally(() => {
      if (this.current === run) this.current = null;
    }).catch(() => undefined);
    return run;
  }

  private after(report: SyncReport): void {
    this.lastReport = report;
    this.options.onReport?.(report);
    if (report.ok) {
      this.failures = 0;
      return;
    }
    this.failures++;
    if (!report.error?.retryable || this.stopped) return;
    this.options.onRetryableFailure?.(report);
    const delay = backoffDelay(this.failures, this.options.baseDelayMs ?? 5000, this.options.maxDelayMs ?? 15 * 60_000, (this.options.random ?? Math.random)());
    this.cancelRetry();
    this.nextRetryMs = delay;
    this.retryTimer = (this.options.setTimeout ?? ((fn, ms) => setTimeout(fn, ms)))(() => {
      this.retryTimer = null;
      this.nextRetryMs = null;
      if (!this.stopped) this.request('retry').catch(() => undefined);
    }, delay);
  }
}

/** The tag of the Background Sync registration; the service worker's 'sync' handler looks for it. */
export const BACKGROUND_SYNC_TAG = 'plummet-office-folder';

export interface TriggerEnvironment {
  addEventListener?(type: 'online', listener: () => void): void;
  removeEventListener?(type: 'online', listener: () => void): void;
  /** navigator.serviceWorker.ready, where there is a service worker. */
  serviceWorkerReady?: Promise<{ sync?: { register(tag: string): Promise<void> } }>;
}

/** Ask the browser to wake the service worker for a sync once it is online again (where it can). */
export async function requestBackgroundSync(env: TriggerEnvironment): Promise<boolean> {
  try {
    const registration = await env.serviceWorkerReady;
    if (!registration?.sync) return false;
    await registration.sync.register(BACKGROUND_SYNC_TAG);
    return true;
  } catch {
    return false;
  }
}

/** Sync on start and on every online event; returns a function that stops listening. */
export function connectSyncTriggers(scheduler: SyncScheduler, env: TriggerEnvironment): () => void {
  const online = () => void scheduler.request('online').catch(() => undefined);
  env.addEventListener?.('online', online);
  void scheduler.request('start').catch(() => undefined);
  return () => env.removeEventListener?.('online', online);
}

/** The page's own environment for the triggers. */
export function browserTriggerEnvironment(): TriggerEnvironment {
  const sw = typeof navigator !== 'undefined' ? navigator.serviceWorker : undefined;
  return {
    addEventListener: (type, fn) => globalThis.addEventListener(type, fn),
    removeEventListener: (type, fn) => globalThis.removeEventListener(type, fn),
    serviceWorkerReady: sw ? (sw.ready as unknown as TriggerEnvironment['serviceWorkerReady']) : undefined,
  };
}
