/**
 * Types of the meta entries sync keeps in the store (declaration merging into src/store/types.ts, as that file
 * invites), so LogStore.getMeta/setMeta know them.
 */
import type { Conflict } from '../log';
import type { SyncSettings } from './settings';
import type { SyncState } from './sync-state';
import type { SettledConflict } from './import-log';

declare module '../store/types' {
  interface MetaValues {
    sync_settings: SyncSettings;
    sync_state: SyncState;
    log_conflicts: Conflict[];
    log_conflicts_settled: SettledConflict[];
  }
}

export {};
