/**
 * The life of a record: created, revised (the previous version kept in its history), deleted (a tombstone).
 * Pure functions: the clock, the wall time and the random source are passed in.
 */
import { LogError, LogValidationError } from './errors';
import type { HybridLogicalClock } from './hlc';
import { assertValidBody, BODY_FIELDS } from './validate';
import { isUuid, uuidV4, type RandomSource } from './uuid';
import type { BodyOf, LogRecord, RecordKind, RecordOf, Revision } from './types';

export interface RecordContext {
  /** The device making the change; must be the clock's own device. */
  device: string;
  clock: HybridLogicalClock;
  /** The wall time of the change. */
  now: Date | number;
  /** An id made elsewhere (another phone, an import); otherwise one is made from `random`. */
  id?: string;
  random?: RandomSource;
}

export interface ReviseContext extends RecordContext {
  /** Why the record changes; required when a measured value or an exclusion changes. */
  reason?: string | null;
}

export interface DeleteContext extends RecordContext {
  reason: string;
}

/**
 * Fields whose change alters a result or the evidence behind it: a revision touching one of them needs a
 * reason. Uncertainties count, since they change the stated uncertainty of C_d; a series moved to another
 * specimen and a drop moved to another series count too, since that changes what was measured.
 */
export const REASON_REQUIRED_FIELDS: { readonly [K in RecordKind]: readonly (keyof BodyOf[K] & string)[] } = {
  site: ['latitude_deg', 'longitude_deg', 'elevation_m'],
  specimen: ['mass_kg', 'u_mass_kg', 'shape'],
  day: [],
  reading: [
    'temperature_C',
    'u_temperature_C',
    'pressure_Pa',
    'u_pressure_Pa',
    'pressure_reference',
    'humidity',
    'wind_speed_m_s',
    'u_wind_speed_m_s',
    'vertical_wind_m_s',
    'u_vertical_wind_m_s',
    'height_m',
  ],
  series: ['specimen_id', 'height_m', 'u_height_m', 'reading_aloft_id', 'timing_delay_s', 'u_timing_delay_s'],
  drop: ['series_id', 'time_s', 'height_m', 'excluded', 'exclusion_reason'],
};

/** The body fields of a record, without its envelope. */
export function bodyOf<R extends LogRecord>(record: R): BodyOf[R['kind']] {
  const body: Record<string, unknown> = {};
  const source = record as unknown as Record<string, unknown>;
  // An optional field a record does not carry stays absent (undefined has no JSON form).
  for (const key of BODY_FIELDS[record.kind]) if (source[key] !== undefined) body[key] = copy(source[key]);
  return body as unknown as BodyOf[R['kind']];
}

/** Records are plain JSON data; a deep copy keeps callers from changing a stored version by accident. */
function copy<T>(value: T): T {
  if (Array.isArray(value)) return value.map(copy) as T;
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    // A field set to undefined is a field left out, as JSON has it (an optional field such as a drop's marks).
    for (const [k, v] of Object.entries(value)) if (v !== undefined) out[k] = copy(v);
    return out as T;
  }
  return value;
}

export function sameValue(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) || Array.isArray(b)) {
    return Array.isArray(a) && Array.isArray(b) && a.length === b.length && a.every((v, i) => sameValue(v, b[i]));
  }
  if (a !== null && b !== null && typeof a === 'object' && typeof b === 'object') {
    const ka = Object.keys(a);
    const kb = Object.keys(b);
    return ka.length === kb.length && ka.every((k) => sameValue((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
  }
  return Number.isNaN(a) && Number.isNaN(b);
}

const millis = (now: Date | number) => (typeof now === 'number' ? now : now.getTime());
const iso = (now: Date | number) => new Date(millis(now)).toISOString();

function checkDevice(ctx: RecordContext): void {
  if (ctx.device !== ctx.clock.device) {
    throw new LogError({ code: 'device-mismatch', field: 'device', value: ctx.device, allowed: `the clock's device "${ctx.clock.device}"`, message: `device "${ctx.device}" does not own the clock of "${ctx.clock.device}"` });
  }
}

export function createRecord<K extends RecordKind>(kind: K, body: BodyOf[K], ctx: RecordContext): RecordOf[K] {
  checkDevice(ctx);
  assertValidBody(kind, body);
  let id: string;
  if (ctx.id !== undefined) {
    if (!isUuid(ctx.id)) {
      const rule = 'must be a UUID';
      throw new LogValidationError([{ path: 'id', value: ctx.id, rule, message: `id: ${JSON.stringify(ctx.id)} is not a record id: ${rule}` }], kind);
    }
    id = ctx.id.toLowerCase();
  } else if (ctx.random) {
    id = uuidV4(ctx.random);
  } else {
    throw new LogError({ code: 'id-missing', field: 'id', value: null, allowed: 'a record id (a UUID), or a random source to make one', message: `a new ${kind} needs an id or a random source to make one` });
  }
  const at = iso(ctx.now);
  return {
    ...copy(body),
    id,
    kind,
    created_at: at,
    updated_at: at,
    rev: ctx.clock.tick(millis(ctx.now)),
    device: ctx.device,
    deleted: false,
    history: [],
  } as unknown as RecordOf[K];
}

function asRevision<R extends LogRecord>(record: R, reason: string | null): Revision<BodyOf[R['kind']]> {
  return { rev: record.rev, device: record.device, updated_at: record.updated_at, reason, deleted: record.deleted, body: bodyOf(record) };
}

/** The next version of `record`: new stamp and time, previous version appended to the history. */
function nextVersion<R extends LogRecord>(record: R, body: BodyOf[R['kind']], deleted: boolean, reason: string | null, ctx: RecordContext): R {
  // stampAfter() rather than tick(): the new stamp must sort after the record's own, even when the record came
  // from a phone whose clock runs ahead of this one (far ahead: then without dragging this clock along).
  const rev = ctx.clock.stampAfter(record.rev, millis(ctx.now));
  return {
    ...copy(body),
    id: record.id,
    kind: record.kind,
    created_at: record.created_at,
    updated_at: iso(ctx.now),
    rev,
    device: ctx.device,
    deleted,
    history: [...copy(record.history), asRevision(record, reason)],
  } as unknown as R;
}

const blank = (reason: string | null | undefined) => typeof reason !== 'string' || reason.trim() === '';

/**
 * Apply `patch` (top-level fields of the body; a nested value such as `shape` is replaced whole).
 * Returns the same record object when nothing changes.
 */
export function reviseRecord<R extends LogRecord>(record: R, patch: Partial<BodyOf[R['kind']]>, ctx: ReviseContext): R {
  checkDevice(ctx);
  const kind = record.kind;
  if (record.deleted) throw new LogError({ code: 'record-deleted', field: 'deleted', value: record.id, allowed: 'a record that is not deleted', message: `${kind} ${record.id} is deleted and cannot be revised` });
  const fields = BODY_FIELDS[kind] as readonly string[];
  const unknown = Object.keys(patch).filter((k) => !fields.includes(k));
  if (unknown.length > 0) {
    throw new LogValidationError(
      unknown.map((k) => {
        const value = (patch as Record<string, unknown>)[k];
        return { path: k, value, rule: '', message: `${k}: ${JSON.stringify(value)} is not a field of a ${kind}` };
      }),
      kind,
    );
  }
  const before = bodyOf(record) as unknown as Record<string, unknown>;
  const after: Record<string, unknown> = { ...before };
  for (const [k, v] of Object.entries(patch)) if (v !== undefined) after[k] = copy(v);
  const changed = fields.filter((k) => !sameValue(before[k], after[k]));
  if (changed.length === 0) return record;
  if (changed.includes('raw')) {
    throw new LogError({ code: 'raw-immutable', field: 'raw', value: after.raw, allowed: 'the raw capture as first stored', message: `the raw capture of ${kind} ${record.id} is kept as it came and cannot be changed` });
  }
  const needsReason = changed.filter((k) => (REASON_REQUIRED_FIELDS[kind] as readonly string[]).includes(k));
  if (needsReason.length > 0 && blank(ctx.reason)) {
    const first = needsReason[0]!;
    throw new LogError({
      code: 'reason-required',
      field: first,
      value: after[first],
      allowed: 'a change with a non-empty reason',
      message: `changing ${needsReason.join(', ')} of a ${kind} needs a reason (the old value stays in the history)`,
    });
  }
  assertValidBody(kind, after);
  return nextVersion(record, after as unknown as BodyOf[R['kind']], false, blank(ctx.reason) ? null : ctx.reason!.trim(), ctx);
}

/** A tombstone: the record marked deleted, its last body and its history kept. Deleting twice changes nothing. */
export function deleteRecord<R extends LogRecord>(record: R, ctx: DeleteContext): R {
  checkDevice(ctx);
  if (record.deleted) return record;
  if (blank(ctx.reason)) {
    throw new LogError({ code: 'reason-required', field: 'reason', value: ctx.reason ?? null, allowed: 'a non-empty reason', message: `deleting a ${record.kind} needs a reason (it stays in the history)` });
  }
  return nextVersion(record, bodyOf(record), true, ctx.reason.trim(), ctx);
}

/**
 * A removed record brought back: a new live version with the tombstone's body, the tombstone kept in the history
 * with the reason it was undone. Restoring a live record changes nothing. Nothing is erased either way.
 */
export function restoreRecord<R extends LogRecord>(record: R, ctx: DeleteContext): R {
  checkDevice(ctx);
  if (!record.deleted) return record;
  if (blank(ctx.reason)) {
    throw new LogError({ code: 'reason-required', field: 'reason', value: ctx.reason ?? null, allowed: 'a non-empty reason', message: `restoring a ${record.kind} needs a reason (it stays in the history)` });
  }
  return nextVersion(record, bodyOf(record), false, ctx.reason.trim(), ctx);
}

/** Every version of the record, oldest first, ending with the current one (whose reason is null). */
export function recordHistory<R extends LogRecord>(record: R): Revision<BodyOf[R['kind']]>[] {
  return [...copy(record.history), asRevision(record, null)] as Revision<BodyOf[R['kind']]>[];
}
