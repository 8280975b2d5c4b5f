/** The browser's own facilities for the store: the one file of src/store that reaches for globals. */
import type { StoreEnvironment } from '../types';

/** Display modes in which the app runs from the home screen rather than in a browser tab. */
const INSTALLED_MODES = ['standalone', 'fullscreen', 'minimal-ui', 'window-controls-overlay'];

export function browserEnvironment(): StoreEnvironment {
  const nav = typeof navigator === 'undefined' ? undefined : navigator;
  return {
    now: () => Date.now(),
    // Bound: calling getRandomValues detached from `crypto` throws "Illegal invocation".
    random: (bytes) => crypto.getRandomValues(bytes),
    storage: nav?.storage ?? null,
    isInstalled() {
      // iOS Safari before display-mode support says so through navigator.standalone.
      if ((nav as { standalone?: boolean } | undefined)?.standalone === true) return true;
      if (typeof matchMedia !== 'function') return null;
      return INSTALLED_MODES.some((mode) => matchMedia(`(display-mode: ${mode})`).matches);
    },
    witness: {
      // localStorage lives apart from IndexedDB in every engine, so it outlives an IndexedDB the browser
      // deleted; it may be missing or refuse (private mode, full), and then there is simply no witness.
      read(key) {
        try {
          return globalThis.localStorage?.getItem(key) ?? null;
        } catch {
          return null;
        }
      },
      write(key, value) {
        try {
          globalThis.localStorage?.setItem(key, value);
        } catch {
          // no witness then
        }
      },
    },
  };
}
