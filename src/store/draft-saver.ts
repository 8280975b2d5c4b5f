/**
 * Saves a form's unsaved input as the person types, so it comes back after a reload, a crash or an update.
 *
 * Writes are spaced, not postponed: the first change after a write is saved `delayMs` later at the latest,
 * with whatever the input is by then. (A plain debounce that restarts its timer on every key would never
 * save while someone keeps typing.)
 */
import type { LogStore } from './log-store';

export interface DraftSaver<T> {
  /** Note the input; it is written within delayMs. */
  save(value: T): void;
  /** Write the pending input now (on pagehide, before navigating away); resolves when it is stored. */
  flush(): Promise<void>;
  /** Drop the pending input and delete the stored draft (after the form was saved for real). */
  clear(): Promise<void>;
  /** True while input is waiting to be written. */
  readonly pending: boolean;
  /** The error of the last failed write (for example 'storage-full'), or null after a successful one. */
  readonly lastError: unknown;
}

type DraftStore = Pick<LogStore, 'putDraft' | 'deleteDraft'>;

export function createDraftSaver<T>(store: DraftStore, key: string, delayMs = 300): DraftSaver<T> {
  let timer: ReturnType<typeof setTimeout> | null = null;
  let hasPending = false;
  let pendingValue: T | undefined;
  let lastError: unknown = null;
  // Writes run one after the other, so an older value can never land after a newer one.
  let writing: Promise<void> = Promise.resolve();

  const write = (): Promise<void> => {
    if (timer !== null) clearTimeout(timer);
    timer = null;
    if (!hasPending) return writing;
    const value = pendingValue as T;
    hasPending = false;
    pendingValue = undefined;
    writing = writing.then(() =>
      store.putDraft(key, value).then(
        () => {
          lastError = null;
        },
        (error: unknown) => {
          // The previous draft stays stored; keep the newest input so the next change or flush retries it.
          lastError = error;
          if (!hasPending) {
            hasPending = true;
            pendingValue = value;
          }
        },
      ),
    );
    return writing;
  };

  return {
    save(value) {
      pendingValue = value;
      hasPending = true;
      if (timer === null) timer = setTimeout(() => void write(), delayMs);
    },
    flush: write,
    async clear() {
      if (timer !== null) clearTimeout(timer);
      timer = null;
      hasPending = false;
      pendingValue = undefined;
      await writing;
      await store.deleteDraft(key);
    },
    get pending() {
      return hasPending;
    },
    get lastError() {
      return lastError;
    },
  };
}
