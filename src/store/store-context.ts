/**
 * What the parts of a log store share: the engine, the browser facilities, this device's identity and clock,
 * and the rules every operation follows (refuse once closed, catch up with other tabs' stamps).
 */
import { compareHlc, type HybridLogicalClock } from '../log';
import type { StoreBackend, WriteTxOptions } from './backend';
import type { DeviceIdentity } from './device-identity';
import { StoreError } from './errors';
import type { StoreEnvironment } from './types';

/** Drafts and bookkeeping: survives a crash of the browser, not necessarily a power cut. */
export const RELAXED: WriteTxOptions = { durability: 'relaxed' };

export interface StoreContext {
  readonly backend: StoreBackend;
  readonly env: StoreEnvironment;
  readonly deviceId: string;
  readonly clock: HybridLogicalClock;
  /** Durability of transactions that write records (strict unless the store was opened otherwise). */
  readonly recordDurability: WriteTxOptions;
  /** Throws 'store-closed' once the store is closed (by close(), another tab's upgrade, or the browser). */
  ensureOpen(): void;
  /** Another tab of this app writes with the same device id: take in its newest stamp so ours sort after it. */
  catchUpClock(stored: string | undefined, now?: number): void;
  /** Records were written: the loss witness notes that this log holds some. */
  recordsWritten(): void;
}

export function storeContext(
  backend: StoreBackend,
  env: StoreEnvironment,
  identity: DeviceIdentity,
  durability: WriteTxOptions['durability'] = 'strict',
): StoreContext {
  const { deviceId, clock } = identity;
  return {
    backend,
    env,
    deviceId,
    clock,
    recordDurability: { durability },
    ensureOpen() {
      if (backend.closed) throw new StoreError({ code: 'store-closed', field: null, value: null, allowed: null, message: 'the log store is closed; reload the app to open it again' });
    },
    catchUpClock(stored) {
      // This device's own stamps (another tab's): taken in at any distance, they only ever rise. Stamps from
      // elsewhere go through clock.receive(), which is bounded (CLOCK_AHEAD_LIMIT_MS).
      if (stored !== undefined && compareHlc(stored, clock.latest) > 0) clock.catchUp(stored);
    },
    recordsWritten: identity.noteRecordsExist,
  };
}
