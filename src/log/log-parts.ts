/**
 * A phone's log split into parts, one per day (by the day's calendar date), plus a small index naming each part
 * with the fingerprint of its text. The office folder holds a phone's log this way so that a sync reads and
 * writes only the days that changed: a drop edited on 14 June changes that day's part and the index, nothing
 * else. A day rather than a month: a crew's season is a few hundred days, and a change touches one of them, so a
 * sync moves about one day of drops instead of a month of them; the price is one request per day on a phone's
 * first sync.
 *
 * Each part is an ordinary log file (format 2, canonical JSON) that stands on its own: the day with
 * their readings, series and drops, and the sites and specimens those refer to (a site or specimen used in
 * several days is in each of them; merging a record twice is merging it once). Records no day reaches (a
 * specimen not yet dropped, a site without days) are in the part "other". So every part passes the one gate
 * (record-gate.ts) alone, can be merged alone, and can be analysed alone.
 *
 * The index (format "plummet-log-parts", version 1):
 *   { "app_version", "device", "format": "plummet-log-parts", "format_version": 1,
 *     "parts": [{ "hash", "key", "records" }] }   keys "YYYY-MM-DD" or "other", each once, sorted.
 * It is read as hostile as any file: JSON, one name per field, nesting, then its schema (PART_INDEX_SCHEMA,
 * with the same checker as the log's), then each key once.
 */
import { canonicalJson } from './canonical';
import { contentHash } from './content-hash';
import { findDuplicateKey } from './duplicate-keys';
import { buildLogFile, type LogFile } from './export';
import { LogFileError } from './export-parse';
import { checkJsonSchema } from './json-schema-check';
import { mergeLogs } from './merge';
import { checkJsonValue } from './record-gate';
import { LOG_FORMAT, LOG_FORMAT_VERSION } from './schema';
import type { LogRecord } from './types';

export const PART_INDEX_FORMAT = 'plummet-log-parts';
export const PART_INDEX_VERSION = 1;
/** The part of the records no day reaches. */
export const OTHER_PART = 'other';
/** More parts than a thousand years of days is not a phone's log. */
export const PART_LIMIT = 366_000;

export interface LogPartEntry {
  /** "YYYY-MM-DD", or "other". */
  key: string;
  /** contentHash of the part's text. */
  hash: string;
  /** How many records the part holds. */
  records: number;
}

export interface LogPartIndex {
  format: typeof PART_INDEX_FORMAT;
  format_version: typeof PART_INDEX_VERSION;
  app_version: string;
  device: string;
  parts: LogPartEntry[];
}

export interface LogPart {
  key: string;
  file: LogFile;
  /** The part's text: canonical JSON (RFC 8785). */
  text: string;
  hash: string;
}

export interface SplitLog {
  parts: LogPart[];
  index: LogPartIndex;
  /** The index's text: canonical JSON. */
  indexText: string;
}

const KEY_PATTERN = '^(?:[0-9]{4}-(?:0[1-9]|1[0-2])-(?:0[1-9]|[12][0-9]|3[01])|other)$';

/** The index's published shape, checked with checkJsonSchema (the keywords it supports only). */
export const PART_INDEX_SCHEMA = {
  $schema: 'https://json-schema.org/draft/2020-12/schema',
  type: 'object',
  required: ['format', 'format_version', 'app_version', 'device', 'parts'],
  additionalProperties: false,
  properties: {
    format: { const: PART_INDEX_FORMAT },
    format_version: { const: PART_INDEX_VERSION },
    app_version: { type: 'string', pattern: '^.{0,64}$' },
    device: { type: 'string', pattern: '^[A-Za-z0-9_.:]{1,64}$' },
    parts: {
      type: 'array',
      items: {
        type: 'object',
        required: ['key', 'hash', 'records'],
        additionalProperties: false,
        properties: {
          key: { type: 'string', pattern: KEY_PATTERN },
          hash: { type: 'string', pattern: '^[0-9a-f]{16}-[0-9]{1,12}$' },
          records: { type: 'integer', minimum: 0, maximum: 100_000_000 },
        },
      },
    },
  },
} as const;

/** The part a record belongs to, by the date of its day; records no day reaches go to "other". */
function partKeys(records: readonly LogRecord[]): Map<string, string> {
  const dayKey = new Map<string, string>();
  for (const r of records) if (r.kind === 'day' && typeof r.date === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(r.date)) dayKey.set(r.id, r.date);
  const seriesKey = new Map<string, string>();
  for (const r of records) if (r.kind === 'series') seriesKey.set(r.id, dayKey.get(r.day_id) ?? OTHER_PART);
  const key = new Map<string, string>();
  for (const r of records) {
    switch (r.kind) {
      case 'day':
        key.set(r.id, dayKey.get(r.id) ?? OTHER_PART);
        break;
      case 'reading':
        key.set(r.id, dayKey.get(r.day_id) ?? OTHER_PART);
        break;
      case 'series':
        key.set(r.id, seriesKey.get(r.id)!);
        break;
      case 'drop':
        key.set(r.id, seriesKey.get(r.series_id) ?? OTHER_PART);
        break;
      default:
        break;
    }
  }
  return key;
}

/** The sites and specimens a part's own records refer to (a day's site, a series' specimen). */
function referencedCatalogue(own: readonly LogRecord[]): Set<string> {
  const ids = new Set<string>();
  for (const r of own) {
    if (r.kind === 'day') ids.add(r.site_id);
    else if (r.kind === 'series') ids.add(r.specimen_id);
  }
  return ids;
}

/**
 * The log split into its parts and their index. Several records of one id (versions not yet merged) go together.
 * The same records give the same texts and hashes, whatever their order.
 */
export function splitLog(records: readonly LogRecord[], options: { device: string; app_version: string }): SplitLog {
  const keys = partKeys(records);
  const own = new Map<string, LogRecord[]>();
  const catalogue: LogRecord[] = [];
  for (const r of records) {
    const key = keys.get(r.id);
    if (key === undefined) {
      catalogue.push(r);
      continue;
    }
    let list = own.get(key);
    if (!list) own.set(key, (list = []));
    list.push(r);
  }
  const used = new Set<string>();
  const byKey = new Map<string, LogRecord[]>();
  for (const [key, list] of own) {
    const refs = referencedCatalogue(list);
    for (const id of refs) used.add(id);
    byKey.set(key, [...catalogue.filter((c) => refs.has(c.id)), ...list]);
  }
  const unused = catalogue.filter((c) => !used.has(c.id));
  if (unused.length > 0) byKey.set(OTHER_PART, [...(byKey.get(OTHER_PART) ?? []), ...unused]);
  const parts: LogPart[] = [];
  for (const key of [...byKey.keys()].sort()) {
    const chosen = byKey.get(key)!;
    const dayIds = key === OTHER_PART ? [] : chosen.filter((r) => r.kind === 'day').map((r) => r.id);
    const selection = key === OTHER_PART ? { kinds: [...new Set(chosen.map((r) => r.kind))] } : { day_ids: dayIds };
    const built = buildLogFile([], { device: options.device, app_version: options.app_version, selection });
    const file: LogFile = { ...built, records: buildLogFile(chosen, { device: options.device, app_version: options.app_version }).records };
    const text = canonicalJson(file);
    parts.push({ key, file, text, hash: contentHash(text) });
  }
  const index: LogPartIndex = {
    format: PART_INDEX_FORMAT,
    format_version: PART_INDEX_VERSION,
    app_version: options.app_version,
    device: options.device,
    parts: parts.map((p) => ({ key: p.key, hash: p.hash, records: p.file.records.length })),
  };
  return { parts, index, indexText: canonicalJson(index) };
}

/** The file name of a part inside the phone's part folder: "<key>.json". */
export const partFileName = (key: string): string => `${key}.json`;

function refuse(at: string, code: 'log-not-json' | 'log-not-a-log' | 'log-format-too-new' | 'log-schema', field: string, value: unknown, allowed: string, message: string): LogFileError {
  return new LogFileError({ code, field, value, allowed, message: `${at}${message}` });
}

const show = (value: unknown): string => {
  const text = JSON.stringify(value) ?? String(value);
  return text.length > 80 ? `${text.slice(0, 77)}...` : text;
};

/**
 * Reads and checks a part index's text. Throws LogFileError naming the field, the value and the rule for the
 * first thing wrong.
 */
export function readPartIndex(text: string, options: { name?: string } = {}): LogPartIndex {
  const at = options.name ? `${options.name}: ` : '';
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    return failNotJson(at, text, error);
  }
  const head = data as { format?: unknown; format_version?: unknown } | null;
  if (head === null || typeof head !== 'object' || Array.isArray(head) || head.format !== PART_INDEX_FORMAT) {
    const value = head && typeof head === 'object' ? head.format : data;
    throw refuse(at, 'log-not-a-log', 'format', value, `must be "${PART_INDEX_FORMAT}"`, `this file is not the index of a log's parts (its "format" is ${show(value)}, an index says "${PART_INDEX_FORMAT}")`);
  }
  if (typeof head.format_version === 'number' && head.format_version > PART_INDEX_VERSION) {
    throw refuse(at, 'log-format-too-new', 'format_version', head.format_version, `must be ${PART_INDEX_VERSION} or older`, `this index was written by a newer app (format ${head.format_version}); this app reads format ${PART_INDEX_VERSION}: update the app`);
  }
  const duplicate = findDuplicateKey(text);
  if (duplicate) {
    throw refuse(at, 'log-schema', `${duplicate.pointer || '(file)'}/${duplicate.key}`, duplicate.key, 'an index names each field of an object once (I-JSON, RFC 7493 §2.3)', `the field ${show(duplicate.key)} appears twice in one object`);
  }
  const structural = checkJsonValue(data, '', 4, 1);
  if (structural.length > 0) {
    const p = structural[0]!;
    throw refuse(at, 'log-schema', p.path || '(file)', p.value, p.rule, p.message);
  }
  const problem = checkJsonSchema(PART_INDEX_SCHEMA, data, { maxErrors: 1 })[0];
  if (problem) throw refuse(at, 'log-schema', problem.path || '(file)', problem.value, problem.message, problem.message);
  const index = data as LogPartIndex;
  if (index.parts.length > PART_LIMIT) {
    throw refuse(at, 'log-schema', 'parts', index.parts.length, `at most ${PART_LIMIT} parts`, `parts lists ${index.parts.length} parts: at most ${PART_LIMIT}`);
  }
  const seen = new Set<string>();
  for (let i = 0; i < index.parts.length; i++) {
    const key = index.parts[i]!.key;
    if (seen.has(key)) throw refuse(at, 'log-schema', `parts[${i}].key`, key, 'each part once', `parts[${i}].key is ${show(key)}, a part listed twice: each part once`);
    seen.add(key);
  }
  return index;
}

function failNotJson(at: string, text: string, error: unknown): never {
  const why = String((error as Error).message).slice(0, 160);
  throw refuse(at, 'log-not-json', '(file)', text.slice(0, 40), 'must be JSON (RFC 8259)', `the file is not JSON (${why}); an index of a log's parts is a JSON file`);
}

/**
 * A phone's parts (each read by readLogFile) assembled into one log, merged exactly as the app merges: the union
 * of every record's versions (a record found in several parts is merged, never duplicated). The header is the
 * first part's device and app version, or those given.
 */
export function assembleParts(parts: readonly LogFile[], options: { device?: string; app_version?: string } = {}): LogFile {
  let records: LogRecord[] = [];
  for (const part of parts) records = mergeLogs(records, part.records);
  return {
    format: LOG_FORMAT,
    format_version: LOG_FORMAT_VERSION,
    app_version: options.app_version ?? parts[0]?.app_version ?? '',
    device: options.device ?? parts[0]?.device ?? '',
    selection: null,
    records,
  };
}
