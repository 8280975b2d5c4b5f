import { useEffect, useState } from 'preact/hooks';
import { useApp } from './app-context';

export type Loaded<T> = { state: 'loading' } | { state: 'ready'; value: T } | { state: 'failed'; error: Error };

/** Loads data from the store and loads it again after every write (and when `deps` change). */
export function useStoreData<T>(load: () => Promise<T>, deps: unknown[]): Loaded<T> {
  const { changes } = useApp();
  const [result, setResult] = useState<Loaded<T>>({ state: 'loading' });
  useEffect(() => {
    let live = true;
    load().then(
      (value) => live && setResult({ state: 'ready', value }),
      (error: unknown) => live && setResult({ state: 'failed', error: error instanceof Error ? error : new Error(String(error)) }),
    );
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [changes, ...deps]);
  return result;
}
