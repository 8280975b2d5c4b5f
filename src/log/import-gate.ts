/**
 * The gate as the import preview runs it: the records a merge would write, checked against the log they would
 * join, with the store's own gate (record-gate.ts). The store runs the same before its write, so a file the
 * preview accepts is not refused when it is written; a refusal here names the file, the record, the field
 * and the value, as the file reader's do.
 */
import { LogFileError } from './export-parse';
import type { LogFile } from './export';
import { gateRecords, recordName } from './record-gate';
import type { LogRecord, RecordKind } from './types';

/**
 * Throws LogFileError ('log-record-invalid') for the first record of `changes` (what previewMerge would write)
 * the store would refuse beside `local`; names it by its place in `file`.
 */
export function assertImportable(file: LogFile, changes: readonly LogRecord[], local: readonly LogRecord[], name?: string): void {
  if (changes.length === 0) return;
  const known = new Map<string, RecordKind>();
  for (const r of local) if (!known.has(r.id)) known.set(r.id, r.kind);
  const problems = gateRecords(changes, { known: (id) => known.get(id) });
  if (problems.length === 0) return;
  const p = problems[0]!;
  const at = /^\[(\d+)\]/.exec(p.path);
  const record = changes[Number(at?.[1] ?? 0)]!;
  const index = file.records.findIndex((r) => r.id === record.id);
  const where = index >= 0 ? `records[${index}]` : `(merged ${recordName(record)})`;
  const lead = `${at?.[0] ?? ''} ${recordName(record)}: `;
  const own = p.message.startsWith(lead) ? p.message.slice(lead.length) : p.message;
  const field = `${where}${p.path.slice(at?.[0].length ?? 0)}`;
  throw new LogFileError({
    code: 'log-record-invalid',
    field,
    value: p.value,
    allowed: p.rule,
    message: `${name ? `${name}: ` : ''}${where} (${recordName(record)}) ${own}`,
  });
}
