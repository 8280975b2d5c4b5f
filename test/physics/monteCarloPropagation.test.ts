import { describe, expect, it } from 'vitest';
import { adaptiveMonteCarloPropagation, ADAPTIVE_MONTE_CARLO, monteCarloPropagation, selectQuantile, sortedQuantile, summariseDraws } from '../../src/physics/monteCarloPropagation';
import fc from 'fast-check';
import { SeriesModel } from '../../src/physics/seriesModel';
import { studentTQuantile } from '../../src/physics/studentT';

const model = new SeriesModel({
  shape: 'sphere',
  dimensionCount: 1,
  humidity: 'none',
  densityOverride: true,
  co2MoleFraction: 0.0004,
  buoyancy: false,
  addedMassCoefficient: 0,
  fitOffset: false,
  counts: Float64Array.from([5]),
});
const x0 = Float64Array.from([290, 0, 0, 1.2, 9.81, 0.2, 0.08, 15, 1.8]);
const nominal = model.evaluate(x0);

describe('monteCarloPropagation', () => {
  it('is reproducible for a seed', () => {
    const spec = { draws: 2000, seed: 42, normals: [{ index: 5, u: 0.001 }], times: { indices: [8], counts: [5], declared_s: 0.004, excess_s: 0, degrees_of_freedom: 4 } };
    const a = monteCarloPropagation(model, x0, spec, false);
    const b = monteCarloPropagation(model, x0, spec, false);
    expect(a.dragCoefficient.interval_95).toEqual(b.dragCoefficient.interval_95);
  });

  it('turns a Type A scatter with ν = 4 into the Student-t interval of the mean (JCGM 101 6.4.9)', () => {
    // Only the scatter varies: the mean time is then t̄ + (s/√n)·t_4, so the 95 % interval of C_d
    // must be the image of t̄ ± t(0.975, 4)·s/√n through the (nearly linear) model.
    const s = 0.004;
    const spec = { draws: 200000, seed: 7, normals: [], times: { indices: [8], counts: [5], declared_s: 0, excess_s: s, degrees_of_freedom: 4 } };
    const result = monteCarloPropagation(model, x0, spec, false);
    const half = (studentTQuantile(0.975, 4) * s) / Math.sqrt(5);
    const x = Float64Array.from(x0);
    x[8] = 1.8 - half;
    const low = model.evaluate(x);
    x[8] = 1.8 + half;
    const high = model.evaluate(x);
    expect(result.dragCoefficient.interval_95[0] / low).toBeCloseTo(1, 2);
    expect(result.dragCoefficient.interval_95[1] / high).toBeCloseTo(1, 2);
    expect(result.dragCoefficient.mean / nominal).toBeCloseTo(1, 2);
  });

  it('clips a drawn quantity to its allowed range', () => {
    const spec = { draws: 500, seed: 1, normals: [{ index: 5, u: 10, min: 0.19, max: 0.21 }], times: { indices: [8], counts: [5], declared_s: 0, excess_s: 0, degrees_of_freedom: 4 } };
    const result = monteCarloPropagation(model, x0, spec, false);
    expect(result.dragCoefficient.failed).toBe(0);
    expect(Math.min(...result.values) / nominal).toBeCloseTo(0.19 / 0.2, 10);
    expect(Math.max(...result.values) / nominal).toBeCloseTo(0.21 / 0.2, 10);
  });
});

describe('adaptiveMonteCarloPropagation (JCGM 101 §7.9)', () => {
  // A mass of 0.2 ± 0.002 kg and a Type A scatter with ν = 4: a skewed, heavy-tailed output.
  const spec = { seed: 3, normals: [{ index: 5, u: 0.002 }], times: { indices: [8], counts: [5], declared_s: 0.002, excess_s: 0.004, degrees_of_freedom: 4 } };

  it('draws whole batches until stable, and the same seed gives the same run', () => {
    const a = adaptiveMonteCarloPropagation(model, x0, spec, false);
    const b = adaptiveMonteCarloPropagation(model, x0, spec, false);
    expect(a.dragCoefficient.interval_95).toEqual(b.dragCoefficient.interval_95);
    expect(a.adaptive.stabilized).toBe(true);
    expect(a.adaptive.batches).toBeGreaterThanOrEqual(2);
    expect(a.dragCoefficient.draws).toBe(a.adaptive.batches * ADAPTIVE_MONTE_CARLO.batch_size);
    expect(a.adaptive.tolerance).toBeCloseTo(a.dragCoefficient.standard_deviation / 20, 12);
  });

  it('keeps its promise: the ends of the interval lie within the tolerance of a 10⁶-draw run in about 95 % of seeds', () => {
    // The reference: 1 000 000 draws, whose own ends are about 30 times steadier than one adaptive run's tolerance.
    const reference = monteCarloPropagation(model, x0, { ...spec, draws: 1_000_000, seed: 99 }, false).dragCoefficient;
    let within = 0;
    const seeds = 60;
    for (let seed = 1; seed <= seeds; seed++) {
      const run = adaptiveMonteCarloPropagation(model, x0, { ...spec, seed }, false);
      const [low, high] = run.dragCoefficient.interval_95;
      const d = run.adaptive.tolerance;
      if (Math.abs(low - reference.interval_95[0]) <= d && Math.abs(high - reference.interval_95[1]) <= d) within++;
    }
    // Each end is within δ with about 95 % probability (2s ≤ δ); both together in at least about 90 %. With 60
    // seeds the binomial standard deviation at 90 % is 3.9 %: allow two of them.
    expect(within / seeds).toBeGreaterThanOrEqual(0.9 - 2 * 0.039);
  }, 60_000);

  it('stops at the cap and says it did not stabilize', () => {
    const run = adaptiveMonteCarloPropagation(model, x0, spec, false, { batch_size: 2000, relative_tolerance: 1e-4, max_draws: 10_000 });
    expect(run.adaptive.stabilized).toBe(false);
    expect(run.adaptive.batches).toBe(5);
    expect(run.dragCoefficient.draws).toBe(10_000);
    expect(run.adaptive.worst_ratio).toBeGreaterThan(1);
  });
});

describe('sortedQuantile', () => {
  it('interpolates between order statistics', () => {
    expect(sortedQuantile([1, 2, 3, 4, 5], 0.5)).toBe(3);
    expect(sortedQuantile([1, 2, 3, 4, 5], 0.125)).toBe(1.5);
    expect(sortedQuantile([1, 2], 1)).toBe(2);
  });
});

describe('selectQuantile', () => {
  it('gives the same quantile as sorting first, for any values', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 300 }), fc.double({ min: 0, max: 1, noNaN: true }), (values, p) => {
        const sorted = Float64Array.from(values).sort();
        expect(selectQuantile(Float64Array.from(values), p)).toBe(sortedQuantile(sorted, p));
      }),
      { numRuns: 500, seed: 13 },
    );
  });
});

describe('summariseDraws', () => {
  it('reads the interval ends and the one-sided bound as sorting first would, however few or tied the draws', () => {
    // Its three quantiles share one array: each later selection searches left of the previous one.
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -20, max: 20 }).map((v) => v / 4), { minLength: 1, maxLength: 300 }), (values) => {
        const sorted = Float64Array.from(values).sort();
        const summary = summariseDraws(Float64Array.from(values), values.length, 0);
        expect(summary.interval_95).toEqual([sortedQuantile(sorted, 0.025), sortedQuantile(sorted, 0.975)]);
        expect(summary.upper_bound_95).toBe(sortedQuantile(sorted, 0.95));
      }),
      { numRuns: 500, seed: 29 },
    );
  });
});
