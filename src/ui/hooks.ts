import { useEffect, useRef, useState } from 'preact/hooks';
import { createDraftSaver, type DraftSaver } from '../store';
import { useApp } from './app-context';
import { registerDraftFlusher } from './draft-registry';

// useStoreData lives apart, so the shell (which needs it for the first screen) does not carry the draft code.
export { useStoreData, type Loaded } from './use-store-data';

/**
 * A form's state that survives a reload, a crash or an update: every change is saved as a draft within
 * 300 ms, and the draft comes back when the form opens again. `clear()` after a real save.
 */
export function useDraft<T extends object>(key: string, initial: () => T): {
  value: T;
  ready: boolean;
  restored: boolean;
  set(patch: Partial<T>): void;
  replace(value: T): void;
  clear(): Promise<void>;
} {
  const { store } = useApp();
  const [value, setValue] = useState<T>(initial);
  const [ready, setReady] = useState(false);
  const [restored, setRestored] = useState(false);
  const saver = useRef<DraftSaver<T> | null>(null);
  const current = useRef(value);
  // The key whose form was typed into before its stored draft was read (effects run after the first paint, so
  // a quick hand can type before the read has even started).
  const touchedKey = useRef<string | null>(null);
  current.current = value;

  useEffect(() => {
    let live = true;
    const s = createDraftSaver<T>(store, key, 300);
    saver.current = s;
    const unregister = registerDraftFlusher(() => s.flush());
    const onHide = () => void s.flush();
    window.addEventListener('pagehide', onHide);
    store.getDraft<T>(key).then((draft) => {
      if (!live) return;
      // Someone who starts typing before the draft is read must not have their input replaced by it.
      if (touchedKey.current === key) {
        setReady(true);
        return;
      }
      if (draft) {
        setValue({ ...initial(), ...draft.value });
        setRestored(true);
      } else {
        setValue(initial());
        setRestored(false);
      }
      setReady(true);
    });
    return () => {
      live = false;
      void s.flush();
      unregister();
      window.removeEventListener('pagehide', onHide);
    };
    // `initial` is a new closure every render; only another store or key means another draft.
  }, [store, key]);

  return {
    value,
    ready,
    restored,
    set(patch) {
      touchedKey.current = key;
      const next = { ...current.current, ...patch };
      current.current = next;
      setValue(next);
      saver.current?.save(next);
    },
    replace(next) {
      touchedKey.current = key;
      current.current = next;
      setValue(next);
      saver.current?.save(next);
    },
    async clear() {
      await saver.current?.clear();
      setRestored(false);
    },
  };
}
