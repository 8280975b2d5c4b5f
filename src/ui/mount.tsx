import { render } from 'preact';
import '../widgets';
import './styles.css';
import { App } from './App';
import { registerServiceWorker, type UpdateHandle } from './service-worker';

export function mountApp(root: HTMLElement): void {
  let pending: UpdateHandle | null = null;
  const listeners = new Set<(u: UpdateHandle) => void>();
  const updates = {
    subscribe(fn: (u: UpdateHandle) => void) {
      listeners.add(fn);
      if (pending) fn(pending);
    },
  };
  registerServiceWorker((u) => {
    pending = u;
    for (const fn of listeners) fn(u);
  });
  render(<App updates={updates} />, root);
}
