import type { ComponentType } from 'preact';
import { useEffect, useState } from 'preact/hooks';
import { Notice } from './Notice';

/**
 * A screen (or a part of one) loaded on first use, so the first paint carries only what it shows. Every chunk
 * is precached by the service worker, so this works offline too.
 */
export type LazyScreen<P extends object> = ComponentType<P> & { preload(): void };

export function lazyScreen<P extends object>(load: () => Promise<ComponentType<P>>, placeholder: string | null = 'Loading…'): LazyScreen<P> {
  let loaded: ComponentType<P> | null = null;
  let loading: Promise<ComponentType<P>> | null = null;
  const start = () => {
    loading ??= load().then((c) => (loaded = c));
    return loading;
  };
  const Screen = function LazyScreen(props: P) {
    const [C, setC] = useState<ComponentType<P> | null>(() => loaded);
    const [error, setError] = useState<string | null>(null);
    useEffect(() => {
      if (C) return;
      // Also when the code arrived between this render and the effect: the promise has settled by then.
      start().then(
        (c) => setC(() => c),
        (e: unknown) => {
          loading = null;
          setError(String(e));
        },
      );
    }, []);
    if (error) return <Notice tone="bad">This screen could not be loaded: {error}</Notice>;
    if (!C) return placeholder === null ? null : <p class="hint">{placeholder}</p>;
    return <C {...props} />;
  };
  /** Start loading now (the screen the page opens on, while the store opens). */
  Screen.preload = () => void start().catch(() => undefined);
  return Screen;
}

/** The performance mark set when the app first starts loading code it held back until the first screen was shown. */
export const IDLE_LOADS_MARK = 'plummet:idle-loads';

/**
 * Resolves when the browser is next idle (after the current screen has rendered), marking the first such moment
 * with IDLE_LOADS_MARK: what loads from here on is not part of the first screen (the size budget counts apart).
 */
export function whenIdle(): Promise<void> {
  return new Promise((resolve) => {
    const go = () => {
      if (performance.getEntriesByName(IDLE_LOADS_MARK).length === 0) performance.mark(IDLE_LOADS_MARK);
      resolve();
    };
    if (typeof requestIdleCallback === 'function') requestIdleCallback(go, { timeout: 1000 });
    else setTimeout(go, 50);
  });
}

/**
 * A module loaded once the screen using it has rendered and the browser is idle (figures that need the physics,
 * for example): null until it has arrived, so the screen shows everything else at once. Loaded once per page and
 * shared by every caller.
 */
export function lazyModule<M>(load: () => Promise<M>): () => M | null {
  let loaded: M | null = null;
  let loading: Promise<M> | null = null;
  return function useLazyModule() {
    const [module, setModule] = useState<M | null>(loaded);
    useEffect(() => {
      if (module) return;
      let live = true;
      loading ??= whenIdle()
        .then(load)
        .then((m) => (loaded = m));
      loading.then(
        (m) => live && setModule(() => m),
        () => {
          // Left as "not yet": the next screen that asks tries again.
          loading = null;
        },
      );
      return () => {
        live = false;
      };
    }, []);
    return module;
  };
}
