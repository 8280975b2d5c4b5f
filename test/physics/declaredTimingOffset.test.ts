import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import type { AnalysisRequest } from '../../src/physics/analysisTypes';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { TIMING_METHOD_DEFAULTS } from '../../src/physics/timingMethodDefaults';
import { validateAnalysisRequest } from '../../src/physics/validateAnalysisRequest';
import { AIR, BALL, createRandom, exactTimes, measuredSeries, SITE, UNCERTAINTY } from './syntheticSeries';

const exactRequest = (cd: number, heights: number[], shift_s = 0): AnalysisRequest => {
  const base = { site: SITE, air: AIR, specimen: BALL };
  const times = exactTimes(base, cd, heights);
  return {
    ...base,
    drops: heights.map((h, i) => ({ height_m: h, time_s: times[i]! + shift_s })),
    timing: { standard_uncertainty_s: 0.004 },
    uncertainty: UNCERTAINTY,
    options: { monte_carlo_draws: 2000 },
  };
};

function rejection(json: unknown): PhysicsInputError {
  try {
    validateAnalysisRequest(json);
  } catch (error) {
    if (error instanceof PhysicsInputError) return error;
    throw error;
  }
  throw new Error('accepted');
}

describe('a declared timing delay', () => {
  it('is checked like every other input: the field, the value and the range', () => {
    const base = exactRequest(0.47, [12]);
    const bad = rejection({ ...base, timing: { ...base.timing, offset_s: 3 } });
    expect([bad.field, bad.value, bad.allowed]).toEqual(['timing.offset_s', 3, '-2 to 2 s']);
    const badU = rejection({ ...base, timing: { ...base.timing, offset_standard_uncertainty_s: -0.01 } });
    expect(badU.field).toBe('timing.offset_standard_uncertainty_s');
    const badMethod = rejection({ ...base, timing: { ...base.timing, method: 'sundial' } });
    expect(badMethod.field).toBe('timing.method');
    expect(badMethod.allowed).toContain('"stopwatch"');
    // "typed" assumes nothing: the crew must state the random part.
    const typed = rejection({ ...base, timing: { method: 'typed' } });
    expect([typed.field, typed.code]).toEqual(['timing.standard_uncertainty_s', 'missing-field']);
  });

  it('takes the method defaults when nothing is given, and explicit values over them', () => {
    const base = exactRequest(0.47, [12]);
    const byMethod = validateAnalysisRequest({ ...base, timing: { method: 'stopwatch' } });
    // Am. J. Phys. 87(2), 110 (2019): a start-and-stop interval N(0, (0.10 s)²).
    expect(byMethod.timing.standard_uncertainty_s).toBe(0.1);
    const video = analyzeSeries(validateAnalysisRequest({ ...base, timing: { method: 'video' } })); // JSON may leave the random part to the method
    // One frame at 30 frames/s, rectangular at each end: (1/30 s)/√6 = 13.61 ms (JCGM 100:2008 §4.3.7).
    expect(video.budget.find((r) => r.input === 'time_s')!.standard_uncertainty).toBeCloseTo(0.013608, 6);
    expect(video.declared_timing_offset).toMatchObject({ offset_s: 0, standard_uncertainty_s: 0.01, method: 'video' });
    const given = analyzeSeries({ ...base, timing: { method: 'video', standard_uncertainty_s: 0.005, offset_s: 0.002, offset_standard_uncertainty_s: 0.001 } });
    expect(given.budget.find((r) => r.input === 'time_s')!.standard_uncertainty).toBe(0.005);
    expect(given.declared_timing_offset).toMatchObject({ offset_s: 0.002, standard_uncertainty_s: 0.001, source: 'given' });
    for (const defaults of Object.values(TIMING_METHOD_DEFAULTS)) expect(defaults.source.length).toBeGreaterThan(10);
  });

  it('is subtracted from every time: a 10 ms late timer declared as such gives the C_d of the true times', () => {
    const heights = [12, 12, 12, 12, 12];
    const truth = analyzeSeries(exactRequest(0.47, heights));
    const late = exactRequest(0.47, heights, 0.01);
    const undeclared = analyzeSeries(late);
    const declared = analyzeSeries({ ...late, timing: { ...late.timing, offset_s: 0.01 } });
    expect(truth.drag_coefficient).toBeCloseTo(0.47, 8);
    expect(declared.drag_coefficient).toBeCloseTo(0.47, 8);
    expect(undeclared.drag_coefficient!).toBeGreaterThan(0.6);
    for (const drop of declared.drops) {
      expect(drop.drag_coefficient).toBeCloseTo(0.47, 8);
      expect(drop.residual_s).toBeCloseTo(0, 9);
    }
  });

  it('is one error shared by every drop: its budget row is the sum of the per-height time sensitivities', () => {
    const heights = [6, 6, 6, 12, 12, 12];
    const request = exactRequest(0.47, heights);
    request.timing = { standard_uncertainty_s: 0.004, offset_s: 0, offset_standard_uncertainty_s: 0.003 };
    const result = analyzeSeries(request);
    const row = result.budget.find((r) => r.input === 'timing_offset_s')!;
    expect(row.standard_uncertainty).toBe(0.003);
    // A fully correlated shift of both mean times: ∂C_d/∂δ = −(∂C_d/∂t̄₁ + ∂C_d/∂t̄₂). Computed here from the
    // single-time sensitivities of the same model (1e-6 s central differences, each analysed on its own).
    const derivative = (j: number, step: number): number => {
      const shifted = (s: number): number => {
        const r = exactRequest(0.47, heights);
        r.drops = r.drops.map((d, i) => (Math.floor(i / 3) === j ? { ...d, time_s: d.time_s + s } : d));
        return analyzeSeries(r).drag_coefficient_estimate;
      };
      return (shifted(step) - shifted(-step)) / (2 * step);
    };
    const summed = derivative(0, 1e-6) + derivative(1, 1e-6);
    expect(Math.abs(row.sensitivity) / Math.abs(summed)).toBeCloseTo(1, 4);
    // Correlated, so not divided by √(number of drops): the contribution is the full |sum|·u.
    expect(row.contribution).toBeCloseTo(Math.abs(summed) * 0.003, 6);
  });

  it('is drawn once per series in the Monte Carlo, not once per drop', () => {
    const request = exactRequest(0.47, [12, 12, 12, 12, 12]);
    request.uncertainty = { height_m: 0, mass_kg: 0, diameter_m: 0, temperature_C: 0, pressure_Pa: 0, relative_humidity_pct: 0 };
    request.timing = { standard_uncertainty_s: 0.0001, offset_s: 0, offset_standard_uncertainty_s: 0.002 };
    request.options = { monte_carlo_draws: 20_000 };
    const result = analyzeSeries(request);
    const row = result.budget.find((r) => r.input === 'timing_offset_s')!;
    // Drawn per drop, the spread would shrink by √5 ≈ 2.24; drawn per series it matches the GUM row
    // (a 2 ms shift is small enough for the linearisation: within 3 %).
    expect(result.monte_carlo.standard_deviation / row.contribution).toBeGreaterThan(0.97);
    expect(result.monte_carlo.standard_deviation / row.contribution).toBeLessThan(1.03);
  });

  it('is the prior a fitted offset is checked against: |fitted − declared| > 2·√(u_fit² + u_declared²) warns', () => {
    const heights = [4, 8, 12, 16, 20];
    const request = exactRequest(0.47, heights, 0.03);
    request.timing = { standard_uncertainty_s: 0.002, offset: 'fit', offset_s: 0, offset_standard_uncertainty_s: 0.002 };
    const disagrees = analyzeSeries(request);
    expect(disagrees.timing_offset_s).toBeCloseTo(0.03, 8);
    expect(disagrees.warnings.map((w) => w.code)).toContain('timing-offset-disagrees');
    // The declared delay is not subtracted when fitting: the fit finds the whole offset itself, and C_d is unchanged.
    expect(disagrees.drag_coefficient).toBeCloseTo(0.47, 8);
    expect(disagrees.budget.some((r) => r.input === 'timing_offset_s')).toBe(false);
    request.timing = { ...request.timing, offset_s: 0.028, offset_standard_uncertainty_s: 0.005 };
    const agrees = analyzeSeries(request);
    expect(agrees.warnings.map((w) => w.code)).not.toContain('timing-offset-disagrees');
    expect(agrees.declared_timing_offset?.offset_s).toBe(0.028);
  });

  it('covers the true C_d in 93–97 % of 500 series with a declared 10 ± 5 ms delay', () => {
    // Each series' true delay is drawn from N(10 ms, (5 ms)²) — the family the crew declares — and the
    // analysis is told 10 ± 5 ms. Binomial standard deviation for n = 500, p = 0.95: √(0.95·0.05/500) = 0.97 %.
    // 1000 Monte Carlo draws per series (instead of 20 000) keep the test inside CI time; the interval's
    // end points then carry about 1 % numerical noise of their own, well inside the spread above.
    const random = createRandom(20261002);
    const series = 500;
    let covered = 0;
    for (let i = 0; i < series; i++) {
      const delay = 0.01 + 0.005 * random.normal();
      const request = measuredSeries({ cd: 0.47, heights: [12, 12, 12, 12, 12], timingU: 0.004, offset_s: delay, random, draws: 1000 });
      request.timing = { standard_uncertainty_s: 0.004, offset_s: 0.01, offset_standard_uncertainty_s: 0.005 };
      const [low, high] = analyzeSeries(request).drag_coefficient_interval_95;
      if (low <= 0.47 && 0.47 <= high) covered++;
    }
    expect(covered / series).toBeGreaterThanOrEqual(0.93);
    expect(covered / series).toBeLessThanOrEqual(0.97);
  });
});
