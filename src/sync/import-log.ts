/**
 * Importing a log into the store: a preview first (added, updated, unchanged, conflicts), then one
 * transaction. Used for a file picked by hand and for every file sync reads from the office folder.
 *
 * Apply reads the local records again and merges afresh, so an edit made while the preview was on screen is
 * not overwritten: merging only ever adds versions, and the newest still wins. Conflicts found are added to
 * the list kept in meta ('log_conflicts') after the records are written; were that second write lost, the
 * losing versions would still be in the records' histories.
 */
import { LogError, addConflicts, openConflicts, previewGatedMerge, readLogFile, type Conflict, type LogFile, type MergePreview } from '../log';
import { SYNC_META, type RecordSource } from './record-source';

export interface ImportPreview {
  file: LogFile;
  preview: MergePreview;
}

/**
 * Reads and checks the text (throws LogFileError naming the file, the record, the field, the value and the rule),
 * then previews the merge, whose records pass the store's own gate here (log/import-gate.ts): what the preview
 * accepts, the write accepts.
 */
export async function previewImport(source: RecordSource, text: string, name?: string): Promise<ImportPreview> {
  const file = readLogFile(text, { name });
  const local = await source.allRecords({ includeDeleted: true });
  return { file, preview: previewGatedMerge(file, local, name) };
}

/** Merges the file into the store in one transaction; returns what was done. Refused as the preview refuses. */
export async function applyImport(source: RecordSource, file: LogFile, name?: string): Promise<MergePreview> {
  const local = await source.allRecords({ includeDeleted: true });
  const preview = previewGatedMerge(file, local, name);
  if (preview.changes.length > 0) await source.putRecords(preview.changes);
  if (preview.conflicts.length > 0) {
    const existing = ((await source.getMeta(SYNC_META.conflicts)) as Conflict[] | undefined) ?? [];
    await source.setMeta(SYNC_META.conflicts, addConflicts(existing, preview.conflicts));
  }
  return preview;
}

/** The conflicts to show: those this phone has not settled by editing the record since. */
export async function loadConflicts(source: RecordSource): Promise<Conflict[]> {
  const all = ((await source.getMeta(SYNC_META.conflicts)) as Conflict[] | undefined) ?? [];
  if (all.length === 0) return [];
  const open = openConflicts(all, await source.allRecords({ includeDeleted: true }), await source.deviceId());
  if (open.length !== all.length) await source.setMeta(SYNC_META.conflicts, open);
  return open;
}

/** A conflict a person has settled, and why; kept on this phone beside the conflict list. */
export interface SettledConflict {
  conflict: Conflict;
  reason: string;
  settled_at: string;
  device: string;
}

/**
 * A person has looked at the conflict and keeps the record as it is, saying why (both versions stay in the
 * record either way). `otherVersion` tells apart two bodies that came in under one stamp (Conflict.other_version).
 */
export async function dismissConflict(
  source: RecordSource,
  id: string,
  otherRev: string,
  reason: string,
  now: Date | number = Date.now(),
  otherVersion?: string,
): Promise<void> {
  if (typeof reason !== 'string' || reason.trim() === '') {
    throw new LogError({ code: 'reason-required', field: 'reason', value: reason ?? null, allowed: 'a non-empty reason', message: 'settling a conflict needs a reason: say which value is right and why' });
  }
  const all = ((await source.getMeta(SYNC_META.conflicts)) as Conflict[] | undefined) ?? [];
  const matches = (c: Conflict) => c.id === id && c.other_rev === otherRev && (otherVersion === undefined || c.other_version === otherVersion);
  const settled = ((await source.getMeta(SYNC_META.settled)) as SettledConflict[] | undefined) ?? [];
  const at = new Date(typeof now === 'number' ? now : now.getTime()).toISOString();
  const device = await source.deviceId();
  const added = all.filter(matches).map((conflict) => ({ conflict, reason: reason.trim(), settled_at: at, device }));
  // The reason first, then the list: were the second write lost, the conflict would only be shown again.
  if (added.length > 0) await source.setMeta(SYNC_META.settled, [...settled, ...added]);
  await source.setMeta(
    SYNC_META.conflicts,
    all.filter((c) => !matches(c)),
  );
}
