/**
 * The opening of the log's IndexedDB through the versioned upgrades in upgrades.ts. Its schema, one idb DBSchema
 * from which every store, value and index type derives, is in log-db.ts.
 *
 * Platform traps, for whoever changes this file:
 * - Booleans are not valid IndexedDB keys: an index over `deleted` (or any key path reaching a boolean)
 *   silently leaves those records out. Tombstones are filtered after reading.
 * - A tab still running the old version holds the database open and blocks the upgrade in a new tab; the
 *   old tab closes its connection when asked (onversionchange) and must reload.
 * - idb creates a transaction's `done` promise the moment it wraps the transaction: a transaction that aborts
 *   with nobody awaiting `done` is an unhandled rejection. Every transaction here has a handler on `done`.
 * - Opening with a version lower than the stored one fails (VersionError): an app rolled back after an
 *   upgrade cannot read the newer database. That is reported as 'database-newer', never "fixed" by deleting.
 */
import { openDB, type IDBPDatabase } from 'idb';
import { StoreError } from './errors';
import type { LogDB } from './log-db';
import { UPGRADES, type Upgrade } from './upgrades';

export type { LogDB };

/** The version this code writes: one more than the last upgrade's index. */
export const DB_VERSION = UPGRADES.length;
export const DEFAULT_DB_NAME = 'plummet-log';

export interface OpenLogDatabaseOptions {
  /** Open at an older version (tests of the upgrade path); the current version otherwise. */
  version?: number;
  /** The upgrade steps; UPGRADES unless a test tries a step that fails or one still to come. */
  upgrades?: readonly Upgrade[];
  /** Another tab runs an older version and holds the database open; this open waits for it. */
  onBlocked?: () => void;
  /** Another tab wants a newer version: this connection has been closed and the page must reload. */
  onVersionChange?: () => void;
  /** The browser closed the connection (storage cleared, disk error); the store opens it again when next used. */
  onTerminated?: () => void;
}

export async function openLogDatabase(name: string, options: OpenLogDatabaseOptions = {}): Promise<IDBPDatabase<LogDB>> {
  const upgrades = options.upgrades ?? UPGRADES;
  const version = options.version ?? upgrades.length;
  let upgradeError: unknown;
  try {
    const db = await openDB<LogDB>(name, version, {
      upgrade(database, oldVersion, newVersion, transaction) {
        // idb makes `done` as soon as it wraps a transaction; if the upgrade aborts and nobody listens, that is
        // an unhandled rejection. The failure itself reaches the caller through the open request.
        transaction.done.catch(() => undefined);
        const steps = upgrades.slice(oldVersion, newVersion ?? version);
        // Each step may read what the one before wrote; an async step keeps the upgrade transaction alive by
        // having requests pending (it awaits nothing but requests of this transaction).
        const run = async () => {
          for (const step of steps) {
            const pending = step(database, transaction);
            if (pending) await pending;
          }
        };
        run().catch((error: unknown) => {
          upgradeError = error;
          try {
            transaction.abort();
          } catch {
            // already finished: the open request reports the failure
          }
        });
      },
      blocked: () => options.onBlocked?.(),
      blocking(_current, _blocked, event) {
        (event.target as IDBDatabase).close();
        options.onVersionChange?.();
      },
      terminated: () => options.onTerminated?.(),
    });
    return db;
  } catch (error) {
    if ((error as { name?: string }).name === 'VersionError') {
      throw new StoreError({
        code: 'database-newer',
        field: null,
        value: version,
        allowed: null,
        message: `the log on this phone was written by a newer version of Plummet than this one (schema ${version}); update the app`,
        cause: error,
      });
    }
    throw new StoreError({
      code: 'open-failed',
      field: null,
      value: name,
      allowed: null,
      message: `the log database "${name}" could not be opened: ${String((upgradeError ?? error) as Error)}`,
      cause: upgradeError ?? error,
    });
  }
}
