/// <reference lib="webworker" />
declare const self: ServiceWorkerGlobalScope;
// The office-folder sync run by the service worker itself, for Background Sync with no page open.
// Imported past the store's index on purpose: the index also brings the page's environment (matchMedia,
// localStorage), which a worker does not have.
import { openLogStore } from '../src/store/idb-store';
import type { StoreEnvironment } from '../src/store/types';
import { syncFolder, type LockManagerLike, type SyncReport } from '../src/sync/sync-run';
import { BACKGROUND_SYNC_TAG } from '../src/sync/scheduler';

export { BACKGROUND_SYNC_TAG };

declare const __APP_VERSION__: string;

/** The store's facilities in a worker: no display mode to read and no localStorage for the loss witness. */
function workerEnvironment(): StoreEnvironment {
  return {
    now: () => Date.now(),
    random: (bytes) => crypto.getRandomValues(bytes),
    storage: self.navigator.storage ?? null,
    isInstalled: () => null,
    witness: null,
  };
}

export async function syncFromWorker(): Promise<SyncReport> {
  const store = await openLogStore({ environment: workerEnvironment() });
  try {
    return await syncFolder({
      source: store,
      appVersion: __APP_VERSION__,
      // The same lock the pages take, so a page opened meanwhile waits instead of syncing alongside.
      locks: (self.navigator.locks as unknown as LockManagerLike | undefined) ?? null,
    });
  } finally {
    store.close();
  }
}
