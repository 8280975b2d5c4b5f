/**
 * The records one user action writes, staged in its transaction so that the action's later steps see its
 * earlier ones, with the version each had before the action (what the per-day counts start from).
 */
import type { LogRecord, RecordKind, RecordOf } from '../log';
import type { IndexedKind, IndexName, StoreTx } from './backend';
import { isKind, isLive, keyOf } from './live-records';

export class Staging {
  readonly records = new Map<string, LogRecord>();
  /** The stored version before this action, for every staged record (undefined when new). */
  private readonly previous = new Map<string, LogRecord | undefined>();
  /** Stored records already read in this transaction: each is read once per action. */
  private readonly read = new Map<string, Promise<LogRecord | undefined>>();

  constructor(private readonly tx: StoreTx) {}

  /** The record as it stands after the steps staged so far (a tombstone included), or undefined. */
  async lookup<K extends RecordKind>(kind: K, id: string): Promise<RecordOf[K] | undefined> {
    const key = keyOf(kind, id);
    const staged = this.records.get(key);
    if (staged) return isKind(staged, kind) ? staged : undefined;
    let pending = this.read.get(key);
    if (!pending) this.read.set(key, (pending = this.tx.get(kind, id)));
    const found = await pending;
    return found && isKind(found, kind) ? found : undefined;
  }

  /** Stage `record`, replacing `current` (as lookup() gave it: stored, or staged by an earlier step). */
  stage(record: LogRecord, current: LogRecord | undefined): void {
    const key = keyOf(record.kind, record.id);
    if (!this.previous.has(key)) this.previous.set(key, current);
    this.records.set(key, record);
  }

  /** The version stored before this action of a record staged in it (undefined when the action made it). */
  storedBefore(record: LogRecord): LogRecord | undefined {
    return this.previous.get(keyOf(record.kind, record.id));
  }

  /** Live records of `kind` found by `index` whose `pointer` is `id`, as they stand after the steps so far. */
  async referrers<K extends IndexedKind>(
    kind: K,
    index: IndexName<K>,
    id: string,
    pointer: (record: RecordOf[K]) => string | null,
  ): Promise<RecordOf[K][]> {
    const found = new Map<string, RecordOf[K]>();
    for (const r of await this.tx.getAllByIndex(kind, index, id)) found.set(r.id, r);
    for (const r of this.records.values()) if (isKind(r, kind)) found.set(r.id, r);
    return [...found.values()].filter((r) => isLive(r) && pointer(r) === id);
  }

  /** Removed records (tombstones) of `kind` found by `index` whose `pointer` is `id`, as they stand after the steps so far. */
  async removedReferrers<K extends IndexedKind>(
    kind: K,
    index: IndexName<K>,
    id: string,
    pointer: (record: RecordOf[K]) => string | null,
  ): Promise<RecordOf[K][]> {
    const found = new Map<string, RecordOf[K]>();
    for (const r of await this.tx.getAllByIndex(kind, index, id)) found.set(r.id, r);
    for (const r of this.records.values()) if (isKind(r, kind)) found.set(r.id, r);
    return [...found.values()].filter((r) => r.deleted && pointer(r) === id);
  }
}
