/// <reference lib="webworker" />
// Plummet's service worker: precaches the app shell so every navigation is answered offline,
// removes caches of older versions, and waits for the page's word before taking over (the page asks
// only when the user taps the update notice, so nobody is switched mid-entry).
import { cleanupOutdatedCaches, createHandlerBoundToURL, precacheAndRoute } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';
import { clientsClaim } from 'workbox-core';

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

// Background Sync: the page registers the tag when changes wait in the outbox; the worker wakes any open
// page to send them (the sync code itself runs in the page, which holds the store and the credentials).
self.addEventListener('sync', (event: Event) => {
  const e = event as ExtendableEvent & { tag?: string };
  if (e.tag !== 'plummet-office-folder') return;
  e.waitUntil(
    self.clients.matchAll({ type: 'window' }).then((clients) => {
      for (const client of clients) client.postMessage({ type: 'SYNC_NOW' });
    }),
  );
});
