/**
 * Why a file in the office folder could not be merged, in the terms the crew can act on: the file, the phone
 * that wrote it, the record and the field refused, and the rule. Sync skips such a file and goes on (the phone's
 * own upload still happens); the problem is kept in the sync state so the Send screen can name it after the run.
 *
 * What a failure says about the file decides what sync does next time:
 * - "file": the file itself is refused (not a log, a newer format, truncated, a record the gate refuses). It is
 *   read again only once it changes.
 * - "passing": this phone could not take it in now (its storage is full, a transaction was aborted). It is read
 *   again at the next run.
 * - "fatal": the store itself cannot be used (closed, written by a newer app): the run stops, as before.
 */
import { formatValue } from '../errors';
import type { LogFile } from '../log';

export interface FileProblem {
  code: string;
  message: string;
  /** The phone (device id) the file says wrote it, when that can be read. */
  device?: string | null;
  /** The id of the record refused, when one is to blame. */
  record?: string | null;
  /** The field within that record (or within the file when no record is to blame). */
  field?: string | null;
  /** The value refused, shortened. */
  value?: string | null;
}

export type ProblemWeight = 'file' | 'passing' | 'fatal';

/** Store failures that say nothing about the file (src/store/errors.ts; matched by code, not imported). */
const PASSING_CODES = new Set(['storage-full', 'transaction-failed']);
const FATAL_CODES = new Set(['store-closed', 'database-newer', 'open-failed']);
/** Platform errors of IndexedDB that are about the phone, not about what was written. */
const PASSING_NAMES = new Set(['QuotaExceededError', 'UnknownError', 'AbortError', 'InvalidStateError', 'TransactionInactiveError']);

/** Long enough for every message we write; a file's own text echoed in a message is cut here. */
const MAX_MESSAGE = 400;
const MAX_NAME = 120;

export function problemWeight(error: unknown): ProblemWeight {
  const e = error as { code?: unknown; name?: unknown } | null;
  if (typeof e?.code === 'string' && FATAL_CODES.has(e.code)) return 'fatal';
  if (typeof e?.code === 'string' && PASSING_CODES.has(e.code)) return 'passing';
  if (typeof e?.name === 'string' && PASSING_NAMES.has(e.name)) return 'passing';
  return 'file';
}

function cut(text: string, max: number): string {
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}

const plainId = (v: unknown): string | null => (typeof v === 'string' && v.length > 0 ? cut(v, MAX_NAME) : null);

/** The file's parsed top level, when its text is JSON at all (a truncated file is not). */
function parsed(text: string): Record<string, unknown> | null {
  try {
    const data: unknown = JSON.parse(text);
    return data && typeof data === 'object' && !Array.isArray(data) ? (data as Record<string, unknown>) : null;
  } catch {
    return null;
  }
}

/** The "device" of the file's header, read from the start of the text when the text does not parse (truncated). */
function deviceOf(file: LogFile | null, data: Record<string, unknown> | null, text: string): string | null {
  if (file) return plainId(file.device);
  if (data) return plainId(data.device);
  // The canonical writer puts the header's keys (app_version, device, …) before "records".
  const head = text.slice(0, 4096);
  const end = head.indexOf('"records"');
  const match = /"device"\s*:\s*"([^"\\]{1,120})"/.exec(end >= 0 ? head.slice(0, end) : head);
  return match ? match[1]! : null;
}

/** The failing record's id and the field inside it. */
function whereIn(error: unknown, file: LogFile | null, data: Record<string, unknown> | null): { record: string | null; field: string | null } {
  const e = error as { field?: unknown; record?: unknown; recordId?: unknown; id?: unknown; problems?: { path?: unknown; message?: unknown }[] } | null;
  const field = typeof e?.field === 'string' ? e.field : null;
  const named = plainId(e?.recordId) ?? plainId(e?.record);
  // "records[12].time_s": a place in the file.
  const inFile = field ? /^records\[(\d+)\](?:\.(.*))?$/.exec(field) : null;
  if (inFile) {
    const index = Number(inFile[1]);
    const records = file?.records ?? (Array.isArray(data?.records) ? (data.records as unknown[]) : []);
    const at = records[index] as { id?: unknown } | undefined;
    return { record: named ?? plainId(at?.id), field: inFile[2] ?? null };
  }
  // A batch refused by the store: "[3].time_s", and its message "[3] drop <id>: …".
  const inBatch = field ? /^\[\d+\]\.(.*)$/.exec(field) : null;
  if (inBatch) {
    const message = typeof e?.problems?.[0]?.message === 'string' ? e.problems[0].message : '';
    const id = /^\[\d+\] \S+ ([^\s:]+):/.exec(message)?.[1] ?? null;
    return { record: named ?? plainId(id), field: inBatch[1] ?? null };
  }
  return { record: named, field: field === null ? null : cut(field, MAX_NAME) };
}

/** The problem to report for `error`, met while reading or merging `text` (parsed as `file` when it got that far). */
export function fileProblem(error: unknown, text: string, file: LogFile | null = null): FileProblem {
  const e = error as { code?: unknown; message?: unknown; value?: unknown } | null;
  const data = file ? null : parsed(text);
  const { record, field } = whereIn(error, file, data);
  const hasValue = e !== null && typeof e === 'object' && 'value' in e && e.value !== undefined;
  return {
    code: typeof e?.code === 'string' ? e.code : typeof (e as { name?: unknown })?.name === 'string' ? String((e as { name: string }).name) : 'merge-failed',
    message: cut(typeof e?.message === 'string' ? e.message : String(error), MAX_MESSAGE),
    device: deviceOf(file, data, text),
    record,
    field,
    value: hasValue ? cut(formatValue(e.value), MAX_NAME) : null,
  };
}

/** One line for people: "plummet-log-phoneB.json (phone phoneB), record 4f…, field time_s: <message>". */
export function describeFileProblem(name: string, problem: FileProblem): string {
  const parts = [problem.device ? `${name} (phone ${problem.device})` : name];
  if (problem.record) parts.push(`record ${problem.record}`);
  if (problem.field) parts.push(`field ${problem.field}`);
  return `${parts.join(', ')}: ${problem.message}`;
}
