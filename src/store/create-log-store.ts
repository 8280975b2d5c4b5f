/**
 * The log store's logic, written once over a StoreBackend and assembled here from its parts: reading records
 * (record-queries.ts) and days (day-views.ts), the user's changes (record-writes.ts), records merged from
 * elsewhere (merged-records.ts), drafts, meta values, and the storage status. Every part follows the same
 * rules: validation before any write, one transaction per user action, and the per-day counts (day-counts.ts),
 * the clock stamp and the count of unsent changes written with the records they describe.
 */
import type { StoreBackend } from './backend';
import { dayViews } from './day-views';
import { loadDeviceIdentity } from './device-identity';
import { draftAccess } from './draft-access';
import type { LogStore } from './log-store';
import { mergedRecordWrites } from './merged-records';
import { metaAccess } from './meta-access';
import { recordQueries } from './record-queries';
import { recordWrites } from './record-writes';
import { storageStatus } from './storage-status';
import { storeContext } from './store-context';
import type { StoreEnvironment } from './types';

export interface CreateLogStoreOptions {
  /** Durability of transactions that write records (see WriteTxOptions). */
  durability?: 'strict' | 'relaxed';
  /** The database name, which also names the loss witness's note. */
  name?: string;
}

export async function createLogStore(backend: StoreBackend, env: StoreEnvironment, options: CreateLogStoreOptions = {}): Promise<LogStore> {
  const identity = await loadDeviceIdentity(backend, env, options.name ?? 'default');
  const ctx = storeContext(backend, env, identity, options.durability);
  const { askPersistenceOnce, ...status } = storageStatus(ctx);
  return {
    ...recordQueries(ctx),
    ...dayViews(ctx),
    ...recordWrites(ctx, askPersistenceOnce),
    ...mergedRecordWrites(ctx),
    ...draftAccess(ctx),
    ...metaAccess(ctx),
    ...status,
    close() {
      backend.close();
    },
  };
}
