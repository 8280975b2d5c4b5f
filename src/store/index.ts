// The log's storage: IndexedDB through idb, with an in-memory twin. Nothing outside imports past this file.
// This face is worker-safe (the service worker imports it); the page's own environment is in ./page.
export type { LogStore } from './log-store';
export { openLogStore, type OpenLogStoreOptions } from './idb-store';
export { createMemoryStore, MemoryDatabase, MEMORY_ENVIRONMENT, type MemoryStoreOptions } from './memory-store';
export { preloadWriteChecks } from './load-write-checks';
export { createDraftSaver, type DraftSaver } from './draft-saver';
export { StoreError, STORAGE_FULL_MESSAGE, type StoreErrorCode } from './errors';
export { assessRisk, RISK_MESSAGES, NEARLY_FULL_SHARE } from './storage-risk';
export { DB_VERSION, DEFAULT_DB_NAME, openLogDatabase, type LogDB, type OpenLogDatabaseOptions } from './database';
export { UPGRADES, upgradeToV1, upgradeToV2, type Upgrade } from './upgrades';
export type * from './types';
