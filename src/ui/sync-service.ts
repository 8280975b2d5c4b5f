// The office-folder sync as the page runs it: the sync layer's auto-sync (on start, on the online event, after
// failures with back-off, Background Sync registered after a failure), plus the service worker's wake-up
// message and a report for the screens to show.
import { startAutoSync, type AutoSync, type SyncReport } from '../sync';
import type { LogStore } from '../store';

export interface SyncService {
  /** A sync now, or right after the one running. */
  syncNow(reason?: Parameters<AutoSync['syncNow']>[0]): Promise<SyncReport>;
  lastReport: SyncReport | null;
  subscribe(fn: (report: SyncReport) => void): () => void;
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
  const listeners = new Set<(r: SyncReport) => void>();
  const service: SyncService = {
    syncNow: (reason) => auto.syncNow(reason),
    lastReport: null,
    subscribe(fn) {
      listeners.add(fn);
      return () => listeners.delete(fn);
    },
  };
  // Each run reads the folder settings afresh, so saving them needs no restart.
  const auto = startAutoSync({
    source: store,
    appVersion: __APP_VERSION__,
    onReport(report) {
      service.lastReport = report;
      if (report.merged.length) onChanged();
      for (const fn of listeners) fn(report);
    },
  });
  window.addEventListener('plummet-sync-now', () => void auto.syncNow('background').catch(() => undefined));
  return service;
}
