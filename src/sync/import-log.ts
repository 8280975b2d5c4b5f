/**
 * Importing a log into the store: a preview first (added, updated, unchanged, conflicts), then one
 * transaction. Used for a file picked by hand and for every file sync reads from the office folder.
 *
 * Apply reads the local records again and merges afresh, so an edit made while the preview was on screen is
 * not overwritten: merging only ever adds versions, and the newest still wins. Conflicts found are added to
 * the list kept in meta ('log_conflicts') after the records are written; were that second write lost, the
 * losing versions would still be in the records' histories.
 *
 * The gate checks each record of the file whole once (readLogFile); what the merge makes anew is checked whole
 * where it is made, and the store checks the batch against the log it joins inside its write. The records the
 * gate has passed travel with the import (ImportPreview.passed), so neither the preview nor the store's write
 * checks them again. Both steps report progress and may be cancelled (TransferOptions); a cancelled import
 * writes nothing.
 */
import {
  LogError,
  addConflicts,
  openConflicts,
  previewGatedMerge,
  readLogFileSteps,
  throwIfCancelled,
  type Conflict,
  type LogFile,
  type LogRecord,
  type MergePreview,
  type TransferOptions,
} from '../log';
import { SYNC_META, type RecordSource } from './record-source';
import { pacedTurns, yieldToPage } from './yield-to-page';

export interface ImportPreview {
  file: LogFile;
  preview: MergePreview;
  /** The record objects the gate has checked whole in this import (GateOptions.passed). */
  passed: WeakSet<object>;
}

/**
 * Reads and checks the text (throws LogFileError naming the file, the record, the field, the value and the rule),
 * then previews the merge, whose records pass the store's own gate here (log/import-gate.ts): what the preview
 * accepts, the write accepts. Reports progress as it checks, and stops with TransferCancelled when asked.
 */
export async function previewImport(source: RecordSource, text: string, name?: string, options: TransferOptions = {}): Promise<ImportPreview> {
  const { onProgress, signal } = options;
  const passed = new WeakSet<object>();
  // The store is read while the file is checked: the engine reads in its own process, so the page's checking and
  // the reading overlap. A file refused or a cancel leaves the read unused (a read changes nothing).
  const reading = source.allRecords({ includeDeleted: true });
  reading.catch(() => undefined);
  const steps = readLogFileSteps(text, { name, passed });
  // The page gets a turn between steps only when someone watches or may cancel: a sync or a test does not wait.
  const watched = onProgress !== undefined || signal !== undefined;
  const turn = pacedTurns();
  let file: LogFile;
  for (;;) {
    throwIfCancelled(signal, 'checking');
    const step = steps.next();
    if (step.done) {
      file = step.value;
      break;
    }
    onProgress?.(step.value);
    if (watched) await turn();
  }
  const preview = await mergeWithStore(source, file, name, passed, options, reading);
  return { file, preview, passed };
}

/** The store's records read (or their read begun earlier, `reading`), and the file merged into them through the gate. */
async function mergeWithStore(
  source: RecordSource,
  file: LogFile,
  name: string | undefined,
  passed: WeakSet<object>,
  { onProgress, signal }: TransferOptions,
  reading?: Promise<LogRecord[]>,
): Promise<MergePreview> {
  const total = file.records.length;
  throwIfCancelled(signal, 'reading');
  onProgress?.({ phase: 'reading', done: 0, total: 0 });
  const local = await (reading ?? source.allRecords({ includeDeleted: true }));
  throwIfCancelled(signal, 'merging');
  onProgress?.({ phase: 'merging', done: 0, total });
  if (onProgress !== undefined || signal !== undefined) await yieldToPage();
  const preview = previewGatedMerge(file, local, name, passed);
  onProgress?.({ phase: 'merging', done: total, total });
  return preview;
}

/**
 * Merges the file into the store in one transaction; returns what was done. Refused as the preview refuses.
 * `passed` is the preview's (ImportPreview.passed), so records checked there are not checked again; without it
 * every record is checked whole. Cancelled (TransferCancelled) before or during the write, nothing is written.
 */
export async function applyImport(source: RecordSource, file: LogFile, name?: string, options: TransferOptions & { passed?: WeakSet<object> } = {}): Promise<MergePreview> {
  const { signal, onProgress } = options;
  const passed = options.passed ?? new WeakSet<object>();
  const preview = await mergeWithStore(source, file, name, passed, options);
  throwIfCancelled(signal, 'writing');
  if (preview.changes.length > 0) await source.putRecords(preview.changes, { passed, signal, onProgress });
  if (preview.conflicts.length > 0) {
    const existing = ((await source.getMeta(SYNC_META.conflicts)) as Conflict[] | undefined) ?? [];
    await source.setMeta(SYNC_META.conflicts, addConflicts(existing, preview.conflicts));
  }
  return preview;
}

/**
 * Writes what a preview (previewImport) found, without reading the store again: each record is merged, inside the
 * write, with the version stored at that moment (PutRecordsOptions.mergeStored), so an edit made while the preview
 * was on screen is kept, as applyImport keeps it. The conflicts are those the preview listed (a version an edit
 * made since crossed is still kept in the record's history). Cancelled before or during the write, nothing is
 * written. Returns the preview.
 */
export async function applyPreviewedImport(source: RecordSource, previewed: ImportPreview, options: TransferOptions = {}): Promise<MergePreview> {
  const { preview, passed } = previewed;
  throwIfCancelled(options.signal, 'writing');
  if (preview.changes.length > 0) await source.putRecords(preview.changes, { passed, mergeStored: true, signal: options.signal, onProgress: options.onProgress });
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
