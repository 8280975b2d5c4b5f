/**
 * The gate as the import preview runs it: the records a merge would write, checked against the log they would
 * join, with the store's own gate (record-gate.ts). The store runs the same before its write, so a file the
 * preview accepts is not refused when it is written; a refusal here names the file, the record, the field
 * and the value, as the file reader's do.
 */
import { LogFileError } from './export-parse';
import type { LogFile } from './export';
import type { Problem } from './errors';
import { previewMerge, type MergePreview } from './merge';
import { gateAgainstLog, gateRecords, recordName } from './record-gate';
import type { LogRecord, RecordKind } from './types';

/** The first problem as the file's error, the record named by its place in `file`. */
function refusal(file: LogFile, batch: readonly LogRecord[], p: Problem, name?: string): LogFileError {
  const at = /^\[(\d+)\]/.exec(p.path);
  const record = batch[Number(at?.[1] ?? 0)]!;
  const index = file.records.findIndex((r) => r.id === record.id && r.kind === record.kind);
  const where = index >= 0 ? `records[${index}]` : `(merged ${recordName(record)})`;
  const lead = `${at?.[0] ?? ''} ${recordName(record)}: `;
  const own = p.message.startsWith(lead) ? p.message.slice(lead.length) : p.message;
  return new LogFileError({
    code: 'log-record-invalid',
    field: `${where}${p.path.slice(at?.[0].length ?? 0)}`,
    value: p.value,
    allowed: p.rule,
    message: `${name ? `${name}: ` : ''}${where} (${recordName(record)}) ${own}`,
  });
}

/**
 * The merge of a file (read and checked by readLogFile) into the local log, through the store's gate: first the
 * file's records against the log (an id the log holds as another kind, a link to the wrong kind), then what the
 * merge would write, as the store will check it. Throws LogFileError ('log-record-invalid') naming the file, the
 * record, the field and the value; the store runs the same gate before its write. `passed`: see GateOptions.
 */
export function previewGatedMerge(file: LogFile, local: readonly LogRecord[], name?: string, passed?: WeakSet<object>): MergePreview {
  const known = new Map<string, RecordKind>();
  for (const r of local) if (!known.has(r.id)) known.set(r.id, r.kind);
  // With `passed` (the records readLogFile checked whole, in this import), only what the merge made anew is
  // checked whole here: a record the log lacks is the file's own object, already through the gate.
  const options = { known: (id: string) => known.get(id), passed };
  const clash = gateAgainstLog(file.records, options);
  if (clash.length > 0) throw refusal(file, file.records, clash[0]!, name);
  const preview = previewMerge(local, file.records);
  const problems = gateRecords(preview.changes, options);
  if (problems.length > 0) throw refusal(file, preview.changes, problems[0]!, name);
  return preview;
}
