/**
 * Reading a log file: JSON, then an upgrade of an older format (upgrade-export.ts), then the published schema (our compact checker, tested against ajv), then the record model's
 * own rules, then one record per id. The first thing wrong is reported with the field, the value and the rule,
 * e.g. `records[12].time_s (drop 4f…) is -1.6: must be > 0`.
 */
import { PlummetError, type PlummetErrorOptions } from '../errors';
import type { LogFile } from './export';
import { LOG_FORMAT, LOG_FORMAT_VERSION, LOG_SCHEMA } from './schema';
import { checkJsonSchema, type JsonSchemaProblem } from './json-schema-check';
import { checkJsonValue, DUPLICATE_ID_RULE, GATE_PROBLEM_LIMIT, gateSteps, RECORD_NESTING_LIMIT, recordName } from './record-gate';
import type { TransferProgress } from './transfer-progress';
import type { Problem } from './errors';
import { countMemberNames, findDuplicateKey } from './duplicate-keys';
import { upgradeLogFile } from './upgrade-export';
import type { LogRecord } from './types';

export type LogFileErrorCode =
  | 'log-not-text'
  | 'log-not-json'
  | 'log-not-a-log'
  | 'log-format-too-new'
  | 'log-schema'
  | 'log-record-invalid'
  | 'log-duplicate-id'
  /** One object names a field twice (I-JSON, RFC 7493 §2.3, forbids it; JSON.parse would keep the last). */
  | 'log-duplicate-key';

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
  if (typeof value === 'number') return String(value);
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

/** Code units collected before they become a string: small enough for String.fromCharCode's argument list. */
const DECODE_CHUNK = 8192;

/** A run of UTF-16 code units as a string (apply takes the typed array as it is; a spread would iterate it). */
const unitsToString = (units: Uint16Array): string => String.fromCharCode.apply(null, units as unknown as number[]);

function notText(encoding: string, offset: number, bytes: Uint8Array, why: string): LogFileError {
  const shown = Array.from(bytes.subarray(offset, offset + 4), (b) => `0x${b.toString(16).toUpperCase().padStart(2, '0')}`).join(' ');
  return new LogFileError({
    code: 'log-not-text',
    field: '(file)',
    value: `byte ${offset}: ${shown || 'end of file'}`,
    allowed: 'UTF-8 (with or without a byte-order mark), or UTF-16 LE/BE with a byte-order mark',
    message: `the file is not ${encoding} text: at byte ${offset} (${shown || 'end of file'}) ${why}; a Plummet log is UTF-8 text (a byte-order mark, or UTF-16 with one, is accepted too)`,
  });
}

/**
 * UTF-8 to a string, refusing what is not well-formed (the Unicode Standard, ch. 3, table 3-7: no overlong forms,
 * no surrogates, nothing above U+10FFFF) rather than putting U+FFFD in a measurement's text in silence.
 * Written out because the pure core has no TextDecoder.
 */
function decodeUtf8(bytes: Uint8Array, start: number): string {
  const parts: string[] = [];
  const units = new Uint16Array(DECODE_CHUNK + 2);
  let n = 0;
  let i = start;
  while (i < bytes.length) {
    const c = bytes[i]!;
    if (c < 0x80) {
      units[n++] = c;
      i++;
    } else {
      let need: number;
      let cp: number;
      let lo = 0x80;
      let hi = 0xbf;
      if (c >= 0xc2 && c <= 0xdf) (need = 1), (cp = c & 0x1f);
      else if (c >= 0xe0 && c <= 0xef) {
        need = 2;
        cp = c & 0x0f;
        if (c === 0xe0) lo = 0xa0;
        if (c === 0xed) hi = 0x9f;
      } else if (c >= 0xf0 && c <= 0xf4) {
        need = 3;
        cp = c & 0x07;
        if (c === 0xf0) lo = 0x90;
        if (c === 0xf4) hi = 0x8f;
      } else throw notText('UTF-8', i, bytes, 'is a byte that cannot start a UTF-8 sequence');
      if (i + need >= bytes.length) throw notText('UTF-8', i, bytes, 'a UTF-8 sequence is cut off by the end of the file');
      for (let k = 1; k <= need; k++) {
        const x = bytes[i + k]!;
        if (x < lo || x > hi) throw notText('UTF-8', i, bytes, 'is not a well-formed UTF-8 sequence');
        lo = 0x80;
        hi = 0xbf;
        cp = (cp << 6) | (x & 0x3f);
      }
      i += need + 1;
      if (cp >= 0x10000) {
        cp -= 0x10000;
        units[n++] = 0xd800 + (cp >> 10);
        units[n++] = 0xdc00 + (cp & 0x3ff);
      } else units[n++] = cp;
    }
    if (n >= DECODE_CHUNK) {
      parts.push(unitsToString(units.subarray(0, n)));
      n = 0;
    }
  }
  parts.push(unitsToString(units.subarray(0, n)));
  return parts.join('');
}

/** UTF-16 after its byte-order mark; an unpaired surrogate is refused like malformed UTF-8. */
function decodeUtf16(bytes: Uint8Array, littleEndian: boolean): string {
  const encoding = littleEndian ? 'UTF-16LE' : 'UTF-16BE';
  if (bytes.length % 2 !== 0) throw notText(encoding, bytes.length - 1, bytes, 'the file ends in the middle of a UTF-16 code unit');
  const parts: string[] = [];
  const units = new Uint16Array(DECODE_CHUNK);
  let n = 0;
  let pendingHigh = -1;
  for (let i = 2; i < bytes.length; i += 2) {
    const u = littleEndian ? bytes[i]! | (bytes[i + 1]! << 8) : (bytes[i]! << 8) | bytes[i + 1]!;
    const isHigh = u >= 0xd800 && u <= 0xdbff;
    const isLow = u >= 0xdc00 && u <= 0xdfff;
    if (pendingHigh >= 0 && !isLow) throw notText(encoding, pendingHigh, bytes, 'is a high surrogate without its low half');
    if (isLow && pendingHigh < 0) throw notText(encoding, i, bytes, 'is a low surrogate without its high half');
    pendingHigh = isHigh ? i : -1;
    units[n++] = u;
    if (n === DECODE_CHUNK && pendingHigh < 0) {
      parts.push(unitsToString(units));
      n = 0;
    } else if (n === DECODE_CHUNK) {
      parts.push(unitsToString(units.subarray(0, n - 1)));
      units[0] = u;
      n = 1;
    }
  }
  if (pendingHigh >= 0) throw notText(encoding, pendingHigh, bytes, 'is a high surrogate without its low half');
  parts.push(unitsToString(units.subarray(0, n)));
  return parts.join('');
}

/**
 * A log file's bytes as text, the one decoding used by the phone's import and the office command: UTF-8, with
 * its byte-order mark dropped if it has one (an editor on Windows adds it), or UTF-16 LE/BE when the file starts
 * with that byte-order mark (what "Unicode" means in some editors' save dialogs). JSON text begins with ASCII
 * (RFC 8259 §2), so a NUL in its first two bytes means UTF-16 or UTF-32 without a mark: refused by name.
 * Throws LogFileError 'log-not-text' naming the byte offset.
 *
 * `strictUtf8`, when given, is the platform's own strict decoder (TextDecoder with fatal: true, ignoreBOM: true),
 * about five times faster on a large log; it is used for well-formed UTF-8 only: when it refuses, the bytes are
 * decoded here again to name the offending byte. Both follow the Unicode Standard's table 3-7 (a test compares them).
 */
export function decodeLogBytes(bytes: Uint8Array, strictUtf8?: (bytes: Uint8Array) => string): string {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return decodeUtf16(bytes, true);
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return decodeUtf16(bytes, false);
  const start = bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  if (bytes.length - start >= 2 && (bytes[start] === 0 || bytes[start + 1] === 0)) {
    throw notText('UTF-8', start, bytes, 'NUL bytes begin the file: UTF-16 or UTF-32 without a byte-order mark, which is not accepted (save it as UTF-8)');
  }
  if (strictUtf8) {
    try {
      return strictUtf8(bytes.subarray(start));
    } catch {
      // Malformed: decoded below, which names the byte.
    }
  }
  return decodeUtf8(bytes, start);
}

/**
 * How a number too large for JSON was written in the file: JSON.parse makes Infinity of 1e999999 and of a
 * 400-digit integer alike, and a message showing "Infinity" or "null" would point at nothing in the file.
 * Scans the text (only when such a number was found) for the first number literal that does not fit.
 */
function writtenTooLarge(text: string): string | null {
  const token = /"(?:[^"\\]|\\.)*"|-?\d[\d.eE+-]*/g;
  for (let m = token.exec(text); m; m = token.exec(text)) {
    const literal = m[0];
    if (literal.startsWith('"')) continue;
    if (!Number.isFinite(Number(literal))) return literal.length > 40 ? `${literal.slice(0, 37)}...` : literal;
  }
  return null;
}

/** A problem the gate found, as the file's error: where in the file, which record, the value and the rule. */
function gateError(data: unknown, problem: Problem, text: string, at: string): LogFileError {
  const field = problem.path;
  const parts = /^records\[(\d+)\]/.exec(field);
  const record = parts ? valueAt(data, ['records', Number(parts[1])]) : undefined;
  const within = parts ? field.slice(parts[0].length + 1) : field;
  const label = parts ? `records[${parts[1]}]${recordLabel(data, ['records', Number(parts[1])])}` : '';
  let value = problem.value;
  // The gate's own lead ("records[3] drop 4f0c…: ") gives way to the file's (the kind and id in brackets).
  const lead = parts ? `records[${parts[1]}] ${recordName(record)}: ` : '';
  const own = lead && problem.message.startsWith(lead) ? problem.message.slice(lead.length) : problem.message.replace(/^records\[\d+\]\.?/, '');
  let message = parts ? `${label} ${own}` : problem.message;
  if (typeof value === 'number' && !Number.isFinite(value) && !Number.isNaN(value)) {
    const written = writtenTooLarge(text);
    if (written !== null) value = written;
    message = `${label ? `${label} ` : ''}${within || field}: ${written ?? 'a number'} is a number too large for JSON: must be a finite number`;
  }
  const code: LogFileErrorCode = problem.rule === DUPLICATE_ID_RULE ? 'log-duplicate-id' : record !== undefined ? 'log-record-invalid' : 'log-schema';
  return new LogFileError({ code, field, value, allowed: problem.rule, message: `${at}${message}` });
}

export interface ReadLogFileOptions {
  /** The file's name, for the messages: "plummet-log-phoneB.json: records[3] …". */
  name?: string;
  /** Filled with the records that passed the gate whole, so the rest of an import does not check them again
   *  (GateOptions.passed). */
  passed?: WeakSet<object>;
}

/**
 * Reads and checks a log file's text. Throws LogFileError for the first thing wrong. Every record passes the
 * store's gate (record-gate.ts) here, so what this accepts can be written.
 */
export function readLogFile(text: string, options: ReadLogFileOptions = {}): LogFile {
  const steps = readLogFileSteps(text, options);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

/**
 * readLogFile in steps, for an import that shows progress and may be cancelled: yields how many records the gate
 * has checked (phase 'checking') as it goes, and returns the file, or throws as readLogFile does.
 */
export function* readLogFileSteps(text: string, options: ReadLogFileOptions = {}): Generator<TransferProgress, LogFile, void> {
  const checked = yield* checkLogTextSteps(text, options, 1);
  if ('errors' in checked) throw checked.errors[0]!;
  return checked.file;
}

/**
 * Everything wrong with a log file's text as far as reading can tell, for a report rather than a refusal: the
 * same stages as readLogFile, which stop at the first stage that fails; that stage lists up to `limit` problems
 * (the published schema's and the gate's may be many; the earlier stages have one). Empty: the file is accepted.
 */
export function logFileProblems(text: string, options: ReadLogFileOptions & { limit?: number } = {}): LogFileError[] {
  const steps = checkLogTextSteps(text, options, Math.max(1, options.limit ?? GATE_PROBLEM_LIMIT));
  for (;;) {
    const step = steps.next();
    if (step.done) return 'errors' in step.value ? step.value.errors : [];
  }
}

type Checked = { file: LogFile } | { errors: LogFileError[] };

function* checkLogTextSteps(text: string, options: ReadLogFileOptions, limit: number): Generator<TransferProgress, Checked, void> {
  const at = options.name ? `${options.name}: ` : '';
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    const why = String((error as Error).message).slice(0, 160);
    return { errors: [new LogFileError({
      code: 'log-not-json',
      field: '(file)',
      value: text.slice(0, 40),
      allowed: 'must be JSON (RFC 8259)',
      message: `${at}the file is not JSON (${why}); a Plummet log is a .json file`,
    })] };
  }
  const head = data as { format?: unknown; format_version?: unknown } | null;
  if (head === null || typeof head !== 'object' || Array.isArray(head) || head.format !== LOG_FORMAT) {
    const value = head && typeof head === 'object' ? head.format : data;
    return { errors: [new LogFileError({
      code: 'log-not-a-log',
      field: 'format',
      value: value,
      allowed: `must be "${LOG_FORMAT}"`,
      message: `${at}this JSON file is not a Plummet log (its "format" is ${show(value)}, a log says "${LOG_FORMAT}")`,
    })] };
  }
  if (typeof head.format_version === 'number' && head.format_version > LOG_FORMAT_VERSION) {
    return { errors: [new LogFileError({
      code: 'log-format-too-new',
      field: 'format_version',
      value: head.format_version,
      allowed: `must be ${LOG_FORMAT_VERSION} or older`,
      message: `${at}this log was written by a newer app (format ${head.format_version}); this app reads format ${LOG_FORMAT_VERSION}: update the app`,
    })] };
  }
  // The page gets a turn between the stages that read the whole file (each a second or so on a phone at 100 000
  // records), so its progress shows and a cancel is seen.
  yield { phase: 'checking', done: 0, total: 0 };
  // What JSON cannot carry and nesting no log has, before anything else walks the values (the file and its records
  // are two levels above a record). The walk counts the keys of every object on the way.
  const tally = { keys: 0 };
  const structural = checkJsonValue(data, '', RECORD_NESTING_LIMIT + 2, 1, tally);
  yield { phase: 'checking', done: 0, total: 0 };
  // A name written twice in one object is reported first (before a structural problem, as the text is read before
  // its values). The keys JSON.parse kept add up to the names the text writes unless some object names a field twice;
  // only then, or when the walk stopped early, is the duplicate looked for (and named).
  const duplicate = structural.length > 0 || tally.keys !== countMemberNames(text) ? findDuplicateKey(text) : null;
  if (duplicate) {
    const parts = [...pointerParts(duplicate.pointer), duplicate.key];
    const field = fieldName(parts);
    const rule = 'a log names each field of an object once (I-JSON, RFC 7493 §2.3)';
    return { errors: [new LogFileError({
      code: 'log-duplicate-key',
      field,
      value: duplicate.key,
      allowed: rule,
      message: `${at}${field}${recordLabel(data, parts)}: the field ${show(duplicate.key)} appears twice in one object, and which one counts is a guess: ${rule}`,
    })] };
  }
  if (structural.length > 0) return { errors: [gateError(data, structural[0]!, text, at)] };
  data = upgradeLogFile(data);
  yield { phase: 'checking', done: 0, total: 0 };
  const problems = checkJsonSchema(LOG_SCHEMA, data, { maxErrors: limit });
  if (problems.length > 0) {
    const parsed = data;
    return {
      errors: problems.map((problem) => {
        const error = schemaError(parsed, problem);
        if (at) Object.defineProperty(error, 'message', { value: `${at}${error.message}` });
        return error;
      }),
    };
  }
  const file = data as LogFile;
  const total = file.records.length;
  yield { phase: 'checking', done: 0, total };
  // The structure was checked on the whole file above; an upgraded file is new data of our making, checked again.
  const upgraded = head.format_version !== LOG_FORMAT_VERSION;
  const refused = yield* progressOf(gateSteps(file.records, { where: (i) => `records[${i}]`, passed: options.passed, structureChecked: !upgraded }), total);
  if (refused.length > 0) return { errors: refused.slice(0, limit).map((p) => gateError(data, p, text, at)) };
  return { file };
}

/** The gate's steps as the import's progress. */
function* progressOf(steps: Generator<number, Problem[], void>, total: number): Generator<TransferProgress, Problem[], void> {
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
    yield { phase: 'checking', done: step.value, total };
  }
}
