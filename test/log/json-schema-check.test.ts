import { describe, expect, expectTypeOf, it } from 'vitest';
import fc from 'fast-check';
import Ajv2020 from 'ajv/dist/2020';
import { checkJsonSchema, JsonSchemaError, SUPPORTED_KEYWORDS, type JsonSchemaProblem } from '../../src/log/json-schema-check';
import { LOG_FORMAT_VERSION, LOG_SCHEMA } from '../../src/log/schema';
import { LIMITS, type Limit } from '../../src/log/validate';
import { formatHlc } from '../../src/log/hlc';
import { RECORD_KINDS } from '../../src/log/types';
import { sampleLog } from '../sync/sample-log';
import { makeAjv } from './schema-files';

// The reference: ajv 8 compiling the same schema, set up as the project's ahead-of-time validator is.
const ajvValidate = makeAjv(false).compile(LOG_SCHEMA);
const ajvValid = (file: unknown): boolean => ajvValidate(file) as boolean;
const problemsOf = (file: unknown): JsonSchemaProblem[] => checkJsonSchema(LOG_SCHEMA, file, { maxErrors: 1000 });

type Rec = Record<string, unknown>;
const set = (record: object | undefined, changes: Rec) => Object.assign(record!, changes);
const kindIn = (records: Rec[], kind: string) => records.filter((r) => r.kind === kind);

const fileOf = (records: unknown[], selection: unknown = null) => ({
  format: 'plummet-log',
  format_version: LOG_FORMAT_VERSION,
  app_version: '0.1.0',
  device: 'phoneA',
  selection,
  records,
});

// ---------------------------------------------------------------------------------------------------------
// Valid log files from fast-check. Our own invented values inside the ranges the record model allows.

const within = (limit: Limit) =>
  fc.double({ min: limit.min, max: limit.max, minExcluded: !limit.minIncluded, noNaN: true, noDefaultInfinity: true });
const atLeastZero = fc.double({ min: 0, max: 1e3, noNaN: true, noDefaultInfinity: true });
const uuid = fc.uuid();
const instant = fc
  .date({ min: new Date('2001-01-01T00:00:00Z'), max: new Date('2099-12-31T23:59:59Z'), noInvalidDate: true })
  .map((d) => d.toISOString());
const device = fc.stringMatching(/^[A-Za-z0-9_.:]{1,12}$/);
const rev = fc
  .tuple(fc.integer({ min: 0, max: 4_102_444_800_000 }), fc.integer({ min: 0, max: 999_999 }), device)
  .map(([ms, counter, d]) => formatHlc({ ms, counter, device: d }));
const text = fc.string({ maxLength: 12 });
const body = fc.dictionary(fc.constantFrom('time_s', 'notes', 'mass_kg', 'shape'), fc.jsonValue({ maxDepth: 1 }), { maxKeys: 3 });
const revision = fc.record({ rev, device, updated_at: instant, reason: fc.option(text, { nil: null }), deleted: fc.boolean(), body });

const envelope = (kind: string) =>
  fc.record({
    id: uuid,
    kind: fc.constant(kind),
    created_at: instant,
    updated_at: instant,
    rev,
    device,
    deleted: fc.boolean(),
    history: fc.array(revision, { maxLength: 2 }),
  });
const length = within(LIMITS.length_m);
const uLength = within(LIMITS.u_length_m);
const shape = fc.oneof(
  fc.record({ kind: fc.constant('sphere'), diameter_m: length, u_diameter_m: uLength }),
  fc.record({ kind: fc.constant('cylinder'), diameter_m: length, u_diameter_m: uLength, length_m: length, u_length_m: uLength }),
  fc.record({ kind: fc.constant('disc'), diameter_m: length, u_diameter_m: uLength, thickness_m: length, u_thickness_m: uLength }),
  fc.record({
    kind: fc.constant('box'),
    length_m: length,
    u_length_m: uLength,
    width_m: length,
    u_width_m: uLength,
    height_m: length,
    u_height_m: uLength,
  }),
  fc.record({
    kind: fc.constant('custom'),
    area_m2: within(LIMITS.area_m2),
    u_area_m2: within(LIMITS.u_area_m2),
    volume_m3: within(LIMITS.volume_m3),
    u_volume_m3: within(LIMITS.u_volume_m3),
  }),
);
const humidity = fc.oneof(
  fc.record({
    kind: fc.constant('relative'),
    relative_humidity_pct: within(LIMITS.relative_humidity_pct),
    u_relative_humidity_pct: within(LIMITS.u_relative_humidity_pct),
  }),
  fc.record({ kind: fc.constant('dew_point'), dew_point_C: within(LIMITS.dew_point_C), u_dew_point_C: within(LIMITS.u_dew_point_C) }),
);
const raw = fc.oneof(
  fc.record({ kind: fc.constant('typed'), text }),
  fc.record({ kind: fc.constant('taps'), timestamps_ms: fc.array(atLeastZero, { minLength: 2, maxLength: 4 }) }),
  fc.record({
    kind: fc.constant('sound'),
    onsets_s: fc.array(atLeastZero, { minLength: 2, maxLength: 4 }),
    sample_rate_Hz: within(LIMITS.sample_rate_Hz),
    sound_travel: fc.option(
      fc.record({
        distance_to_release_m: within(LIMITS.sound_distance_m),
        distance_to_landing_m: within(LIMITS.sound_distance_m),
        speed_of_sound_m_s: within(LIMITS.speed_of_sound_m_s),
        temperature_C: fc.option(within(LIMITS.temperature_C)),
        correction_s: within(LIMITS.sound_travel_correction_s),
      }),
    ),
  }),
  fc.record({
    kind: fc.constant('frames'),
    frames: fc.array(fc.nat({ max: 100_000 }), { minLength: 2, maxLength: 4 }),
    frame_rate_Hz: within(LIMITS.frame_rate_Hz),
  }),
);
const oneOf = (...values: string[]) => fc.constantFrom(...values);

const bodies: Record<string, fc.Arbitrary<Record<string, unknown>>> = {
  site: fc.record({
    name: text,
    latitude_deg: within(LIMITS.latitude_deg),
    longitude_deg: within(LIMITS.longitude_deg),
    elevation_m: within(LIMITS.elevation_m),
    elevation_source: oneOf('survey', 'map', 'gps', 'other'),
    notes: text,
  }),
  specimen: fc.record({
    name: text,
    mass_kg: within(LIMITS.mass_kg),
    u_mass_kg: within(LIMITS.u_mass_kg),
    shape,
    reference_drag_coefficient: fc.option(within(LIMITS.reference_drag_coefficient), { nil: null }),
    notes: text,
  }),
  day: fc.record({ site_id: uuid, date: instant.map((i) => i.slice(0, 10)), crew: fc.array(text, { maxLength: 3 }), notes: text }),
  reading: fc.oneof(
    ...(['station', 'sea_level'] as const).map((reference) =>
      fc.record({
        day_id: uuid,
        taken_at: instant,
        temperature_C: within(LIMITS.temperature_C),
        u_temperature_C: within(LIMITS.u_temperature_C),
        pressure_Pa: within(reference === 'station' ? LIMITS.station_pressure_Pa : LIMITS.sea_level_pressure_Pa),
        u_pressure_Pa: within(LIMITS.u_pressure_Pa),
        pressure_reference: fc.constant(reference),
        humidity,
        wind_speed_m_s: fc.option(within(LIMITS.wind_speed_m_s), { nil: null }),
        u_wind_speed_m_s: fc.option(within(LIMITS.u_wind_speed_m_s), { nil: null }),
        vertical_wind_m_s: fc.option(within(LIMITS.vertical_wind_m_s), { nil: null }),
        u_vertical_wind_m_s: fc.option(within(LIMITS.u_vertical_wind_m_s), { nil: null }),
        height_m: within(LIMITS.reading_height_m),
        instrument: text,
        notes: text,
      }),
    ),
  ),
  series: fc.record({
    day_id: uuid,
    specimen_id: uuid,
    height_m: within(LIMITS.height_m),
    u_height_m: within(LIMITS.u_height_m),
    height_method: oneOf('tape', 'laser', 'survey', 'marked', 'other'),
    timing_method: oneOf('typed', 'stopwatch', 'tap', 'sound', 'video', 'gates'),
    u_time_s: within(LIMITS.u_time_s),
    target_relative_uncertainty: within(LIMITS.target_relative_uncertainty),
    reading_id: fc.option(uuid, { nil: null }),
    reading_aloft_id: fc.option(uuid, { nil: null }),
    timing_offset: oneOf('none', 'fit'),
    timing_delay_s: fc.option(within(LIMITS.timing_delay_s), { nil: null }),
    u_timing_delay_s: fc.option(within(LIMITS.u_timing_delay_s), { nil: null }),
    started_at: instant,
    notes: text,
  }),
  drop: fc.record({
    series_id: uuid,
    seq: fc.integer({ min: 1, max: 500 }),
    raw,
    time_s: within(LIMITS.time_s),
    height_m: fc.option(within(LIMITS.height_m), { nil: null }),
    excluded: fc.boolean(),
    exclusion_reason: fc.option(text, { nil: null }),
    note: text,
    captured_at: instant,
  }),
};
const recordOf = (kind: string) => fc.tuple(envelope(kind), bodies[kind]!).map(([e, b]) => ({ ...e, ...b }));
const anyRecord = fc.constantFrom(...RECORD_KINDS).chain(recordOf);
const selection = fc.option(
  fc.record({
    day_ids: fc.array(uuid, { maxLength: 2 }),
    specimen_ids: fc.array(uuid, { maxLength: 2 }),
    site_ids: fc.array(uuid, { maxLength: 2 }),
    kinds: fc.subarray([...RECORD_KINDS]),
  }),
  { nil: null },
);
/** A valid log file: one record of every kind, a few more of any kind, in any order. */
const logFile = fc
  .tuple(fc.tuple(...RECORD_KINDS.map(recordOf)), fc.array(anyRecord, { maxLength: 3 }), selection, device, text)
  .chain(([each, more, sel, d, version]) =>
    fc.shuffledSubarray([...each, ...more], { minLength: each.length + more.length }).map((records) => ({
      ...fileOf(records, sel),
      device: d,
      app_version: version,
    })),
  );

// ---------------------------------------------------------------------------------------------------------
// One change at a time, anywhere in a file.

/** Every string the schema names in an enum or a const: a record or shape kind swapped for another. */
const NAMED: string[] = [];
JSON.stringify(LOG_SCHEMA, (key, value: unknown) => {
  if (key === 'const' && typeof value === 'string') NAMED.push(value);
  if (key === 'enum') NAMED.push(...(value as string[]));
  return value;
});

type Json = Record<string, unknown> | unknown[];
interface Spot {
  parent: Json;
  key: string | number;
  pointer: string;
}
function spots(value: unknown, pointer = '', out: Spot[] = []): Spot[] {
  if (typeof value === 'object' && value !== null) {
    for (const [k, v] of Object.entries(value)) {
      const key = Array.isArray(value) ? Number(k) : k;
      const at = `${pointer}/${k}`;
      out.push({ parent: value as Json, key, pointer: at });
      spots(v, at, out);
    }
  }
  return out;
}
const kindOf = (v: unknown) => (v === null ? 'null' : Array.isArray(v) ? 'array' : typeof v);

interface Mutation {
  name: string;
  applies: (v: unknown) => boolean;
  /** The new value, or `undefined` to remove it; `pick` chooses among variants. */
  to: (v: unknown, pick: number) => unknown;
}
const MUTATIONS: Mutation[] = [
  {
    name: 'wrong type',
    applies: () => true,
    to: (v) => ({ number: String(v), string: 7, boolean: 'yes', null: false, array: {}, object: 'x' })[kindOf(v) as string],
  },
  { name: 'null where a value was', applies: (v) => v !== null, to: () => null },
  { name: 'out of range', applies: (v) => typeof v === 'number', to: (v, pick) => [0, -1e-9, -5, 1e7, 4e5, 2e6, -(v as number)][pick % 7] },
  { name: 'a fraction', applies: (v) => Number.isInteger(v), to: (v) => (v as number) + 0.5 },
  { name: 'rounded down to an integer (1.0 is one)', applies: (v) => typeof v === 'number' && !Number.isInteger(v), to: (v) => Math.floor(v as number) },
  { name: 'missing', applies: () => true, to: () => undefined },
  { name: 'an extra property', applies: (v) => kindOf(v) === 'object', to: (v) => ({ ...(v as object), height_M: 12 }) },
  { name: 'another named value', applies: (v) => typeof v === 'string', to: (_v, pick) => NAMED[pick % NAMED.length] },
  {
    name: 'spoilt text',
    applies: (v) => typeof v === 'string',
    to: (v, pick) => {
      const s = v as string;
      return [`${s} `, s.slice(1), s.toUpperCase(), '', s.replace(/\d/, 'x'), `${s}x`][pick % 6];
    },
  },
  {
    name: 'a shorter list of numbers (the lists that have a minItems)',
    applies: (v) => Array.isArray(v) && v.length >= 2 && v.every((x) => typeof x === 'number'),
    to: (v, pick) => (v as unknown[]).slice(0, pick % 2),
  },
  { name: 'a bad item', applies: (v) => Array.isArray(v), to: (v, pick) => [...(v as unknown[]), ['x', -1, null, 1.5][pick % 4]] },
];

/** Applies mutation number `which` to the value at spot number `where` among those it applies to. */
function mutate(file: unknown, where: number, which: number, pick: number): { pointer: string; name: string } | null {
  const mutation = MUTATIONS[which % MUTATIONS.length]!;
  const valueAt = (spot: Spot) => (spot.parent as Record<string | number, unknown>)[spot.key];
  const usable = spots(file).filter((spot) => mutation.applies(valueAt(spot)));
  if (usable.length === 0) return null; // e.g. no list of numbers in this file
  const spot = usable[where % usable.length]!;
  const next = mutation.to(valueAt(spot), pick);
  if (next !== undefined) (spot.parent as Record<string | number, unknown>)[spot.key] = next;
  else if (Array.isArray(spot.parent)) spot.parent.splice(spot.key as number, 1);
  else delete spot.parent[spot.key as string];
  return { pointer: spot.pointer, name: mutation.name };
}

describe('checking log files against the published schema, compared with ajv 8', () => {
  it('accepts the demo log of every kind of record, as ajv does', () => {
    const file = fileOf(sampleLog({ days: 2, seriesPerDay: 2, dropsPerSeries: 3 }));
    expect(ajvValid(file)).toBe(true);
    expect(problemsOf(file)).toEqual([]);
  });

  it('accepts 150 generated valid log files, as ajv does', () => {
    fc.assert(
      fc.property(logFile, (file) => {
        expect(ajvValid(file), JSON.stringify(ajvValidate.errors)).toBe(true);
        expect(problemsOf(file)).toEqual([]);
      }),
      { numRuns: 150 },
    );
  });

  it('agrees with ajv on valid or not for 600 files with one change each, and points near the change', () => {
    const seen: Record<string, [valid: number, invalid: number]> = {};
    fc.assert(
      fc.property(logFile, fc.nat(), fc.nat(), fc.nat(), (generated, where, which, pick) => {
        const file = structuredClone(generated); // fast-check reuses generated values while shrinking
        const change = mutate(file, where, which, pick);
        fc.pre(change !== null);
        const { pointer, name } = change!;
        const reference = ajvValid(file);
        const problems = problemsOf(file);
        expect(problems.length === 0, `${name} at ${pointer}: ${JSON.stringify(problems)}`).toBe(reference);
        const tally = (seen[name] ??= [0, 0]);
        tally[reference ? 0 : 1]++;
        // What a change broke lies inside the object or list that holds the changed value.
        const parent = pointer.slice(0, pointer.lastIndexOf('/'));
        if (!reference) expect(problems.some((p) => p.path.startsWith(parent)), `${name} at ${pointer}`).toBe(true);
      }),
      { numRuns: 600 },
    );
    const total = Object.values(seen).reduce((sum, [v, i]) => sum + v + i, 0);
    const invalid = Object.values(seen).reduce((sum, [, i]) => sum + i, 0);
    expect(total).toBe(600);
    // Both outcomes were exercised, and every kind of change broke at least one file.
    expect(invalid).toBeGreaterThan(300);
    expect(total - invalid).toBeGreaterThan(20);
    for (const m of MUTATIONS) expect(seen[m.name]?.[1], m.name).toBeGreaterThan(0);
  });

  it.each([
    ['a drop time of 0 s (the minimum is exclusive)', false, (r: Rec[]) => set(kindIn(r, 'drop')[0], { time_s: 0 })],
    ['a drop number of 2.0, an integer', true, (r: Rec[]) => set(kindIn(r, 'drop')[0], { seq: 2.0 })],
    ['a drop number of 2.5', false, (r: Rec[]) => set(kindIn(r, 'drop')[0], { seq: 2.5 })],
    ['a sea-level pressure of 90 kPa', true, (r: Rec[]) => set(kindIn(r, 'reading')[0], { pressure_reference: 'sea_level', pressure_Pa: 90_000 })],
    ['a station pressure of 40 kPa', true, (r: Rec[]) => set(kindIn(r, 'reading')[0], { pressure_Pa: 40_000 })],
    ['a sea-level pressure of 40 kPa', false, (r: Rec[]) => set(kindIn(r, 'reading')[0], { pressure_reference: 'sea_level', pressure_Pa: 40_000 })],
    ['a cylinder without its length', false, (r: Rec[]) => set(kindIn(r, 'specimen')[0], { shape: { kind: 'cylinder', diameter_m: 0.02, u_diameter_m: 0 } })],
    ['a drop record labelled as a site', false, (r: Rec[]) => set(kindIn(r, 'drop')[0], { kind: 'site' })],
    ['an id in upper case', true, (r: Rec[]) => set(r[0], { id: (r[0]!.id as string).toUpperCase() })],
    ['a selection with a bad kind', false, (r: Rec[]) => r, { day_ids: [], specimen_ids: [], site_ids: [], kinds: ['weather'] }],
    ['an empty selection', true, (r: Rec[]) => r, { day_ids: [], specimen_ids: [], site_ids: [], kinds: [] }],
    ['a selection missing its kinds', false, (r: Rec[]) => r, { day_ids: [], specimen_ids: [], site_ids: [] }],
  ] as [string, boolean, (r: Rec[]) => unknown, unknown?][])('agrees with ajv on %s (valid: %s)', (_what, valid, spoil, sel = null) => {
    const records = structuredClone(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 2 })) as unknown as Rec[];
    spoil(records);
    const file = fileOf(records, sel);
    expect(ajvValid(file)).toBe(valid);
    expect(problemsOf(file).length === 0).toBe(valid);
  });
});

// ---------------------------------------------------------------------------------------------------------
// Each keyword on small schemas. Expected outcomes are those of the JSON Schema Test Suite
// (github.com/json-schema-org/JSON-Schema-Test-Suite, tests/draft2020-12/<file>), which states the
// 2020-12 specification's rules as data; where its file was not at hand the rule is quoted from the
// specification (Core or Validation 2020-12, section numbers from memory). Cases the suite writes with
// keywords we do not support (maxItems, multipleOf, exclusiveMaximum) are left out or marked as adapted.

/** `ajvDiffers`: ajv 8.20 reads a property found on Object.prototype ("constructor", "toString") as present. */
type Case = [description: string, data: unknown, valid: boolean, ajvDiffers?: true];
const D = '$schema';
const DRAFT = 'https://json-schema.org/draft/2020-12/schema';
const KEYWORD_CASES: [source: string, schema: object, cases: Case[]][] = [
  ['type.json: integer type matches integers (Validation 6.1.1)', { [D]: DRAFT, type: 'integer' }, [
    ['an integer is an integer', 1, true], ['a float with zero fractional part is an integer', 1.0, true],
    ['a float is not an integer', 1.1, false], ['a string is not an integer', 'foo', false],
    ['a string is still not an integer, even if it looks like one', '1', false], ['an object is not an integer', {}, false],
    ['an array is not an integer', [], false], ['a boolean is not an integer', true, false], ['null is not an integer', null, false],
  ]],
  ['type.json: number type matches numbers', { type: 'number' }, [
    ['an integer is a number', 1, true], ['a float is a number', 1.1, true], ['a string is not a number', 'foo', false],
    ['a string is still not a number, even if it looks like one', '1', false], ['an object is not a number', {}, false],
    ['a boolean is not a number', true, false], ['null is not a number', null, false],
  ]],
  ['type.json: string type matches strings', { type: 'string' }, [
    ['1 is not a string', 1, false], ['a string is a string', 'foo', true], ['an empty string is still a string', '', true],
    ['an array is not a string', [], false], ['null is not a string', null, false],
  ]],
  ['type.json: object type matches objects', { type: 'object' }, [
    ['an object is an object', {}, true], ['an array is not an object', [], false], ['null is not an object', null, false],
    ['a string is not an object', 'foo', false],
  ]],
  ['type.json: array type matches arrays', { type: 'array' }, [
    ['an array is an array', [], true], ['an object is not an array', {}, false], ['null is not an array', null, false],
  ]],
  ['type.json: boolean type matches booleans', { type: 'boolean' }, [
    ['zero is not a boolean', 0, false], ['an empty string is not a boolean', '', false], ['true is a boolean', true, true],
    ['false is a boolean', false, true], ['null is not a boolean', null, false],
  ]],
  ['type.json: null type matches only the null object', { type: 'null' }, [
    ['zero is not null', 0, false], ['an empty string is not null', '', false], ['false is not null', false, false],
    ['null is null', null, true],
  ]],
  ['type.json: multiple types can be specified in an array', { type: ['integer', 'string'] }, [
    ['an integer is valid', 1, true], ['a string is valid', 'foo', true], ['a float is invalid', 1.1, false],
    ['an object is invalid', {}, false], ['null is invalid', null, false],
  ]],
  ['enum.json: simple enum validation (Validation 6.1.2)', { enum: [1, 2, 3] }, [
    ['one of the enum is valid', 1, true], ['something else is invalid', 4, false],
  ]],
  ['enum.json: heterogeneous enum validation', { enum: [6, 'foo', [], true, { foo: 12 }] }, [
    ['one of the enum is valid', [], true], ['something else is invalid', null, false],
    ['objects are deep compared', { foo: false }, false], ['valid object matches', { foo: 12 }, true],
    ['extra properties in object is invalid', { foo: 12, boo: 42 }, false],
  ]],
  ['enum.json: enum with false does not match 0', { enum: [false] }, [['false is valid', false, true], ['integer zero is invalid', 0, false]]],
  ['enum.json: enum with [true] does not match [1]', { enum: [[true]] }, [['[true] is valid', [true], true], ['[1] is invalid', [1], false]]],
  ['enum.json: enum with 1 does not match true', { enum: [1] }, [['true is invalid', true, false], ['float one is valid', 1.0, true]]],
  ['enum.json: nul characters in strings', { enum: ['hello\u0000there'] }, [
    ['match string with nul', 'hello\u0000there', true], ['do not match string lacking nul', 'hellothere', false],
  ]],
  ['Validation 6.1.3: const is valid when the instance equals the value (from memory)', { const: 2 }, [
    ['the same value', 2, true], ['the same value written 2.0', 2.0, true], ['another value', 5, false], ['another type', 'a', false],
  ]],
  ['Validation 6.1.3 and 4.2.2: objects are equal with the same members in any order (from memory)', { const: { foo: 'bar', baz: 'bax' } }, [
    ['same object', { foo: 'bar', baz: 'bax' }, true], ['same object, other key order', { baz: 'bax', foo: 'bar' }, true],
    ['another object', { foo: 'bar' }, false], ['an array', ['bar', 'bax'], false],
  ]],
  ['Validation 6.1.3: const false does not match 0 nor null (from memory)', { const: false }, [
    ['false', false, true], ['zero', 0, false], ['null', null, false],
  ]],
  ['Validation 6.2.4: minimum is inclusive (from memory)', { minimum: 1.1 }, [
    ['above the minimum is valid', 2.6, true], ['boundary point is valid', 1.1, true], ['below the minimum is invalid', 0.6, false],
    ['ignores non-numbers', 'x', true],
  ]],
  ['Validation 6.2.2: maximum is inclusive (from memory)', { maximum: 3.0 }, [
    ['below the maximum is valid', 2.6, true], ['boundary point is valid', 3.0, true], ['above the maximum is invalid', 3.5, false],
    ['ignores non-numbers', 'x', true],
  ]],
  ['exclusiveMinimum.json: exclusiveMinimum validation (Validation 6.2.5)', { exclusiveMinimum: 1.1 }, [
    ['above the exclusiveMinimum is valid', 1.2, true], ['boundary point is invalid', 1.1, false],
    ['below the exclusiveMinimum is invalid', 0.6, false], ['ignores non-numbers', 'x', true],
  ]],
  ['exclusiveMinimum.json: exclusiveMinimum with zero', { exclusiveMinimum: 0 }, [
    ['positive number is valid', 0.1, true], ['zero integer is invalid', 0, false], ['negative float is invalid', -0.001, false],
  ]],
  ['pattern.json: pattern validation (Validation 6.3.3)', { pattern: '^a*$' }, [
    ['a matching pattern is valid', 'aaa', true], ['a non-matching pattern is invalid', 'abc', false],
    ['ignores booleans', true, true], ['ignores integers', 123, true], ['ignores objects', {}, true], ['ignores null', null, true],
  ]],
  ['pattern.json: pattern is not anchored', { pattern: 'a+' }, [['matches a substring', 'xxaayy', true]]],
  ['pattern.json: pattern with Unicode property escape requires unicode mode', { type: 'string', pattern: '^\\p{Letter}+$' }, [
    ['ASCII letters match', 'Hello', true], ['Non-ASCII letters match', 'π', true], ['Digits do not match', '123', false],
  ]],
  ['pattern.json: unicode literal in pattern', { pattern: '^π$' }, [
    ['matches single unicode character', 'π', true], ['multiple unicode characters do not match', 'ππ', false],
  ]],
  ['required.json: required validation (Validation 6.5.3)', { properties: { foo: {}, bar: {} }, required: ['foo'] }, [
    ['present required property is valid', { foo: 1 }, true], ['non-present required property is invalid', { bar: 1 }, false],
    ['ignores arrays', [], true], ['ignores strings', '', true], ['null is valid', null, true],
  ]],
  ['required.json: required properties whose names are Javascript object property names', { required: ['__proto__', 'toString', 'constructor'] }, [
    ['none of the properties mentioned', {}, false, true],
    ['__proto__ present', JSON.parse('{ "__proto__": "foo" }'), false, true],
    ['toString present', { toString: { length: 37 } }, false, true],
    ['all present', JSON.parse('{ "__proto__": 12, "toString": { "length": "foo" }, "constructor": 37 }'), true],
  ]],
  ['Core 10.3.2.1: properties applies each named subschema to that member only (from memory)', { properties: { foo: { type: 'integer' }, bar: { type: 'string' } } }, [
    ['both properties present and valid', { foo: 1, bar: 'baz' }, true], ['one property invalid', { foo: 1, bar: {} }, false],
    ['both properties invalid', { foo: [], bar: {} }, false], ['doesn\'t invalidate other properties', { quux: [] }, true],
    ['ignores arrays', [], true], ['ignores other non-objects', 12, true],
  ]],
  ['Core 10.3.2.1: properties named like Object.prototype members (from memory)', { properties: { constructor: { type: 'number' }, toString: { type: 'number' } } }, [
    ['absent is valid', {}, true, true], ['present and wrong', { constructor: 'x' }, false], ['present and right', { toString: 3 }, true, true],
  ]],
  ['additionalProperties.json: additionalProperties with schema (Core 10.3.2.3)', { properties: { foo: {}, bar: {} }, additionalProperties: { type: 'boolean' } }, [
    ['no additional properties is valid', { foo: 1 }, true], ['an additional valid property is valid', { foo: 1, bar: 2, quux: true }, true],
    ['an additional invalid property is invalid', { foo: 1, bar: 2, quux: 12 }, false],
  ]],
  ['additionalProperties.json: additionalProperties being false (patternProperties left out)', { properties: { foo: {}, bar: {} }, additionalProperties: false }, [
    ['no additional properties is valid', { foo: 1 }, true], ['an additional property is invalid', { foo: 1, bar: 2, quux: 'boom' }, false],
    ['ignores arrays', [1, 2, 3], true], ['ignores strings', 'foobarbaz', true], ['ignores other non-objects', 12, true],
  ]],
  ['additionalProperties.json: additionalProperties can exist by itself', { additionalProperties: { type: 'boolean' } }, [
    ['an additional valid property is valid', { foo: true }, true], ['an additional invalid property is invalid', { foo: 1 }, false],
  ]],
  ['additionalProperties.json: additionalProperties does not look in applicators (Core 10.2)', { allOf: [{ properties: { foo: {} } }], additionalProperties: { type: 'boolean' } }, [
    ['properties defined in allOf are not examined', { foo: 1, bar: true }, false],
  ]],
  ['additionalProperties.json: additionalProperties with null valued instance properties', { additionalProperties: { type: 'null' } }, [
    ['allows null values', { foo: null }, true],
  ]],
  ['required.json with additionalProperties.json: both rules hold together (combined, from their cases)', { properties: { foo: {}, bar: {} }, required: ['foo'], additionalProperties: false }, [
    ['required and optional present', { foo: 1, bar: 2 }, true], ['only the optional one', { bar: 1 }, false],
    ['required and an extra one', { foo: 1, quux: 2 }, false], ['required present with value null', { foo: null }, true],
  ]],
  ['required.json with additionalProperties.json: a required name that properties does not list is still additional', { required: ['a'], additionalProperties: false }, [
    ['present', { a: 1 }, false], ['absent', {}, false], ['not an object', 'a', true],
  ]],
  ['items.json: a schema given for items (Core 10.3.1.2)', { items: { type: 'integer' } }, [
    ['valid items', [1, 2, 3], true], ['wrong type of items', [1, 'x'], false], ['ignores non-arrays', { foo: 'bar' }, true],
    ['JavaScript pseudo-array is valid', { 0: 'invalid', length: 1 }, true],
  ]],
  ['items.json: items with boolean schema (false)', { items: false }, [
    ['any non-empty array is invalid', [1, 'foo', true], false], ['empty array is valid', [], true],
  ]],
  ['items.json: nested items', { type: 'array', items: { type: 'array', items: { type: 'array', items: { type: 'array', items: { type: 'number' } } } } }, [
    ['valid nested array', [[[[1]], [[2], [3]]], [[[4], [5], [6]]]], true],
    ['nested array with invalid type', [[[['1']], [[2], [3]]], [[[4], [5], [6]]]], false],
    ['not deep enough', [[[1], [2], [3]], [[4], [5], [6]]], false],
  ]],
  ['Validation 6.4.2: minItems (from memory)', { minItems: 1 }, [
    ['longer is valid', [1, 2], true], ['exact length is valid', [1], true], ['too short is invalid', [], false], ['ignores non-arrays', '', true],
  ]],
  ['allOf.json: allOf (Core 10.2.1.1)', { allOf: [{ properties: { bar: { type: 'integer' } }, required: ['bar'] }, { properties: { foo: { type: 'string' } }, required: ['foo'] }] }, [
    ['allOf', { foo: 'baz', bar: 2 }, true], ['mismatch second', { foo: 'baz' }, false], ['mismatch first', { bar: 2 }, false],
    ['wrong type', { foo: 'baz', bar: 'quux' }, false],
  ]],
  ['allOf.json: allOf simple types', { allOf: [{ maximum: 30 }, { minimum: 20 }] }, [['valid', 25, true], ['mismatch one', 35, false]]],
  ['allOf.json: allOf with boolean schemas, some false', { allOf: [true, false] }, [['any value is invalid', 'foo', false]]],
  ['allOf.json: nested allOf, to check validation semantics', { allOf: [{ allOf: [{ type: 'null' }] }] }, [
    ['null is valid', null, true], ['anything non-null is invalid', 123, false],
  ]],
  ['Core 10.2.1.2: anyOf is valid if the instance is valid against at least one subschema (from memory)', { anyOf: [{ type: 'integer' }, { minimum: 2 }] }, [
    ['first anyOf valid', 1, true], ['second anyOf valid', 2.5, true], ['both anyOf valid', 3, true], ['neither anyOf valid', 1.5, false],
  ]],
  ['Core 10.2.1.2: anyOf with boolean schemas (from memory)', { anyOf: [false, true] }, [['some true', 'foo', true]]],
  ['Core 10.2.1.2: anyOf with all false (from memory)', { anyOf: [false, false] }, [['all false', 'foo', false]]],
  ['if-then-else.json: ignore if without then or else (Core 10.2.2.1)', { if: { const: 0 } }, [
    ['valid when valid against lone if', 0, true], ['valid when invalid against lone if', 'hello', true],
  ]],
  ['if-then-else.json: ignore then without if (Core 10.2.2.2)', { then: { const: 0 } }, [
    ['valid when valid against lone then', 0, true], ['valid when invalid against lone then', 'hello', true],
  ]],
  ['if-then-else.json: ignore else without if (Core 10.2.2.3)', { else: { const: 0 } }, [
    ['valid when valid against lone else', 0, true], ['valid when invalid against lone else', 'hello', true],
  ]],
  ['if-then-else.json: if with boolean schema true', { if: true, then: { const: 'then' }, else: { const: 'else' } }, [
    ['always chooses the then path (valid)', 'then', true], ['always chooses the then path (invalid)', 'else', false],
  ]],
  ['if-then-else.json: if with boolean schema false', { if: false, then: { const: 'then' }, else: { const: 'else' } }, [
    ['always chooses the else path (invalid)', 'then', false], ['always chooses the else path (valid)', 'else', true],
  ]],
  ['if-then-else.json: then: false fails when condition matches', { if: { const: 1 }, then: false }, [
    ['matches if, then=false: invalid', 1, false], ['does not match if, then ignored: valid', 2, true],
  ]],
  ['if-then-else.json: else: false fails when condition does not match', { if: { const: 1 }, else: false }, [
    ['matches if, else ignored: valid', 1, true], ['does not match if, else executes: invalid', 2, false],
  ]],
  ['if-then-else.json: validate against correct branch (adapted: maximum/minimum/const for exclusiveMaximum/multipleOf)', { if: { maximum: -1 }, then: { minimum: -10 }, else: { const: 4 } }, [
    ['valid through then', -1, true], ['invalid through then', -100, false], ['valid through else', 4, true], ['invalid through else', 3, false],
  ]],
  ['if-then-else.json: non-interference across combined schemas (adapted as above)', { allOf: [{ if: { maximum: -1 } }, { then: { minimum: -10 } }, { else: { const: 4 } }] }, [
    ['valid, but would have been invalid through then', -100, true], ['valid, but would have been invalid through else', 3, true],
  ]],
  ['ref.json: root pointer ref (Core 8.2.3.1)', { properties: { foo: { $ref: '#' } }, additionalProperties: false }, [
    ['match', { foo: false }, true], ['recursive match', { foo: { foo: false } }, true], ['mismatch', { bar: false }, false],
    ['recursive mismatch', { foo: { bar: false } }, false],
  ]],
  ['ref.json: relative pointer ref to object', { properties: { foo: { type: 'integer' }, bar: { $ref: '#/properties/foo' } } }, [
    ['match', { bar: 3 }, true], ['mismatch', { bar: true }, false],
  ]],
  ['ref.json: escaped pointer ref (RFC 6901 and percent-encoding)', { $defs: { 'tilde~field': { type: 'integer' }, 'slash/field': { type: 'integer' }, 'percent%field': { type: 'integer' } }, properties: { tilde: { $ref: '#/$defs/tilde~0field' }, slash: { $ref: '#/$defs/slash~1field' }, percent: { $ref: '#/$defs/percent%25field' } } }, [
    ['slash invalid', { slash: 'aoeu' }, false], ['tilde invalid', { tilde: 'aoeu' }, false], ['percent invalid', { percent: 'aoeu' }, false],
    ['slash valid', { slash: 123 }, true], ['tilde valid', { tilde: 123 }, true], ['percent valid', { percent: 123 }, true],
  ]],
  ['ref.json: nested refs', { $defs: { a: { type: 'integer' }, b: { $ref: '#/$defs/a' }, c: { $ref: '#/$defs/b' } }, $ref: '#/$defs/c' }, [
    ['nested ref valid', 5, true], ['nested ref invalid', 'a', false],
  ]],
  ['ref.json: ref applies alongside sibling keywords (adapted: minItems for maxItems)', { $defs: { reffed: { type: 'array' } }, properties: { foo: { $ref: '#/$defs/reffed', minItems: 2 } } }, [
    ['ref valid, minItems valid', { foo: [1, 2] }, true], ['ref valid, minItems invalid', { foo: [1] }, false], ['ref invalid', { foo: 'string' }, false],
  ]],
  ['ref.json: property named $ref that is not a reference', { properties: { $ref: { type: 'string' } } }, [
    ['property named $ref valid', { $ref: 'a' }, true], ['property named $ref invalid', { $ref: 2 }, false],
  ]],
  ['ref.json: $ref to boolean schema false', { $ref: '#/$defs/bool', $defs: { bool: false } }, [['any value is invalid', 'foo', false]]],
  ['ref.json: refs with quote', { properties: { 'foo"bar': { $ref: '#/$defs/foo%22bar' } }, $defs: { 'foo"bar': { type: 'number' } } }, [
    ['object with numbers is valid', { 'foo"bar': 1 }, true], ['object with strings is invalid', { 'foo"bar': '1' }, false],
  ]],
  ['ref.json: naive replacement of $ref with its destination is not correct', { $defs: { a_string: { type: 'string' } }, enum: [{ $ref: '#/$defs/a_string' }] }, [
    ['do not evaluate the $ref inside the enum, matching any string', 'this is a string', false],
    ['match the enum exactly', { $ref: '#/$defs/a_string' }, true],
  ]],
];

describe('each keyword, against the JSON Schema 2020-12 rules', () => {
  const loose = new Ajv2020({ strict: false });
  describe.each(KEYWORD_CASES)('%s', (_source, schema, cases) => {
    it.each(cases)('%s', (_description, data, valid, ajvDiffers) => {
      expect(checkJsonSchema(schema, data).length === 0).toBe(valid);
      // The reference library reads the rule the same way, except where it is known not to (see Case).
      expect(loose.validate(schema, data)).toBe(ajvDiffers ? !valid : valid);
    });
  });

  it('agrees with ajv on 200 random schemas made of these keywords, each tried on 8 random values', () => {
    const name = fc.constantFrom('a', 'b', 'c');
    const { value } = fc.letrec<{ value: unknown }>((tie) => ({
      value: fc.oneof(
        { depthSize: 'small', withCrossShrink: true },
        fc.constant(null),
        fc.boolean(),
        fc.integer({ min: -5, max: 5 }),
        fc.double({ min: -5, max: 5, noNaN: true }),
        fc.constantFrom('', 'a', 'ab', 'b1', 'ba'),
        fc.array(tie('value'), { maxLength: 3 }),
        // Plain objects, as JSON.parse makes them (fast-check's have no prototype, which ajv's equality minds).
        fc.dictionary(name, tie('value'), { maxKeys: 3 }).map((d) => ({ ...d })),
      ),
    }));
    const bound = fc.oneof(fc.integer({ min: -3, max: 3 }), fc.double({ min: -3, max: 3, noNaN: true }));
    const { schema } = fc.letrec<{ schema: unknown }>((tie) => ({
      schema: fc.oneof(
        { depthSize: 'small', withCrossShrink: true },
        fc.boolean(),
        fc.record(
          {
            type: fc.oneof(
              fc.constantFrom('null', 'boolean', 'object', 'array', 'number', 'integer', 'string'),
              fc.subarray(['null', 'integer', 'string', 'object', 'array'], { minLength: 1 }),
            ),
            const: value,
            enum: fc.array(value, { minLength: 1, maxLength: 3 }),
            pattern: fc.constantFrom('^a', 'b$', '^[ab]+$', '\\d'),
            minimum: bound,
            maximum: bound,
            exclusiveMinimum: bound,
            required: fc.subarray(['a', 'b', 'c']),
            properties: fc.dictionary(name, tie('schema'), { maxKeys: 2 }).map((d) => ({ ...d })),
            additionalProperties: tie('schema'),
            items: tie('schema'),
            minItems: fc.nat({ max: 3 }),
            allOf: fc.array(tie('schema'), { minLength: 1, maxLength: 2 }),
            anyOf: fc.array(tie('schema'), { minLength: 1, maxLength: 2 }),
            if: tie('schema'),
            then: tie('schema'),
            else: tie('schema'),
          },
          { requiredKeys: [] },
        ),
      ),
    }));
    const loose = new Ajv2020({ strict: false });
    let invalid = 0;
    fc.assert(
      fc.property(schema, fc.array(value, { minLength: 8, maxLength: 8 }), (s, values) => {
        const reference = loose.compile(typeof s === 'boolean' ? s : (s as object));
        for (const v of values) {
          const ours = checkJsonSchema(typeof s === 'boolean' ? { allOf: [s] } : (s as object), v).length === 0;
          expect(ours, `${JSON.stringify(s)} on ${JSON.stringify(v)}`).toBe(reference(v));
          if (!ours) invalid++;
        }
      }),
      { numRuns: 200 },
    );
    expect(invalid).toBeGreaterThan(300); // a good share of the 1600 checks say no
  }, 60_000); // ajv generates code for each of the 200 schemas: slow on a busy machine

  it('does not report why an if failed, only what then or else asked', () => {
    const schema = { if: { properties: { kind: { const: 'a' } } }, then: { required: ['x'] }, else: { required: ['y'] } };
    const problems = checkJsonSchema(schema, { kind: 'b' });
    expect(problems.map((p) => [p.path, p.keyword])).toEqual([['/y', 'required']]);
  });

  it('stops after maxErrors problems, 100 by default', () => {
    const schema = { items: { type: 'string' } };
    const numbers = Array.from({ length: 500 }, (_, i) => i);
    expect(checkJsonSchema(schema, numbers)).toHaveLength(100);
    expect(checkJsonSchema(schema, numbers, { maxErrors: 3 }).map((p) => p.path)).toEqual(['/0', '/1', '/2']);
  });

  it('reports every problem of a file, not just the first', () => {
    const records = structuredClone(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 3 })) as unknown as Rec[];
    for (const drop of kindIn(records, 'drop')) set(drop, { time_s: -1 });
    expect(problemsOf(fileOf(records)).filter((p) => p.keyword === 'exclusiveMinimum')).toHaveLength(3);
  });

  it('returns a list of problems', () => {
    expectTypeOf(checkJsonSchema).returns.toEqualTypeOf<JsonSchemaProblem[]>();
    expectTypeOf<JsonSchemaProblem>().toEqualTypeOf<{ path: string; keyword: string; value: unknown; message: string }>();
  });
});

// ---------------------------------------------------------------------------------------------------------

describe('a schema it cannot apply faithfully', () => {
  const codeOf = (schema: object) => {
    try {
      checkJsonSchema(schema, {});
      return null;
    } catch (error) {
      expect(error).toBeInstanceOf(JsonSchemaError);
      return error as JsonSchemaError;
    }
  };

  it('supports every keyword the log schema uses', () => {
    const used = new Set<string>();
    const walk = (s: unknown, isMap = false): void => {
      if (typeof s !== 'object' || s === null) return;
      if (Array.isArray(s)) return s.forEach((x) => walk(x));
      for (const [k, v] of Object.entries(s)) {
        if (isMap) walk(v);
        else if (used.add(k) && !['const', 'enum', 'required'].includes(k)) walk(v, k === 'properties' || k === '$defs');
      }
    };
    walk(LOG_SCHEMA);
    expect([...used].filter((k) => !SUPPORTED_KEYWORDS.includes(k))).toEqual([]);
    expect(() => checkJsonSchema(LOG_SCHEMA, {})).not.toThrow();
  });

  it.each(['format', 'exclusiveMaximum', 'maxItems', 'minLength', 'oneOf', 'not', 'patternProperties', 'prefixItems', 'unevaluatedProperties', 'dependentRequired', '$anchor', '$dynamicRef', 'contains', 'uniqueItems', 'propertyNames', 'multipleOf'])(
    'refuses a schema with "%s" (schema-keyword-unsupported), even in an unused $defs entry',
    (keyword) => {
      const schema = structuredClone(LOG_SCHEMA) as { $defs: Record<string, Record<string, unknown>> };
      schema.$defs.spare = { type: 'string', [keyword]: 'x' };
      const error = codeOf(schema)!;
      expect(error.code).toBe('schema-keyword-unsupported');
      expect(error.field).toBe(`#/$defs/spare/${keyword}`);
      expect(error.value).toBe('x');
      expect(error.message).toContain(`"${keyword}"`);
    },
  );

  it('refuses the same keyword deep inside a property and names where it is', () => {
    const schema = structuredClone(LOG_SCHEMA) as { $defs: { instant: Record<string, unknown> } };
    schema.$defs.instant.format = 'date-time';
    expect(codeOf(schema)).toMatchObject({ code: 'schema-keyword-unsupported', field: '#/$defs/instant/format', value: 'date-time' });
  });

  it.each([
    ['another dialect', { $schema: 'http://json-schema.org/draft-07/schema#', type: 'string' }, '#/$schema'],
    ['items as a list (the draft 2019 form)', { items: [{ type: 'string' }] }, '#/items'],
    ['a pattern that is not a regular expression', { pattern: '(' }, '#/pattern'],
    ['a reference to another document', { $ref: 'other.json#/$defs/x' }, '#/$ref'],
    ['a reference to nothing', { $ref: '#/$defs/missing' }, '#/$ref'],
    ['a minimum given as text', { minimum: '0' }, '#/minimum'],
    ['required given as one string', { required: 'kind' }, '#/required'],
    ['a nested $id, which would move what $ref points at', { properties: { a: { $id: 'x.json' } } }, '#/properties/a'],
  ])('refuses %s (schema-invalid)', (_what, schema, field) => {
    expect(codeOf(schema)).toMatchObject({ code: 'schema-invalid', field });
  });
});

// ---------------------------------------------------------------------------------------------------------

describe('messages name the field, the value and the rule', () => {
  const records = () => structuredClone(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 2 })) as unknown as Rec[];
  const first = (spoil: (r: Rec[]) => void, sel: unknown = null) => {
    const r = records();
    spoil(r);
    const problems = problemsOf(fileOf(r, sel));
    expect(problems).toHaveLength(1);
    return { problem: problems[0]! };
  };
  const specimenAt = (r: Rec[]) => r.findIndex((x) => x.kind === 'specimen');

  it.each([
    ['a negative mass', (r: Rec[]) => set(r[specimenAt(r)], { mass_kg: -2 }), '/records/S/mass_kg', 'exclusiveMinimum', -2, '/records/S/mass_kg: -2 must be > 0 and ≤ 20000'],
    ['a mass above the range', (r: Rec[]) => set(r[specimenAt(r)], { mass_kg: 25_000 }), '/records/S/mass_kg', 'maximum', 25_000, '/records/S/mass_kg: 25000 must be > 0 and ≤ 20000'],
    ['a mass typed as text', (r: Rec[]) => set(r[specimenAt(r)], { mass_kg: '0.06' }), '/records/S/mass_kg', 'type', '0.06', '/records/S/mass_kg: "0.06" must be a number'],
    ['a missing name', (r: Rec[]) => delete r[specimenAt(r)]!.name, '/records/S/name', 'required', undefined, '/records/S/name: is required but missing'],
    ['a misspelt field', (r: Rec[]) => set(r[specimenAt(r)], { Mass_kg: 1 }), '/records/S/Mass_kg', 'additionalProperties', 1, '/records/S/Mass_kg: 1 is not an allowed property here'],
    ['an unknown shape', (r: Rec[]) => set(r[specimenAt(r)], { shape: { kind: 'cone' } }), '/records/S/shape/kind', 'enum', 'cone', '/records/S/shape/kind: "cone" must be one of "sphere", "cylinder", "disc", "box", "custom"'],
    ['a malformed id', (r: Rec[]) => set(r[specimenAt(r)], { id: 'abc' }), '/records/S/id', 'pattern', 'abc', '/records/S/id: "abc" must match the pattern ^[0-9A-Fa-f]{8}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{4}-[0-9A-Fa-f]{12}$'],
    ['a drag coefficient out of range (nullable)', (r: Rec[]) => set(r[specimenAt(r)], { reference_drag_coefficient: 7 }), '/records/S/reference_drag_coefficient', 'maximum', 7, '/records/S/reference_drag_coefficient: 7 must be > 0 and ≤ 5'],
    ['a drag coefficient as text (nullable)', (r: Rec[]) => set(r[specimenAt(r)], { reference_drag_coefficient: 'x' }), '/records/S/reference_drag_coefficient', 'anyOf', 'x', '/records/S/reference_drag_coefficient: "x" must be a number, or must be null'],
  ] as [string, (r: Rec[]) => unknown, string, string, unknown, string][])('for %s', (_what, spoil, path, keyword, value, message) => {
    const { problem } = first(spoil);
    const at = String(specimenAt(records()));
    expect(problem).toEqual({ path: path.replace('S', at), keyword, value, message: message.replace('S', at) });
  });

  it('for a tap capture with one tap, a fractional drop number and the wrong format', () => {
    const r = records();
    const [drop] = kindIn(r, 'drop');
    set(drop, { raw: { kind: 'taps', timestamps_ms: [5] }, seq: 1.5 });
    const at = r.indexOf(drop!);
    const messages = problemsOf({ ...fileOf(r), format: 'plummet' }).map((p) => p.message);
    expect(messages).toEqual([
      '/format: "plummet" must be "plummet-log"',
      `/records/${at}/seq: 1.5 must be an integer`,
      `/records/${at}/raw/timestamps_ms: [5] must have at least 2 items`,
    ]);
  });

  it('for a sea-level pressure typed in hPa, with the range of the branch that applies', () => {
    const { problem } = first((r) => set(kindIn(r, 'reading')[0], { pressure_reference: 'sea_level', pressure_Pa: 1013 }));
    expect(problem.keyword).toBe('minimum');
    expect(problem.message).toMatch(/^\/records\/\d+\/pressure_Pa: 1013 must be ≥ 85000 and ≤ 110000$/);
  });

  it('for a bad value inside a nullable object, pointing into the object', () => {
    const { problem } = first(() => {}, { day_ids: ['nope'], specimen_ids: [], site_ids: [], kinds: [] });
    expect(problem).toMatchObject({ path: '/selection/day_ids/0', keyword: 'pattern', value: 'nope' });
  });

  it('for the whole file given as a list', () => {
    expect(checkJsonSchema(LOG_SCHEMA, [])).toEqual([{ path: '', keyword: 'type', value: [], message: '(root): [] must be an object' }]);
  });
});
