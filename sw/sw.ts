/// <reference lib="webworker" />
// Plummet's service worker: precaches the app shell so every navigation is answered offline,
// removes caches of older versions, and waits for the page's word before taking over (the page asks
// only when the user taps the update notice, so nobody is switched mid-entry).
import { cleanupOutdatedCaches, createHandlerBoundToURL, precacheAndRoute } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';
import { clientsClaim } from 'workbox-core';
import { BACKGROUND_SYNC_TAG, syncFromWorker } from './background-sync';

declare const self: ServiceWorkerGlobalScope & {
  __WB_MANIFEST: Array<{ url: string; revision: string | null }>;
};

precacheAndRoute(self.__WB_MANIFEST);
cleanupOutdatedCaches();
registerRoute(new NavigationRoute(createHandlerBoundToURL('index.html')));

// A first install takes control of the open page at once (there is no older version to protect);
// an update waits in the "waiting" state until the page sends SKIP_WAITING.
clientsClaim();

self.addEventListener('message', (event: ExtendableMessageEvent) => {
  const data = event.data as { type?: string } | null;
  if (data?.type === 'SKIP_WAITING') void self.skipWaiting();
});

// Background Sync: the page registers the tag after a failed sync; the browser wakes this worker once the phone
// is online again. With a window of the app open, that page syncs (it holds the live state); with none, the
// worker syncs itself from the same IndexedDB log. Throwing on a retryable failure lets the browser retry later.
self.addEventListener('sync', (event: Event) => {
  const e = event as ExtendableEvent & { tag?: string };
  if (e.tag !== BACKGROUND_SYNC_TAG) return;
  e.waitUntil(
    self.clients.matchAll({ type: 'window' }).then(async (clients) => {
      if (clients.length > 0) {
        for (const client of clients) client.postMessage({ type: 'SYNC_NOW' });
        return;
      }
      const report = await syncFromWorker();
      if (!report.ok && report.error?.retryable) throw new Error(report.error.code);
    }),
  );
});
