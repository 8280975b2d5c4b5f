/**
 * The log store on IndexedDB (through idb).
 *
 * Every request, transaction error and abort ends in a settled promise: idb rejects a request's promise on
 * its error event and `tx.done` on error or abort; this adapter always awaits `done`, aborts the transaction
 * when the work inside it throws, and turns the platform's errors into StoreErrors (a QuotaExceededError,
 * whether on a request or at commit, becomes 'storage-full'). Nothing half-written is ever committed.
 *
 * Seen in Chromium with a profile on a disk that fills up: the put requests of the failing transaction
 * reject with "AbortError: The transaction was aborted", and only `transaction.error` says
 * QuotaExceededError. Reporting the first rejected request would call a full disk a generic failure.
 * (Chromium's DevTools quota override, Storage.overrideQuotaForOrigin, does not make IndexedDB refuse
 * anything, and navigator.storage.estimate() shows pages a made-up quota: test a full disk with a real one.)
 */
import { unwrap, type IDBPDatabase, type IDBPTransaction, type StoreNames } from 'idb';
import { LogError, TransferCancelled, type LogRecord, type RecordKind, type RecordOf } from '../log';
import type { IndexedKind, IndexName, PutWatch, StoreBackend, StoreTx, WriteTxOptions } from './backend';
import { createLogStore, type CreateLogStoreOptions } from './create-log-store';
import { DEFAULT_DB_NAME, openLogDatabase, type LogDB, type OpenLogDatabaseOptions } from './database';
import { byId, placeDrops, whereBucket, type DropPack, type DropWhere } from './drop-packs';
import { StoreError, isQuotaError, storageFull } from './errors';
import type { LogStore } from './log-store';
import type { DaySummary, DraftEntry, MetaKey, MetaValues, StoreEnvironment } from './types';

type Names = StoreNames<LogDB>[];
type AnyTx = IDBPTransaction<LogDB, Names, 'readonly' | 'readwrite'>;
/** From this many ids on, getMany looks at the keys first instead of asking for each id. */
const MANY = 64;

class IdbTx implements StoreTx {
  /** Every stored drop's series, once read in this transaction (kept up to date by putRecords): a large write asks
   *  for it up to three times (the versions before, the kinds of the ids, the write itself). Only ids and series
   *  ids, so nothing handed out is shared. */
  private allPlaces: Map<string, string> | undefined;

  constructor(private readonly tx: AnyTx) {}

  /** The bare transaction: many requests at once without a promise and listeners for each (idb's wrapping). */
  private get raw(): IDBTransaction {
    return unwrap(this.tx as IDBPTransaction<LogDB, Names, 'readwrite'>) as unknown as IDBTransaction;
  }

  /** The series whose pack holds each drop id (since version 5 drops live in packs: drop-packs.ts). */
  private async dropPlaces(ids: readonly string[]): Promise<Map<string, string>> {
    const places = new Map<string, string>();
    const all = this.allPlaces ?? (ids.length < MANY ? await this.placesOf(ids) : await this.readAllPlaces());
    for (const id of ids) {
      const at = all.get(id);
      if (at !== undefined) places.set(id, at);
    }
    return places;
  }

  /** The places in the buckets of these ids. */
  private async placesOf(ids: readonly string[]): Promise<Map<string, string>> {
    const store = this.tx.objectStore('drop_where');
    const buckets = await Promise.all([...new Set(ids.map(whereBucket))].map((b) => store.get(b)));
    const places = new Map<string, string>();
    for (const w of buckets) if (w) for (const id in w.places) places.set(id, w.places[id]!);
    return places;
  }

  /** Every drop's place. Measured in Chromium: 50 000 ids read in 25 ms this way, 2 to 5 s through a key cursor. */
  private async readAllPlaces(): Promise<Map<string, string>> {
    const all = new Map<string, string>();
    for (const w of await this.tx.objectStore('drop_where').getAll()) for (const id in w.places) all.set(id, w.places[id]!);
    this.allPlaces = all;
    return all;
  }

  private async dropPacks(seriesIds: Iterable<string>): Promise<Map<string, DropPack>> {
    const store = this.tx.objectStore('drop_pack');
    const keys = [...new Set(seriesIds)];
    const packs = await Promise.all(keys.map((key) => store.get(key)));
    return new Map(keys.map((key, i) => [key, packs[i] ?? { series_id: key, drops: [] }]));
  }

  private async getDrops(ids: readonly string[]): Promise<(RecordOf['drop'] | undefined)[]> {
    const places = await this.dropPlaces(ids);
    if (places.size === 0) return ids.map(() => undefined);
    const found = new Map<string, RecordOf['drop']>();
    for (const pack of (await this.dropPacks(places.values())).values()) for (const d of pack.drops) found.set(d.id, d);
    return ids.map((id) => found.get(id));
  }

  async get<K extends RecordKind>(kind: K, id: string): Promise<RecordOf[K] | undefined> {
    if (kind === 'drop') return (await this.getDrops([id]))[0] as RecordOf[K] | undefined;
    return this.tx.objectStore(kind).get(id) as Promise<RecordOf[K] | undefined>;
  }

  async getMany<K extends RecordKind>(kind: K, ids: readonly string[]): Promise<(RecordOf[K] | undefined)[]> {
    if (kind === 'drop') return this.getDrops(ids) as Promise<(RecordOf[K] | undefined)[]>;
    const store = this.tx.objectStore(kind as Exclude<RecordKind, 'drop'>) as unknown as {
      get(id: string): Promise<RecordOf[K] | undefined>;
      getAll(): Promise<RecordOf[K][]>;
      getAllKeys(): Promise<string[]>;
      count(): Promise<number>;
    };
    const one = () => Promise.all(ids.map((id) => store.get(id)));
    if (ids.length < MANY) return one();
    // Measured in Chromium: 50 000 gets of mostly absent ids took 0.9 s. The keys alone say which exist;
    // only those are read, or the whole store at once when the batch covers most of it.
    if ((await store.count()) > ids.length * 4) return one();
    const present = new Set(await store.getAllKeys());
    let hits = 0;
    for (const id of ids) if (present.has(id)) hits++;
    if (hits === 0) return ids.map(() => undefined);
    if (hits * 2 < present.size) return Promise.all(ids.map((id) => (present.has(id) ? store.get(id) : undefined)));
    const byId = new Map((await store.getAll()).map((r) => [r.id, r]));
    return ids.map((id) => byId.get(id));
  }

  async getAll<K extends RecordKind>(kind: K): Promise<RecordOf[K][]> {
    if (kind === 'drop') return (await this.tx.objectStore('drop_pack').getAll()).flatMap((p) => p.drops).sort(byId) as RecordOf[K][];
    return this.tx.objectStore(kind).getAll() as Promise<RecordOf[K][]>;
  }

  async getAllByIndex<K extends IndexedKind>(kind: K, index: IndexName<K>, key?: string): Promise<RecordOf[K][]> {
    if (kind === 'drop') {
      // by_series: a pack is one series' drops sorted by id; the packs come in series order (the index's order).
      if (key !== undefined) return ((await this.tx.objectStore('drop_pack').get(key))?.drops ?? []) as RecordOf[K][];
      return (await this.tx.objectStore('drop_pack').getAll()).flatMap((p) => p.drops) as RecordOf[K][];
    }
    const store = this.tx.objectStore(kind) as unknown as { index(name: string): { getAll(key?: string): Promise<unknown[]> } };
    return store.index(index).getAll(key) as Promise<RecordOf[K][]>;
  }

  async putRecords(records: readonly LogRecord[], watch?: PutWatch): Promise<void> {
    if (records.length === 0) return;
    const drops = records.filter((r): r is RecordOf['drop'] => r.kind === 'drop');
    // Drops are put in their series' packs: read where each is now and the packs they leave and join first, then
    // every write goes out at once.
    let packs: DropPack[] = [];
    let wheres: DropWhere[] = [];
    let gone: string[] = [];
    const perPack = new Map<string, number>();
    if (drops.length > 0) {
      const places = await this.dropPlaces(drops.map((d) => d.id));
      const affected = new Set<string>();
      for (const d of drops) {
        affected.add(d.series_id);
        const at = places.get(d.id);
        if (at !== undefined) affected.add(at);
      }
      const placed = placeDrops(await this.dropPacks(affected), drops, places);
      packs = placed.packs;
      gone = placed.gone;
      if (placed.moved.size > 0) {
        // The buckets of the drops that are new or changed series, as stored, with their new places.
        const store = this.tx.objectStore('drop_where');
        const keys = [...new Set([...placed.moved.keys()].map(whereBucket))];
        const stored = await Promise.all(keys.map((b) => store.get(b)));
        const buckets = new Map(keys.map((b, i) => [b, stored[i] ?? { bucket: b, places: {} }]));
        for (const [id, series] of placed.moved) buckets.get(whereBucket(id))!.places[id] = series;
        wheres = [...buckets.values()];
        if (this.allPlaces) for (const [id, series] of placed.moved) this.allPlaces.set(id, series);
      }
      for (const d of drops) perPack.set(d.series_id, (perPack.get(d.series_id) ?? 0) + 1);
    }
    // All requests go out at once on the bare transaction, and only the last is awaited: requests of one
    // transaction complete in the order made, and a failed one aborts the transaction, which fails every
    // later request (the last among them). A watch listens to the request with which the count of records
    // written passes each multiple of `every`: the progress of a large write, and its chance to be cancelled.
    const tx = this.raw;
    const stores = new Map<string, IDBObjectStore>();
    const storeOf = (name: string) => {
      let store = stores.get(name);
      if (!store) stores.set(name, (store = tx.objectStore(name)));
      return store;
    };
    return new Promise((resolve, reject) => {
      let last: IDBRequest | undefined;
      let written = 0;
      const counted = (request: IDBRequest, n: number) => {
        const before = written;
        written += n;
        const step = watch ? Math.floor(written / watch.every) * watch.every : 0;
        if (watch && step > before && written < records.length) {
          const at = written;
          request.addEventListener('success', () => {
            try {
              watch.onStep(at);
            } catch (error) {
              reject(error);
            }
          });
        }
      };
      for (const r of records) {
        if (r.kind === 'drop') continue;
        last = storeOf(r.kind).put(r);
        counted(last, 1);
      }
      for (const key of gone) last = storeOf('drop_pack').delete(key);
      for (const w of wheres) last = storeOf('drop_where').put(w);
      for (const pack of packs) {
        last = storeOf('drop_pack').put(pack);
        counted(last, perPack.get(pack.series_id) ?? 0);
      }
      const request = last!;
      request.addEventListener('success', () => resolve());
      request.addEventListener('error', () => reject(request.error ?? tx.error));
    });
  }

  getSummary(dayId: string): Promise<DaySummary | undefined> {
    return this.tx.objectStore('day_summary').get(dayId);
  }

  getAllSummaries(): Promise<DaySummary[]> {
    return this.tx.objectStore('day_summary').getAll();
  }

  async putSummary(summary: DaySummary): Promise<void> {
    await (this.tx as IDBPTransaction<LogDB, Names, 'readwrite'>).objectStore('day_summary').put(summary);
  }

  async deleteSummary(dayId: string): Promise<void> {
    await (this.tx as IDBPTransaction<LogDB, Names, 'readwrite'>).objectStore('day_summary').delete(dayId);
  }

  async getMeta<K extends MetaKey>(key: K): Promise<MetaValues[K] | undefined> {
    // What putMeta stored under this key: MetaValues[K] by the engine's promise (see StoreTx).
    return (await this.tx.objectStore('meta').get(key))?.value as MetaValues[K] | undefined;
  }

  async putMeta<K extends MetaKey>(key: K, value: MetaValues[K]): Promise<void> {
    await (this.tx as IDBPTransaction<LogDB, Names, 'readwrite'>).objectStore('meta').put({ key, value });
  }

  getDraft(key: string): Promise<DraftEntry | undefined> {
    return this.tx.objectStore('draft').get(key);
  }

  async putDraft(entry: DraftEntry): Promise<void> {
    await (this.tx as IDBPTransaction<LogDB, Names, 'readwrite'>).objectStore('draft').put(entry);
  }

  async deleteDraft(key: string): Promise<void> {
    await (this.tx as IDBPTransaction<LogDB, Names, 'readwrite'>).objectStore('draft').delete(key);
  }
}

/** Our own errors pass through; the platform's become StoreErrors with the original as `cause`. */
function translate(error: unknown): unknown {
  if (error instanceof StoreError || error instanceof LogError || error instanceof TransferCancelled) return error;
  if (isQuotaError(error)) return storageFull(error);
  const name = (error as { name?: string } | null)?.name ?? 'Error';
  if (name === 'InvalidStateError') return new StoreError({ code: 'store-closed', field: null, value: name, allowed: null, message: 'the log database connection is closed; reload the app', cause: error });
  return new StoreError({
    code: 'transaction-failed',
    field: null,
    value: name,
    allowed: null,
    message: `the log database refused the change (${name}): ${String((error as Error)?.message ?? error)}`,
    cause: error,
  });
}

class IdbBackend implements StoreBackend {
  /** Closed for good: by close() or because a newer version of the app needs the database. */
  closed = false;
  /** The browser closed the connection (after a disk error, for one); the next call opens it again. */
  private lost = false;
  private db: IDBPDatabase<LogDB>;

  constructor(
    db: IDBPDatabase<LogDB>,
    private readonly connect: () => Promise<IDBPDatabase<LogDB>>,
  ) {
    this.db = db;
  }

  private async connection(): Promise<IDBPDatabase<LogDB>> {
    if (this.closed) throw new StoreError({ code: 'store-closed', field: null, value: null, allowed: null, message: 'the log store is closed; reload the app to open it again' });
    if (this.lost) {
      this.db = await this.connect();
      this.lost = false;
    }
    return this.db;
  }

  private async run<T>(mode: 'readonly' | 'readwrite', fn: (tx: StoreTx) => Promise<T>, durability: 'strict' | 'relaxed' | 'default'): Promise<T> {
    let tx: AnyTx;
    try {
      const db = await this.connection();
      tx = db.transaction([...db.objectStoreNames], mode, { durability });
    } catch (error) {
      // A connection the browser closed without a close event (Chromium after a disk error) throws
      // InvalidStateError here: open it again, once.
      if ((error as { name?: string }).name !== 'InvalidStateError' || this.closed) throw translate(error);
      this.lost = true;
      try {
        const db = await this.connection();
        tx = db.transaction([...db.objectStoreNames], mode, { durability });
      } catch (again) {
        throw translate(again);
      }
    }
    const done = tx.done;
    // Attached at once so an abort that happens while `fn` still runs is never an unhandled rejection.
    done.catch(() => undefined);
    let result: T;
    try {
      result = await fn(new IdbTx(tx));
    } catch (error) {
      try {
        tx.abort();
      } catch {
        // already aborted by the failed request, or finished
      }
      await done.catch(() => undefined);
      // When a transaction aborts, each of its pending requests fails with a bare AbortError; the cause
      // (QuotaExceededError, for one) is on the transaction. Our own errors are the cause themselves.
      const own = error instanceof StoreError || error instanceof LogError || error instanceof TransferCancelled;
      throw translate(!own && tx.error ? tx.error : error);
    }
    try {
      await done;
    } catch (error) {
      throw translate(tx.error ?? error);
    }
    return result;
  }

  read<T>(fn: (tx: StoreTx) => Promise<T>): Promise<T> {
    return this.run('readonly', fn, 'default');
  }

  write<T>(fn: (tx: StoreTx) => Promise<T>, options: WriteTxOptions): Promise<T> {
    return this.run('readwrite', fn, options.durability);
  }

  close(): void {
    this.closed = true;
    this.db.close();
  }

  markClosed(): void {
    this.closed = true;
  }

  markLost(): void {
    this.lost = true;
  }
}

export interface OpenLogStoreOptions extends CreateLogStoreOptions, Omit<OpenLogDatabaseOptions, 'version' | 'upgrades'> {
  /** Browser facilities: browserEnvironment() in the app, a fake in tests. */
  environment: StoreEnvironment;
  /** The database name; tests give each store its own. */
  name?: string;
}

export async function openLogStore(options: OpenLogStoreOptions): Promise<LogStore> {
  let backend: IdbBackend | undefined;
  const connect = () =>
    openLogDatabase(options.name ?? DEFAULT_DB_NAME, {
      onBlocked: options.onBlocked,
      onVersionChange() {
        backend?.markClosed();
        options.onVersionChange?.();
      },
      onTerminated() {
        backend?.markLost();
        options.onTerminated?.();
      },
    });
  backend = new IdbBackend(await connect(), connect);
  return createLogStore(backend, options.environment, { ...options, name: options.name ?? DEFAULT_DB_NAME });
}
