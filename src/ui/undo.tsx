// The one undo of the app: after an action a screen calls offerUndo() with what the action wrote, and a bar at the
// bottom offers to take it back, one tap, for a few seconds. Undoing writes new versions (store.undo): a record made
// is removed, a record removed is restored, a record changed gets its old values back; nothing is erased.
import { createContext, type ComponentChildren } from 'preact';
import { useCallback, useContext, useEffect, useMemo, useRef, useState } from 'preact/hooks';
import type { LogRecord } from '../log';
import { useApp } from './app-context';
import { describeError } from './errors';

/** How long the bar stays: long enough to read a short line and reach the button, short enough not to linger. */
export const UNDO_SHOW_MS = 8000;

interface Offer {
  /** What was done, in a few words: "Drop 4 added". */
  label: string;
  written: readonly LogRecord[];
  id: number;
}

interface UndoApi {
  offerUndo(label: string, written: readonly LogRecord[]): void;
}

const UndoContext = createContext<UndoApi>({ offerUndo: () => {} });

export function useUndo(): UndoApi {
  return useContext(UndoContext);
}

export function UndoProvider({ children }: { children: ComponentChildren }) {
  const app = useApp();
  const [offer, setOffer] = useState<Offer | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const next = useRef(0);

  const offerUndo = useCallback((label: string, written: readonly LogRecord[]) => {
    if (written.length === 0) return;
    setMessage(null);
    setOffer({ label, written, id: ++next.current });
  }, []);

  useEffect(() => {
    if (!offer) return;
    const timer = setTimeout(() => setOffer((o) => (o?.id === offer.id ? null : o)), UNDO_SHOW_MS);
    return () => clearTimeout(timer);
  }, [offer]);

  useEffect(() => {
    if (!message) return;
    const timer = setTimeout(() => setMessage(null), UNDO_SHOW_MS);
    return () => clearTimeout(timer);
  }, [message]);

  const undo = async () => {
    if (!offer) return;
    const taken = offer;
    setOffer(null);
    try {
      await app.store.undo(taken.written, `undone: ${taken.label}`);
      setMessage(`Undone: ${taken.label}. The history keeps both versions.`);
      app.notifyChanged();
    } catch (e) {
      setMessage(`Could not undo: ${describeError(e)}`);
    }
  };

  const api = useMemo(() => ({ offerUndo }), [offerUndo]);
  return (
    <UndoContext.Provider value={api}>
      {children}
      <div class="undo-bar" role="status" aria-live="polite" hidden={!offer && !message}>
        {offer ? (
          <>
            <span class="undo-text">{offer.label.charAt(0).toUpperCase() + offer.label.slice(1)}</span>
            <button type="button" class="btn undo-btn" onClick={() => void undo()}>
              Undo
            </button>
          </>
        ) : (
          <span class="undo-text">{message}</span>
        )}
      </div>
    </UndoContext.Provider>
  );
}
