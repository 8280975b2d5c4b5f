/**
 * Validation of record bodies and whole records. Every write goes through here first; nothing invalid is
 * stored. A problem names the field, the value and the rule, in words a person can act on.
 *
 * The ranges, choices and text lengths come from the field catalogue (fields.ts).
 */
import { LogValidationError, type Problem } from './errors';
import { STAMP_MAX_MS, STAMP_MIN_MS, readStamp, type HlcStamp } from './hlc';
import { deletionReasonProblems } from './deletion-reason';
import { historyOrderProblems } from './version-order';
import { isRecordId, isUuid } from './uuid';
import { RECORD_KINDS, type BodyOf, type RecordKind } from './types';
import {
  CLIP_TIME_TOLERANCE_S,
  DEW_POINT_MARGIN_C,
  ENUMS,
  KEY_FRAME_TYPES,
  LIMITS,
  LIST_LIMITS,
  SHAPE_DIMENSIONS,
  SOUND_TRAVEL_TOLERANCE_S,
  TEXT_LIMITS,
  type Limit,
} from './fields';

/** The catalogue's limits, also reachable from here where they were first defined. */
export { LIMITS, type Limit } from './fields';

const NAME_MAX = TEXT_LIMITS.name;
const NOTES_MAX = TEXT_LIMITS.notes;
const TYPED_MAX = TEXT_LIMITS.typed;
const CREW_MAX = TEXT_LIMITS.crew;
const CAPTURE_MAX = TEXT_LIMITS.capture;


export const BODY_FIELDS: { readonly [K in RecordKind]: readonly (keyof BodyOf[K] & string)[] } = {
  site: ['name', 'latitude_deg', 'longitude_deg', 'elevation_m', 'elevation_source', 'notes'],
  specimen: ['name', 'mass_kg', 'u_mass_kg', 'shape', 'reference_drag_coefficient', 'notes'],
  day: ['site_id', 'date', 'crew', 'notes'],
  reading: [
    'day_id',
    'taken_at',
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
    'instrument',
    'notes',
  ],
  series: [
    'day_id',
    'specimen_id',
    'height_m',
    'u_height_m',
    'height_method',
    'timing_method',
    'u_time_s',
    'target_relative_uncertainty',
    'reading_id',
    'reading_aloft_id',
    'timing_offset',
    'gate_distances_m',
    'timing_delay_s',
    'u_timing_delay_s',
    'started_at',
    'notes',
  ],
  drop: [
    'series_id',
    'seq',
    'raw',
    'time_s',
    'height_m',
    'excluded',
    'exclusion_reason',
    'note',
    'captured_at',
    'marks',
    'release_time_known',
    'clip',
  ],
};

export const ENVELOPE_FIELDS = ['id', 'kind', 'created_at', 'updated_at', 'rev', 'device', 'deleted', 'history'] as const;
const ENVELOPE_FIELD_SET: ReadonlySet<string> = new Set(ENVELOPE_FIELDS);
const BODY_FIELD_SETS: ReadonlyMap<RecordKind, ReadonlySet<string>> = new Map(RECORD_KINDS.map((kind) => [kind, new Set<string>(BODY_FIELDS[kind])]));
/** A whole record's fields: the envelope's and its kind's body fields. */
const RECORD_FIELD_SETS: ReadonlyMap<RecordKind, ReadonlySet<string>> = new Map(
  RECORD_KINDS.map((kind) => [kind, new Set<string>([...ENVELOPE_FIELDS, ...BODY_FIELDS[kind]])]),
);

const SHAPE_FIELDS: Record<string, readonly string[]> = SHAPE_DIMENSIONS;

/** How much of an offending value a message quotes: enough to find it, never the whole of a long text. */
export const EXCERPT_CHARS = 80;

/** An offending value as a message quotes it: text quoted and cut to an excerpt, numbers as they are. */
function show(value: unknown): string {
  if (typeof value === 'string') {
    if (value.length <= EXCERPT_CHARS) return JSON.stringify(value);
    return `${JSON.stringify(value.slice(0, EXCERPT_CHARS))}... (${value.length} characters)`;
  }
  if (typeof value === 'number' || typeof value === 'boolean' || value === null || value === undefined) return String(value);
  let text: string;
  try {
    text = JSON.stringify(value) ?? String(value);
  } catch {
    // Nested too deep for the engine's writer, or a cycle: say what it is instead.
    return Array.isArray(value) ? '[a list]' : '{an object}';
  }
  return text.length > 60 ? `${text.slice(0, 57)}...` : text;
}

/** The same, for the gate's messages. */
export const showValue = show;

function limitRule(limit: Limit): string {
  const unit = limit.unit ? ` ${limit.unit}` : '';
  const note = limit.note ? ` ${limit.note}` : '';
  return `must be ${limit.minIncluded ? '≥' : '>'} ${limit.min} and ≤ ${limit.max}${unit}${note}`;
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const isFiniteNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const within = (v: number, limit: Limit) => (limit.minIncluded ? v >= limit.min : v > limit.min) && v <= limit.max;

const INSTANT_PATTERN = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d{1,3})?Z$/;
const DATE_PATTERN = /^(\d{4})-(\d{2})-(\d{2})$/;

/** The number written at text[from, from + n) in ASCII digits (the pattern has made sure they are digits). */
function digits(text: string, from: number, n: number): number {
  let v = 0;
  for (let i = from; i < from + n; i++) v = v * 10 + (text.charCodeAt(i) - 48);
  return v;
}

/** Days from 1970-01-01 to a date of the proleptic Gregorian calendar (H. Hinnant, "chrono-Compatible Low-Level
 *  Date Algorithms", days_from_civil), the calendar of ECMAScript's time values. */
function daysFromCivil(y: number, m: number, d: number): number {
  const yy = m <= 2 ? y - 1 : y;
  const era = Math.floor(yy / 400);
  const yoe = yy - era * 400;
  const doy = Math.floor((153 * (m + (m > 2 ? -3 : 9)) + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

const isLeapYear = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/**
 * The time value (ms since 1970, as Date.parse gives it) of an ISO 8601 instant in UTC as the log writes it, or
 * NaN when the text is not one: a date that does not exist (2026-02-30), hour 24 or second 60 included. Read
 * from the digits without a Date, since an import reads three of these per record.
 */
export function instantMs(value: string): number {
  if (!INSTANT_PATTERN.test(value)) return NaN;
  const y = digits(value, 0, 4);
  const mo = digits(value, 5, 2);
  const d = digits(value, 8, 2);
  const h = digits(value, 11, 2);
  const mi = digits(value, 14, 2);
  const sec = digits(value, 17, 2);
  if (mo < 1 || mo > 12 || d < 1 || d > (mo === 2 && isLeapYear(y) ? 29 : MONTH_DAYS[mo - 1]!) || h > 23 || mi > 59 || sec > 59) return NaN;
  // ".5" is 500 ms, ".05" 50 ms.
  const fraction = value.length > 20 ? digits(value, 20, value.length - 21) * 10 ** (24 - value.length) : 0;
  return daysFromCivil(y, mo, d) * 86_400_000 + h * 3_600_000 + mi * 60_000 + sec * 1000 + fraction;
}

export function isIsoInstant(value: unknown): value is string {
  return typeof value === 'string' && !Number.isNaN(instantMs(value));
}

export function isIsoDate(value: unknown): value is string {
  if (typeof value !== 'string') return false;
  const m = DATE_PATTERN.exec(value);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (y < 1900 || y > 2200) return false;
  const date = new Date(Date.UTC(y, mo - 1, d));
  return date.getUTCFullYear() === y && date.getUTCMonth() === mo - 1 && date.getUTCDate() === d;
}

/** Collects problems; each check returns whether the value passed, so dependent checks can be skipped. */
class Checker {
  readonly problems: Problem[] = [];

  /** `shown` replaces the value in the message where the value itself is too long to read (a list, a text). */
  add(path: string, value: unknown, rule: string, what: string, shown = show(value)): false {
    const message = value === undefined ? `${path}: missing: ${rule}` : `${path}: ${shown} ${what}${rule ? `: ${rule}` : ''}`;
    this.problems.push({ path, value, rule, message });
    return false;
  }

  // The rules in words are written only for a value that fails: an import checks hundreds of thousands of fields.
  number(path: string, value: unknown, limit: Limit): value is number {
    if (isFiniteNumber(value) && within(value, limit)) return true;
    const rule = limitRule(limit);
    if (value === undefined) return this.add(path, value, rule, '');
    if (!isFiniteNumber(value)) return this.add(path, value, rule, 'is not a finite number');
    return this.add(path, value, rule, 'is out of range');
  }

  nullableNumber(path: string, value: unknown, limit: Limit): boolean {
    return value === null || this.number(path, value, limit);
  }

  /**
   * A standard uncertainty: not negative, not larger than the quantity it belongs to, and not beyond the
   * catalogue's limit (past which the quantity is not measured at all).
   */
  uncertainty(path: string, value: unknown, ofPath: string, of: unknown, limit: Limit): boolean {
    const known = isFiniteNumber(of) && of > 0;
    if (isFiniteNumber(value) && !(value < 0 || (known && value > of) || value > limit.max)) return true;
    const unit = limit.unit;
    // The catalogue's cap is named only where it is the tighter bound.
    const capped = known ? of > limit.max : isFiniteNumber(value) && value > limit.max;
    const rule = `must be ≥ 0 and ≤ ${ofPath}${known ? ` (${of} ${unit})` : ''}${capped ? ` and ≤ ${limit.max} ${unit}` : ''}`;
    if (value === undefined) return this.add(path, value, rule, '');
    if (!isFiniteNumber(value)) return this.add(path, value, rule, 'is not a finite number');
    if (value < 0 || (known && value > of) || value > limit.max) return this.add(path, value, rule, 'is out of range');
    return true;
  }

  integer(path: string, value: unknown, min: number): boolean {
    if (Number.isInteger(value) && (value as number) >= min) return true;
    const rule = `must be a whole number ≥ ${min}`;
    if (value === undefined) return this.add(path, value, rule, '');
    if (!Number.isInteger(value) || (value as number) < min) return this.add(path, value, rule, 'is out of range');
    return true;
  }

  text(path: string, value: unknown, max: number, required: boolean): boolean {
    if (typeof value === 'string' && value.length <= max && (!required || value.trim() !== '') && loneSurrogateAt(value) < 0) return true;
    const rule = required ? `must be 1 to ${max} characters` : `must be at most ${max} characters`;
    if (value === undefined) return this.add(path, value, rule, '');
    if (typeof value !== 'string') return this.add(path, value, rule, 'is not text');
    if (required && value.trim() === '') return this.add(path, value, rule, 'is empty');
    const lone = loneSurrogateAt(value);
    if (lone >= 0) return this.add(path, value, UNICODE_RULE, `holds a lone UTF-16 surrogate at character ${lone + 1}`);
    if (value.length > max) return this.add(path, value, rule, 'is too long', `${show(value.slice(0, 20))}… (${value.length} characters)`);
    return true;
  }

  oneOf<T extends string>(path: string, value: unknown, options: readonly T[]): value is T {
    if (typeof value === 'string' && (options as readonly string[]).includes(value)) return true;
    const rule = `must be one of: ${options.join(', ')}`;
    if (value === undefined) return this.add(path, value, rule, '');
    return this.add(path, value, options.join(', '), 'is not one of');
  }

  boolean(path: string, value: unknown): value is boolean {
    if (typeof value === 'boolean') return true;
    return this.add(path, value, 'must be true or false', 'is not true or false');
  }

  id(path: string, value: unknown, nullable = false): boolean {
    if (isRecordId(value) || (nullable && value === null)) return true;
    if (isUuid(value)) return this.add(path, value, 'must be a UUID in lower case, as the app writes ids', 'is in upper case');
    return this.add(path, value, `must be a UUID${nullable ? ' or null' : ''}`, 'is not a record id');
  }

  instant(path: string, value: unknown): boolean {
    if (isIsoInstant(value)) return true;
    return this.add(path, value, 'must be ISO 8601 in UTC, e.g. 2026-06-14T09:12:03.412Z', 'is not an instant');
  }

  date(path: string, value: unknown): boolean {
    if (isIsoDate(value)) return true;
    return this.add(path, value, 'must be YYYY-MM-DD between 1900 and 2200', 'is not a calendar date');
  }

  object(path: string, value: unknown, what: string): value is Record<string, unknown> {
    if (isObject(value)) return true;
    return this.add(path, value, `${what} must be an object of fields`, 'is not an object');
  }

  onlyFields(prefix: string, value: Record<string, unknown>, allowed: readonly string[] | ReadonlySet<string>, what: string): void {
    const has = Array.isArray(allowed) ? (key: string) => allowed.includes(key) : (key: string) => (allowed as ReadonlySet<string>).has(key);
    for (const key of Object.keys(value)) {
      if (!has(key)) this.add(join(prefix, key), value[key], '', `is not a field of ${what}`);
    }
  }

  /** A list of numbers in time order: at least two entries (the release and the impact). */
  series(path: string, value: unknown, check: (p: string, v: unknown) => boolean): boolean {
    const rule = 'a capture needs at least 2 (release and impact)';
    if (!Array.isArray(value)) return this.add(path, value, `must be a list of at least 2 numbers`, 'is not a list');
    const count = () => `${show(value)} (${value.length} ${value.length === 1 ? 'entry' : 'entries'})`;
    if (value.length < 2) return this.add(path, value, rule, 'is too short', count());
    if (value.length > CAPTURE_MAX) return this.add(path, value, `at most ${CAPTURE_MAX} entries`, 'is too long', count());
    let ok = true;
    value.forEach((v, i) => {
      const at = `${path}[${i}]`;
      if (!check(at, v)) ok = false;
      else if (i > 0 && isFiniteNumber(value[i - 1]) && (v as number) < value[i - 1]) {
        ok = this.add(at, v, `must not be before ${path}[${i - 1}] (${value[i - 1]})`, 'is out of order');
      }
    });
    return ok;
  }
}

/**
 * Text must be well-formed Unicode: a lone UTF-16 surrogate (an escaped "\\ud800" without its pair) cannot be
 * written to a JSON file (RFC 7493 §2.1), so a log holding one could never be exported or synced again.
 */
export const UNICODE_RULE = 'text must be valid Unicode, without lone UTF-16 surrogates (RFC 7493 §2.1)';
const SURROGATE = /[\uD800-\uDFFF]/;
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** The position of the first lone surrogate in the text, or -1. */
export function loneSurrogateAt(text: string): number {
  if (!SURROGATE.test(text)) return -1;
  return LONE_SURROGATE.exec(text)?.index ?? -1;
}

const join = (prefix: string, key: string) => (prefix ? `${prefix}.${key}` : key);
const article = (kind: string) => (/^[aeiou]/.test(kind) ? `an ${kind}` : `a ${kind}`);

function checkShape(c: Checker, shape: unknown): void {
  if (!c.object('shape', shape, 'a shape')) return;
  const kinds = ENUMS.shape_kind;
  if (!c.oneOf('shape.kind', shape.kind, kinds)) return;
  if (shape.kind === 'custom') {
    c.number('shape.area_m2', shape.area_m2, LIMITS.area_m2);
    c.uncertainty('shape.u_area_m2', shape.u_area_m2, 'shape.area_m2', shape.area_m2, LIMITS.u_area_m2);
    c.number('shape.volume_m3', shape.volume_m3, LIMITS.volume_m3);
    c.uncertainty('shape.u_volume_m3', shape.u_volume_m3, 'shape.volume_m3', shape.volume_m3, LIMITS.u_volume_m3);
    c.onlyFields('shape', shape, ['kind', 'area_m2', 'u_area_m2', 'volume_m3', 'u_volume_m3'], 'a custom shape');
    return;
  }
  const dims = SHAPE_FIELDS[shape.kind]!;
  for (const dim of dims) {
    c.number(`shape.${dim}`, shape[dim], LIMITS.length_m);
    c.uncertainty(`shape.u_${dim}`, shape[`u_${dim}`], `shape.${dim}`, shape[dim], LIMITS.u_length_m);
  }
  c.onlyFields('shape', shape, ['kind', ...dims.flatMap((d) => [d, `u_${d}`])], article(shape.kind));
}

function checkHumidity(c: Checker, humidity: unknown, temperature: unknown): void {
  if (!c.object('humidity', humidity, 'humidity')) return;
  if (!c.oneOf('humidity.kind', humidity.kind, ENUMS.humidity_kind)) return;
  if (humidity.kind === 'relative') {
    c.number('humidity.relative_humidity_pct', humidity.relative_humidity_pct, LIMITS.relative_humidity_pct);
    c.number('humidity.u_relative_humidity_pct', humidity.u_relative_humidity_pct, LIMITS.u_relative_humidity_pct);
    c.onlyFields('humidity', humidity, ['kind', 'relative_humidity_pct', 'u_relative_humidity_pct'], 'a relative humidity');
    return;
  }
  const dew = humidity.dew_point_C;
  const tKnown = isFiniteNumber(temperature) && within(temperature, LIMITS.temperature_C);
  if (tKnown && isFiniteNumber(dew) && within(dew, LIMITS.dew_point_C) && dew > temperature + DEW_POINT_MARGIN_C) {
    const ceiling = Math.round((temperature + DEW_POINT_MARGIN_C) * 1000) / 1000;
    c.add(
      'humidity.dew_point_C',
      dew,
      `must be ≥ ${LIMITS.dew_point_C.min} °C and not above temperature_C + ${DEW_POINT_MARGIN_C} (${ceiling} °C)`,
      'is out of range',
    );
  } else {
    c.number('humidity.dew_point_C', dew, LIMITS.dew_point_C);
  }
  c.number('humidity.u_dew_point_C', humidity.u_dew_point_C, LIMITS.u_dew_point_C);
  c.onlyFields('humidity', humidity, ['kind', 'dew_point_C', 'u_dew_point_C'], 'a dew point');
}

/**
 * The sound-travel correction stored with a sound capture: its inputs and its value, which must agree, so a
 * drop's time can be recomputed from its record alone. null: the interval was not corrected.
 */
function checkSoundTravel(c: Checker, travel: unknown): void {
  if (travel === null) return;
  if (travel === undefined) {
    c.add('raw.sound_travel', travel, 'must be the correction applied (its distances, speed of sound and value) or null', '');
    return;
  }
  if (!c.object('raw.sound_travel', travel, 'a sound-travel correction')) return;
  const d_r = c.number('raw.sound_travel.distance_to_release_m', travel.distance_to_release_m, LIMITS.sound_distance_m);
  const d_i = c.number('raw.sound_travel.distance_to_landing_m', travel.distance_to_landing_m, LIMITS.sound_distance_m);
  const speed = c.number('raw.sound_travel.speed_of_sound_m_s', travel.speed_of_sound_m_s, LIMITS.speed_of_sound_m_s);
  c.nullableNumber('raw.sound_travel.temperature_C', travel.temperature_C, LIMITS.temperature_C);
  const value = travel.correction_s;
  if (c.number('raw.sound_travel.correction_s', value, LIMITS.sound_travel_correction_s) && d_r && d_i && speed) {
    const expected = ((travel.distance_to_release_m as number) - (travel.distance_to_landing_m as number)) / (travel.speed_of_sound_m_s as number);
    if (Math.abs((value as number) - expected) > SOUND_TRAVEL_TOLERANCE_S) {
      c.add(
        'raw.sound_travel.correction_s',
        value,
        `must equal (distance_to_release_m − distance_to_landing_m) / speed_of_sound_m_s (${expected} s)`,
        'does not match its inputs',
      );
    }
  }
  c.onlyFields(
    'raw.sound_travel',
    travel,
    ['distance_to_release_m', 'distance_to_landing_m', 'speed_of_sound_m_s', 'temperature_C', 'correction_s'],
    'a sound-travel correction',
  );
}

function checkRaw(c: Checker, raw: unknown): void {
  if (!c.object('raw', raw, 'a raw capture')) return;
  if (!c.oneOf('raw.kind', raw.kind, ENUMS.raw_kind)) return;
  const finiteAtLeastZero = (p: string, v: unknown) =>
    isFiniteNumber(v) && v >= 0 ? true : c.add(p, v, 'must be a finite number ≥ 0', 'is not a time');
  const wholeAtLeastZero = (p: string, v: unknown) =>
    Number.isInteger(v) && (v as number) >= 0 ? true : c.add(p, v, '', 'is not a whole number');
  switch (raw.kind) {
    case 'typed': {
      if (typeof raw.text === 'string' && raw.text.trim() === '') {
        c.add('raw.text', raw.text, `must hold the value as typed (1 to ${TYPED_MAX} characters)`, 'is empty');
      } else c.text('raw.text', raw.text, TYPED_MAX, true);
      c.onlyFields('raw', raw, ['kind', 'text'], 'a typed capture');
      return;
    }
    case 'taps':
      c.series('raw.timestamps_ms', raw.timestamps_ms, finiteAtLeastZero);
      c.onlyFields('raw', raw, ['kind', 'timestamps_ms'], 'a tap capture');
      return;
    case 'sound':
      c.series('raw.onsets_s', raw.onsets_s, finiteAtLeastZero);
      c.number('raw.sample_rate_Hz', raw.sample_rate_Hz, LIMITS.sample_rate_Hz);
      checkSoundTravel(c, raw.sound_travel);
      c.onlyFields('raw', raw, ['kind', 'onsets_s', 'sample_rate_Hz', 'sound_travel'], 'a sound capture');
      return;
    case 'frames':
      c.series('raw.frames', raw.frames, wholeAtLeastZero);
      c.number('raw.frame_rate_Hz', raw.frame_rate_Hz, LIMITS.frame_rate_Hz);
      c.onlyFields('raw', raw, ['kind', 'frames', 'frame_rate_Hz'], 'a frame capture');
      return;
  }
}

/**
 * A list of min to max entries, each checked by `check`; false (with the problem added) when it is not a list of
 * that length, without looking at the entries (a hostile list of a million is refused by its length).
 */
function checkListLength(c: Checker, path: string, value: unknown, min: number, max: number, what: string): value is unknown[] {
  const rule = min === max ? `must be a list of ${min} ${what}` : `must be a list of ${min} to ${max} ${what}`;
  if (!Array.isArray(value)) return c.add(path, value, rule, 'is not a list');
  if (value.length < min || value.length > max) {
    return c.add(path, value, rule, value.length < min ? 'is too short' : 'is too long', `a list of ${value.length}`);
  }
  return true;
}

/** Each entry after the first must be above the one before it (only checked between entries that passed). */
function strictlyIncreasing(c: Checker, path: (i: number) => string, values: readonly unknown[], ok: readonly boolean[], unit: string): boolean {
  let good = true;
  for (let i = 1; i < values.length; i++) {
    if (!ok[i] || !ok[i - 1]) continue;
    const [before, now] = [values[i - 1] as number, values[i] as number];
    if (now <= before) good = c.add(path(i), now, `must be above ${path(i - 1)} (${before}${unit}): strictly increasing`, 'is out of order');
  }
  return good;
}

/** A drop's marks: 2 to 64 points, distance and time each in range and strictly increasing. */
function checkMarks(c: Checker, marks: unknown): marks is { distance_m: number; time_s: number }[] {
  if (!checkListLength(c, 'marks', marks, LIST_LIMITS.marks_min, LIST_LIMITS.marks_max, 'marks (distance_m, time_s)')) return false;
  const distanceOk: boolean[] = [];
  const timeOk: boolean[] = [];
  marks.forEach((mark, i) => {
    const at = `marks[${i}]`;
    if (!c.object(at, mark, 'a mark')) {
      distanceOk.push(false);
      timeOk.push(false);
      return;
    }
    distanceOk.push(c.number(`${at}.distance_m`, mark.distance_m, LIMITS.mark_distance_m));
    timeOk.push(c.number(`${at}.time_s`, mark.time_s, LIMITS.mark_time_s));
    c.onlyFields(at, mark, ['distance_m', 'time_s'], 'a mark');
  });
  const distances = marks.map((m) => (isObject(m) ? m.distance_m : undefined));
  const times = marks.map((m) => (isObject(m) ? m.time_s : undefined));
  const inOrder = strictlyIncreasing(c, (i) => `marks[${i}].distance_m`, distances, distanceOk, ' m');
  const timesInOrder = strictlyIncreasing(c, (i) => `marks[${i}].time_s`, times, timeOk, ' s');
  return inOrder && timesInOrder && distanceOk.every(Boolean) && timeOk.every(Boolean);
}

/**
 * A drop with marks: its own time_s (and height_m when it overrides the series') is the landing, at or after the
 * last mark and never contradicting the marks' order. The series' height is checked by the analysis, which sees it.
 */
function checkLandingAfterMarks(c: Checker, marks: readonly { distance_m: number; time_s: number }[], time: unknown, height: unknown): void {
  const last = marks[marks.length - 1]!;
  const n = marks.length - 1;
  const timeKnown = isFiniteNumber(time) && within(time, LIMITS.time_s);
  const heightKnown = isFiniteNumber(height) && within(height, LIMITS.height_m);
  if (timeKnown && time < last.time_s) {
    c.add('time_s', time, `must not be before the last mark, marks[${n}].time_s (${last.time_s} s): the landing comes last`, 'is out of order');
  }
  if (heightKnown && height < last.distance_m) {
    c.add('height_m', height, `must not be below the last mark, marks[${n}].distance_m (${last.distance_m} m): the landing comes last`, 'is out of order');
  }
  if (timeKnown && heightKnown && (time === last.time_s) !== (height === last.distance_m)) {
    const rule = `the landing (height_m ${height} m at time_s ${time} s) must be the last mark (${last.distance_m} m at ${last.time_s} s) or beyond it in both`;
    c.add('time_s', time, rule, 'contradicts the marks');
  }
}

/** A series' gate distances: 2 to 64, each in range, strictly increasing. */
function checkGates(c: Checker, gates: unknown): void {
  if (!checkListLength(c, 'gate_distances_m', gates, LIST_LIMITS.gates_min, LIST_LIMITS.gates_max, 'gate distances')) return;
  const ok = gates.map((d, i) => c.number(`gate_distances_m[${i}]`, d, LIMITS.mark_distance_m));
  strictlyIncreasing(c, (i) => `gate_distances_m[${i}]`, gates, ok, ' m');
}

const BASE64_DIGITS = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
const KEY_FRAME_PREFIX = /^data:(image\/(?:png|jpeg|webp));base64,/;
const BASE64_BODY = /^[A-Za-z0-9+/]*={0,2}$/;
/** The longest data URL of an allowed image: the prefix and the base64 of the largest image allowed. */
const KEY_FRAME_CHARS_MAX = 'data:image/jpeg;base64,'.length + Math.ceil(LIST_LIMITS.key_frame_bytes_max / 3) * 4;

/** The first `count` bytes of a base64 text (whole groups of four characters only). */
function firstBytes(base64: string, count: number): number[] {
  const bytes: number[] = [];
  for (let i = 0; i + 4 <= base64.length && bytes.length < count; i += 4) {
    const group = [...base64.slice(i, i + 4)].map((ch) => BASE64_DIGITS.indexOf(ch));
    const bits = ((group[0]! << 18) | (group[1]! << 12) | (Math.max(group[2]!, 0) << 6) | Math.max(group[3]!, 0)) >>> 0;
    bytes.push((bits >> 16) & 0xff, (bits >> 8) & 0xff, bits & 0xff);
  }
  return bytes.slice(0, count);
}

/**
 * A key frame's image: a data URL of a PNG, JPEG or WebP in base64, decoding to at most 16 KB, whose bytes begin
 * as that type's files do. The length is checked before anything reads the text.
 */
function checkKeyFrameImage(c: Checker, path: string, image: unknown): void {
  const allowed = Object.keys(KEY_FRAME_TYPES).join(', ');
  const rule = `must be a data URL "data:<type>;base64,…" of ${allowed}, at most ${LIST_LIMITS.key_frame_bytes_max} bytes`;
  if (typeof image !== 'string') {
    c.add(path, image, rule, image === undefined ? '' : 'is not text');
    return;
  }
  if (image.length > KEY_FRAME_CHARS_MAX) {
    c.add(path, image, rule, 'is too large', `${show(image.slice(0, 30))}… (${image.length} characters)`);
    return;
  }
  const prefix = KEY_FRAME_PREFIX.exec(image);
  if (!prefix) {
    c.add(path, image, rule, 'is not a data URL of an allowed image');
    return;
  }
  const body = image.slice(prefix[0].length);
  if (body.length % 4 !== 0 || !BASE64_BODY.test(body)) {
    c.add(path, image, rule, 'is not base64');
    return;
  }
  const padding = body.endsWith('==') ? 2 : body.endsWith('=') ? 1 : 0;
  const bytes = (body.length / 4) * 3 - padding;
  if (bytes > LIST_LIMITS.key_frame_bytes_max) {
    c.add(path, image, rule, 'is too large', `${show(image.slice(0, 30))}… (${bytes} bytes)`);
    return;
  }
  const type = prefix[1] as keyof typeof KEY_FRAME_TYPES;
  const magic = KEY_FRAME_TYPES[type];
  const head = firstBytes(body, 12);
  const isWebp = type !== 'image/webp' || String.fromCharCode(...head.slice(8, 12)) === 'WEBP';
  if (head.length < magic.length || magic.some((b, i) => head[i] !== b) || !isWebp) {
    c.add(path, image, `its bytes must begin as a ${type.slice(6).toUpperCase()} file does`, `is not ${article(type.slice(6).toUpperCase())} image`);
  }
}

/**
 * A clip's evidence: every field in range, timestamps strictly increasing with one tracked row per frame, the
 * release before the impact, 0, 2 or 3 scale marks, at most 6 small key frames; and the drop's time is the
 * impact minus the release.
 */
function checkClip(c: Checker, clip: unknown, time: unknown): void {
  if (!c.object('clip', clip, 'the evidence of a clip')) return;
  c.text('clip.codec', clip.codec, TEXT_LIMITS.codec, true);
  c.text('clip.container', clip.container, TEXT_LIMITS.codec, true);
  c.number('clip.width_px', clip.width_px, LIMITS.clip_size_px);
  c.number('clip.height_px', clip.height_px, LIMITS.clip_size_px);
  c.number('clip.frame_rate_hz', clip.frame_rate_hz, LIMITS.frame_rate_Hz);
  const frames = LIST_LIMITS.clip_frames_max;
  if (checkListLength(c, 'clip.frame_times_s', clip.frame_times_s, 2, frames, 'frame timestamps')) {
    const times = clip.frame_times_s;
    const ok = times.map((t, i) => c.number(`clip.frame_times_s[${i}]`, t, LIMITS.clip_time_s));
    strictlyIncreasing(c, (i) => `clip.frame_times_s[${i}]`, times, ok, ' s');
    if (checkListLength(c, 'clip.track_y_px', clip.track_y_px, times.length, times.length, 'rows, one per frame timestamp (or null)')) {
      clip.track_y_px.forEach((y, i) => c.nullableNumber(`clip.track_y_px[${i}]`, y, LIMITS.clip_position_px));
    }
  } else if (!Array.isArray(clip.track_y_px)) {
    c.add('clip.track_y_px', clip.track_y_px, 'must be a list of rows, one per frame timestamp (or null)', 'is not a list');
  }
  const release = c.number('clip.release_s', clip.release_s, LIMITS.clip_time_s);
  c.number('clip.u_release_s', clip.u_release_s, LIMITS.u_clip_time_s);
  const impact = c.number('clip.impact_s', clip.impact_s, LIMITS.clip_time_s);
  c.number('clip.u_impact_s', clip.u_impact_s, LIMITS.u_clip_time_s);
  if (release && impact) {
    const [r, i] = [clip.release_s as number, clip.impact_s as number];
    if (i <= r) c.add('clip.impact_s', i, `must be after clip.release_s (${r} s)`, 'is out of order');
    else if (isFiniteNumber(time) && Math.abs(time - (i - r)) > CLIP_TIME_TOLERANCE_S) {
      c.add('time_s', time, `must equal clip.impact_s − clip.release_s (${i - r} s)`, 'does not match the clip');
    }
  }
  if (c.object('clip.fall_line', clip.fall_line, 'a line on the frame')) {
    const line = clip.fall_line;
    for (const key of ['x0_px', 'y0_px', 'x1_px', 'y1_px']) c.number(`clip.fall_line.${key}`, line[key], LIMITS.clip_position_px);
    c.onlyFields('clip.fall_line', line, ['x0_px', 'y0_px', 'x1_px', 'y1_px'], 'a line on the frame');
  }
  c.number('clip.landing_y_px', clip.landing_y_px, LIMITS.clip_position_px);
  const counts: readonly number[] = LIST_LIMITS.scale_counts;
  const scaleRule = `must be a list of ${counts.join(', ')} scale marks (x_px, y_px, height_m)`;
  if (!Array.isArray(clip.scale)) c.add('clip.scale', clip.scale, scaleRule, 'is not a list');
  else if (!counts.includes(clip.scale.length)) c.add('clip.scale', clip.scale, scaleRule, 'has a wrong count', `a list of ${clip.scale.length}`);
  else {
    clip.scale.forEach((mark, i) => {
      const at = `clip.scale[${i}]`;
      if (!c.object(at, mark, 'a scale mark')) return;
      c.number(`${at}.x_px`, mark.x_px, LIMITS.clip_position_px);
      c.number(`${at}.y_px`, mark.y_px, LIMITS.clip_position_px);
      c.number(`${at}.height_m`, mark.height_m, LIMITS.scale_height_m);
      c.onlyFields(at, mark, ['x_px', 'y_px', 'height_m'], 'a scale mark');
    });
  }
  if (checkListLength(c, 'clip.key_frames', clip.key_frames, 0, LIST_LIMITS.key_frames_max, 'key frames')) {
    clip.key_frames.forEach((frame, i) => {
      const at = `clip.key_frames[${i}]`;
      if (!c.object(at, frame, 'a key frame')) return;
      c.number(`${at}.time_s`, frame.time_s, LIMITS.clip_time_s);
      checkKeyFrameImage(c, `${at}.image`, frame.image);
      c.onlyFields(at, frame, ['time_s', 'image'], 'a key frame');
    });
  }
  c.onlyFields(
    'clip',
    clip,
    ['codec', 'container', 'width_px', 'height_px', 'frame_rate_hz', 'frame_times_s', 'track_y_px', 'release_s', 'u_release_s', 'impact_s', 'u_impact_s', 'fall_line', 'landing_y_px', 'scale', 'key_frames'],
    'the evidence of a clip',
  );
}

function checkCrew(c: Checker, crew: unknown): void {
  if (!Array.isArray(crew)) {
    c.add('crew', crew, 'must be a list of names', 'is not a list');
    return;
  }
  if (crew.length > CREW_MAX) c.add('crew', crew, `at most ${CREW_MAX} names`, 'is too long', `${crew.length} names`);
  crew.forEach((name, i) => c.text(`crew[${i}]`, name, NAME_MAX, true));
}

const CHECKS: { [K in RecordKind]: (c: Checker, b: Record<string, unknown>) => void } = {
  site(c, b) {
    c.text('name', b.name, NAME_MAX, true);
    c.number('latitude_deg', b.latitude_deg, LIMITS.latitude_deg);
    c.number('longitude_deg', b.longitude_deg, LIMITS.longitude_deg);
    c.number('elevation_m', b.elevation_m, LIMITS.elevation_m);
    c.oneOf('elevation_source', b.elevation_source, ENUMS.elevation_source);
    c.text('notes', b.notes, NOTES_MAX, false);
  },
  specimen(c, b) {
    c.text('name', b.name, NAME_MAX, true);
    c.number('mass_kg', b.mass_kg, LIMITS.mass_kg);
    c.uncertainty('u_mass_kg', b.u_mass_kg, 'mass_kg', b.mass_kg, LIMITS.u_mass_kg);
    checkShape(c, b.shape);
    c.nullableNumber('reference_drag_coefficient', b.reference_drag_coefficient, LIMITS.reference_drag_coefficient);
    c.text('notes', b.notes, NOTES_MAX, false);
  },
  day(c, b) {
    c.id('site_id', b.site_id);
    c.date('date', b.date);
    checkCrew(c, b.crew);
    c.text('notes', b.notes, NOTES_MAX, false);
  },
  reading(c, b) {
    c.id('day_id', b.day_id);
    c.instant('taken_at', b.taken_at);
    c.number('temperature_C', b.temperature_C, LIMITS.temperature_C);
    c.number('u_temperature_C', b.u_temperature_C, LIMITS.u_temperature_C);
    const seaLevel = b.pressure_reference === 'sea_level';
    c.number('pressure_Pa', b.pressure_Pa, seaLevel ? LIMITS.sea_level_pressure_Pa : LIMITS.station_pressure_Pa);
    c.number('u_pressure_Pa', b.u_pressure_Pa, LIMITS.u_pressure_Pa);
    c.oneOf('pressure_reference', b.pressure_reference, ENUMS.pressure_reference);
    checkHumidity(c, b.humidity, b.temperature_C);
    c.nullableNumber('wind_speed_m_s', b.wind_speed_m_s, LIMITS.wind_speed_m_s);
    c.nullableNumber('u_wind_speed_m_s', b.u_wind_speed_m_s, LIMITS.u_wind_speed_m_s);
    c.nullableNumber('vertical_wind_m_s', b.vertical_wind_m_s, LIMITS.vertical_wind_m_s);
    c.nullableNumber('u_vertical_wind_m_s', b.u_vertical_wind_m_s, LIMITS.u_vertical_wind_m_s);
    c.number('height_m', b.height_m, LIMITS.reading_height_m);
    c.text('instrument', b.instrument, NAME_MAX, false);
    c.text('notes', b.notes, NOTES_MAX, false);
  },
  series(c, b) {
    c.id('day_id', b.day_id);
    c.id('specimen_id', b.specimen_id);
    c.number('height_m', b.height_m, LIMITS.height_m);
    c.uncertainty('u_height_m', b.u_height_m, 'height_m', b.height_m, LIMITS.u_height_m);
    c.oneOf('height_method', b.height_method, ENUMS.height_method);
    c.oneOf('timing_method', b.timing_method, ENUMS.timing_method);
    c.number('u_time_s', b.u_time_s, LIMITS.u_time_s);
    c.number('target_relative_uncertainty', b.target_relative_uncertainty, LIMITS.target_relative_uncertainty);
    c.id('reading_id', b.reading_id, true);
    c.id('reading_aloft_id', b.reading_aloft_id, true);
    c.oneOf('timing_offset', b.timing_offset, ENUMS.timing_offset);
    if (b.gate_distances_m !== undefined) checkGates(c, b.gate_distances_m);
    c.nullableNumber('timing_delay_s', b.timing_delay_s, LIMITS.timing_delay_s);
    c.nullableNumber('u_timing_delay_s', b.u_timing_delay_s, LIMITS.u_timing_delay_s);
    c.instant('started_at', b.started_at);
    c.text('notes', b.notes, NOTES_MAX, false);
  },
  drop(c, b) {
    c.id('series_id', b.series_id);
    c.integer('seq', b.seq, 1);
    checkRaw(c, b.raw);
    c.number('time_s', b.time_s, LIMITS.time_s);
    c.nullableNumber('height_m', b.height_m, LIMITS.height_m);
    if (c.boolean('excluded', b.excluded)) {
      if (b.excluded) {
        if (typeof b.exclusion_reason !== 'string' || b.exclusion_reason.trim() === '') {
          c.add('exclusion_reason', b.exclusion_reason ?? null, 'an excluded drop needs a reason', 'is missing');
        } else c.text('exclusion_reason', b.exclusion_reason, NAME_MAX, true);
      } else if (b.exclusion_reason !== null) {
        c.add('exclusion_reason', b.exclusion_reason, '', 'must be null when the drop is not excluded');
      }
    }
    c.text('note', b.note, NOTES_MAX, false);
    c.instant('captured_at', b.captured_at);
    if (b.marks !== undefined && checkMarks(c, b.marks)) checkLandingAfterMarks(c, b.marks, b.time_s, b.height_m);
    if (b.release_time_known !== undefined) c.boolean('release_time_known', b.release_time_known);
    if (b.clip !== undefined) checkClip(c, b.clip, b.time_s);
  },
};

/** Every problem with a record body of the given kind; an empty list means it may be stored. */
export function validateBody(kind: RecordKind, body: unknown): Problem[] {
  const c = new Checker();
  if (!RECORD_KINDS.includes(kind)) {
    c.add('(kind)', kind, RECORD_KINDS.join(', '), 'is not one of');
    return c.problems;
  }
  if (!c.object('(body)', body, article(kind))) return c.problems;
  CHECKS[kind](c, body);
  c.onlyFields('', body, BODY_FIELD_SETS.get(kind)!, article(kind));
  return c.problems;
}

/** Throws LogValidationError (code 'record-invalid') unless the body is valid. */
export function assertValidBody<K extends RecordKind>(kind: K, body: unknown): asserts body is BodyOf[K] {
  const problems = validateBody(kind, body);
  if (problems.length > 0) throw new LogValidationError(problems, kind);
}

/** A device id: letters, digits, _ . : only. */
const DEVICE_PATTERN = /^[A-Za-z0-9_.:]+$/;

/**
 * A stamp's parts, or null (with the problem added) when it is not one. The clock rolls a full counter over into
 * the next millisecond, so a counter at its top is a stamp like any other.
 */
function checkStamp(c: Checker, path: string, value: unknown): HlcStamp | null {
  const { stamp, problem } = readStamp(value);
  if (problem) {
    c.add(path, value, problem.rule, problem.what);
    return null;
  }
  if (!DEVICE_PATTERN.test(stamp.device)) {
    c.add(path, value, 'its device must be letters, digits, _ . : only', 'is not a clock stamp');
    return null;
  }
  return stamp;
}

function checkDevice(c: Checker, path: string, value: unknown): boolean {
  if (typeof value !== 'string' || !DEVICE_PATTERN.test(value)) {
    c.add(path, value, 'must be letters, digits, _ . : only', 'is not a device id');
    return false;
  }
  return true;
}

/** A version's device is the device of its stamp: the phone that made the edit. */
function checkStampDevice(c: Checker, at: string, stamp: HlcStamp | null, device: unknown): void {
  if (stamp && typeof device === 'string' && checkDevice(c, join(at, 'device'), device) && stamp.device !== device) {
    c.add(join(at, 'device'), device, `must be the device of its stamp (${stamp.device})`, 'does not match the stamp');
  }
}

const CLOCK_RANGE = `must be from ${new Date(STAMP_MIN_MS).toISOString()} to ${new Date(STAMP_MAX_MS).toISOString()}`;

/** A time the phone's clock wrote into the envelope: an instant within the clock's range (no year 0). */
function checkClockInstant(c: Checker, path: string, value: unknown): void {
  const ms = typeof value === 'string' ? instantMs(value) : NaN;
  if (Number.isNaN(ms)) {
    c.instant(path, value);
    return;
  }
  if (ms < STAMP_MIN_MS || ms > STAMP_MAX_MS) c.add(path, value, CLOCK_RANGE, "is beyond the clock's range");
}

const REVISION_FIELDS = ['rev', 'device', 'updated_at', 'reason', 'deleted', 'body'] as const;

/** The body fields of a record, on an object without a prototype: a key "__proto__" stays an own key (and is refused). */
function bodyFields(record: Record<string, unknown>): Record<string, unknown> {
  const body: Record<string, unknown> = Object.create(null);
  for (const key of Object.keys(record)) {
    if (!ENVELOPE_FIELD_SET.has(key)) body[key] = record[key];
  }
  return body;
}

/**
 * An object whose fields can be read by name as its own: the object itself when it is plain (parsed JSON, a stored
 * clone, the app's own object literals: Object.prototype or no prototype, and no field name of a record, a version
 * or a body is a member of Object.prototype — a test holds READ_FIELD_NAMES to that; nested values such as a shape
 * or a clip were always read so), else a copy of its own enumerable fields on an object without a prototype, so
 * nothing is read from another prototype. An import reads 100 000 records: the copies were a quarter of the gate's
 * time.
 */
function ownFields(value: Record<string, unknown>): Record<string, unknown> {
  const proto = Object.getPrototypeOf(value);
  if (proto === Object.prototype || proto === null) return value;
  const out: Record<string, unknown> = Object.create(null);
  for (const key of Object.keys(value)) out[key] = value[key];
  return out;
}

/** Every name a record's checks read: the envelope's, a version's and each kind's body fields. */
export const READ_FIELD_NAMES: readonly string[] = [...ENVELOPE_FIELDS, 'reason', 'body', ...Object.values(BODY_FIELDS).flat()];

/**
 * Every problem with a whole record as stored or exported: its envelope, its body, and each earlier version in
 * its history, whose body is checked as a body of the record's kind (an earlier version can become current in a
 * merge). Stamps must rise through the history to the current one, each version's device must be its stamp's.
 * Fields are read as own fields only: nothing can be inherited from a prototype.
 */
export function validateRecord(input: unknown): Problem[] {
  const c = new Checker();
  if (!c.object('(record)', input, 'a record')) return c.problems;
  const record = ownFields(input);
  const kind = record.kind;
  if (!c.oneOf('kind', kind, RECORD_KINDS)) return c.problems;
  c.id('id', record.id);
  checkClockInstant(c, 'created_at', record.created_at);
  checkClockInstant(c, 'updated_at', record.updated_at);
  const stamp = checkStamp(c, 'rev', record.rev);
  if (stamp) checkStampDevice(c, '', stamp, record.device);
  else checkDevice(c, 'device', record.device);
  c.boolean('deleted', record.deleted);
  const problems: Problem[] = [];
  if (!Array.isArray(record.history)) {
    c.add('history', record.history, 'must be a list of earlier versions', 'is not a list');
  } else {
    let previous: string | null = null;
    record.history.forEach((item: unknown, i: number) => {
      const at = `history[${i}]`;
      if (!c.object(at, item, 'an earlier version')) return;
      const entry = ownFields(item);
      const revStamp = checkStamp(c, `${at}.rev`, entry.rev);
      if (revStamp) {
        const rev = entry.rev as string;
        checkStampDevice(c, at, revStamp, entry.device);
        if (previous !== null && rev < previous) {
          c.add(`${at}.rev`, rev, `must not be older than history[${i - 1}].rev (${previous}): the history runs oldest first`, 'is out of order');
        }
        // Whether an earlier version stands after the current one is historyOrderProblems' rule (version-order.ts),
        // which also orders two versions under one stamp.
        previous = rev;
      } else checkDevice(c, `${at}.device`, entry.device);
      checkClockInstant(c, `${at}.updated_at`, entry.updated_at);
      if (entry.reason !== null) c.text(`${at}.reason`, entry.reason, NOTES_MAX, false);
      c.boolean(`${at}.deleted`, entry.deleted);
      c.onlyFields(at, entry, REVISION_FIELDS, 'an earlier version');
      if (entry.body === undefined) c.add(`${at}.body`, undefined, 'the body of an earlier version', '');
      else if (c.object(`${at}.body`, entry.body, 'the body of an earlier version')) {
        for (const p of validateBody(kind, ownFields(entry.body))) {
          const path = `${at}.body.${p.path}`;
          problems.push({ ...p, path, message: `${at}.body.${p.message}` });
        }
      }
    });
  }
  // The body's fields are read on the record itself (its envelope fields are allowed beside them); a copy of the body
  // is made only when a history entry shares the current stamp and the two versions must be compared.
  const b = new Checker();
  CHECKS[kind](b, record);
  b.onlyFields('', record, RECORD_FIELD_SETS.get(kind)!, article(kind));
  // Same-stamp versions sort by what they say (version-order.ts): no history entry may sort after the current one.
  const deletion = deletionReasonProblems(record);
  const order = historyOrderProblems(record, () => bodyFields(record));
  if (deletion.length + order.length + b.problems.length + problems.length === 0) return c.problems;
  return [...c.problems, ...deletion, ...order, ...b.problems, ...problems];
}
