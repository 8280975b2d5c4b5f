// The office-folder sync as the page runs it: one scheduler for the app, started when a folder is set up,
// triggered on start, on the online event, after changes, by Background Sync (via the service worker's
// message) and by hand.
import {
  SyncScheduler,
  browserTriggerEnvironment,
  connectSyncTriggers,
  loadSyncSettings,
  requestBackgroundSync,
  syncFolder,
  type LockManagerLike,
  type RecordSource,
  type SyncReport,
} from '../sync';
import type { LogStore } from '../store';

export function recordSource(store: LogStore): RecordSource {
  return {
    allRecords: (o) => store.allRecords(o),
    putRecords: (r) => store.putRecords(r),
    getMeta: (key) => store.getMeta(key as never),
    setMeta: (key, value) => store.setMeta(key as never, value as never),
    deviceId: () => store.deviceId(),
    status: () => store.status(),
    markSent: (now, sent) => store.markSent(now, sent),
  };
}

export interface SyncService {
  scheduler: SyncScheduler;
  lastReport: SyncReport | null;
  subscribe(fn: (report: SyncReport) => void): () => void;
  /** Call after the folder settings change. */
  restart(): Promise<void>;
}

let running: SyncService | null = null;

/** The app's sync service, once started (the page starts it right after the first paint). */
export function currentSyncService(): SyncService | null {
  return running;
}

export function startSyncService(store: LogStore, onChanged: () => void): SyncService {
  running ??= createSyncService(store, onChanged);
  return running;
}

function createSyncService(store: LogStore, onChanged: () => void): SyncService {
  const source = recordSource(store);
  const listeners = new Set<(r: SyncReport) => void>();
  const env = browserTriggerEnvironment();
  let disconnect: (() => void) | null = null;
  const scheduler = new SyncScheduler({
    // The lock keeps two tabs of the app from syncing the same folder at once.
    run: () => syncFolder({ source, appVersion: __APP_VERSION__, locks: (navigator.locks as unknown as LockManagerLike | undefined) ?? null }),
    onReport(report) {
      service.lastReport = report;
      if (report.merged.length) onChanged();
      for (const fn of listeners) fn(report);
    },
    onRetryableFailure: () => void requestBackgroundSync(env),
  });
  const service: SyncService = {
    scheduler,
    lastReport: null,
    subscribe(fn) {
      listeners.add(fn);
      return () => listeners.delete(fn);
    },
    async restart() {
      disconnect?.();
      disconnect = null;
      const settings = await loadSyncSettings(source).catch(() => null);
      if (settings?.enabled) disconnect = connectSyncTriggers(scheduler, env);
    },
  };
  window.addEventListener('plummet-sync-now', () => void scheduler.request('background').catch(() => undefined));
  void service.restart();
  return service;
}
