/**
 * Sync for the screens in one call: a scheduler that syncs on start, on the online event, when asked, and
 * again after a failure with back-off; Background Sync registered after a failure where the browser has it (the
 * service worker then syncs when the connection returns, with the page closed); and what to show.
 */
import type { TransferOptions } from '../log';
import { SyncError } from './errors';
import { SYNC_META, type RecordSource } from './record-source';
import { loadSyncSettings } from './settings';
import type { SyncState } from './sync-state';
import { refusedReport, syncFolder, type LockManagerLike, type SyncReport } from './sync-run';
import { browserTriggerEnvironment, connectSyncTriggers, requestBackgroundSync, SyncScheduler, type SyncReason, type TriggerEnvironment } from './scheduler';

export interface SyncStatus {
  configured: boolean;
  enabled: boolean;
  folder_url: string | null;
  last_success_at: string | null;
  last_attempt_at: string | null;
  last_error: SyncState['last_error'];
  /** Runs failed in a row. */
  failures: number;
  /** Changes made on this phone not sent yet, where the store counts them; null where it does not. */
  unsent_changes: number | null;
}

/** What the settings screen shows: when the last sync succeeded, why the last one failed, what waits. */
export async function loadSyncStatus(source: RecordSource): Promise<SyncStatus> {
  const settings = await loadSyncSettings(source);
  const state = (await source.getMeta(SYNC_META.state)) as SyncState | undefined | null;
  const current = state && settings && state.folder_url === settings.folder_url ? state : null;
  return {
    configured: settings !== null,
    enabled: settings?.enabled ?? false,
    folder_url: settings?.folder_url ?? null,
    last_success_at: current?.last_success_at ?? null,
    last_attempt_at: current?.last_attempt_at ?? null,
    last_error: current?.last_error ?? null,
    failures: current?.failures ?? 0,
    unsent_changes: source.status ? (await source.status()).unsentChanges : null,
  };
}

export interface AutoSyncOptions {
  source: RecordSource;
  appVersion: string;
  /** The page's by default (window's online event, navigator.serviceWorker). */
  env?: TriggerEnvironment;
  /** navigator.locks by default, where there is one. */
  locks?: LockManagerLike | null;
  onReport?: (report: SyncReport) => void;
  baseDelayMs?: number;
  maxDelayMs?: number;
}

export interface AutoSync {
  scheduler: SyncScheduler;
  /** A sync now (or right after the one running), e.g. from a "Sync now" button or after a change; with the
   *  caller's progress listener and Cancel (a cancelled run rejects with TransferCancelled). */
  syncNow(reason?: SyncReason, transfer?: TransferOptions): Promise<SyncReport>;
  stop(): void;
}

export function startAutoSync(options: AutoSyncOptions): AutoSync {
  const env = options.env ?? browserTriggerEnvironment();
  const locks =
    options.locks !== undefined ? options.locks : typeof navigator !== 'undefined' && navigator.locks ? (navigator.locks as unknown as LockManagerLike) : null;
  const scheduler = new SyncScheduler({
    async run(reason, transfer) {
      const settings = await loadSyncSettings(options.source);
      if (settings && !settings.enabled && reason !== 'manual') {
        const device = await options.source.deviceId();
        return refusedReport(device, new SyncError({ code: 'sync-disabled', field: null, value: null, allowed: null, message: 'automatic sync is switched off in the settings' }), new Date().toISOString());
      }
      return syncFolder({ source: options.source, appVersion: options.appVersion, locks, ...(settings ? { settings } : {}), ...transfer });
    },
    baseDelayMs: options.baseDelayMs,
    maxDelayMs: options.maxDelayMs,
    onReport: options.onReport,
    onRetryableFailure: () => void requestBackgroundSync(env),
  });
  const disconnect = connectSyncTriggers(scheduler, env);
  return {
    scheduler,
    syncNow: (reason = 'manual', transfer) => scheduler.request(reason, transfer),
    stop() {
      disconnect();
      scheduler.stop();
    },
  };
}
