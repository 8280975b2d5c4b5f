export interface UpdateHandle {
  /** Switch to the waiting version: the worker takes over and the page reloads once it controls it. */
  apply(): void;
}

/**
 * Registers the service worker with workbox-window. `onUpdateReady` is called when a new version has
 * installed and waits; nothing switches until `apply()` is called (the user tapped the notice). The page calls
 * this once it is idle after load, and workbox-window is loaded then, so the first screen does not carry it
 * (it is precached like every chunk, so this works offline too).
 * Development builds skip registration (the dev server has no precache manifest).
 */
export async function registerServiceWorker(onUpdateReady: (update: UpdateHandle) => void): Promise<void> {
  if (import.meta.env.DEV || !('serviceWorker' in navigator)) return;
  const { Workbox } = await import('workbox-window');
  const wb = new Workbox(`${import.meta.env.BASE_URL}sw.js`);
  wb.addEventListener('waiting', () => {
    onUpdateReady({
      apply() {
        wb.addEventListener('controlling', () => window.location.reload());
        wb.messageSkipWaiting();
      },
    });
  });
  wb.addEventListener('message', (event) => {
    const data = event.data as { type?: string } | null;
    if (data?.type === 'SYNC_NOW') window.dispatchEvent(new CustomEvent('plummet-sync-now'));
  });
  await wb.register();
}
