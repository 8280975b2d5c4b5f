import { render } from 'preact';
import './styles.css';
import { App, preloadScreen } from './App';
import { parseRoute } from './router';
import { AppProvider, loadSettings } from './app-context';
import { registerServiceWorker, type UpdateHandle } from './service-worker';
import { openLogStore, preloadWriteChecks, type LogStore } from '../store';
import { browserEnvironment } from '../store/page';
import { SYNC_META } from '../sync';
import { describeError } from './errors';
import { provideSyncWiring } from './sync-wiring';
import { whenIdle } from './lazy';

export async function mountApp(root: HTMLElement): Promise<void> {
  let pending: UpdateHandle | null = null;
  const listeners = new Set<(u: UpdateHandle) => void>();
  const updates = {
    subscribe(fn: (u: UpdateHandle) => void) {
      listeners.add(fn);
      if (pending) fn(pending);
      return () => void listeners.delete(fn);
    },
  };
  // The worker registers once the page has loaded and the browser is idle: its install downloads the whole
  // precache, which must not compete with the first screen's own code.
  afterLoad(() =>
    idleCallback(() =>
      void registerServiceWorker((u) => {
        pending = u;
        for (const fn of listeners) fn(u);
      }).catch(() => undefined),
    ),
  );
  // The first screen's code loads while the store opens, not after.
  const route = parseRoute(location.hash);
  preloadScreen(route);
  try {
    const store = await openLogStore({
      environment: browserEnvironment(),
      onVersionChange: () => {
        // Another tab opened a newer version of the database: this tab must reload to keep writing.
        root.insertAdjacentHTML('afterbegin', '<p class="notice notice-warn" role="alert">Plummet was updated in another tab. Reload this page to go on.</p>');
      },
    });
    const [settings, status] = await Promise.all([loadSettings(store), store.status().catch(() => undefined)]);
    preloadScreen(route, settings.currentDayId);
    let bump: () => void = () => undefined;
    render(
      <AppProvider store={store} initialSettings={settings} initialStatus={status} onReady={(notify) => (bump = notify)}>
        <App updates={updates} />
      </AppProvider>,
      root,
    );
    startSyncWhenWanted(store, () => bump());
    // The record checks every write needs, in memory once the first screen is idle (store/load-write-checks.ts).
    afterLoad(() => void whenIdle().then(preloadWriteChecks));
  } catch (error) {
    root.innerHTML = '';
    const p = document.createElement('p');
    p.className = 'notice notice-bad';
    p.setAttribute('role', 'alert');
    p.textContent = `Plummet cannot open its storage on this phone: ${describeError(error)} If the browser is in a private mode, open Plummet in a normal tab.`;
    root.append(p);
  }
}

/**
 * The sync code loads only where it has work: after the first screen, when an office folder is set up; when the
 * Send screen asks for it; or when the service worker asks the page to sync. A phone without a folder never
 * downloads it at start.
 */
function startSyncWhenWanted(store: LogStore, onChanged: () => void): void {
  provideSyncWiring({ store, onChanged });
  const start = () => import('./sync-service').then((m) => m.startSyncService(store, onChanged));
  window.addEventListener('plummet-sync-now', () => void start().then((s) => s.syncNow('background').catch(() => undefined)));
  void store.getMeta(SYNC_META.settings).then(
    (settings) => {
      if (settings) afterLoad(() => void whenIdle().then(start));
    },
    () => undefined,
  );
}

/**
 * Idle time without the idle-loads mark (lazy.tsx): the worker's registration (workbox-window, about 2 KB) counts
 * as part of the first screen in the size budget, which is the stricter reading.
 */
function idleCallback(fn: () => void): void {
  if (typeof requestIdleCallback === 'function') requestIdleCallback(() => fn(), { timeout: 2000 });
  else setTimeout(fn, 50);
}

function afterLoad(fn: () => void): void {
  if (document.readyState === 'complete') fn();
  else window.addEventListener('load', () => fn(), { once: true });
}
