// The office-folder sync as the page runs it: the sync layer's auto-sync (on start, on the online event, after
// failures with back-off, Background Sync registered after a failure), and a report for the screens to show.
// Its code loads only when it is needed: at start where an office folder is set up, or when a screen or the
// service worker asks for it.
import { startAutoSync, type AutoSync, type SyncReport } from '../sync';
import type { LogStore } from '../store';
import type { TransferOptions } from '../log';
import { syncWiring } from './sync-wiring';

export interface SyncService {
  /** A sync now, or right after the one running; with a progress listener and Cancel (rejects with
   *  TransferCancelled when cancelled). */
  syncNow(reason?: Parameters<AutoSync['syncNow']>[0], transfer?: TransferOptions): Promise<SyncReport>;
  lastReport: SyncReport | null;
  subscribe(fn: (report: SyncReport) => void): () => void;
}

let running: SyncService | null = null;

/** The app's sync service, started on first use once the shell has handed over the store (null before that). */
export function currentSyncService(): SyncService | null {
  const wiring = syncWiring();
  if (!running && wiring) running = createSyncService(wiring.store, () => wiring.onChanged());
  return running;
}

export function startSyncService(store: LogStore, onChanged: () => void): SyncService {
  running ??= createSyncService(store, onChanged);
  return running;
}

function createSyncService(store: LogStore, onChanged: () => void): SyncService {
  const listeners = new Set<(r: SyncReport) => void>();
  const service: SyncService = {
    syncNow: (reason, transfer) => auto.syncNow(reason, transfer),
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
  return service;
}
