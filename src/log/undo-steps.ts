/**
 * What undoes one user action, worked out from the records the action wrote. Undoing never erases: a record the
 * action made is removed (a tombstone), a record it removed is restored, a record it revised gets its previous
 * body back as a new version. Each step names the revision the action left, so an undo after someone else has
 * changed the record (another tab, a sync) is refused rather than overwriting their change.
 */
import { RECORD_KINDS, type BodyOf, type LogRecord, type RecordKind } from './types';

export type UndoStep =
  | { op: 'remove'; kind: RecordKind; id: string; reason: string; expectedRev: string }
  | { op: 'restore'; kind: RecordKind; id: string; reason: string; expectedRev: string }
  | { op: 'revise'; kind: RecordKind; id: string; patch: Partial<BodyOf[RecordKind]>; reason: string; expectedRev: string };

const kindOrder = (kind: RecordKind) => RECORD_KINDS.indexOf(kind);

/**
 * The steps that undo an action which wrote `written` (each record as the action left it), containers first:
 * a day or series comes back before what it holds, and removing a container takes what it holds with it.
 */
export function undoSteps(written: readonly LogRecord[], reason: string): UndoStep[] {
  const steps: UndoStep[] = [];
  for (const record of [...written].sort((a, b) => kindOrder(a.kind) - kindOrder(b.kind))) {
    const previous = record.history[record.history.length - 1];
    const base = { kind: record.kind, id: record.id, reason, expectedRev: record.rev };
    if (!previous) {
      if (!record.deleted) steps.push({ op: 'remove', ...base });
    } else if (record.deleted && !previous.deleted) {
      steps.push({ op: 'restore', ...base });
    } else if (!record.deleted && previous.deleted) {
      steps.push({ op: 'remove', ...base });
    } else if (!record.deleted) {
      steps.push({ op: 'revise', ...base, patch: previous.body as Partial<BodyOf[RecordKind]> });
    }
  }
  return steps;
}
