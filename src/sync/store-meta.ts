/**
 * Types of the meta entries sync keeps in the store (declaration merging into src/store/types.ts, as that file
 * invites), so LogStore.getMeta/setMeta know them.
 */
import type { Conflict } from '../log';
import type { SyncSettings } from './settings';
import type { SyncState } from './sync-state';

declare module '../store/types' {
  interface MetaValues {
    sync_settings: SyncSettings;
    sync_state: SyncState;
    log_conflicts: Conflict[];
  }
}

export {};
