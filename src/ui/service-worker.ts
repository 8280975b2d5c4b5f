export interface UpdateHandle {
  /** Switch to the waiting version: the worker takes over and the page reloads once it controls it. */
  apply(): void;
}

/**
 * Registers the service worker. `onUpdateReady` is called when a new version has installed and waits (found
 * waiting at registration, or installed while the page is open); nothing switches until `apply()` is called
 * (the user tapped the notice), which sends the worker SKIP_WAITING and reloads once it has taken over.
 * A first install is no update: the worker claims the page itself. Written on the platform API alone (it is
 * this small), so the first screen carries no registration library.
 * Development builds skip registration (the dev server has no precache manifest).
 */
export function registerServiceWorker(onUpdateReady: (update: UpdateHandle) => void): void {
  if (import.meta.env.DEV || !('serviceWorker' in navigator)) return;
  const container = navigator.serviceWorker;
  const offer = (worker: ServiceWorker) =>
    onUpdateReady({
      apply() {
        container.addEventListener('controllerchange', () => window.location.reload(), { once: true });
        worker.postMessage({ type: 'SKIP_WAITING' });
      },
    });
  container.addEventListener('message', (event: MessageEvent) => {
    const data = event.data as { type?: string } | null;
    if (data?.type === 'SYNC_NOW') window.dispatchEvent(new CustomEvent('plummet-sync-now'));
  });
  container.register(`${import.meta.env.BASE_URL}sw.js`).then(
    (registration) => {
      if (registration.waiting && container.controller) offer(registration.waiting);
      registration.addEventListener('updatefound', () => {
        const worker = registration.installing;
        // Without a controller this is the first install, which takes over by itself.
        if (!worker || !container.controller) return;
        worker.addEventListener('statechange', () => {
          if (worker.state === 'installed') offer(worker);
        });
      });
    },
    () => undefined,
  );
}
