/**
 * The one gate of the store: every record that enters it (typed, imported, synced, upgraded) passes here first,
 * the whole record with its history, and the import preview runs the same gate, so a file the preview accepts
 * cannot fail when it is written.
 *
 * In order: the value must be JSON the canonical writer can write (plain objects and lists, finite numbers,
 * well-formed Unicode, nesting of a record's depth only) — so whatever is stored can always be exported —
 * then the record model's rules on own fields only (validate.ts: the envelope, the body, every history body as
 * a body of its kind, stamps rising through the history), then the batch: each id once and of one kind, and each
 * link naming a record of the kind it must.
 */
import { LogValidationError, type Problem } from './errors';
import { RECORD_KINDS, type RecordKind } from './types';
import { loneSurrogateAt, showValue as show, UNICODE_RULE, validateRecord } from './validate';
import { PROGRESS_STEP } from './transfer-progress';

/**
 * How deep a record's values may nest: the record, its history, a version, its body, a clip's evidence, its list
 * of key frames or scale marks, one of them, and room for one more. Deeper is not a record, and is refused before any code
 * that recurses (a writer, a comparison) meets it.
 */
export const RECORD_NESTING_LIMIT = 8;

/** At most this many problems are collected from one batch: enough to act on, bounded for a hostile file. */
export const GATE_PROBLEM_LIMIT = 50;

/** Which field of a body links to which kind of record (null allowed where the link is optional). */
export const REFERENCE_FIELDS: { readonly [K in RecordKind]: readonly { field: string; kind: RecordKind }[] } = {
  site: [],
  specimen: [],
  day: [{ field: 'site_id', kind: 'site' }],
  reading: [{ field: 'day_id', kind: 'day' }],
  series: [
    { field: 'day_id', kind: 'day' },
    { field: 'specimen_id', kind: 'specimen' },
    { field: 'reading_id', kind: 'reading' },
    { field: 'reading_aloft_id', kind: 'reading' },
  ],
  drop: [{ field: 'series_id', kind: 'series' }],
};

/** The rule a batch breaks when an id comes twice (the file reader names it 'log-duplicate-id'). */
export const DUPLICATE_ID_RULE = 'each record appears once, and an id names one record of one kind';

const join = (path: string, key: string) => (path ? `${path}.${key}` : key);

/**
 * Problems that would stop the canonical writer (canonical.ts) or that no record can hold: a value JSON cannot
 * carry (undefined, a function), a number that is not finite (1e999999 parses to Infinity), a lone surrogate in
 * a text or a key, an object that is not a plain one (a prototype other than Object's could lend it fields),
 * nesting deeper than `depthLimit`. Own keys only. Stops after `limit` problems. With `tally`, adds the number of
 * keys of every object walked to tally.keys (the file reader compares it with the names written in the text, to
 * know there is no duplicate name without collecting them; see duplicate-keys.ts).
 */
export function checkJsonValue(value: unknown, path = '', depthLimit = RECORD_NESTING_LIMIT, limit = GATE_PROBLEM_LIMIT, tally?: { keys: number }): Problem[] {
  const problems: Problem[] = [];
  // Where the walk is, as the keys and places below `path`: written out as a path only for a problem (a file holds
  // millions of values, and building each one's path took a third of this walk).
  const trail: (string | number)[] = [];
  const here = (): string => {
    let out = path;
    for (const step of trail) out = typeof step === 'number' ? `${out}[${step}]` : join(out, step);
    return out;
  };
  const add = (at: string, v: unknown, rule: string, what: string, shown = show(v)) => {
    const where = at || '(record)';
    problems.push({ path: where, value: v, rule, message: `${where}: ${shown} ${what}: ${rule}` });
  };
  let keys = 0;
  const walk = (v: unknown, depth: number): void => {
    if (problems.length >= limit) return;
    switch (typeof v) {
      case 'string': {
        const lone = loneSurrogateAt(v);
        if (lone >= 0) add(here(), v, UNICODE_RULE, `holds a lone UTF-16 surrogate at character ${lone + 1}`);
        return;
      }
      case 'number':
        if (!Number.isFinite(v)) {
          const what = Number.isNaN(v) ? 'is not a number' : 'is a number too large for JSON';
          add(here(), v, 'must be a finite number', what, Number.isNaN(v) ? 'NaN' : `${v < 0 ? '-' : ''}a number too large`);
        }
        return;
      case 'boolean':
        return;
      case 'object': {
        if (v === null) return;
        if (depth >= depthLimit) {
          add(here(), v, `a record nests at most ${RECORD_NESTING_LIMIT} levels deep`, 'is nested too deep', Array.isArray(v) ? '[a list]' : '{an object}');
          return;
        }
        if (Array.isArray(v)) {
          for (let i = 0; i < v.length && problems.length < limit; i++) {
            trail.push(i);
            walk(v[i], depth + 1);
            trail.pop();
          }
          return;
        }
        const proto = Object.getPrototypeOf(v);
        if (proto !== Object.prototype && proto !== null) {
          add(here(), v, 'must be plain JSON data', 'is not a plain object', '{an object}');
          return;
        }
        const names = Object.keys(v);
        keys += names.length;
        for (const key of names) {
          if (problems.length >= limit) return;
          const lone = loneSurrogateAt(key);
          if (lone >= 0) {
            add(join(here(), show(key)), key, UNICODE_RULE, `(a field name) holds a lone UTF-16 surrogate at character ${lone + 1}`);
            continue;
          }
          trail.push(key);
          walk((v as Record<string, unknown>)[key], depth + 1);
          trail.pop();
        }
        return;
      }
      default:
        add(here(), v, 'must be null, true, false, a number, text, a list or an object', `(a ${typeof v}) has no JSON form`, typeof v === 'undefined' ? 'missing' : `a ${typeof v}`);
    }
  };
  walk(value, 0);
  if (tally) tally.keys += keys;
  return problems;
}

/** Every problem of one record: first what JSON cannot carry (nothing else is looked at then), then its rules. */
export function checkIncomingRecord(record: unknown): Problem[] {
  const structural = checkJsonValue(record);
  return structural.length > 0 ? structural : validateRecord(record);
}

export interface GateOptions {
  /** The kind of a record already in the log under this id, or undefined; called for the batch's ids and links. */
  known?: (id: string) => RecordKind | undefined;
  /** How a record of the batch is named in messages, by its position: "records[3]", "[3]" by default. */
  where?: (index: number) => string;
  /**
   * The record objects this gate has already checked whole in the same transfer (an import: the file read, then
   * the preview, then the store's write). Their own checks are not run again; the batch's are (ids, kinds,
   * links), as those depend on the log they join. Records that pass whole here are added. The transfer owns
   * the set and never changes a record it holds: a record is a value, and the gate remembers the object.
   */
  passed?: WeakSet<object>;
  /** Set by the file reader: the whole file was found to be JSON the canonical writer can write (checkJsonValue
   *  at a record's depth), so that part of each record's own checks is not repeated. */
  structureChecked?: boolean;
}

type Loose = { kind?: unknown; id?: unknown; [field: string]: unknown };

/** How a message names a record: "drop 4f0c…" (kind and id as far as they are text). */
export const recordName = (record: unknown): string => label(record as Loose);

const label = (record: Loose) =>
  `${typeof record?.kind === 'string' ? show(record.kind).slice(1, -1) : 'record'}${typeof record?.id === 'string' ? ` ${show(record.id).slice(1, -1)}` : ''}`;

/**
 * Every problem of a batch of records about to enter the store (an empty list: it may be written). Each problem's
 * path is the record's position and its field ("[3].history[0].body.name"), its message names the record ("[3] drop 4f0c…: history[0].body.name: …").
 */
export function gateRecords(records: readonly unknown[], options: GateOptions = {}): Problem[] {
  const steps = gateSteps(records, options);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

/**
 * The gate in steps, for a transfer that reports progress and may be cancelled between them: yields the number of
 * records checked so far every PROGRESS_STEP records, and returns the problems as gateRecords does.
 */
export function* gateSteps(records: readonly unknown[], options: GateOptions = {}): Generator<number, Problem[], void> {
  const where = options.where ?? ((i: number) => `[${i}]`);
  const passed = options.passed;
  const problems: Problem[] = [];
  const push = (i: number, record: Loose, p: Problem) =>
    problems.push({ ...p, path: `${where(i)}.${p.path}`, message: `${where(i)} ${label(record)}: ${p.message}` });
  /** The batch's own ids and where each is, from the records that passed on their own. */
  const batch = new Map<string, number>();
  const good: number[] = [];
  for (let i = 0; i < records.length && problems.length < GATE_PROBLEM_LIMIT; i++) {
    if (i > 0 && i % PROGRESS_STEP === 0) yield i;
    const record = records[i] as Loose;
    const checked = passed !== undefined && typeof record === 'object' && record !== null && passed.has(record);
    if (!checked) {
      const own = options.structureChecked ? validateRecord(record) : checkIncomingRecord(record);
      for (const p of own.slice(0, GATE_PROBLEM_LIMIT - problems.length)) push(i, record, p);
      if (own.length > 0) continue;
      if (passed !== undefined) passed.add(record as object);
    }
    const id = record.id as string;
    const earlier = batch.get(id);
    if (earlier !== undefined) {
      const rule = DUPLICATE_ID_RULE;
      const kind = (records[earlier] as Loose).kind as RecordKind;
      push(i, record, { path: 'id', value: id, rule, message: `id: ${show(id)} is the id of ${where(earlier)} (${kind}) too: ${rule}` });
      continue;
    }
    batch.set(id, i);
    good.push(i);
  }
  const batchKind = (id: string): RecordKind | undefined => {
    const at = batch.get(id);
    return at === undefined ? undefined : ((records[at] as Loose).kind as RecordKind);
  };
  problems.push(...kindProblems(records, good, batchKind, options, GATE_PROBLEM_LIMIT - problems.length));
  return problems;
}

/**
 * The batch against the log: an id the log holds as another kind, a link naming a record of the wrong kind.
 * `good` are the positions of records that passed on their own, `batch` their ids.
 */
function kindProblems(
  records: readonly unknown[],
  good: readonly number[],
  batchKind: (id: string) => RecordKind | undefined,
  options: GateOptions,
  limit: number,
): Problem[] {
  const where = options.where ?? ((i: number) => `[${i}]`);
  const problems: Problem[] = [];
  const push = (i: number, record: Loose, p: Problem) =>
    problems.push({ ...p, path: `${where(i)}.${p.path}`, message: `${where(i)} ${label(record)}: ${p.message}` });
  const kindOf = (id: string): RecordKind | undefined => batchKind(id) ?? options.known?.(id);
  for (const i of good) {
    if (problems.length >= limit) break;
    const record = records[i] as Loose;
    const kind = record.kind as RecordKind;
    const id = record.id as string;
    const stored = options.known?.(id);
    if (stored !== undefined && stored !== kind) {
      const rule = `an id names one record of one kind; this log holds a ${stored} under it`;
      push(i, record, { path: 'id', value: id, rule, message: `id: ${show(id)} is the id of a ${stored} already in this log: ${rule}` });
    }
    for (const link of REFERENCE_FIELDS[kind]) {
      const target = record[link.field];
      if (typeof target !== 'string') continue;
      const targetKind = kindOf(target);
      if (targetKind !== undefined && targetKind !== link.kind) {
        const rule = `must be the id of a ${link.kind}`;
        push(i, record, { path: link.field, value: target, rule, message: `${link.field}: ${show(target)} names a ${targetKind}: ${rule}` });
      }
    }
  }
  return problems;
}

/**
 * Only the batch against the log (kindProblems), for records that passed the gate on their own already (a file
 * the reader accepted): what an import checks before it merges, since a merge of two kinds under one id is
 * meaningless.
 */
export function gateAgainstLog(records: readonly LogRecordLike[], options: GateOptions): Problem[] {
  const batch = new Map<string, RecordKind>();
  for (const r of records) batch.set(r.id, r.kind);
  return kindProblems(records, records.map((_, i) => i), (id) => batch.get(id), options, GATE_PROBLEM_LIMIT);
}

type LogRecordLike = { id: string; kind: RecordKind };

/** The ids a batch's gate may ask `known` about: the records' own ids and the ids they link to. */
export function gateLookups(records: readonly unknown[]): string[] {
  const ids = new Set<string>();
  for (const r of records as readonly Loose[]) {
    if (typeof r?.id === 'string') ids.add(r.id);
    const links = typeof r?.kind === 'string' && (RECORD_KINDS as readonly string[]).includes(r.kind) ? REFERENCE_FIELDS[r.kind as RecordKind] : [];
    for (const link of links) if (typeof r[link.field] === 'string') ids.add(r[link.field] as string);
  }
  return [...ids];
}

/** Throws LogValidationError (code 'record-invalid') naming each problem unless the batch passes the gate. */
export function assertGateRecords(records: readonly unknown[], options: GateOptions = {}): void {
  const problems = gateRecords(records, options);
  if (problems.length > 0) throw new LogValidationError(problems, 'record');
}
