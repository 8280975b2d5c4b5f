/// <reference lib="webworker" />
declare const self: ServiceWorkerGlobalScope;
// The office-folder sync run by the service worker itself, for Background Sync with no page open.
// Through the worker-safe faces only: the page's environment (matchMedia, localStorage) is in src/store/page.
import { openLogStore, type StoreEnvironment } from '../src/store';
import { BACKGROUND_SYNC_TAG, syncFolder, type LockManagerLike, type SyncReport } from '../src/sync';

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
