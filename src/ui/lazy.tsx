import type { ComponentType } from 'preact';
import { useEffect, useState } from 'preact/hooks';

/**
 * A screen loaded on first use, so the first paint carries only the shell. Every chunk is precached by the
 * service worker, so this works offline too.
 */
export function lazyScreen<P extends object>(load: () => Promise<ComponentType<P>>): ComponentType<P> {
  let loaded: ComponentType<P> | null = null;
  let loading: Promise<ComponentType<P>> | null = null;
  return function LazyScreen(props: P) {
    const [, setReady] = useState(0);
    const [error, setError] = useState<string | null>(null);
    useEffect(() => {
      if (loaded) return;
      loading ??= load();
      loading.then(
        (c) => {
          loaded = c;
          setReady(1);
        },
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
}
