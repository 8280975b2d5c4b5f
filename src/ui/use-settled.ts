import { useEffect, useState } from 'preact/hooks';

/** How long input must rest before a costly computation follows it, ms. */
export const SETTLE_MS = 300;

/**
 * The value once it has stopped changing for `delayMs` (the first value at once): a screen computes on what was
 * typed, not on every keystroke. `key` tells equal values apart from changed ones.
 */
export function useSettled<T>(value: T, delayMs = SETTLE_MS, key: (value: T) => string = (v) => JSON.stringify(v)): T {
  const [settled, setSettled] = useState(value);
  const k = key(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(timer);
    // Only a changed key restarts the wait.
  }, [k, delayMs]);
  return settled;
}
