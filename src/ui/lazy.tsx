import type { ComponentType } from 'preact';
import { useEffect, useState } from 'preact/hooks';

/**
 * A screen loaded on first use, so the first paint carries only the shell. Every chunk is precached by the
 * service worker, so this works offline too.
 */
export type LazyScreen<P extends object> = ComponentType<P> & { preload(): void };

export function lazyScreen<P extends object>(load: () => Promise<ComponentType<P>>): LazyScreen<P> {
  let loaded: ComponentType<P> | null = null;
  let loading: Promise<ComponentType<P>> | null = null;
  const start = () => {
    loading ??= load().then((c) => (loaded = c));
    return loading;
  };
  const Screen = function LazyScreen(props: P) {
    const [, setReady] = useState(0);
    const [error, setError] = useState<string | null>(null);
    useEffect(() => {
      if (loaded) return;
      start().then(
        () => setReady(1),
        (e: unknown) => {
          loading = null;
          setError(String(e));
        },
      );
    }, []);
    if (error) return <p role="alert">This screen could not be loaded: {error}</p>;
    if (!loaded) return <p class="hint">Loading…</p>;
    const C = loaded;
    return <C {...props} />;
  };
  /** Start loading now (the screen the page opens on, while the store opens). */
  Screen.preload = () => void start().catch(() => undefined);
  return Screen;
}
