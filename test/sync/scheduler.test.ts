import { describe, expect, it, vi } from 'vitest';
import { backoffDelay, BACKGROUND_SYNC_TAG, connectSyncTriggers, requestBackgroundSync, SyncScheduler } from '../../src/sync/scheduler';
import type { SyncReport } from '../../src/sync/sync-run';
import { TransferCancelled, type TransferOptions } from '../../src/log/transfer-progress';

function report(ok: boolean, retryable = true, code = 'sync-network'): SyncReport {
  return {
    ok,
    started_at: '',
    finished_at: '',
    own_file: '',
    merged: [],
    skipped: 0,
    problems: [],
    uploaded: ok,
    conflicts: [],
    error: ok ? null : { code, message: code, status: null, retryable },
  };
}

/** Timers under the test's control. */
function clock() {
  const timers: { at: number; fn: () => void; id: number }[] = [];
  let now = 0;
  let next = 1;
  return {
    setTimeout: (fn: () => void, ms: number) => {
      const id = next++;
      timers.push({ at: now + ms, fn, id });
      return id;
    },
    clearTimeout: (id: unknown) => {
      const i = timers.findIndex((t) => t.id === id);
      if (i >= 0) timers.splice(i, 1);
    },
    pending: () => timers.map((t) => t.at - now),
    async advance(ms: number) {
      now += ms;
      for (const t of timers.filter((t) => t.at <= now)) {
        timers.splice(timers.indexOf(t), 1);
        t.fn();
      }
      await new Promise((r) => setTimeout(r, 0));
    },
  };
}

describe('the back-off delay', () => {
  it('doubles from the base with each failure, up to the cap', () => {
    expect([1, 2, 3, 4, 10].map((n) => backoffDelay(n, 5000, 60_000, 1 - 1e-12))).toEqual([5000, 10000, 20000, 40000, 60000]);
  });

  it('is spread over half to all of that by the random factor (jitter)', () => {
    expect(backoffDelay(3, 5000, 60_000, 0)).toBe(10000);
    expect(backoffDelay(3, 5000, 60_000, 0.5)).toBe(15000);
  });
});

describe('the sync scheduler', () => {
  it('runs one sync at a time, and one more after it however many requests came meanwhile', async () => {
    let release!: () => void;
    const run = vi.fn(() => new Promise<SyncReport>((resolve) => (release = () => resolve(report(true)))));
    const scheduler = new SyncScheduler({ run });
    const first = scheduler.request('start');
    const queued = [scheduler.request('change'), scheduler.request('change'), scheduler.request('online')];
    expect(run).toHaveBeenCalledTimes(1);
    release();
    await first;
    await new Promise((r) => setTimeout(r, 0));
    expect(run).toHaveBeenCalledTimes(2);
    release();
    await Promise.all(queued);
    expect(run).toHaveBeenCalledTimes(2);
  });

  it('retries a failure that waiting can cure after a growing delay, and stops once it succeeds', async () => {
    const c = clock();
    const results = [report(false), report(false), report(true)];
    const run = vi.fn(async () => results.shift()!);
    const onRetryableFailure = vi.fn();
    const scheduler = new SyncScheduler({ run, baseDelayMs: 1000, random: () => 0.9999, setTimeout: c.setTimeout, clearTimeout: c.clearTimeout, onRetryableFailure });
    await scheduler.request('start');
    expect(scheduler.nextRetryMs).toBe(1000);
    await c.advance(1000);
    expect(run).toHaveBeenCalledTimes(2);
    expect(scheduler.nextRetryMs).toBe(2000);
    await c.advance(1999);
    expect(run).toHaveBeenCalledTimes(2);
    await c.advance(1);
    expect(run).toHaveBeenCalledTimes(3);
    expect(scheduler.nextRetryMs).toBeNull();
    expect(c.pending()).toEqual([]);
    expect(onRetryableFailure).toHaveBeenCalledTimes(2);
  });

  it('does not retry by itself what waiting cannot cure (a wrong password)', async () => {
    const c = clock();
    const run = vi.fn(async () => report(false, false, 'sync-unauthorized'));
    const scheduler = new SyncScheduler({ run, setTimeout: c.setTimeout, clearTimeout: c.clearTimeout });
    await scheduler.request('start');
    expect(c.pending()).toEqual([]);
    expect(scheduler.lastReport?.error?.code).toBe('sync-unauthorized');
  });

  it('syncs at once when asked while a retry waits, instead of waiting for it', async () => {
    const c = clock();
    const run = vi.fn(async () => report(false));
    const scheduler = new SyncScheduler({ run, baseDelayMs: 60_000, setTimeout: c.setTimeout, clearTimeout: c.clearTimeout });
    await scheduler.request('start');
    expect(c.pending()).toHaveLength(1);
    await scheduler.request('online');
    expect(run).toHaveBeenCalledTimes(2);
    expect(c.pending()).toHaveLength(1);
  });
});

describe('the sync triggers', () => {
  it('sync on start and on every online event', async () => {
    const listeners: (() => void)[] = [];
    const reasons: string[] = [];
    const scheduler = new SyncScheduler({ run: async (reason) => (reasons.push(reason), report(true)) });
    const stop = connectSyncTriggers(scheduler, {
      addEventListener: (_type, fn) => listeners.push(fn),
      removeEventListener: (_type, fn) => listeners.splice(listeners.indexOf(fn), 1),
    });
    await new Promise((r) => setTimeout(r, 0));
    listeners.forEach((fn) => fn());
    await new Promise((r) => setTimeout(r, 0));
    expect(reasons).toEqual(['start', 'online']);
    stop();
    expect(listeners).toEqual([]);
  });

  it('register Background Sync with the service worker where the browser has it', async () => {
    const register = vi.fn(async () => undefined);
    expect(await requestBackgroundSync({ serviceWorkerReady: Promise.resolve({ sync: { register } }) })).toBe(true);
    expect(register).toHaveBeenCalledWith(BACKGROUND_SYNC_TAG);
    expect(await requestBackgroundSync({ serviceWorkerReady: Promise.resolve({}) })).toBe(false);
    expect(await requestBackgroundSync({})).toBe(false);
    const refused = vi.fn(async () => Promise.reject(new Error('NotAllowedError')));
    expect(await requestBackgroundSync({ serviceWorkerReady: Promise.resolve({ sync: { register: refused } }) })).toBe(false);
  });
});

describe('a run cancelled by its caller', () => {
  it('is no failure: no retry is scheduled, the failures in a row stay, and the caller gets TransferCancelled', async () => {
    const c = clock();
    const results: (() => Promise<SyncReport>)[] = [async () => report(false), async () => Promise.reject(new TransferCancelled('uploading'))];
    const run = vi.fn((_reason: string, _transfer?: TransferOptions) => results.shift()!());
    const scheduler = new SyncScheduler({ run, baseDelayMs: 1000, random: () => 0.9999, setTimeout: c.setTimeout, clearTimeout: c.clearTimeout });
    await scheduler.request('start');
    expect(scheduler.nextRetryMs).toBe(1000);
    const signal = new AbortController().signal;
    const onProgress = vi.fn();
    await expect(scheduler.request('manual', { signal, onProgress })).rejects.toBeInstanceOf(TransferCancelled);
    // The caller's progress and Cancel went to the run.
    expect(run).toHaveBeenLastCalledWith('manual', { signal, onProgress });
    // A manual request cleared the waiting retry; the cancel schedules none, and the last report is the failure.
    expect(c.pending()).toEqual([]);
    expect(scheduler.nextRetryMs).toBeNull();
    expect(scheduler.lastReport?.ok).toBe(false);
    // The next failure counts as the second in a row (delay doubled), not as a first after a cancel.
    results.push(async () => report(false));
    await scheduler.request('online');
    expect(scheduler.nextRetryMs).toBe(2000);
  });

  it('hands a request made while another run goes on its own progress and Cancel, for the run after it', async () => {
    let release!: () => void;
    const run = vi.fn((_reason: string, _transfer?: TransferOptions) => new Promise<SyncReport>((resolve) => (release = () => resolve(report(true)))));
    const scheduler = new SyncScheduler({ run });
    const first = scheduler.request('start');
    const signal = new AbortController().signal;
    const onProgress = vi.fn();
    const mine = scheduler.request('manual', { signal, onProgress });
    expect(run).toHaveBeenCalledTimes(1);
    expect(run).toHaveBeenLastCalledWith('start', undefined);
    release();
    await first;
    await new Promise((r) => setTimeout(r, 0));
    expect(run).toHaveBeenLastCalledWith('manual', { signal, onProgress });
    release();
    await mine;
  });
});
