import { render } from 'preact';
import './styles.css';
import { App, preloadScreen } from './App';
import { parseRoute } from './router';
import { AppProvider, loadSettings } from './app-context';
import { registerServiceWorker, type UpdateHandle } from './service-worker';
import { openLogStore } from '../store';
import { browserEnvironment } from '../store/page';
import { describeError } from './errors';

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
  registerServiceWorker((u) => {
    pending = u;
    for (const fn of listeners) fn(u);
  });
  // The first screen's code loads while the store opens, not after.
  preloadScreen(parseRoute(location.hash).screen);
  try {
    const store = await openLogStore({
      environment: browserEnvironment(),
      onVersionChange: () => {
        // Another tab opened a newer version of the database: this tab must reload to keep writing.
        root.insertAdjacentHTML('afterbegin', '<p class="notice notice-warn" role="alert">Plummet was updated in another tab. Reload this page to go on.</p>');
      },
    });
    const settings = await loadSettings(store);
    let bump: () => void = () => undefined;
    render(
      <AppProvider store={store} initialSettings={settings} onReady={(notify) => (bump = notify)}>
        <App updates={updates} />
      </AppProvider>,
      root,
    );
    // Sync code loads after the first paint: the shell stays small, and a phone without a folder never needs it.
    void import('./sync-service').then((m) => m.startSyncService(store, () => bump()));
  } catch (error) {
    root.innerHTML = '';
    const p = document.createElement('p');
    p.className = 'notice notice-bad';
    p.setAttribute('role', 'alert');
    p.textContent = `Plummet cannot open its storage on this phone: ${describeError(error)} If the browser is in a private mode, open Plummet in a normal tab.`;
    root.append(p);
  }
}
