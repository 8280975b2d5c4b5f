// An in-memory RecordSource for the sync tests: copies values in and out, as a real store would, counts
// writes, and can be told to fail the next write.
import type { LogRecord } from '../../src/log/types';
import type { PutRecordsOptions } from '../../src/log/transfer-progress';
import { mergeRecord } from '../../src/log/merge';
import type { RecordSource } from '../../src/sync/record-source';

export class MemoryRecordSource implements RecordSource {
  readonly records = new Map<string, LogRecord>();
  readonly meta = new Map<string, unknown>();
  putCalls = 0;
  failNextPut: Error | null = null;

  constructor(
    readonly device: string,
    records: readonly LogRecord[] = [],
  ) {
    for (const r of records) this.records.set(r.id, structuredClone(r));
  }

  async allRecords(): Promise<LogRecord[]> {
    return [...this.records.values()].map((r) => structuredClone(r));
  }

  async putRecords(records: LogRecord[], options: PutRecordsOptions = {}): Promise<void> {
    if (this.failNextPut) {
      const error = this.failNextPut;
      this.failNextPut = null;
      throw error;
    }
    if (options.signal?.aborted) throw new Error('cancelled');
    this.putCalls++;
    for (const r of records) {
      const stored = this.records.get(r.id);
      this.records.set(r.id, structuredClone(options.mergeStored && stored ? mergeRecord(stored, r) : r));
    }
  }

  async getMeta(key: string): Promise<unknown> {
    const value = this.meta.get(key);
    return value === undefined ? undefined : structuredClone(value);
  }

  async setMeta(key: string, value: unknown): Promise<void> {
    this.meta.set(key, structuredClone(value));
  }

  async deviceId(): Promise<string> {
    return this.device;
  }

  /** Records as a map of id to record, for comparisons. */
  snapshot(): Map<string, LogRecord> {
    return new Map([...this.records].map(([k, v]) => [k, structuredClone(v)]));
  }
}
