/**
 * The user's changes to the log: create, revise and remove records, one transaction per user action.
 * Each step is validated (by the record functions of log/) and its references checked before anything is
 * written; removal cascades into what a day or a series holds; the day counts, the clock stamp and the count
 * of unsent changes are written in the same transaction as the records they describe.
 */
import {
  uuidV4,
  type BodyOf,
  type LogRecord,
  type RecordContext,
  type RecordKind,
  type RecordOf,
} from '../log';
import { dayCountsAfter, writeDayCounts } from './day-counts';
import { StoreError } from './errors';
import { knownKinds } from './known-kinds';
import { isKind } from './live-records';
import type { LogStore } from './log-store';
import { checkReferences } from './record-references';
import { removalSet, restorationSet } from './removal-set';
import { Staging } from './staging';
import type { StoreContext } from './store-context';
import type { LogAction, WriteOptions } from './types';
import { loadWriteChecks } from './load-write-checks';

/**
 * One step of an action, with kind and body not tied together: every LogAction is one, and so is the action
 * create(), revise() and remove() make from their generic arguments. The record functions check the body.
 */
type Step =
  | { op: 'create'; kind: RecordKind; body: BodyOf[RecordKind]; id?: string | undefined }
  | { op: 'revise'; kind: RecordKind; id: string; patch: Partial<BodyOf[RecordKind]>; reason?: string | null; expectedRev?: string | undefined }
  | { op: 'remove' | 'restore'; kind: RecordKind; id: string; reason: string; expectedRev?: string | undefined };

/**
 * A new drop's number, read from the drops stored (and staged by this action) inside the write transaction, not
 * from the form's view: two tabs that both show "drop 6" get 6 and 7. The number asked for is kept when no live
 * drop of the series has it or a higher one.
 */
async function withFreeSeq(body: BodyOf['drop'], staging: Staging): Promise<BodyOf['drop']> {
  // A number the record check refuses stays as it is, to be refused with its own message.
  if (!Number.isInteger(body.seq) || body.seq < 1 || typeof body.series_id !== 'string') return body;
  const drops = await staging.referrers('drop', 'by_series', body.series_id, (d) => d.series_id);
  const highest = drops.reduce((m, d) => Math.max(m, d.seq), 0);
  return body.seq > highest ? body : { ...body, seq: highest + 1 };
}

function changedElsewhere(current: LogRecord, expectedRev: string): StoreError {
  return new StoreError({
    code: 'changed-elsewhere',
    field: 'rev',
    value: current.rev,
    allowed: `the revision the form was opened with (${expectedRev})`,
    message: `changed elsewhere: reload. This ${current.kind} was changed (in another tab, or by a sync or an import) after the form was opened; nothing was saved. Reload it and make the change again.`,
  });
}

export function recordWrites(
  ctx: StoreContext,
  askPersistenceOnce: () => void,
): Pick<LogStore, 'create' | 'revise' | 'remove' | 'restore' | 'undo' | 'commit' | 'newId'> {
  const { backend, env, clock } = ctx;

  async function runSteps(steps: readonly Step[], options: WriteOptions = {}): Promise<LogRecord[]> {
    ctx.ensureOpen();
    // Before the transaction: inside it, only its own requests may be awaited.
    const { assertGateRecords, createRecord, deleteRecord, restoreRecord, reviseRecord } = await loadWriteChecks();
    const now = env.now();
    const written = await backend.write(async (tx) => {
      const [storedClock, unsentBefore] = await Promise.all([tx.getMeta('clock'), tx.getMeta('unsent_changes')]);
      ctx.catchUpClock(storedClock, now);
      const recordCtx: RecordContext = { device: ctx.deviceId, clock, now, random: env.random };
      const staging = new Staging(tx);
      for (const step of steps) {
        if (step.op === 'create') {
          const body = step.kind === 'drop' ? await withFreeSeq(step.body as BodyOf['drop'], staging) : step.body;
          const record = createRecord(step.kind, body, { ...recordCtx, id: step.id });
          const [existing, referenceError] = await Promise.all([
            staging.lookup(record.kind, record.id),
            checkReferences(record, undefined, staging).then(
              () => null,
              (error: unknown) => error,
            ),
          ]);
          if (existing) throw new StoreError({ code: 'already-exists', field: null, value: record.id, allowed: null, message: `${record.kind} ${record.id} already exists` });
          if (referenceError) throw referenceError;
          staging.stage(record, undefined);
          continue;
        }
        const current = await staging.lookup(step.kind, step.id);
        if (!current) throw new StoreError({ code: 'not-found', field: null, value: step.id, allowed: null, message: `no ${step.kind} ${step.id}` });
        if (step.op === 'revise') {
          if (step.expectedRev !== undefined && current.rev !== step.expectedRev) throw changedElsewhere(current, step.expectedRev);
          const next = reviseRecord(current, step.patch, { ...recordCtx, reason: step.reason ?? null });
          if (next === current) continue;
          await checkReferences(next, current, staging);
          staging.stage(next, current);
        } else if (step.op === 'remove') {
          if (current.deleted) continue;
          if (step.expectedRev !== undefined && current.rev !== step.expectedRev) throw changedElsewhere(current, step.expectedRev);
          for (const record of await removalSet(current, staging)) staging.stage(deleteRecord(record, { ...recordCtx, reason: step.reason }), record);
        } else {
          if (!current.deleted) continue;
          if (step.expectedRev !== undefined && current.rev !== step.expectedRev) throw changedElsewhere(current, step.expectedRev);
          // Containers first, so each restored record finds what it points at live again.
          for (const record of await restorationSet(current, staging)) {
            const next = restoreRecord(record, { ...recordCtx, reason: step.reason });
            await checkReferences(next, undefined, staging);
            staging.stage(next, record);
          }
        }
      }
      const records = [...staging.records.values()];
      const writes: Promise<unknown>[] = [];
      if (records.length > 0) {
        // The gate every record passes before the store (log/record-gate.ts). Links were checked against their
        // kinds above; a new id is looked up under every kind, so it cannot reuse another record's id.
        const created = records.filter((r) => staging.storedBefore(r) === undefined).map((r) => r.id);
        const known = await knownKinds(tx, created);
        assertGateRecords(records, { known: (id) => known.get(id) });
        // Counted from the state before the action, so every read happens before the first put.
        const counts = await dayCountsAfter(tx, records, records.map((r) => staging.storedBefore(r)));
        writes.push(
          tx.putRecords(records),
          ...writeDayCounts(tx, counts),
          tx.putMeta('unsent_changes', (unsentBefore ?? 0) + records.length),
          tx.putMeta('clock', clock.latest),
        );
      }
      if (options.clearDraft !== undefined) writes.push(tx.deleteDraft(options.clearDraft));
      await Promise.all(writes);
      return records;
    }, ctx.recordDurability);
    if (written.length > 0) {
      ctx.recordsWritten();
      askPersistenceOnce();
    }
    return written;
  }

  /** The record of `kind` and `id` as the action left it (written by it, or as stored when it changed nothing). */
  async function resultOf<K extends RecordKind>(written: readonly LogRecord[], kind: K, id: string | undefined): Promise<RecordOf[K]> {
    const own = written.find((r): r is RecordOf[K] => isKind(r, kind) && (id === undefined || r.id === id));
    const record = own ?? (id === undefined ? undefined : await backend.read((tx) => tx.get(kind, id)));
    if (!record) throw new StoreError({ code: 'not-found', field: null, value: id ?? null, allowed: null, message: `no ${kind} ${id ?? ''}`.trimEnd() });
    return record;
  }

  return {
    async create(kind, body, options = {}) {
      const written = await runSteps([{ op: 'create', kind, body, id: options.id }], options);
      return resultOf(written, kind, written[0]?.id);
    },

    async revise(kind, id, patch, reason = null, options = {}) {
      return resultOf(await runSteps([{ op: 'revise', kind, id, patch, reason, expectedRev: options.expectedRev }], options), kind, id);
    },

    async remove(kind, id, reason, options = {}) {
      return resultOf(await runSteps([{ op: 'remove', kind, id, reason }], options), kind, id);
    },

    async restore(kind, id, reason, options = {}) {
      return resultOf(await runSteps([{ op: 'restore', kind, id, reason }], options), kind, id);
    },

    async undo(written, reason) {
      const { undoSteps } = await loadWriteChecks();
      return runSteps(undoSteps(written, reason));
    },

    commit: (actions: LogAction[], options?: WriteOptions) => runSteps(actions, options),

    newId() {
      return uuidV4(env.random);
    },
  };
}
