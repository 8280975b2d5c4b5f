// @vitest-environment happy-dom
/**
 * The rule between the layers, field by field: what the physics accepts ⊇ what the log stores ⊇ what a form
 * accepts, so no value a crew can type is refused later. Each stored number is tried at its edges (the minimum,
 * just above it, the maximum, just outside on both sides) through the real checks: the quantity input the forms
 * use (given the catalogue's limit, as the forms pass it), the log's validateBody, and validateAnalysisRequest
 * (or the timing's own checks for the sound-travel fields). The physics cannot import the catalogue, so this
 * test is what keeps its limits wide enough.
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { FIELDS, LIMITS, inputRange, validateBody, type Limit, type LimitName, type RecordKind } from '../src/log';
import { validateAnalysisRequest } from '../src/physics';
import { checkFallTime, soundTravelCorrection, speedOfSoundAt } from '../src/timing';
import '../src/widgets/quantity-input';
import type { QuantityInput } from '../src/widgets/quantity-input';
import { UNITS, type QuantityKind } from '../src/widgets/units';
import * as demo from './log/demo-bodies';
import { demoClip } from './log/marks-demo';

type Json = Record<string, any>;

/** A valid analysis request (our own invented values) to change one field of. */
const request = (): Json => ({
  site: { latitude_deg: 53.8, elevation_m: 74.5 },
  air: { temperature_C: 17.4, pressure_Pa: 100_820, pressure_reference: 'station', relative_humidity_pct: 62 },
  specimen: { mass_kg: 0.0637, shape: 'sphere', diameter_m: 0.025, reference_drag_coefficient: 0.47 },
  drops: [
    { height_m: 6.12, time_s: 1.121 },
    { height_m: 6.12, time_s: 1.125 },
  ],
  timing: { standard_uncertainty_s: 0.03, offset: 'none' },
  uncertainty: { height_m: 0.01, mass_kg: 0.0001, diameter_m: 0.00002, temperature_C: 0.3, pressure_Pa: 50, relative_humidity_pct: 3 },
});

const analyse = (change: (r: Json) => void) => () => {
  const r = request();
  change(r);
  validateAnalysisRequest(r);
};
const withDew = (r: Json, dew: number) => {
  delete r.air.relative_humidity_pct;
  delete r.uncertainty.relative_humidity_pct;
  r.air.dew_point_C = dew;
};
const specimenOf = (r: Json, shape: Json, uncertainty: Json) => {
  r.specimen = { mass_kg: 0.0637, ...shape };
  r.uncertainty = { height_m: 0.01, mass_kg: 0.0001, ...uncertainty };
};

interface Case {
  /** The catalogue field: record kind and path. */
  kind: RecordKind;
  path: string;
  /** A valid body of that kind holding v (and whatever else lets v be judged on its own). */
  body: (v: number) => Json;
  /** The quantity input a form uses for it; absent where no form types it. */
  form?: QuantityKind;
  /** How the form's value becomes the stored one (a percent stored as a fraction). */
  formScale?: number;
  /** Throws unless the next layer accepts v; absent where nothing downstream reads the field. */
  downstream?: (v: number) => () => void;
}

const site = (change: Json) => ({ ...demo.site(), ...change });
const specimen = (change: Json) => ({ ...demo.steelBall(), ...change });
const reading = (change: Json) => ({ ...demo.reading(), ...change });
const series = (change: Json) => ({ ...demo.series(), ...change });
const drop = (change: Json) => ({ ...demo.drop(), ...change });
const relative = (rh: number, u = 3) => ({ kind: 'relative', relative_humidity_pct: rh, u_relative_humidity_pct: u });
const dewPoint = (dew: number, u = 0.5) => ({ kind: 'dew_point', dew_point_C: dew, u_dew_point_C: u });
const travel = (d_r: number, d_i: number, c: number, temperature_C: number | null = 20) => ({
  distance_to_release_m: d_r,
  distance_to_landing_m: d_i,
  speed_of_sound_m_s: c,
  temperature_C,
  correction_s: (d_r - d_i) / c,
});
const sound = (t: Json) => drop({ raw: { kind: 'sound', onsets_s: [1, 2.1], sample_rate_Hz: 44_100, sound_travel: t } });

/** A drop timed from a clip (test/log/marks-demo.ts) with `change` made to its clip; the drop's time follows it. */
const clipped = (change: Json) => {
  const clip = { ...demoClip(1.2), ...change };
  return drop({ clip, time_s: clip.impact_s - clip.release_s, raw: { kind: 'frames', frames: [120, 408], frame_rate_Hz: 240 } });
};
const line = (key: string, v: number) => clipped({ fall_line: { x0_px: 360, y0_px: 100, x1_px: 362, y1_px: 1190, [key]: v } });

const CASES: Case[] = [
  // A clip's evidence: made by motion/ from the frames, never typed, read by no physics.
  { kind: 'drop', path: 'clip.width_px', body: (v) => clipped({ width_px: v }) },
  { kind: 'drop', path: 'clip.height_px', body: (v) => clipped({ height_px: v }) },
  { kind: 'drop', path: 'clip.frame_rate_hz', body: (v) => clipped({ frame_rate_hz: v }) },
  { kind: 'drop', path: 'clip.u_release_s', body: (v) => clipped({ u_release_s: v }) },
  { kind: 'drop', path: 'clip.u_impact_s', body: (v) => clipped({ u_impact_s: v }) },
  { kind: 'drop', path: 'clip.landing_y_px', body: (v) => clipped({ landing_y_px: v }) },
  ...['x0_px', 'y0_px', 'x1_px', 'y1_px'].map((key): Case => ({ kind: 'drop', path: `clip.fall_line.${key}`, body: (v) => line(key, v) })),
  { kind: 'site', path: 'latitude_deg', body: (v) => site({ latitude_deg: v }), form: 'angle', downstream: (v) => analyse((r) => (r.site.latitude_deg = v)) },
  { kind: 'site', path: 'longitude_deg', body: (v) => site({ longitude_deg: v }), form: 'angle' },
  { kind: 'site', path: 'elevation_m', body: (v) => site({ elevation_m: v }), form: 'length', downstream: (v) => analyse((r) => (r.site.elevation_m = v)) },
  { kind: 'specimen', path: 'mass_kg', body: (v) => specimen({ mass_kg: v, u_mass_kg: 0 }), form: 'mass', downstream: (v) => analyse((r) => (r.specimen.mass_kg = v)) },
  {
    kind: 'specimen',
    path: 'u_mass_kg',
    body: (v) => specimen({ mass_kg: LIMITS.mass_kg.max, u_mass_kg: v }),
    form: 'mass',
    downstream: (v) => analyse((r) => (r.uncertainty.mass_kg = v)),
  },
  ...(['diameter_m', 'length_m'] as const).map(
    (dim): Case => ({
      kind: 'specimen',
      path: `shape.${dim}`,
      body: (v) => specimen({ shape: { kind: 'cylinder', diameter_m: 0.1, u_diameter_m: 0, length_m: 0.1, u_length_m: 0, [dim]: v } }),
      form: 'smallLength',
      downstream: (v) => analyse((r) => specimenOf(r, { shape: 'cylinder', diameter_m: 0.1, length_m: 0.1, [dim]: v }, {})),
    }),
  ),
  {
    kind: 'specimen',
    path: 'shape.thickness_m',
    body: (v) => specimen({ shape: { kind: 'disc', diameter_m: 0.1, u_diameter_m: 0, thickness_m: v, u_thickness_m: 0 } }),
    form: 'smallLength',
    downstream: (v) => analyse((r) => specimenOf(r, { shape: 'disc', diameter_m: 0.1, thickness_m: v }, {})),
  },
  ...(['width_m', 'height_m'] as const).map(
    (dim): Case => ({
      kind: 'specimen',
      path: `shape.${dim}`,
      body: (v) =>
        specimen({ shape: { kind: 'box', length_m: 0.1, u_length_m: 0, width_m: 0.1, u_width_m: 0, height_m: 0.1, u_height_m: 0, [dim]: v } }),
      form: 'smallLength',
      // The physics calls the box's height its thickness.
      downstream: (v) =>
        analyse((r) => specimenOf(r, { shape: 'box', length_m: 0.1, width_m: 0.1, thickness_m: 0.1, [dim === 'height_m' ? 'thickness_m' : dim]: v }, {})),
    }),
  ),
  ...(['diameter_m', 'length_m', 'thickness_m'] as const).map(
    (dim): Case => ({
      kind: 'specimen',
      path: `shape.u_${dim}`,
      body: (v) => {
        const max = LIMITS.length_m.max;
        const shape = dim === 'thickness_m' ? { kind: 'disc', diameter_m: max, u_diameter_m: 0, thickness_m: max } : { kind: 'cylinder', diameter_m: max, u_diameter_m: 0, length_m: max, u_length_m: 0 };
        return specimen({ shape: { ...shape, [`u_${dim}`]: v } });
      },
      form: 'smallLength',
      downstream: (v) =>
        analyse((r) =>
          dim === 'thickness_m'
            ? specimenOf(r, { shape: 'disc', diameter_m: 0.1, thickness_m: 0.01 }, { thickness_m: v })
            : specimenOf(r, { shape: 'cylinder', diameter_m: 0.1, length_m: 0.1 }, { [dim]: v }),
        ),
    }),
  ),
  {
    kind: 'specimen',
    path: 'shape.area_m2',
    body: (v) => specimen({ shape: { kind: 'custom', area_m2: v, u_area_m2: 0, volume_m3: 0.001, u_volume_m3: 0 } }),
    form: 'area',
    downstream: (v) => analyse((r) => specimenOf(r, { shape: 'custom', area_m2: v, volume_m3: 0.001 }, {})),
  },
  {
    kind: 'specimen',
    path: 'shape.volume_m3',
    body: (v) => specimen({ shape: { kind: 'custom', area_m2: 0.01, u_area_m2: 0, volume_m3: v, u_volume_m3: 0 } }),
    form: 'volume',
    downstream: (v) => analyse((r) => specimenOf(r, { shape: 'custom', area_m2: 0.01, volume_m3: v }, {})),
  },
  {
    kind: 'specimen',
    path: 'shape.u_area_m2',
    body: (v) => specimen({ shape: { kind: 'custom', area_m2: LIMITS.area_m2.max, u_area_m2: v, volume_m3: 0.001, u_volume_m3: 0 } }),
    form: 'area',
    downstream: (v) => analyse((r) => specimenOf(r, { shape: 'custom', area_m2: 0.01, volume_m3: 0.001 }, { area_m2: v })),
  },
  {
    kind: 'specimen',
    path: 'shape.u_volume_m3',
    body: (v) => specimen({ shape: { kind: 'custom', area_m2: 0.01, u_area_m2: 0, volume_m3: LIMITS.volume_m3.max, u_volume_m3: v } }),
    form: 'volume',
    downstream: (v) => analyse((r) => specimenOf(r, { shape: 'custom', area_m2: 0.01, volume_m3: 0.001 }, { volume_m3: v })),
  },
  {
    kind: 'specimen',
    path: 'reference_drag_coefficient',
    body: (v) => specimen({ reference_drag_coefficient: v }),
    form: 'ratio',
    downstream: (v) => analyse((r) => (r.specimen.reference_drag_coefficient = v)),
  },
  { kind: 'reading', path: 'temperature_C', body: (v) => reading({ temperature_C: v }), form: 'temperature', downstream: (v) => analyse((r) => (r.air.temperature_C = v)) },
  { kind: 'reading', path: 'u_temperature_C', body: (v) => reading({ u_temperature_C: v }), form: 'temperature', downstream: (v) => analyse((r) => (r.uncertainty.temperature_C = v)) },
  { kind: 'reading', path: 'pressure_Pa', body: (v) => reading({ pressure_Pa: v }), form: 'pressure', downstream: (v) => analyse((r) => (r.air.pressure_Pa = v)) },
  { kind: 'reading', path: 'u_pressure_Pa', body: (v) => reading({ u_pressure_Pa: v }), form: 'pressure', downstream: (v) => analyse((r) => (r.uncertainty.pressure_Pa = v)) },
  {
    kind: 'reading',
    path: 'humidity.relative_humidity_pct',
    body: (v) => reading({ humidity: relative(v) }),
    form: 'percent',
    downstream: (v) => analyse((r) => (r.air.relative_humidity_pct = v)),
  },
  {
    kind: 'reading',
    path: 'humidity.u_relative_humidity_pct',
    body: (v) => reading({ humidity: relative(62, v) }),
    form: 'percent',
    downstream: (v) => analyse((r) => (r.uncertainty.relative_humidity_pct = v)),
  },
  {
    kind: 'reading',
    path: 'humidity.dew_point_C',
    // The air as warm as the log allows, so the dew point is judged by its own range.
    body: (v) => reading({ temperature_C: LIMITS.temperature_C.max, humidity: dewPoint(v) }),
    form: 'temperature',
    downstream: (v) =>
      analyse((r) => {
        r.air.temperature_C = LIMITS.temperature_C.max;
        withDew(r, v);
      }),
  },
  {
    kind: 'reading',
    path: 'humidity.u_dew_point_C',
    body: (v) => reading({ humidity: dewPoint(5, v) }),
    form: 'temperature',
    downstream: (v) =>
      analyse((r) => {
        withDew(r, 5);
        r.uncertainty.dew_point_C = v;
      }),
  },
  // The air's motion and where it was read: the physics takes the drag on the velocity relative to the air.
  { kind: 'reading', path: 'wind_speed_m_s', body: (v) => reading({ wind_speed_m_s: v }), form: 'speed', downstream: (v) => analyse((r) => (r.air.wind_speed_m_s = v)) },
  {
    kind: 'reading',
    path: 'u_wind_speed_m_s',
    body: (v) => reading({ u_wind_speed_m_s: v }),
    form: 'speed',
    downstream: (v) => analyse((r) => (r.uncertainty.wind_speed_m_s = v)),
  },
  {
    kind: 'reading',
    path: 'vertical_wind_m_s',
    body: (v) => reading({ vertical_wind_m_s: v }),
    form: 'speed',
    downstream: (v) => analyse((r) => (r.air.vertical_wind_m_s = v)),
  },
  {
    kind: 'reading',
    path: 'u_vertical_wind_m_s',
    body: (v) => reading({ u_vertical_wind_m_s: v }),
    form: 'speed',
    downstream: (v) => analyse((r) => (r.uncertainty.vertical_wind_m_s = v)),
  },
  { kind: 'reading', path: 'height_m', body: (v) => reading({ height_m: v }), form: 'length', downstream: (v) => analyse((r) => (r.air.height_m = v)) },
  {
    kind: 'series',
    path: 'height_m',
    body: (v) => series({ height_m: v, u_height_m: 0 }),
    form: 'length',
    downstream: (v) => analyse((r) => r.drops.forEach((d: Json) => (d.height_m = v))),
  },
  {
    kind: 'series',
    path: 'u_height_m',
    body: (v) => series({ height_m: LIMITS.height_m.max, u_height_m: v }),
    form: 'length',
    downstream: (v) => analyse((r) => (r.uncertainty.height_m = v)),
  },
  { kind: 'series', path: 'u_time_s', body: (v) => series({ u_time_s: v }), form: 'time', downstream: (v) => analyse((r) => (r.timing.standard_uncertainty_s = v)) },
  { kind: 'series', path: 'timing_delay_s', body: (v) => series({ timing_delay_s: v }), form: 'time', downstream: (v) => analyse((r) => (r.timing.offset_s = v)) },
  {
    kind: 'series',
    path: 'u_timing_delay_s',
    body: (v) => series({ u_timing_delay_s: v }),
    form: 'time',
    downstream: (v) => analyse((r) => (r.timing.offset_standard_uncertainty_s = v)),
  },
  // Typed as a percent, stored as a fraction; the planner reads it, not the analysis.
  { kind: 'series', path: 'target_relative_uncertainty', body: (v) => series({ target_relative_uncertainty: v }), form: 'percent', formScale: 0.01 },
  {
    kind: 'drop',
    path: 'time_s',
    body: (v) => drop({ time_s: v, raw: { kind: 'typed', text: String(v) } }),
    form: 'time',
    downstream: (v) => analyse((r) => (r.drops[0].time_s = v)),
  },
  { kind: 'drop', path: 'height_m', body: (v) => drop({ height_m: v }), form: 'length', downstream: (v) => analyse((r) => (r.drops[0].height_m = v)) },
  { kind: 'drop', path: 'raw.sample_rate_Hz', body: (v) => drop({ raw: { kind: 'sound', onsets_s: [1, 2], sample_rate_Hz: v, sound_travel: null } }) },
  { kind: 'drop', path: 'raw.frame_rate_Hz', body: (v) => drop({ raw: { kind: 'frames', frames: [1, 60], frame_rate_Hz: v } }) },
  {
    kind: 'drop',
    path: 'raw.sound_travel.distance_to_release_m',
    body: (v) => sound(travel(v, v, 343)),
    form: 'length',
    downstream: (v) => () => soundTravelCorrection({ distance_to_release_m: v, distance_to_landing_m: v, speed_of_sound_m_s: 343 }),
  },
  {
    kind: 'drop',
    path: 'raw.sound_travel.distance_to_landing_m',
    body: (v) => sound(travel(0, v, 343)),
    form: 'length',
    downstream: (v) => () => soundTravelCorrection({ distance_to_release_m: 0, distance_to_landing_m: v, speed_of_sound_m_s: 343 }),
  },
  {
    kind: 'drop',
    path: 'raw.sound_travel.speed_of_sound_m_s',
    body: (v) => sound(travel(10, 0, v)),
    downstream: (v) => () => soundTravelCorrection({ distance_to_release_m: 10, distance_to_landing_m: 0, speed_of_sound_m_s: v }),
  },
  {
    kind: 'drop',
    path: 'raw.sound_travel.temperature_C',
    body: (v) => sound(travel(10, 0, 343, v)),
    downstream: (v) => () => speedOfSoundAt(v),
  },
  {
    kind: 'drop',
    path: 'raw.sound_travel.correction_s',
    // Inputs that give v with the slowest sound: the largest corrections come from the longest distances.
    body: (v) => {
      const c = LIMITS.speed_of_sound_m_s.min;
      return sound(v >= 0 ? travel(v * c, 0, c) : travel(0, -v * c, c));
    },
  },
];

/**
 * Uncertainties of a box's width and height: the same limit and the same check as u_length_m, tried above. A clip's
 * release and impact can only be judged together (the impact after the release, the drop's time their difference):
 * their edges are tried in test/log/drop-marks.test.ts.
 */
const SAME_CHECK_AS_ANOTHER = ['specimen.shape.u_width_m', 'specimen.shape.u_height_m', 'drop.clip.release_s', 'drop.clip.impact_s'];

/** The values tried for a limit: [value, whether the limit itself allows it]. */
function edges(limit: Limit): [number, boolean][] {
  const step = (x: number) => Math.max(Math.abs(x), 1) * 1e-9;
  return [
    [limit.min - step(limit.min), false],
    [limit.min, limit.minIncluded],
    [limit.min + step(limit.min), true],
    [limit.max, true],
    [limit.max + step(limit.max), false],
  ];
}

function limitOf(c: Case): Limit {
  const spec = (FIELDS[c.kind] as Record<string, { type: string; limit?: LimitName }>)[c.path];
  expect(spec?.limit, `${c.kind}.${c.path} is in the catalogue`).toBeDefined();
  return LIMITS[spec!.limit!];
}

/** The quantity input a form shows for the field, given the catalogue's limit as the forms pass it. */
function formInput(kind: QuantityKind, limit: Limit, scale: number): QuantityInput {
  const el = document.createElement('pl-quantity') as QuantityInput;
  const range = inputRange(limit);
  Object.assign(el, { label: 'Field', quantity: kind, unit: UNITS[kind][0]!.symbol, ...range, min: range.min / scale, max: range.max / scale });
  return el;
}

/** What the form gives for the stored value v typed in its display unit: the stored value, or null if refused. */
function typed(el: QuantityInput, kind: QuantityKind, v: number, scale: number): number | null {
  const unit = UNITS[kind][0]!;
  const shown = (v / scale - (unit.offset ?? 0)) / unit.scale;
  const { value } = el.check(String(shown));
  return value === null ? null : value * scale;
}

const accepts = (f: () => unknown) => {
  try {
    f();
    return true;
  } catch {
    return false;
  }
};

describe('physics accepts ⊇ log stores ⊇ form accepts, at every edge of every stored number', () => {
  it('covers every number the catalogue lists', () => {
    const numbers = Object.entries(FIELDS).flatMap(([kind, fields]) =>
      Object.entries(fields as Record<string, { type: string }>)
        .filter(([, spec]) => spec.type === 'number' || spec.type === 'uncertainty')
        .map(([path]) => `${kind}.${path}`),
    );
    const covered = new Set([...CASES.map((c) => `${c.kind}.${c.path}`), ...SAME_CHECK_AS_ANOTHER]);
    expect(numbers.filter((n) => !covered.has(n))).toEqual([]);
  });

  it.each(CASES.map((c) => [`${c.kind}.${c.path}`, c] as const))('%s', (_name, c) => {
    const limit = limitOf(c);
    const stores = (v: number) => validateBody(c.kind, c.body(v)).length === 0;
    const el = c.form ? formInput(c.form, limit, c.formScale ?? 1) : null;
    for (const [v, allowed] of edges(limit)) {
      // The log follows its catalogue exactly, on both sides of each edge.
      expect(stores(v), `the log ${allowed ? 'stores' : 'refuses'} ${c.path} = ${v}`).toBe(allowed);
      if (el) {
        const value = typed(el, c.form!, v, c.formScale ?? 1);
        if (value !== null) expect(stores(value), `the log stores ${c.path} = ${value}, which the form accepted`).toBe(true);
        expect(value !== null, `the form ${allowed ? 'accepts' : 'refuses'} ${c.path} = ${v}`).toBe(allowed);
      }
      if (allowed && c.downstream) expect(accepts(c.downstream(v)), `the physics accepts ${c.path} = ${v}, which the log stores`).toBe(true);
    }
  });

  it('a station and a sea-level pressure each have their own range, in the form as in the log', () => {
    for (const [reference, limit] of [
      ['station', LIMITS.station_pressure_Pa],
      ['sea_level', LIMITS.sea_level_pressure_Pa],
    ] as const) {
      for (const [v, allowed] of edges(limit)) {
        expect(validateBody('reading', reading({ pressure_reference: reference, pressure_Pa: v })).length === 0).toBe(allowed);
        if (allowed) {
          expect(accepts(analyse((r) => ((r.air.pressure_Pa = v), (r.air.pressure_reference = reference)))), `${reference} ${v} Pa`).toBe(true);
        }
      }
    }
  });

  it('the timing takes every fall time up to the longest the log stores', () => {
    expect(checkFallTime(LIMITS.time_s.max)).toBe(LIMITS.time_s.max);
    expect(accepts(() => checkFallTime(LIMITS.time_s.max * (1 + 1e-9)))).toBe(false);
  });
});

describe('the forms take their limits from the catalogue', () => {
  // The page's URL class is happy-dom's here, so the path is built from this file's own path.
  const root = join(dirname(fileURLToPath(import.meta.url)), '../src/ui/screens/');
  const files = (dir: string): string[] =>
    readdirSync(dir).flatMap((name) => {
      const path = dir + name;
      return statSync(path).isDirectory() ? files(`${path}/`) : path.endsWith('.tsx') ? [path] : [];
    });
  // The planner's inputs are not stored fields (its own defaults live with the planner).
  const forms = files(root).filter((f) => !f.endsWith('PlanScreen.tsx'));

  it('no screen that writes records writes a number as an input limit', () => {
    expect(forms.length).toBeGreaterThan(3);
    const literal = /\b(min|max|uMax)=\{\s*-?[\d.]/g;
    const found = forms.flatMap((f) => [...readFileSync(f, 'utf8').matchAll(literal)].map((m) => `${f.slice(root.length)}: ${m[0]}`));
    expect(found).toEqual([]);
  });
});
