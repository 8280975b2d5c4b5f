/**
 * This phone's device id and clock. The id is made once and kept in meta; a fresh database where the loss
 * witness remembers a log with records means the browser erased that log, which is noted ('erased_log').
 */
import { HybridLogicalClock, randomDeviceId } from '../log';
import type { StoreBackend } from './backend';
import { isoAt } from './live-records';
import { lossWitness } from './loss-witness';
import type { StoreEnvironment } from './types';

export interface DeviceIdentity {
  readonly deviceId: string;
  /** Issues the stamps of this device's changes; starts from the newest stamp stored. */
  readonly clock: HybridLogicalClock;
  /** Records were written: from now on, losing this log is noticed. */
  noteRecordsExist(): void;
}

export async function loadDeviceIdentity(backend: StoreBackend, env: StoreEnvironment, name: string): Promise<DeviceIdentity> {
  // Read first (the common case costs no write); make the id in a write transaction that looks again, so two
  // tabs opening a new database together agree on one id.
  const stored = await backend.read(async (tx) => ({ device: await tx.getMeta('device_id'), stamp: await tx.getMeta('clock') }));
  const witness = lossWitness(env, name);
  const deviceId =
    stored.device ||
    (await backend.write(
      async (tx) => {
        const existing = await tx.getMeta('device_id');
        if (existing) return existing;
        const made = randomDeviceId(env.random);
        await tx.putMeta('device_id', made);
        if (witness.remembered !== null) await tx.putMeta('erased_log', { device_id: witness.remembered, noticed_at: isoAt(env.now()) });
        return made;
      },
      { durability: 'relaxed' },
    ));
  const { stamp } = stored;
  const clock = new HybridLogicalClock(deviceId, stamp && stamp.endsWith(`-${deviceId}`) ? stamp : undefined);
  return { deviceId, clock, noteRecordsExist: () => witness.note(deviceId) };
}
