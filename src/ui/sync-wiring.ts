// What the page's sync service needs from the shell (the store and the change notifier), handed over without
// loading the sync code: the shell sets it at start, the sync service reads it when it is first used.
import type { LogStore } from '../store';

export interface SyncWiring {
  store: LogStore;
  onChanged(): void;
}

let wiring: SyncWiring | null = null;

export function provideSyncWiring(next: SyncWiring): void {
  wiring = next;
}

export function syncWiring(): SyncWiring | null {
  return wiring;
}
