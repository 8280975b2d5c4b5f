import fc from 'fast-check';
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { describe, expect, it } from 'vitest';
import { fallTime, fallTimeFactor } from '../../src/physics/fallModel';
import { fitDragConstant, solveFallTimeFactor } from '../../src/physics/fitDragConstant';

const g = 9.79;
/** The textbook closed form, written independently of ours: τ·arccosh(e^{kh}). */
const textbook = (k: number, h: number): number => Math.acosh(Math.exp(k * h)) / Math.sqrt(g * k);
const model = (k: number, h: number): number => fallTime(h, { effective_gravity_m_s2: g, drag_constant_per_m: k, effective_mass_kg: 1 });

describe('fitDragConstant', () => {
  it('recovers the drag constant exactly from noise-free times at one height', () => {
    const fit = fitDragConstant(g, [12], [model(0.0042, 12)], [5], false);
    expect(fit.status).toBe('ok');
    expect(fit.drag_constant_per_m / 0.0042 - 1).toBeCloseTo(0, 12);
  });

  it('at one height gives the k whose time equals the mean measured time', () => {
    const times = [1.601, 1.596, 1.604, 1.598];
    const meanTime = times.reduce((a, b) => a + b) / times.length;
    const fit = fitDragConstant(g, [12], [meanTime], [4], false);
    expect(model(fit.drag_constant_per_m, 12)).toBeCloseTo(meanTime, 14);
  });

  it('fits C_d and a timing offset together as ml-levenberg-marquardt does', () => {
    // Ten drops from five heights, k = 0.003/m, a 12 ms start/stop delay and ±1 ms of fixed "noise".
    const heights = [3, 3, 6, 6, 10, 10, 15, 15, 20, 20];
    const noise = [0.0012, -0.0008, 0.0005, -0.0011, 0.0009, 0.0002, -0.0006, 0.001, -0.0004, 0.0001];
    const times = heights.map((h, i) => textbook(0.003, h) + 0.012 + noise[i]!);
    const groupMeans = [0, 2, 4, 6, 8].map((i) => (times[i]! + times[i + 1]!) / 2);
    const ours = fitDragConstant(g, [3, 6, 10, 15, 20], groupMeans, [2, 2, 2, 2, 2], true);
    // The general-purpose fitter on the single drops, with the textbook model written out.
    const reference = levenbergMarquardt({ x: heights, y: times }, ([k, d]) => (h: number) => textbook(k!, h) + d!, {
      initialValues: [0.002, 0],
      damping: 1e-3,
      gradientDifference: [1e-7, 1e-7],
      centralDifference: true,
      maxIterations: 2000,
      errorTolerance: 1e-30,
      improvementThreshold: 1e-12,
    });
    const [k, offset] = reference.parameterValues;
    // LM's finite-difference Jacobian (step 1e-7) limits it to about 1e-9 relative here.
    expect(Math.abs(ours.drag_constant_per_m / k! - 1)).toBeLessThan(1e-7);
    expect(Math.abs(ours.offset_s - offset!)).toBeLessThan(1e-9);
    expect(ours.offset_s).toBeCloseTo(0.012, 3);
  });

  it('fits several heights without offset by least squares (zero gradient at the optimum)', () => {
    const heights = [4, 9, 16];
    const means = [model(0.01, 4) + 0.001, model(0.01, 9) - 0.002, model(0.01, 16) + 0.0005];
    const counts = [3, 1, 2];
    const fit = fitDragConstant(g, heights, means, counts, false);
    const S = (k: number): number => heights.reduce((s, h, j) => s + counts[j]! * (means[j]! - model(k, h)) ** 2, 0);
    const k = fit.drag_constant_per_m;
    expect(S(k)).toBeLessThanOrEqual(S(k * (1 + 1e-6)));
    expect(S(k)).toBeLessThanOrEqual(S(k * (1 - 1e-6)));
  });

  it('passes smoothly below zero drag when the times are a little short of a drag-free fall', () => {
    const t0 = Math.sqrt((2 * 10) / g);
    const fit = fitDragConstant(g, [10], [t0 - 0.001], [3], false);
    expect(fit.status).toBe('ok');
    expect(fit.drag_constant_per_m).toBeLessThan(0);
  });

  it('always ends, with a value or a reason, whatever the times', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ h: fc.double({ min: 0.1, max: 500, noNaN: true }), t: fc.double({ min: 1e-3, max: 1e4, noNaN: true }) }), { minLength: 1, maxLength: 6 }),
        fc.boolean(),
        (groups, offset) => {
          const unique = [...new Map(groups.map((x) => [x.h, x])).values()];
          fc.pre(!offset || unique.length >= 3);
          const fit = fitDragConstant(g, unique.map((x) => x.h), unique.map((x) => x.t), unique.map(() => 1), offset);
          expect(['ok', 'faster-than-free-fall', 'drag-unexplained', 'not-converged']).toContain(fit.status);
          expect(Number.isFinite(fit.drag_constant_per_m)).toBe(true);
          expect(fit.iterations).toBeLessThanOrEqual(200);
        },
      ),
      { numRuns: 300, seed: 99 },
    );
  });
});

describe('solveFallTimeFactor', () => {
  it('says "faster than free fall" for a time a quarter of the drag-free one, and "unexplained" for one 10⁵ times longer', () => {
    expect(solveFallTimeFactor(0.2).status).toBe('faster-than-free-fall');
    expect(solveFallTimeFactor(1e5).status).toBe('drag-unexplained');
  });

  it('finds the same root from a warm start near the answer as from none, wherever the start and the target lie', () => {
    // A warm start goes through a remembered second-order expansion of Φ (the Monte Carlo's path): it may change
    // the iterations, never the root.
    fc.assert(
      fc.property(fc.double({ min: -15, max: 1e5, noNaN: true }), fc.double({ min: -0.2, max: 0.2, noNaN: true }), (x, spread) => {
        const target = fallTimeFactor(x);
        const cold = solveFallTimeFactor(target);
        const warm = solveFallTimeFactor(target * (1 + spread / 100), x * (1 + spread));
        const warmSame = solveFallTimeFactor(target, x * (1 + spread / 10));
        expect([cold.status, warm.status, warmSame.status]).toEqual(['ok', 'ok', 'ok']);
        expect(Math.abs(warmSame.x - cold.x)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(cold.x)));
      }),
      { numRuns: 400, seed: 5 },
    );
  });
});
