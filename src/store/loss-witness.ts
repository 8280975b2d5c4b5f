/**
 * The note kept outside IndexedDB (see LossWitness in types.ts) that a log with records existed here, so a
 * log the browser erased is noticed on the next start instead of the app simply starting again empty.
 */
import type { StoreEnvironment } from './types';

export interface LossWitness {
  /** The device id of the log the note remembers, or null when there is no note (or it cannot be read). */
  readonly remembered: string | null;
  /** Note that the log of `deviceId` holds records; once per store, and only when not noted already. */
  note(deviceId: string): void;
}

export function lossWitness(env: StoreEnvironment, name: string): LossWitness {
  const key = `plummet-log-witness:${name}`;
  const remembered = readNote(env, key);
  let current = false;
  return {
    remembered,
    note(deviceId) {
      if (current || !env.witness) return;
      current = true;
      if (remembered === deviceId) return;
      env.witness.write(key, JSON.stringify({ device_id: deviceId, since: new Date(env.now()).toISOString() }));
    },
  };
}

function readNote(env: StoreEnvironment, key: string): string | null {
  try {
    const text = env.witness?.read(key);
    const note: unknown = text ? JSON.parse(text) : null;
    return typeof note === 'object' && note !== null && 'device_id' in note && typeof note.device_id === 'string' ? note.device_id : null;
  } catch {
    return null;
  }
}
