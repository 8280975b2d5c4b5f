import { describe, expect, it } from 'vitest';
import { AirColumn, STANDARD_LAPSE_RATE_K_PER_M } from '../../src/physics/airColumn';
import { airProperties, type AirInput } from '../../src/physics/airProperties';
import { analyzeSeries, prepareSeries } from '../../src/physics/analyzeSeries';
import { createRandom } from '../../src/physics/createRandom';
import { uncertaintyBudget } from '../../src/physics/uncertaintyBudget';
import type { AnalysisRequest } from '../../src/physics/analysisTypes';
import { fallThroughColumn } from '../../src/physics/fallThroughColumn';
import { localGravity } from '../../src/physics/normalGravity';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { validateAnalysisRequest } from '../../src/physics/validateAnalysisRequest';

// Invented scenario: a 0.21 kg, 95 mm ball, air read at the landing surface.
const SITE = { latitude_deg: 46.1, elevation_m: 430 };
const AIR: AirInput = { temperature_C: 17.5, pressure_Pa: 96120, pressure_reference: 'station', relative_humidity_pct: 55 };
const BALL = { shape: 'sphere' as const, mass_kg: 0.21, diameter_m: 0.095 };

/** Fall times through the standard column (our own model, checked against odex in fallThroughColumn.test.ts). */
function columnTimes(heights: number[], cd: number, air: AirInput = AIR, lapse = STANDARD_LAPSE_RATE_K_PER_M, specimen = BALL, W = 0, U = 0): number[] {
  const props = airProperties(air, SITE.elevation_m);
  const column = new AirColumn(
    {
      height_m: 0,
      temperature_K: props.temperature_K,
      pressure_Pa: props.station_pressure_Pa!,
      gasFactor: (props.density_kg_m3 * props.temperature_K) / props.station_pressure_Pa!,
      verticalWind_m_s: W,
      windSpeed_m_s: U,
    },
    localGravity(SITE).gravity_m_s2,
    lapse,
  );
  const d = specimen.diameter_m;
  const body = {
    mass_kg: specimen.mass_kg,
    area_m2: (Math.PI * d * d) / 4,
    volume_m3: (Math.PI * d ** 3) / 6,
    characteristic_length_m: d,
    buoyancy: true,
    added_mass_coefficient: 0.5,
    drag_coefficient: cd,
  };
  return heights.map((h) => fallThroughColumn(h, body, column).time_s);
}

function request(height: number, times: number[], extra: Partial<AnalysisRequest> = {}): AnalysisRequest {
  return {
    site: SITE,
    air: AIR,
    specimen: BALL,
    drops: times.map((t) => ({ height_m: height, time_s: t })),
    timing: { standard_uncertainty_s: 0.002 },
    options: { monte_carlo_draws: 1000 },
    ...extra,
  };
}

describe('the air along the fall in a series analysis', () => {
  it('recovers the C_d of a 1000 m fall through the standard column (the closed form at the ground reading is 5 % off)', () => {
    const times = columnTimes([1000], 0.5);
    const result = analyzeSeries(request(1000, [times[0]!, times[0]!, times[0]!]));
    expect(result.air_column!.weight).toBe(1);
    expect(result.drag_coefficient).toBeCloseTo(0.5, 6);
    // The uniform-air closed form at the ground density would give about 0.475 (the issue of tall drops).
    expect(result.air_column!.correction_ratio).toBeGreaterThan(1.04);
    expect(result.budget.map((r) => r.input)).toContain('lapse_rate_K_per_m');
  });

  it('puts no step in the result where the closed form hands over to the column', () => {
    // Noise-free times from the column; the release height climbs through the hand-over (effect 0.1 to 0.2 of the
    // time's uncertainty). Where the weight is strictly between 0 and 1, and at both ends of the hand-over, the
    // change of C_d over a height step shrinks with the step (continuous); a step in the result would not.
    const at = (h: number) => {
      const t = columnTimes([h], 0.5)[0]!;
      const r = analyzeSeries({ ...request(h, [t, t, t, t, t]), options: { monte_carlo_draws: 200 } });
      return { weight: r.air_column!.weight, cd: r.drag_coefficient_estimate };
    };
    const sweep = Array.from({ length: 21 }, (_, i) => 8 + 1.6 * i).map((h) => ({ h, ...at(h) }));
    expect(sweep[0]!.weight).toBe(0);
    expect(sweep[sweep.length - 1]!.weight).toBe(1);
    const firstOn = sweep.findIndex((s) => s.weight > 0);
    const lastPartial = sweep.findLastIndex((s) => s.weight < 1);
    for (const h of [sweep[firstOn - 1]!.h, sweep[Math.floor((firstOn + lastPartial) / 2)]!.h, sweep[lastPartial]!.h]) {
      const base = at(h).cd;
      const coarse = Math.abs(at(h + 0.5).cd - base);
      const fine = Math.abs(at(h + 0.005).cd - base);
      expect(fine).toBeLessThan(0.05 * coarse + 1e-9);
    }
  }, 120_000);

  it("has a Monte Carlo surrogate within 5 % of u_c of the exact model over the inputs' spread (3000 m, crosswind)", () => {
    const times = columnTimes([3000], 0.5, AIR, STANDARD_LAPSE_RATE_K_PER_M, BALL, 0, 4);
    const r = request(3000, times.concat(times), {
      air: { ...AIR, wind_speed_m_s: 4 },
      timing: { standard_uncertainty_s: 0.05 },
      uncertainty: { height_m: 1, mass_kg: 0.001, diameter_m: 0.0003, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 },
    });
    const prepared = prepareSeries(r);
    const { model, x0 } = prepared.fit;
    const budget = uncertaintyBudget(model, x0, prepared.inputs.specs);
    const inputs: { index: number; u: number }[] = [];
    for (const spec of prepared.inputs.specs) spec.indices.forEach((index, i) => inputs.push({ index, u: spec.standard_uncertainty * spec.weights[i]! }));
    const spread = inputs.filter((i) => i.u > 0);
    const random = createRandom(7);
    const draws = Array.from({ length: 20 }, () => {
      const x = Float64Array.from(x0);
      for (const { index, u } of spread) x[index] = x0[index]! + u * random.normal();
      return x;
    });
    const exact = draws.map((x) => model.evaluate(x));
    model.freezeColumn(x0, spread);
    const surrogate = draws.map((x) => model.evaluate(x));
    model.columnSurrogate = null;
    const worst = Math.max(...exact.map((e, i) => Math.abs(e - surrogate[i]!)));
    if (process.env['PLUMMET_PRINT_COVERAGE']) console.log('surrogate error over u_c', worst / budget.combined_standard_uncertainty);
    // Draws at the standard uncertainties, as the Monte Carlo draws them; the surrogate leaves out the cross terms,
    // which is where its error comes from (at twice the spread it grows to about a tenth of u_c).
    expect(worst).toBeLessThan(0.05 * budget.combined_standard_uncertainty);
  }, 120_000);

  it('keeps the closed form exactly where the column does not matter (a 14 m drop)', () => {
    const times = columnTimes([14], 0.5);
    const result = analyzeSeries(request(14, [times[0]!, times[0]!]));
    expect(result.air_column!.weight).toBe(0);
    expect(result.air_column!.correction_ratio).toBe(1);
    expect(result.budget.map((r) => r.input)).not.toContain('lapse_rate_K_per_m');
  });

  it('interpolates between two readings and shows their rows', () => {
    const times = columnTimes([300], 0.5);
    const aloft = { height_m: 300, temperature_C: 15.55, pressure_Pa: 92780, pressure_reference: 'station' as const, relative_humidity_pct: 55 };
    const result = analyzeSeries(request(300, [times[0]!, times[0]!], { air_aloft: aloft, uncertainty: { temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 } }));
    expect(result.air_column!.readings).toBe(2);
    expect(result.budget.map((r) => r.input)).toEqual(expect.arrayContaining(['air_aloft.temperature_C', 'air_aloft.pressure_Pa']));
    // The aloft reading is close to the standard column (hydrostatic at 6.5 K/km): the same C_d within 2e-3.
    expect(Math.abs(result.drag_coefficient! / 0.5 - 1)).toBeLessThan(2e-3);
  });

  it('has rows for the air motion and slows a light ball in an updraft', () => {
    const light = { shape: 'sphere' as const, mass_kg: 0.02, diameter_m: 0.1 };
    const times = columnTimes([20], 0.5, AIR, STANDARD_LAPSE_RATE_K_PER_M, light, 0.3);
    const declared = analyzeSeries({ ...request(20, [times[0]!, times[0]!]), specimen: light, air: { ...AIR, vertical_wind_m_s: 0.3, wind_speed_m_s: 0 } });
    expect(declared.drag_coefficient).toBeCloseTo(0.5, 5);
    expect(declared.budget.map((r) => r.input)).toEqual(expect.arrayContaining(['vertical_wind_m_s', 'wind_speed_m_s']));
    const ignored = analyzeSeries({ ...request(20, [times[0]!, times[0]!]), specimen: light });
    // Left out, the updraft reads as more drag.
    expect(ignored.drag_coefficient!).toBeGreaterThan(0.52);
  });

  it('warns past Mach 0.3 and refuses past Mach 0.6 at impact', () => {
    const heavy = { shape: "sphere" as const, mass_kg: 2, diameter_m: 0.1 };
    const t = columnTimes([6000], 0.3, AIR, STANDARD_LAPSE_RATE_K_PER_M, heavy)[0]!;
    const r = analyzeSeries({ ...request(6000, [t, t]), specimen: heavy });
    expect(r.air_column!.impact_mach).toBeGreaterThan(0.3);
    expect(r.warnings.map((w) => w.code)).toContain('compressible-impact');
    const heavier = { shape: 'sphere' as const, mass_kg: 40, diameter_m: 0.1 };
    const t2 = columnTimes([10000], 0.3, AIR, STANDARD_LAPSE_RATE_K_PER_M, heavier)[0]!;
    expect(() => analyzeSeries({ ...request(10000, [t2, t2]), specimen: heavier })).toThrow(/Mach 0\.6/);
  });
});

describe('the request for the air along the fall and its motion', () => {
  const base = request(300, [8, 8]);
  const refusal = (change: (r: Record<string, any>) => void): PhysicsInputError => {
    const r = structuredClone(base) as Record<string, any>;
    change(r);
    try {
      validateAnalysisRequest(r);
    } catch (error) {
      return error as PhysicsInputError;
    }
    throw new Error('accepted');
  };
  it.each([
    ['air.height_m', (r: Record<string, any>) => (r.air.height_m = 10_001), '0 to 10 000 m'],
    ['air.vertical_wind_m_s', (r: Record<string, any>) => (r.air.vertical_wind_m_s = 12), '-10 to 10 m/s'],
    ['air.wind_speed_m_s', (r: Record<string, any>) => (r.air.wind_speed_m_s = -1), '0 to 75 m/s'],
    ['air_aloft.height_m', (r: Record<string, any>) => (r.air_aloft = { temperature_C: 10, pressure_Pa: 90000, pressure_reference: 'station' }), '0 to 10 000 m'],
    ['air_aloft.height_m', (r: Record<string, any>) => (r.air_aloft = { height_m: 0.5, temperature_C: 10, pressure_Pa: 90000, pressure_reference: 'station' }), 'at least 1 m'],
    ['air_aloft.density_kg_m3', (r: Record<string, any>) => (r.air_aloft = { height_m: 300, temperature_C: 10, pressure_Pa: 90000, pressure_reference: 'station', density_kg_m3: 1.1 }), 'height_m'],
    ['uncertainty.lapse_rate_K_per_m', (r: Record<string, any>) => (r.uncertainty = { lapse_rate_K_per_m: 0.02 }), '0 to 0.01 K/m'],
    ['drops[0].height_m', (r: Record<string, any>) => (r.drops[0].height_m = 10_001), 'at most 10 000 m'],
  ])('refuses a bad %s with the field, the value and the range', (field, change, allowed) => {
    const error = refusal(change);
    expect(error).toBeInstanceOf(PhysicsInputError);
    expect(error.field).toBe(field);
    expect(error.allowed).toContain(allowed);
  });

  it('accepts release heights up to 10 000 m and a reading aloft', () => {
    const r = structuredClone(base);
    r.drops[0]!.height_m = 10_000;
    r.air_aloft = { height_m: 300, temperature_C: 15.5, pressure_Pa: 92800, pressure_reference: 'station' };
    r.uncertainty = { lapse_rate_K_per_m: 0.002, vertical_wind_m_s: 0.1, wind_speed_m_s: 1 };
    expect(validateAnalysisRequest(r).air_aloft?.height_m).toBe(300);
  });
});
