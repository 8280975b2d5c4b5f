/**
 * Reading a log file: JSON, then an upgrade of an older format (upgrade-export.ts), then the published schema (our compact checker, tested against ajv), then the record model's
 * own rules, then one record per id. The first thing wrong is reported with the field, the value and the rule,
 * e.g. `records[12].time_s (drop 4f…) is -1.6: must be > 0`.
 */
import { PlummetError, type PlummetErrorOptions } from '../errors';
import type { LogFile } from './export';
import { LOG_FORMAT, LOG_FORMAT_VERSION, LOG_SCHEMA } from './schema';
import { checkJsonSchema, type JsonSchemaProblem } from './json-schema-check';
import { validateRecord } from './validate';
import { upgradeLogFile } from './upgrade-export';
import type { LogRecord } from './types';

export type LogFileErrorCode =
  | 'log-not-json'
  | 'log-not-a-log'
  | 'log-format-too-new'
  | 'log-schema'
  | 'log-record-invalid'
  | 'log-duplicate-id';

/** `field` is where in the file, e.g. "records[12].time_s" ("(file)" for the file as a whole); `allowed` the rule
 *  broken, in words, e.g. "must be > 0". */
export class LogFileError extends PlummetError<LogFileErrorCode> {
  declare readonly field: string;
  declare readonly allowed: string;
  constructor(options: PlummetErrorOptions<LogFileErrorCode> & { field: string; allowed: string }) {
    super(options);
    this.name = 'LogFileError';
  }

  /** The same as `allowed` (the office command prints it as the rule). */
  get rule(): string {
    return this.allowed;
  }
}

/** "/records/3/shape/diameter_m" → ["records", 3, "shape", "diameter_m"] (JSON Pointer, RFC 6901). */
function pointerParts(pointer: string): (string | number)[] {
  if (!pointer) return [];
  return pointer
    .slice(1)
    .split('/')
    .map((p) => p.replace(/~1/g, '/').replace(/~0/g, '~'))
    .map((p) => (/^\d+$/.test(p) ? Number(p) : p));
}

function fieldName(parts: (string | number)[]): string {
  let out = '';
  for (const p of parts) out += typeof p === 'number' ? `[${p}]` : out ? `.${p}` : p;
  return out || '(file)';
}

function valueAt(data: unknown, parts: (string | number)[]): unknown {
  let here: unknown = data;
  for (const p of parts) {
    if (here === null || typeof here !== 'object') return undefined;
    here = (here as Record<string | number, unknown>)[p];
  }
  return here;
}

function show(value: unknown): string {
  if (value === undefined) return 'missing';
  const text = JSON.stringify(value) ?? String(value);
  return text.length > 60 ? `${text.slice(0, 57)}...` : text;
}

/** Which record a field belongs to, for the message: ` (drop 4f0c…)`. */
function recordLabel(data: unknown, parts: (string | number)[]): string {
  if (parts[0] !== 'records' || typeof parts[1] !== 'number') return '';
  const record = valueAt(data, parts.slice(0, 2)) as Partial<LogRecord> | undefined;
  if (!record || typeof record !== 'object') return '';
  return ` (${typeof record.kind === 'string' ? record.kind : 'record'}${typeof record.id === 'string' ? ` ${record.id}` : ''})`;
}

/** The pattern of each named definition, in words. */
const PATTERN_RULES: Record<string, string> = {
  id: 'must be a record id (a UUID such as 0b7e2d4c-5f1a-4c3e-9d2b-8a6f4e1c7b90)',
  instant: 'must be an ISO 8601 instant in UTC such as 2026-06-14T09:12:03.412Z',
  date: 'must be a calendar date YYYY-MM-DD',
  device: 'must be a device id of letters, digits, _ . : only',
  rev: 'must be a clock stamp "<ms, 15 digits>-<counter, 6 digits>-<device>"',
};

/** The rule of a problem in words: the checker's own sentence without its "path: value" lead. */
function ruleOf(problem: JsonSchemaProblem, data: unknown, parts: (string | number)[]): string {
  if (problem.keyword === 'required') return 'is required';
  if (problem.keyword === 'additionalProperties') {
    const owner = valueAt(data, parts.slice(0, -1)) as { kind?: unknown } | undefined;
    return `is not a field of ${typeof owner?.kind === 'string' ? `a ${owner.kind}` : 'this object'} in format ${LOG_FORMAT_VERSION}`;
  }
  if (problem.keyword === 'pattern') {
    const def = /\$defs\/([^/]+)/.exec(problem.message)?.[1];
    const last = parts[parts.length - 1];
    const named = PATTERN_RULES[def ?? ''] ?? (typeof last === 'string' ? PATTERN_RULES[last.replace(/_id$/, '') === last ? last : 'id'] : undefined);
    if (named) return named;
  }
  const prefix = `${problem.path}: `;
  let rule = problem.message.startsWith(prefix) ? problem.message.slice(prefix.length) : problem.message;
  const shown = JSON.stringify(problem.value);
  if (shown !== undefined && rule.startsWith(`${shown} `)) rule = rule.slice(shown.length + 1);
  return rule;
}

function schemaError(data: unknown, problem: JsonSchemaProblem): LogFileError {
  const parts = pointerParts(problem.path);
  const rule = ruleOf(problem, data, parts);
  const field = fieldName(parts);
  const value = valueAt(data, parts);
  const label = `${field}${recordLabel(data, parts)}`;
  const message = value === undefined ? `${label} is missing; it is required` : `${label} is ${show(value)}: ${rule}`;
  return new LogFileError({ code: 'log-schema', field, value, allowed: rule, message });
}

/** Reads and checks a log file's text. Throws LogFileError for the first thing wrong. */
export function readLogFile(text: string): LogFile {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    throw new LogFileError({
      code: 'log-not-json',
      field: '(file)',
      value: text.slice(0, 40),
      allowed: 'must be JSON (RFC 8259)',
      message: `the file is not JSON (${(error as Error).message}); a Plummet log is a .json file`,
    });
  }
  const head = data as { format?: unknown; format_version?: unknown } | null;
  if (head === null || typeof head !== 'object' || Array.isArray(head) || head.format !== LOG_FORMAT) {
    const value = head && typeof head === 'object' ? head.format : data;
    throw new LogFileError({
      code: 'log-not-a-log',
      field: 'format',
      value: value,
      allowed: `must be "${LOG_FORMAT}"`,
      message: `this JSON file is not a Plummet log (its "format" is ${show(value)}, a log says "${LOG_FORMAT}")`,
    });
  }
  if (typeof head.format_version === 'number' && head.format_version > LOG_FORMAT_VERSION) {
    throw new LogFileError({
      code: 'log-format-too-new',
      field: 'format_version',
      value: head.format_version,
      allowed: `must be ${LOG_FORMAT_VERSION} or older`,
      message: `this log was written by a newer app (format ${head.format_version}); this app reads format ${LOG_FORMAT_VERSION}: update the app`,
    });
  }
  data = upgradeLogFile(data);
  const problems = checkJsonSchema(LOG_SCHEMA, data, { maxErrors: 1 });
  if (problems.length > 0) throw schemaError(data, problems[0]!);
  const file = data as LogFile;
  const seen = new Map<string, number>();
  file.records.forEach((record, i) => {
    const problems = validateRecord(record);
    if (problems.length > 0) {
      const p = problems[0]!;
      const field = `records[${i}].${p.path}`;
      throw new LogFileError({ code: 'log-record-invalid', field, value: p.value, allowed: p.rule, message: `records[${i}] (${record.kind} ${record.id}): ${p.message}` });
    }
    const earlier = seen.get(record.id);
    if (earlier !== undefined) {
      throw new LogFileError({
        code: 'log-duplicate-id',
        field: `records[${i}].id`,
        value: record.id,
        allowed: 'each record appears once',
        message: `records[${i}].id ${record.id} is the id of records[${earlier}] too; a file holds each record once`,
      });
    }
    seen.set(record.id, i);
  });
  return file;
}
