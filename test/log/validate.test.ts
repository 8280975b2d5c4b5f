import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assertValidBody, instantMs, isIsoInstant, READ_FIELD_NAMES, validateBody, validateRecord } from '../../src/log/validate';
import { LogValidationError } from '../../src/log/errors';
import { FIELDS } from '../../src/log/fields';
import { RECORD_KINDS } from '../../src/log/types';
import type { BodyOf, RecordKind } from '../../src/log/types';
import * as demo from './demo-bodies';

const bodies: { [K in RecordKind]: () => BodyOf[K] } = {
  site: demo.site,
  specimen: demo.steelBall,
  day: demo.day,
  reading: demo.reading,
  series: demo.series,
  drop: demo.drop,
};

const messages = (kind: RecordKind, body: unknown) => validateBody(kind, body).map((p) => p.message);

describe('validateBody', () => {
  it.each(Object.keys(bodies) as RecordKind[])('finds nothing wrong with a well-formed %s', (kind) => {
    expect(validateBody(kind, bodies[kind]())).toEqual([]);
  });

  it('names the field, the value and the rule when a mass is zero', () => {
    const problems = validateBody('specimen', { ...demo.steelBall(), mass_kg: 0 });
    expect(problems).toEqual([
      {
        path: 'mass_kg',
        value: 0,
        rule: 'must be > 0 and ≤ 20000 kg',
        message: 'mass_kg: 0 is out of range: must be > 0 and ≤ 20000 kg',
      },
    ]);
  });

  it('catches a pressure typed in hectopascals instead of pascals', () => {
    expect(messages('reading', { ...demo.reading(), pressure_Pa: 1013.25 })).toEqual([
      'pressure_Pa: 1013.25 is out of range: must be ≥ 30000 and ≤ 110000 Pa (station pressure)',
    ]);
  });

  it('accepts the extremes of the inhabited and climbed Earth', () => {
    // Dead Sea shore about −430 m; Everest summit 8849 m with about 33.7 kPa station pressure (from memory).
    expect(validateBody('site', { ...demo.site(), elevation_m: -430 })).toEqual([]);
    expect(validateBody('site', { ...demo.site(), elevation_m: 8849 })).toEqual([]);
    expect(validateBody('reading', { ...demo.reading(), pressure_Pa: 33_700 })).toEqual([]);
    // Lowest and highest air temperatures recorded at the surface: −89.2 °C (Vostok, 1983),
    // 56.7 °C (Death Valley, 1913), WMO weather and climate extremes archive (from memory).
    expect(validateBody('reading', { ...demo.reading(), temperature_C: -89.2 })).toEqual([]);
    expect(validateBody('reading', { ...demo.reading(), temperature_C: 56.7 })).toEqual([]);
    // Lowest sea-level pressure measured, 87.0 kPa in typhoon Tip, 1979 (from memory).
    expect(
      validateBody('reading', { ...demo.reading(), pressure_reference: 'sea_level', pressure_Pa: 87_000 }),
    ).toEqual([]);
  });

  it('refuses a sea-level pressure that only a mountain station could read', () => {
    expect(messages('reading', { ...demo.reading(), pressure_reference: 'sea_level', pressure_Pa: 70_000 })).toEqual([
      'pressure_Pa: 70000 is out of range: must be ≥ 85000 and ≤ 110000 Pa (reduced to sea level)',
    ]);
  });

  it('refuses coordinates off the globe', () => {
    expect(messages('site', { ...demo.site(), latitude_deg: 91, longitude_deg: -180.5 })).toEqual([
      'latitude_deg: 91 is out of range: must be ≥ -90 and ≤ 90 °',
      'longitude_deg: -180.5 is out of range: must be ≥ -180 and ≤ 180 °',
    ]);
  });

  it('refuses numbers that are not finite and text where a number belongs', () => {
    expect(messages('drop', { ...demo.drop(), time_s: Number.NaN })).toEqual([
      'time_s: NaN is not a finite number: must be > 0 and ≤ 3600 s',
    ]);
    expect(messages('drop', { ...demo.drop(), time_s: '1.12' })).toEqual([
      'time_s: "1.12" is not a finite number: must be > 0 and ≤ 3600 s',
    ]);
    expect(messages('series', { ...demo.series(), height_m: Number.POSITIVE_INFINITY })).toEqual([
      'height_m: Infinity is not a finite number: must be > 0 and ≤ 10000 m',
    ]);
  });

  it('reports a missing field and a field the record does not have', () => {
    const { mass_kg: _dropped, ...withoutMass } = demo.steelBall();
    expect(messages('specimen', { ...withoutMass, mass_g: 63.7 })).toEqual([
      'mass_kg: missing: must be > 0 and ≤ 20000 kg',
      'mass_g: 63.7 is not a field of a specimen',
    ]);
  });

  it('collects every problem of a record, not only the first', () => {
    const problems = validateBody('series', { ...demo.series(), height_m: -1, u_time_s: -0.1, timing_method: 'ear' });
    expect(problems.map((p) => p.path)).toEqual(['height_m', 'timing_method', 'u_time_s']);
  });

  it('checks the dimensions of each shape and refuses a shape it does not know', () => {
    expect(messages('specimen', { ...demo.steelBall(), shape: { kind: 'sphere', diameter_m: 0, u_diameter_m: 0 } })).toEqual([
      'shape.diameter_m: 0 is out of range: must be > 0 and ≤ 10 m',
    ]);
    expect(
      validateBody('specimen', {
        ...demo.steelBall(),
        shape: { kind: 'custom', area_m2: 0.0123, u_area_m2: 0.0002, volume_m3: 0.0004, u_volume_m3: 0.00001 },
      }),
    ).toEqual([]);
    expect(messages('specimen', { ...demo.steelBall(), shape: { kind: 'cone', diameter_m: 0.1 } })).toEqual([
      'shape.kind: "cone" is not one of: sphere, cylinder, disc, box, custom',
    ]);
    expect(
      messages('specimen', {
        ...demo.steelBall(),
        shape: { kind: 'box', length_m: 0.2, u_length_m: 0.001, width_m: 0.1, u_width_m: 0.001 },
      }),
    ).toEqual(['shape.height_m: missing: must be > 0 and ≤ 10 m', 'shape.u_height_m: missing: must be ≥ 0 and ≤ shape.height_m']);
  });

  it('refuses a standard uncertainty larger than the quantity itself', () => {
    expect(messages('specimen', { ...demo.steelBall(), u_mass_kg: 0.1 })).toEqual([
      'u_mass_kg: 0.1 is out of range: must be ≥ 0 and ≤ mass_kg (0.0637 kg)',
    ]);
  });

  it('refuses a dew point above the air temperature', () => {
    const humid = { kind: 'dew_point', dew_point_C: 19.5, u_dew_point_C: 0.5 };
    expect(messages('reading', { ...demo.reading(), humidity: humid })).toEqual([
      'humidity.dew_point_C: 19.5 is out of range: must be ≥ -90 °C and not above temperature_C + 1 (18.4 °C)',
    ]);
    expect(validateBody('reading', { ...demo.reading(), humidity: { ...humid, dew_point_C: 11.2 } })).toEqual([]);
  });

  it('refuses a calendar date that does not exist and an instant that is not ISO 8601', () => {
    expect(messages('day', { ...demo.day(), date: '2026-02-30' })).toEqual([
      'date: "2026-02-30" is not a calendar date: must be YYYY-MM-DD between 1900 and 2200',
    ]);
    expect(messages('reading', { ...demo.reading(), taken_at: '14/06/2026 09:05' })).toEqual([
      'taken_at: "14/06/2026 09:05" is not an instant: must be ISO 8601 in UTC, e.g. 2026-06-14T09:12:03.412Z',
    ]);
  });

  it('wants a reason for an excluded drop and none for a drop that counts', () => {
    expect(messages('drop', { ...demo.drop(), excluded: true })).toEqual([
      'exclusion_reason: null is missing: an excluded drop needs a reason',
    ]);
    expect(messages('drop', { ...demo.drop(), exclusion_reason: 'wind gust' })).toEqual([
      'exclusion_reason: "wind gust" must be null when the drop is not excluded',
    ]);
    expect(validateBody('drop', { ...demo.drop(), excluded: true, exclusion_reason: 'wind gust' })).toEqual([]);
  });

  it('checks that a raw capture is complete and in time order', () => {
    expect(messages('drop', { ...demo.drop(), raw: { kind: 'taps', timestamps_ms: [11_121, 10_000] } })).toEqual([
      'raw.timestamps_ms[1]: 10000 is out of order: must not be before raw.timestamps_ms[0] (11121)',
    ]);
    expect(messages('drop', { ...demo.drop(), raw: { kind: 'taps', timestamps_ms: [10_000] } })).toEqual([
      'raw.timestamps_ms: [10000] (1 entry) is too short: a capture needs at least 2 (release and impact)',
    ]);
    expect(messages('drop', { ...demo.drop(), raw: { kind: 'frames', frames: [12, 45.5], frame_rate_Hz: 240 } })).toEqual([
      'raw.frames[1]: 45.5 is not a whole number',
    ]);
    expect(messages('drop', { ...demo.drop(), raw: { kind: 'typed', text: '  ' } })).toEqual([
      'raw.text: "  " is empty: must hold the value as typed (1 to 100 characters)',
    ]);
  });

  it('keeps the whole offending text but shows only its start when a note is too long', () => {
    const notes = 'wind '.repeat(2001);
    const [problem] = validateBody('site', { ...demo.site(), notes });
    expect(problem?.value).toBe(notes);
    expect(problem?.message).toBe('notes: "wind wind wind wind "… (10005 characters) is too long: must be at most 10000 characters');
  });

  it('wants record ids where a record points at another', () => {
    expect(messages('series', { ...demo.series(), day_id: 'day-1' })).toEqual([
      'day_id: "day-1" is not a record id: must be a UUID',
    ]);
  });

  it('refuses something that is not an object at all', () => {
    expect(messages('site', null)).toEqual(['(body): null is not an object: a site must be an object of fields']);
    expect(messages('nonsense' as RecordKind, {})).toEqual([
      '(kind): "nonsense" is not one of: site, specimen, day, reading, series, drop',
    ]);
  });

  it('accepts every mass in range and refuses every mass out of it', () => {
    fc.assert(
      // Up to 20 000 kg (a payload on a crane or under a balloon); the edges themselves are tried every run.
      fc.property(fc.oneof(fc.double({ noNaN: true }), fc.constantFrom(0, Number.MIN_VALUE, 1000.5, 19_999.99, 20_000, 20_000.01)), (mass) => {
        const ok = validateBody('specimen', { ...demo.steelBall(), mass_kg: mass, u_mass_kg: 0 }).length === 0;
        expect(ok).toBe(mass > 0 && mass <= 20_000);
      }),
      { seed: 20_000, numRuns: 300 },
    );
  });
});

describe('assertValidBody', () => {
  it('throws a record-invalid error carrying all the problems', () => {
    let caught: unknown;
    try {
      assertValidBody('specimen', { ...demo.steelBall(), mass_kg: 0, name: '' });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(LogValidationError);
    const error = caught as LogValidationError;
    expect(error.code).toBe('record-invalid');
    expect(error.problems.map((p) => p.path)).toEqual(['name', 'mass_kg']);
    expect(error.message).toContain('mass_kg: 0 is out of range: must be > 0 and ≤ 20000 kg');
  });
});

describe('validateRecord', () => {
  const envelope = {
    id: demo.SITE_ID,
    kind: 'site',
    created_at: '2026-06-14T08:00:00.000Z',
    updated_at: '2026-06-14T08:00:00.000Z',
    rev: '001781424000000-000000-a1b2c3d4e5f60718',
    device: 'a1b2c3d4e5f60718',
    deleted: false,
    history: [],
  };

  it('accepts a whole stored record', () => {
    expect(validateRecord({ ...envelope, ...demo.site() })).toEqual([]);
  });

  it('checks the envelope as well as the body', () => {
    const paths = validateRecord({ ...envelope, ...demo.site(), id: 'x', rev: 'yesterday', deleted: 'no', history: {} }).map(
      (p) => p.path,
    );
    expect(paths).toEqual(['id', 'rev', 'deleted', 'history']);
  });

  it('checks each earlier version kept in the history', () => {
    const old = { rev: 'bad', device: 'a1b2c3d4e5f60718', updated_at: envelope.updated_at, reason: null, deleted: false, body: demo.site() };
    expect(validateRecord({ ...envelope, ...demo.site(), history: [old] }).map((p) => p.message)).toEqual([
      'history[0].rev: "bad" is not a clock stamp: must be ms-counter-device',
    ]);
  });

  // A plain object's fields are read by name, without a copy (an import reads 100 000 records): that reads only its
  // own fields as long as no name read is a member of Object.prototype.
  it('reads no field whose name Object.prototype holds, so a plain record is read by its own fields only', () => {
    expect(READ_FIELD_NAMES.length).toBeGreaterThan(60);
    expect(READ_FIELD_NAMES.filter((name) => name in Object.prototype)).toEqual([]);
    // Nested values (a shape, a capture, a clip, marks) are read by name too: every part of every catalogued path.
    const parts = RECORD_KINDS.flatMap((kind) => Object.keys(FIELDS[kind]).flatMap((path) => path.split(/[.[\]]+/).filter(Boolean)));
    expect(parts.length).toBeGreaterThan(READ_FIELD_NAMES.length);
    expect(parts.filter((name) => name in Object.prototype)).toEqual([]);
  });

  it('reads only own fields of a record, a version and a body that are not plain objects', () => {
    const lent = { ...envelope, ...demo.site() };
    // Every field lent by a prototype: none of them counts, each is missing.
    const inherited = validateRecord(Object.create(lent)).map((p) => p.path);
    expect(inherited).toEqual(['kind']);
    const body = Object.assign(Object.create({ name: 'Lent' }), { ...demo.site(), name: undefined });
    delete body.name;
    const old = { rev: '000000000000001-000000-a1b2c3d4e5f60718', device: 'a1b2c3d4e5f60718', updated_at: envelope.updated_at, reason: null, deleted: false, body };
    expect(validateRecord({ ...envelope, ...demo.site(), history: [old] }).map((p) => p.path)).toEqual(['history[0].body.name']);
    const version = Object.assign(Object.create({ deleted: false }), { ...old, body: demo.site() });
    delete version.deleted;
    expect(validateRecord({ ...envelope, ...demo.site(), history: [version] }).map((p) => p.path)).toEqual(['history[0].deleted']);
  });

  it('finds the same in a plain record as in the same fields without a prototype', () => {
    const bare = (v: object) => Object.assign(Object.create(null), v);
    const old = { rev: '001781424000000-000000-a1b2c3d4e5f60718', device: 'a1b2c3d4e5f60718', updated_at: envelope.updated_at, reason: null, deleted: false, body: { ...demo.site(), name: 'Other' } };
    const record = { ...envelope, ...demo.site(), elevation_m: -1e6, extra: 1, history: [old] };
    const plain = validateRecord(record);
    expect(plain.map((p) => p.path)).toEqual(['history[0].rev', 'elevation_m', 'extra']);
    expect(validateRecord(bare({ ...record, history: [bare({ ...old, body: bare(old.body) })] }))).toEqual(plain);
  });
});

describe('instantMs', () => {
  // The reference is the platform's own calendar (ECMAScript Date.parse and toISOString, ECMA-262 §21.4.1): a text
  // is an instant when Date.parse reads it and writes the same date and time back (no roll-over of 2026-02-30).
  const reference = (text: string): number => {
    if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d{1,3})?Z$/.test(text)) return NaN;
    const ms = Date.parse(text);
    return Number.isFinite(ms) && new Date(ms).toISOString().slice(0, 19) === text.slice(0, 19) ? ms : NaN;
  };
  const pad = (n: number, width: number) => String(n).padStart(width, '0');

  it('reads the time value Date.parse reads, and refuses what the calendar does not hold', () => {
    const cases = [
      '2026-06-14T09:12:03.412Z', '2026-06-14T09:12:03Z', '2026-06-14T09:12:03.4Z', '2026-06-14T09:12:03.05Z',
      '1970-01-01T00:00:00.000Z', '1969-12-31T23:59:59.999Z', '0000-01-01T00:00:00Z', '0000-02-29T12:00:00Z',
      '9999-12-31T23:59:59.999Z', '2000-02-29T00:00:00Z', '1900-02-29T00:00:00Z', '2024-02-29T00:00:00Z',
      '2026-02-29T00:00:00Z', '2026-02-30T00:00:00Z', '2026-04-31T00:00:00Z', '2026-13-01T00:00:00Z',
      '2026-00-10T00:00:00Z', '2026-01-00T00:00:00Z', '2026-01-01T24:00:00Z', '2026-01-01T23:60:00Z',
      '2026-01-01T23:59:60Z', '2026-01-01T09:12:03.4120Z', '2026-01-01T09:12:03+00:00', '2026-01-01 09:12:03Z', '',
    ];
    for (const text of cases) expect([text, instantMs(text)]).toEqual([text, reference(text)]);
    expect(Number.isNaN(instantMs('2026-02-30T00:00:00Z'))).toBe(true);
    expect(instantMs('2026-06-14T09:12:03.412Z')).toBe(Date.UTC(2026, 5, 14, 9, 12, 3, 412));
  });

  it('agrees with Date.parse on drawn dates and times, valid or not', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 9999 }), fc.integer({ min: 0, max: 13 }), fc.integer({ min: 0, max: 32 }),
        fc.integer({ min: 0, max: 24 }), fc.integer({ min: 0, max: 60 }), fc.integer({ min: 0, max: 60 }),
        fc.option(fc.stringMatching(/^\d{1,3}$/)),
        (y, mo, d, h, mi, s, fraction) => {
          const text = `${pad(y, 4)}-${pad(mo, 2)}-${pad(d, 2)}T${pad(h, 2)}:${pad(mi, 2)}:${pad(s, 2)}${fraction === null ? '' : `.${fraction}`}Z`;
          expect(instantMs(text)).toEqual(reference(text));
          expect(isIsoInstant(text)).toBe(!Number.isNaN(reference(text)));
        },
      ),
      { numRuns: 5000, seed: 20261203 },
    );
  });
});
