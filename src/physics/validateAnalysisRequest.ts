/**
 * Checks an untrusted JSON value (a file, a stored record) before it is analysed, and turns it
 * into a typed AnalysisRequest. Every problem is a PhysicsInputError naming the field as a JSON
 * path, the value found and the allowed range. Unknown fields are errors too: a misspelt or
 * unit-less name ("temperature" for "temperature_C") would otherwise be silently ignored.
 */
import { airProperties, type AirInput } from './airProperties';
import type { AirAloftInput, AnalysisOptions, AnalysisRequest, DropInput, DropMark, TimingInput, UncertaintyInput } from './analysisTypes';
import { checkNumber, checkOptionalNumber } from './checkNumber';
import { localGravity, type SiteInput } from './normalGravity';
import { PhysicsInputError } from './physicsInputError';
import { checkSpecimen, SHAPE_DIMENSIONS } from './specimenGeometry';
import { TIMING_METHOD_DEFAULTS, TIMING_METHODS, type TimingMethod } from './timingMethodDefaults';

/**
 * The physics' own limits. It may not import the log's field catalogue (the two are independent), so a test
 * (test/field-limits.test.ts) holds the rule between them: every value the log stores is accepted here.
 */
export const DROP_LIMITS = {
  count: { min: 1, max: 10_000, text: '1 to 10 000 drops' },
  // Towers, cranes, balloons and aircraft: the air along the fall is modelled (airColumn.ts) up to the top of the
  // ISO 2533 troposphere's first 10 km.
  height_m: { min: 0, minExclusive: true, max: 10_000, text: 'above 0 and at most 10 000 m' },
  // A slow seed (about 0.3 m/s) from the highest release takes close to an hour (the log stores up to 3600 s).
  time_s: { min: 0, minExclusive: true, max: 3600, text: 'above 0 and at most 3600 s' },
  standard_uncertainty_s: { min: 0, minExclusive: true, max: 10, text: 'above 0 and at most 10 s' },
} as const;

/**
 * A drop's marks (distance fallen against time from the release): at least two to say anything a single time does
 * not, at most 64 (a 240 frames/s clip of a 1 m fall holds about 110 frames; a few dozen evenly spread say as much).
 */
export const MARK_LIMITS = {
  count: { min: 2, max: 64, text: '2 to 64 marks' },
  distance_m: { min: 0, max: 10_000, text: '0 to 10 000 m fallen from the release point' },
  time_s: { min: 0, max: 3600, text: '0 to 3600 s from the release' },
  // A video's release is estimated: its marks' zero may sit a little after the body left rest.
  estimatedTime_s: { min: -1, max: 3600, text: '-1 to 3600 s from the estimated release' },
} as const;

/** A declared start/stop delay: hand timing is off by a few tenths of a second at worst (see timingMethodDefaults.ts). */
export const TIMING_OFFSET_LIMITS = {
  offset_s: { min: -2, max: 2, text: '-2 to 2 s' },
  offset_standard_uncertainty_s: { min: 0, max: 2, text: '0 to 2 s' },
  release_standard_uncertainty_s: { min: 0, max: 2, text: '0 to 2 s' },
} as const;

/** The air along the fall and its motion (airColumn.ts). */
export const AIR_COLUMN_LIMITS = {
  height_m: { min: 0, max: 10_000, text: '0 to 10 000 m above the landing surface' },
  // A strong thermal or a storm's downdraft near the ground reaches a few m/s; beyond 10 m/s nobody drops anything.
  vertical_wind_m_s: { min: -10, max: 10, text: '-10 to 10 m/s (positive up)' },
  // The log's own bound for a wind reading (src/log/fields.ts).
  wind_speed_m_s: { min: 0, max: 75, text: '0 to 75 m/s' },
  /** Two readings closer than this give no usable slope. */
  readingSeparation_m: 1,
} as const;

export const OPTION_LIMITS = {
  added_mass_coefficient: { min: 0, max: 100, text: '0 to 100' },
  monte_carlo_draws: { min: 200, max: 1_000_000, text: 'a whole number from 200 to 1 000 000' },
  seed: { min: 0, max: 4_294_967_295, text: 'a whole number from 0 to 4 294 967 295' },
} as const;

/** Largest standard uncertainty accepted for each input (beyond these the input is not measured at all). */
const UNCERTAINTY_LIMITS: Record<keyof UncertaintyInput, { max: number; text: string }> = {
  height_m: { max: 10, text: '0 to 10 m' },
  mass_kg: { max: 100, text: '0 to 100 kg' },
  diameter_m: { max: 1, text: '0 to 1 m' },
  length_m: { max: 1, text: '0 to 1 m' },
  width_m: { max: 1, text: '0 to 1 m' },
  thickness_m: { max: 1, text: '0 to 1 m' },
  area_m2: { max: 10, text: '0 to 10 m²' },
  volume_m3: { max: 10, text: '0 to 10 m³' },
  temperature_C: { max: 20, text: '0 to 20 °C' },
  pressure_Pa: { max: 5000, text: '0 to 5000 Pa' },
  relative_humidity_pct: { max: 50, text: '0 to 50 %' },
  dew_point_C: { max: 20, text: '0 to 20 °C' },
  density_kg_m3: { max: 0.5, text: '0 to 0.5 kg/m³' },
  gravity_m_s2: { max: 0.05, text: '0 to 0.05 m/s²' },
  // Ten times the largest shape default (a very flat disc), so any honest doubt fits.
  added_mass_coefficient: { max: 10, text: '0 to 10' },
  // Three times the gap between the standard and the dry adiabatic lapse rate.
  lapse_rate_K_per_m: { max: 0.01, text: '0 to 0.01 K/m' },
  vertical_wind_m_s: { max: 10, text: '0 to 10 m/s' },
  wind_speed_m_s: { max: 30, text: '0 to 30 m/s' },
  mark_distance_m: { max: 1, text: '0 to 1 m' },
  mark_scale_relative: { max: 0.2, text: '0 to 0.2 (a fifth of the distances)' },
};

/**
 * A drop's marks, strictly increasing in distance and time, and its landing (height_m, time_s) when given: the
 * last mark itself, or one more mark after it. Returns the marks with the landing last.
 */
function checkMarks(drop: Record<string, unknown>, field: string, releaseKnown: boolean): { marks: DropMark[]; height_m: number; time_s: number } {
  const value = drop['marks'];
  if (!Array.isArray(value)) {
    throw new PhysicsInputError({ code: 'wrong-type', field: `${field}.marks`, value, allowed: `an array of { "distance_m", "time_s" }, ${MARK_LIMITS.count.text}` });
  }
  if (value.length < MARK_LIMITS.count.min || value.length > MARK_LIMITS.count.max) {
    throw new PhysicsInputError({ code: 'out-of-range', field: `${field}.marks`, value: `${value.length} marks`, allowed: MARK_LIMITS.count.text });
  }
  const timeRange = releaseKnown ? MARK_LIMITS.time_s : MARK_LIMITS.estimatedTime_s;
  const marks: DropMark[] = value.map((m, k) => {
    const markField = `${field}.marks[${k}]`;
    const mark = asObject(m, markField);
    rejectUnknown(mark, markField, ['distance_m', 'time_s']);
    return {
      distance_m: checkNumber(`${markField}.distance_m`, mark['distance_m'], MARK_LIMITS.distance_m),
      time_s: checkNumber(`${markField}.time_s`, mark['time_s'], timeRange),
    };
  });
  for (let k = 1; k < marks.length; k++) {
    const before = marks[k - 1]!;
    const mark = marks[k]!;
    if (!(mark.distance_m > before.distance_m)) {
      throw new PhysicsInputError({ code: 'out-of-range', field: `${field}.marks[${k}].distance_m`, value: mark.distance_m, allowed: `more than the mark before (${before.distance_m} m): marks strictly increasing in distance` });
    }
    if (!(mark.time_s > before.time_s)) {
      throw new PhysicsInputError({ code: 'out-of-range', field: `${field}.marks[${k}].time_s`, value: mark.time_s, allowed: `more than the mark before (${before.time_s} s): marks strictly increasing in time` });
    }
  }
  const last = marks[marks.length - 1]!;
  const hasHeight = drop['height_m'] !== undefined;
  const hasTime = drop['time_s'] !== undefined;
  if (hasHeight !== hasTime) {
    const missing = hasHeight ? 'time_s' : 'height_m';
    throw new PhysicsInputError({ code: 'missing-field', field: `${field}.${missing}`, value: undefined, allowed: 'both height_m and time_s (the landing, one more mark) or neither with marks' });
  }
  if (!hasHeight) {
    checkNumber(`${field}.marks[${marks.length - 1}].time_s`, last.time_s, DROP_LIMITS.time_s);
    checkNumber(`${field}.marks[${marks.length - 1}].distance_m`, last.distance_m, DROP_LIMITS.height_m);
    return { marks, height_m: last.distance_m, time_s: last.time_s };
  }
  const height = checkNumber(`${field}.height_m`, drop['height_m'], DROP_LIMITS.height_m);
  const time = checkNumber(`${field}.time_s`, drop['time_s'], DROP_LIMITS.time_s);
  // The landing repeated as the last mark (a validated request read again) is the same mark.
  if (height === last.distance_m && time === last.time_s) return { marks, height_m: height, time_s: time };
  if (!(height > last.distance_m)) {
    throw new PhysicsInputError({ code: 'out-of-range', field: `${field}.height_m`, value: height, allowed: `more than the last mark's distance (${last.distance_m} m): the landing is the last point of the fall` });
  }
  if (!(time > last.time_s)) {
    throw new PhysicsInputError({ code: 'out-of-range', field: `${field}.time_s`, value: time, allowed: `more than the last mark's time (${last.time_s} s): the landing is the last point of the fall` });
  }
  return { marks: [...marks, { distance_m: height, time_s: time }], height_m: height, time_s: time };
}

const AIR_READING_FIELDS = ['temperature_C', 'pressure_Pa', 'pressure_reference', 'relative_humidity_pct', 'dew_point_C'] as const;
const AIR_MOTION_FIELDS = ['height_m', 'vertical_wind_m_s', 'wind_speed_m_s'] as const;

function checkAirMotion(object: Record<string, unknown>, field: string): void {
  checkOptionalNumber(`${field}.height_m`, object['height_m'], AIR_COLUMN_LIMITS.height_m);
  checkOptionalNumber(`${field}.vertical_wind_m_s`, object['vertical_wind_m_s'], AIR_COLUMN_LIMITS.vertical_wind_m_s);
  checkOptionalNumber(`${field}.wind_speed_m_s`, object['wind_speed_m_s'], AIR_COLUMN_LIMITS.wind_speed_m_s);
}

function asObject(value: unknown, field: string): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new PhysicsInputError({
      code: value === undefined ? 'missing-field' : 'wrong-type',
      field,
      value,
      allowed: 'an object',
    });
  }
  return value as Record<string, unknown>;
}

function rejectUnknown(object: Record<string, unknown>, field: string, known: readonly string[]): void {
  for (const key of Object.keys(object)) {
    if (!known.includes(key)) {
      throw new PhysicsInputError({
        code: 'unknown-field',
        field: field === '' ? key : `${field}.${key}`,
        value: object[key],
        allowed: known.join(', '),
      });
    }
  }
}

function checkInteger(field: string, value: unknown, range: { min: number; max: number; text: string }): number {
  const n = checkNumber(field, value, range);
  if (!Number.isInteger(n)) throw new PhysicsInputError({ code: 'out-of-range', field, value, allowed: range.text });
  return n;
}

/** Validate and type an untrusted analysis request. */
export function validateAnalysisRequest(json: unknown): AnalysisRequest {
  const root = asObject(json, '(request)');
  rejectUnknown(root, '', ['site', 'air', 'air_aloft', 'specimen', 'drops', 'timing', 'uncertainty', 'options']);

  const siteObject = asObject(root['site'], 'site');
  rejectUnknown(siteObject, 'site', ['latitude_deg', 'elevation_m', 'gravity_m_s2']);
  const site = siteObject as SiteInput;
  localGravity(site);
  if (site.elevation_m !== undefined) checkNumber('site.elevation_m', site.elevation_m, { min: -500, max: 9000, text: '-500 to 9000 m' });

  const airObject = asObject(root['air'], 'air');
  rejectUnknown(airObject, 'air', [...AIR_READING_FIELDS, 'co2_mole_fraction', 'density_kg_m3', ...AIR_MOTION_FIELDS]);
  const air = airObject as unknown as AirInput;
  airProperties(air, site.elevation_m);
  checkAirMotion(airObject, 'air');

  let airAloft: AirAloftInput | undefined;
  if (root['air_aloft'] !== undefined) {
    const aloftObject = asObject(root['air_aloft'], 'air_aloft');
    rejectUnknown(aloftObject, 'air_aloft', [...AIR_READING_FIELDS, ...AIR_MOTION_FIELDS]);
    if (aloftObject['height_m'] === undefined) {
      throw new PhysicsInputError({ code: 'missing-field', field: 'air_aloft.height_m', value: undefined, allowed: AIR_COLUMN_LIMITS.height_m.text });
    }
    checkAirMotion(aloftObject, 'air_aloft');
    const aloftHeight = aloftObject['height_m'] as number;
    const readingHeight = air.height_m ?? 0;
    if (Math.abs(aloftHeight - readingHeight) < AIR_COLUMN_LIMITS.readingSeparation_m) {
      throw new PhysicsInputError({
        code: 'out-of-range',
        field: 'air_aloft.height_m',
        value: aloftHeight,
        allowed: `at least ${AIR_COLUMN_LIMITS.readingSeparation_m} m from air.height_m (${readingHeight} m)`,
      });
    }
    const aloftAsAir = aloftObject as unknown as AirInput;
    const hasHumidity = aloftAsAir.relative_humidity_pct !== undefined || aloftAsAir.dew_point_C !== undefined;
    if (aloftAsAir.pressure_Pa === undefined) {
      throw new PhysicsInputError({ code: 'missing-field', field: 'air_aloft.pressure_Pa', value: undefined, allowed: 'a pressure reading at that height (station or sea-level)' });
    }
    // Without its own humidity the reading keeps the ground's vapour mole fraction: check the rest with a dry stand-in.
    airProperties(hasHumidity ? aloftAsAir : { ...aloftAsAir, relative_humidity_pct: 0 }, (site.elevation_m ?? 0) + aloftHeight, 'air_aloft');
    airAloft = aloftObject as unknown as AirAloftInput;
  }

  const specimen = checkSpecimen(root['specimen']);

  const dropsValue = root['drops'];
  if (!Array.isArray(dropsValue)) {
    throw new PhysicsInputError({
      code: dropsValue === undefined ? 'missing-field' : 'wrong-type',
      field: 'drops',
      value: dropsValue,
      allowed: `an array of { "height_m", "time_s" }, ${DROP_LIMITS.count.text}`,
    });
  }
  if (dropsValue.length < DROP_LIMITS.count.min || dropsValue.length > DROP_LIMITS.count.max) {
    throw new PhysicsInputError({ code: 'out-of-range', field: 'drops', value: `${dropsValue.length} drops`, allowed: DROP_LIMITS.count.text });
  }
  const drops: DropInput[] = dropsValue.map((d, i) => {
    const field = `drops[${i}]`;
    const drop = asObject(d, field);
    rejectUnknown(drop, field, ['id', 'height_m', 'time_s', 'marks', 'release_time_known']);
    const id = drop['id'];
    if (id !== undefined && typeof id !== 'string') throw new PhysicsInputError({ code: 'wrong-type', field: `${field}.id`, value: id, allowed: 'a string (the drop\'s own name)' });
    const known = drop['release_time_known'];
    if (known !== undefined && typeof known !== 'boolean') {
      throw new PhysicsInputError({ code: 'wrong-type', field: `${field}.release_time_known`, value: known, allowed: 'true or false' });
    }
    if (drop['marks'] === undefined) {
      if (known === false) {
        throw new PhysicsInputError({ code: 'conflicting-fields', field: `${field}.release_time_known`, value: known, allowed: 'true, or false only with marks (a single time needs its release)' });
      }
      return {
        ...(id !== undefined ? { id } : {}),
        height_m: checkNumber(`${field}.height_m`, drop['height_m'], DROP_LIMITS.height_m),
        time_s: checkNumber(`${field}.time_s`, drop['time_s'], DROP_LIMITS.time_s),
        ...(known !== undefined ? { release_time_known: known } : {}),
      };
    }
    const checked = checkMarks(drop, field, known !== false);
    return {
      ...(id !== undefined ? { id } : {}),
      height_m: checked.height_m,
      time_s: checked.time_s,
      marks: checked.marks,
      ...(known !== undefined ? { release_time_known: known } : {}),
    };
  });

  const timingObject = asObject(root['timing'], 'timing');
  rejectUnknown(timingObject, 'timing', ['standard_uncertainty_s', 'offset', 'method', 'offset_s', 'offset_standard_uncertainty_s', 'release_standard_uncertainty_s']);
  const methodValue = timingObject['method'];
  if (methodValue !== undefined && !TIMING_METHODS.includes(methodValue as TimingMethod)) {
    throw new PhysicsInputError({ code: 'out-of-range', field: 'timing.method', value: methodValue, allowed: TIMING_METHODS.map((m) => `"${m}"`).join(', ') });
  }
  const method = methodValue as TimingMethod | undefined;
  const methodRandom = method === undefined ? null : TIMING_METHOD_DEFAULTS[method].standard_uncertainty_s;
  const timing: TimingInput = {
    standard_uncertainty_s:
      timingObject['standard_uncertainty_s'] === undefined && methodRandom !== null
        ? methodRandom
        : checkNumber('timing.standard_uncertainty_s', timingObject['standard_uncertainty_s'], DROP_LIMITS.standard_uncertainty_s),
  };
  if (method !== undefined) timing.method = method;
  const offsetS = checkOptionalNumber('timing.offset_s', timingObject['offset_s'], TIMING_OFFSET_LIMITS.offset_s);
  if (offsetS !== undefined) timing.offset_s = offsetS;
  const offsetU = checkOptionalNumber('timing.offset_standard_uncertainty_s', timingObject['offset_standard_uncertainty_s'], TIMING_OFFSET_LIMITS.offset_standard_uncertainty_s);
  if (offsetU !== undefined) timing.offset_standard_uncertainty_s = offsetU;
  const releaseU = checkOptionalNumber('timing.release_standard_uncertainty_s', timingObject['release_standard_uncertainty_s'], TIMING_OFFSET_LIMITS.release_standard_uncertainty_s);
  if (releaseU !== undefined) timing.release_standard_uncertainty_s = releaseU;
  const offset = timingObject['offset'];
  if (offset !== undefined) {
    if (offset !== 'none' && offset !== 'fit') {
      throw new PhysicsInputError({ code: 'out-of-range', field: 'timing.offset', value: offset, allowed: '"none" or "fit"' });
    }
    timing.offset = offset;
    if (offset === 'fit' && drops.some((d) => d.marks !== undefined)) {
      // Only times from a known release see the offset: a drop whose release is estimated takes any constant
      // delay into its own release shift.
      const distances = new Set<number>();
      for (const d of drops) {
        if (d.release_time_known === false) continue;
        for (const m of d.marks ?? [{ distance_m: d.height_m }]) if (m.distance_m > 0) distances.add(m.distance_m);
      }
      if (distances.size < 3) {
        throw new PhysicsInputError({
          code: 'offset-needs-three-heights',
          field: 'timing.offset',
          value: offset,
          allowed: `"none", or "fit" with times from a known release at 3 or more distinct distances (these drops have ${distances.size}; a drop with an estimated release cannot tell an offset from its own release shift)`,
        });
      }
    } else if (offset === 'fit') {
      const distinct = new Set(drops.map((d) => d.height_m)).size;
      if (distinct < 3) {
        throw new PhysicsInputError({
          code: 'offset-needs-three-heights',
          field: 'timing.offset',
          value: offset,
          allowed: `"none", or "fit" with drops from at least 3 distinct heights (these drops have ${distinct})`,
        });
      }
    }
  }

  const request: AnalysisRequest = { site, air, specimen: specimen.input, drops, timing };
  if (airAloft !== undefined) request.air_aloft = airAloft;

  if (root['uncertainty'] !== undefined) {
    const u = asObject(root['uncertainty'], 'uncertainty');
    const allowed: string[] = ['height_m', 'mass_kg', ...SHAPE_DIMENSIONS[specimen.input.shape]];
    if (air.density_kg_m3 !== undefined) allowed.push('density_kg_m3');
    allowed.push('temperature_C');
    if (air.pressure_Pa !== undefined) allowed.push('pressure_Pa');
    if (air.relative_humidity_pct !== undefined) allowed.push('relative_humidity_pct');
    if (air.dew_point_C !== undefined) allowed.push('dew_point_C');
    allowed.push('gravity_m_s2', 'added_mass_coefficient', 'lapse_rate_K_per_m', 'vertical_wind_m_s', 'wind_speed_m_s', 'mark_distance_m', 'mark_scale_relative');
    rejectUnknown(u, 'uncertainty', allowed);
    const uncertainty: UncertaintyInput = {};
    for (const key of Object.keys(u) as (keyof UncertaintyInput)[]) {
      const limit = UNCERTAINTY_LIMITS[key];
      uncertainty[key] = checkNumber(`uncertainty.${key}`, u[key], { min: 0, max: limit.max, text: limit.text });
    }
    request.uncertainty = uncertainty;
  }

  if (root['options'] !== undefined) {
    const o = asObject(root['options'], 'options');
    rejectUnknown(o, 'options', ['buoyancy', 'added_mass_coefficient', 'monte_carlo_draws', 'seed', 'drag_law']);
    const options: AnalysisOptions = {};
    if (o['buoyancy'] !== undefined) {
      if (typeof o['buoyancy'] !== 'boolean') {
        throw new PhysicsInputError({ code: 'wrong-type', field: 'options.buoyancy', value: o['buoyancy'], allowed: 'true or false' });
      }
      options.buoyancy = o['buoyancy'];
    }
    const ca = checkOptionalNumber('options.added_mass_coefficient', o['added_mass_coefficient'], OPTION_LIMITS.added_mass_coefficient);
    if (ca !== undefined) options.added_mass_coefficient = ca;
    if (o['monte_carlo_draws'] !== undefined) {
      options.monte_carlo_draws = checkInteger('options.monte_carlo_draws', o['monte_carlo_draws'], OPTION_LIMITS.monte_carlo_draws);
    }
    if (o['seed'] !== undefined) options.seed = checkInteger('options.seed', o['seed'], OPTION_LIMITS.seed);
    if (o['drag_law'] !== undefined) {
      const law = o['drag_law'];
      if (law !== 'auto' && law !== 'constant' && law !== 'scaled_sphere') {
        throw new PhysicsInputError({ code: 'out-of-range', field: 'options.drag_law', value: law, allowed: '"auto", "constant" or "scaled_sphere"' });
      }
      options.drag_law = law;
    }
    request.options = options;
  }
  return request;
}
