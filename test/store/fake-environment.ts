// A controllable stand-in for the browser facilities the store is given.
import { webcrypto } from 'node:crypto';
import type { StoreEnvironment } from '../../src/store';

export interface FakeEnvironment {
  environment: StoreEnvironment;
  /** Move the wall clock (backwards too: phones get their time reset). */
  setNow(ms: number): void;
  advance(ms: number): void;
  storage: {
    persistCalls: number;
    /** What persist() answers. */
    grant: boolean;
    persisted: boolean;
    usage: number;
    quota: number;
  };
  setInstalled(value: boolean | null): void;
  /** What the loss witness holds (localStorage in the browser). */
  witnessNotes: Map<string, string>;
}

export const T0 = Date.UTC(2026, 5, 14, 9, 0, 0);

export function fakeEnvironment(start = T0): FakeEnvironment {
  let now = start;
  let installed: boolean | null = false;
  const witnessNotes = new Map<string, string>();
  const storage = { persistCalls: 0, grant: true, persisted: false, usage: 120_000, quota: 2_000_000_000 };
  return {
    environment: {
      now: () => now,
      random: (bytes) => webcrypto.getRandomValues(bytes),
      storage: {
        async persist() {
          storage.persistCalls++;
          storage.persisted = storage.grant;
          return storage.grant;
        },
        persisted: async () => storage.persisted,
        estimate: async () => ({ usage: storage.usage, quota: storage.quota }),
      },
      isInstalled: () => installed,
      witness: {
        read: (key) => witnessNotes.get(key) ?? null,
        write: (key, value) => void witnessNotes.set(key, value),
      },
    },
    witnessNotes,
    setNow: (ms) => {
      now = ms;
    },
    advance: (ms) => {
      now += ms;
    },
    storage,
    setInstalled: (value) => {
      installed = value;
    },
  };
}
