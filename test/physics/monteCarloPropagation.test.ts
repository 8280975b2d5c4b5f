import { describe, expect, it } from 'vitest';
import { monteCarloPropagation, selectQuantile, sortedQuantile } from '../../src/physics/monteCarloPropagation';
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
