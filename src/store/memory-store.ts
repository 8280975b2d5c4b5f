/**
 * The in-memory twin of the IndexedDB store: the same LogStore, for component tests and for Node.
 * It copies values in and out (as IndexedDB's structured clone does), runs one transaction at a time,
 * writes a transaction's changes only when it finishes, and can be given a quota to test a full disk.
 */
import type { LogRecord, RecordKind, RecordOf } from '../log';
import { INDEX_FIELDS, type IndexedKind, type IndexName, type PutWatch, type StoreBackend, type StoreTx } from './backend';
import { createLogStore, type CreateLogStoreOptions } from './create-log-store';
import { StoreError, storageFull } from './errors';
import type { LogStore } from './log-store';
import type { DaySummary, DraftEntry, MetaKey, MetaValues, StoreEnvironment } from './types';

type StoreName = RecordKind | 'day_summary' | 'draft' | 'meta';
const STORE_NAMES: readonly StoreName[] = ['site', 'specimen', 'day', 'reading', 'series', 'drop', 'day_summary', 'draft', 'meta'];
const REMOVED = Symbol('removed');

const sizeOf = (value: unknown) => (value === undefined ? 0 : JSON.stringify(value).length);

/** The data of a memory store; open it again with createMemoryStore({ database }) to test a reload. */
export class MemoryDatabase {
  readonly stores = new Map<StoreName, Map<string, unknown>>(STORE_NAMES.map((name) => [name, new Map()]));
  /** Writes that would take the size above this many bytes fail with 'storage-full'; null means no limit. */
  quotaBytes: number | null = null;
  private bytes = 0;
  private queue: Promise<unknown> = Promise.resolve();

  /** The size of everything held, counted as the length of its JSON text. */
  sizeBytes(): number {
    return this.bytes;
  }

  /** One transaction at a time, in the order asked, as IndexedDB does for overlapping read-write ones. */
  run<T>(fn: () => Promise<T>): Promise<T> {
    const result = this.queue.then(fn);
    this.queue = result.catch(() => undefined);
    return result;
  }

  apply(writes: Map<StoreName, Map<string, unknown>>): void {
    let delta = 0;
    for (const [name, changes] of writes) {
      const store = this.stores.get(name)!;
      for (const [key, value] of changes) delta += (value === REMOVED ? 0 : sizeOf(value)) - sizeOf(store.get(key));
    }
    if (this.quotaBytes !== null && delta > 0 && this.bytes + delta > this.quotaBytes) {
      throw storageFull(Object.assign(new Error(`memory quota of ${this.quotaBytes} bytes exceeded`), { name: 'QuotaExceededError' }));
    }
    for (const [name, changes] of writes) {
      const store = this.stores.get(name)!;
      for (const [key, value] of changes) {
        if (value === REMOVED) store.delete(key);
        else store.set(key, value);
      }
    }
    this.bytes += delta;
  }
}

class MemoryTx implements StoreTx {
  readonly writes = new Map<StoreName, Map<string, unknown>>();

  constructor(
    private readonly db: MemoryDatabase,
    private readonly writable: boolean,
  ) {}

  private read(name: StoreName, key: string): unknown {
    const pending = this.writes.get(name);
    if (pending?.has(key)) {
      const value = pending.get(key);
      return value === REMOVED ? undefined : value;
    }
    return this.db.stores.get(name)!.get(key);
  }

  private values(name: StoreName): unknown[] {
    const keys = new Set([...this.db.stores.get(name)!.keys(), ...(this.writes.get(name)?.keys() ?? [])]);
    return [...keys]
      .sort()
      .map((key) => this.read(name, key))
      .filter((v) => v !== undefined);
  }

  private write(name: StoreName, key: string, value: unknown): void {
    if (!this.writable) throw new StoreError({ code: 'transaction-failed', field: null, value: name, allowed: null, message: 'a read-only transaction cannot write' });
    let pending = this.writes.get(name);
    if (!pending) this.writes.set(name, (pending = new Map()));
    pending.set(key, value === REMOVED ? REMOVED : structuredClone(value));
  }

  async get<K extends RecordKind>(kind: K, id: string): Promise<RecordOf[K] | undefined> {
    const value = this.read(kind, id);
    return value === undefined ? undefined : (structuredClone(value) as RecordOf[K]);
  }

  async getMany<K extends RecordKind>(kind: K, ids: readonly string[]): Promise<(RecordOf[K] | undefined)[]> {
    return ids.map((id) => {
      const value = this.read(kind, id);
      return value === undefined ? undefined : (structuredClone(value) as RecordOf[K]);
    });
  }

  async getAll<K extends RecordKind>(kind: K): Promise<RecordOf[K][]> {
    return this.values(kind).map((v) => structuredClone(v) as RecordOf[K]);
  }

  async getAllByIndex<K extends IndexedKind>(kind: K, index: IndexName<K>, key?: string): Promise<RecordOf[K][]> {
    const field = (INDEX_FIELDS[kind] as Record<string, string>)[index]!;
    const rows = this.values(kind) as Record<string, unknown>[];
    const matching = key === undefined ? rows : rows.filter((r) => r[field] === key);
    // Index order: by the indexed value, then by primary key (values() is already in primary key order).
    return matching
      .map((r, i) => ({ r, i }))
      .sort((a, b) => {
        const x = String(a.r[field]);
        const y = String(b.r[field]);
        return x < y ? -1 : x > y ? 1 : a.i - b.i;
      })
      .map(({ r }) => structuredClone(r) as unknown as RecordOf[K]);
  }

  async putRecords(records: readonly LogRecord[], watch?: PutWatch): Promise<void> {
    records.forEach((record, i) => {
      this.write(record.kind, record.id, record);
      if (watch && (i + 1) % watch.every === 0 && i + 1 < records.length) watch.onStep(i + 1);
    });
  }

  async getSummary(dayId: string): Promise<DaySummary | undefined> {
    return structuredClone(this.read('day_summary', dayId)) as DaySummary | undefined;
  }

  async getAllSummaries(): Promise<DaySummary[]> {
    return this.values('day_summary').map((v) => structuredClone(v) as DaySummary);
  }

  async putSummary(summary: DaySummary): Promise<void> {
    this.write('day_summary', summary.day_id, summary);
  }

  async deleteSummary(dayId: string): Promise<void> {
    this.write('day_summary', dayId, REMOVED);
  }

  async getMeta<K extends MetaKey>(key: K): Promise<MetaValues[K] | undefined> {
    // What putMeta stored under this key: MetaValues[K] by the engine's promise (see StoreTx).
    return structuredClone(this.read('meta', key)) as MetaValues[K] | undefined;
  }

  async putMeta<K extends MetaKey>(key: K, value: MetaValues[K]): Promise<void> {
    this.write('meta', key, value);
  }

  async getDraft(key: string): Promise<DraftEntry | undefined> {
    return structuredClone(this.read('draft', key)) as DraftEntry | undefined;
  }

  async putDraft(entry: DraftEntry): Promise<void> {
    this.write('draft', entry.key, entry);
  }

  async deleteDraft(key: string): Promise<void> {
    this.write('draft', key, REMOVED);
  }
}

class MemoryBackend implements StoreBackend {
  closed = false;

  constructor(private readonly db: MemoryDatabase) {}

  private transact<T>(writable: boolean, fn: (tx: StoreTx) => Promise<T>): Promise<T> {
    if (this.closed) return Promise.reject(new StoreError({ code: 'store-closed', field: null, value: null, allowed: null, message: 'the log store is closed' }));
    return this.db.run(async () => {
      const tx = new MemoryTx(this.db, writable);
      const result = await fn(tx);
      if (writable) this.db.apply(tx.writes);
      return result;
    });
  }

  read<T>(fn: (tx: StoreTx) => Promise<T>): Promise<T> {
    return this.transact(false, fn);
  }

  write<T>(fn: (tx: StoreTx) => Promise<T>): Promise<T> {
    return this.transact(true, fn);
  }

  close(): void {
    this.closed = true;
  }
}

/** Node-safe defaults: the wall clock, the platform random source, no storage manager, install state unknown. */
export const MEMORY_ENVIRONMENT: StoreEnvironment = {
  now: () => Date.now(),
  random: (bytes) => globalThis.crypto.getRandomValues(bytes),
  storage: null,
  isInstalled: () => null,
  witness: null,
};

export interface MemoryStoreOptions extends CreateLogStoreOptions {
  environment?: Partial<StoreEnvironment>;
  /** Open the data of an earlier memory store (to test a reload); a fresh database otherwise. */
  database?: MemoryDatabase;
}

export function createMemoryStore(options: MemoryStoreOptions = {}): Promise<LogStore> {
  const database = options.database ?? new MemoryDatabase();
  return createLogStore(new MemoryBackend(database), { ...MEMORY_ENVIRONMENT, ...options.environment }, { name: 'memory', ...options });
}
