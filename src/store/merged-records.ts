/**
 * Writing records merged from elsewhere (an imported file, the office folder) exactly as they are: the whole
 * batch passes the gate (log/record-gate.ts, the same the import preview runs) before anything is written, then one transaction with the day counts, the clock (local
 * edits made later must sort after everything merged in) and the erased-log note.
 */
import { LogValidationError, PROGRESS_STEP, clockAhead, compareHlc, throwIfCancelled, type LogRecord, type RecordKind } from '../log';
import { loadWriteChecks } from './load-write-checks';
import type { StoreTx } from './backend';
import { dayCountsAfter, writeDayCounts } from './day-counts';
import { knownKinds } from './known-kinds';
import type { LogStore } from './log-store';
import type { StoreContext } from './store-context';

/** The stored version of each record of a batch, in the batch's order (undefined for new ones). */
async function previousVersions(tx: StoreTx, records: readonly LogRecord[]): Promise<(LogRecord | undefined)[]> {
  const byKind = new Map<RecordKind, number[]>();
  records.forEach((r, i) => {
    let list = byKind.get(r.kind);
    if (!list) byKind.set(r.kind, (list = []));
    list.push(i);
  });
  const previous: (LogRecord | undefined)[] = new Array(records.length);
  await Promise.all(
    [...byKind].map(async ([kind, positions]) => {
      const found = await tx.getMany(kind, positions.map((i) => records[i]!.id));
      positions.forEach((at, j) => (previous[at] = found[j]));
    }),
  );
  return previous;
}

export function mergedRecordWrites(ctx: StoreContext): Pick<LogStore, 'putRecords'> {
  const { backend, env, clock } = ctx;
  return {
    async putRecords(incoming, options = {}) {
      ctx.ensureOpen();
      if (incoming.length === 0) return;
      const { signal, onProgress } = options;
      throwIfCancelled(signal, 'writing');
      // Before the transaction: inside it, only its own requests may be awaited.
      const { gateLookups, gateRecords, mergeRecord } = await loadWriteChecks();
      const now = env.now();
      await backend.write(async (tx) => {
        const [storedClock, erasedLog, previous] = await Promise.all([tx.getMeta('clock'), tx.getMeta('erased_log'), previousVersions(tx, incoming)]);
        // Merged with what is stored now: an edit made since the caller read the store is kept (a merge is a union
        // of versions, so merging the caller's merge with the stored record is merging the stored one afresh).
        const records = options.mergeStored ? incoming.map((r, i) => (previous[i] ? mergeRecord(previous[i]!, r) : r)) : incoming;
        // Each record whole (unless this transfer's gate has checked that very record whole already), and against
        // the log: an id stored under another kind, a link to the wrong kind.
        const known = await knownKinds(tx, gateLookups(records));
        const problems = gateRecords(records, { known: (id) => known.get(id), passed: options.passed });
        if (problems.length > 0) throw new LogValidationError(problems, 'record');
        ctx.catchUpClock(storedClock, now);
        // Counted from the state before the batch, so every read happens before the first put.
        const counts = await dayCountsAfter(tx, records, previous);
        // The newest stamp the clock may follow; one from a clock far ahead is stored but not followed (hlc.ts).
        const followed = records.filter((r) => !clockAhead(r.rev, now));
        const newest = followed.reduce((max, r) => (compareHlc(r.rev, max) > 0 ? r.rev : max), clock.latest);
        if (compareHlc(newest, clock.latest) > 0) clock.receive(newest, now);
        throwIfCancelled(signal, 'writing');
        const total = records.length;
        onProgress?.({ phase: 'writing', done: 0, total });
        const watch = {
          every: PROGRESS_STEP,
          onStep(written: number) {
            // Thrown here, the transaction fails and nothing of the batch is written.
            throwIfCancelled(signal, 'writing');
            onProgress?.({ phase: 'writing', done: written, total });
          },
        };
        const writes: Promise<unknown>[] = [tx.putRecords(records, watch), ...writeDayCounts(tx, counts), tx.putMeta('clock', clock.latest)];
        // The erased log's records are back once an import brings records that its device wrote.
        if (erasedLog && records.some((r) => r.device === erasedLog.device_id || r.history.some((h) => h.device === erasedLog.device_id))) {
          writes.push(tx.putMeta('erased_log', null));
        }
        await Promise.all(writes);
      }, ctx.recordDurability);
      onProgress?.({ phase: 'writing', done: incoming.length, total: incoming.length });
      ctx.recordsWritten();
    },
  };
}
