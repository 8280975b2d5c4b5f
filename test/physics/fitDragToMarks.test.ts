import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { describe, expect, it } from 'vitest';
import { createRandom } from '../../src/physics/createRandom';
import { fallTime, timeBetweenHeights, type FallParameters } from '../../src/physics/fallModel';
import { fitDragToMarks, type MarkedDrop } from '../../src/physics/fitDragToMarks';

const g = 9.79;
const fall = (k: number): FallParameters => ({ effective_gravity_m_s2: g, drag_constant_per_m: k, effective_mass_kg: 1 });
/** The textbook closed form, written independently of ours: τ·arccosh(e^{kd}). */
const textbook = (k: number, d: number): number => (d <= 0 ? 0 : Math.acosh(Math.exp(k * d)) / Math.sqrt(g * k));

function drop(distances: number[], times: number[], releaseKnown: boolean, timeU: number, releaseU = 0): MarkedDrop {
  return { distances_m: Float64Array.from(distances), times_s: Float64Array.from(times), releaseKnown, timeU_s: timeU, releaseU_s: releaseU, distanceU_m: 0 };
}

describe('fitDragToMarks', () => {
  it('recovers k and the release shift exactly from times between gates (the physics\' own timeBetweenHeights)', () => {
    // The clock starts as the body passes the first gate at 0.3 m: the release is 'unknown', its shift −T(0.3 m).
    const k = 0.02;
    const gates = [0.3, 0.8, 1.5, 2.4, 3.5];
    const times = gates.map((d) => timeBetweenHeights(0.3, d, fall(k)));
    const fit = fitDragToMarks(g, [drop(gates, times, false, 0.001)], false);
    expect(fit.status).toBe('ok');
    expect(fit.dragConstant_per_m / k - 1).toBeCloseTo(0, 7);
    expect(fit.shifts_s[0]! + fallTime(0.3, fall(k))).toBeCloseTo(0, 10);
    expect(fit.degreesOfFreedom).toBe(3);
  });

  it('agrees with ml-levenberg-marquardt on whitened residuals: two video drops and one gate drop with a shared release error and an offset', () => {
    // Truth: k = 0.015/m, a 4 ms delay on the known-release drop, shifts of 21 and −13 ms on the estimated ones.
    const random = createRandom(20_261_202);
    const kTrue = 0.015;
    const tU = 0.001;
    const rU = 0.002;
    const video = (shift: number) => {
      const d = Array.from({ length: 12 }, (_, i) => 0.05 + 0.25 * i);
      return { d, t: d.map((x) => textbook(kTrue, x) + shift + tU * random.normal()) };
    };
    const a = video(0.021);
    const b = video(-0.013);
    const gates = [1.0, 2.0, 3.0, 4.0];
    const release = rU * random.normal();
    const c = { d: gates, t: gates.map((x) => textbook(kTrue, x) + 0.004 + release + tU * random.normal()) };
    const ours = fitDragToMarks(g, [drop(a.d, a.t, false, tU), drop(b.d, b.t, false, tU), drop(c.d, c.t, true, tU, rU)], true);
    expect(ours.status).toBe('ok');

    // The reference: parameters [k, δ, s_a, s_b], every residual whitened by the Cholesky factor of its drop's
    // covariance (σ_t²·I, or σ_t²·I + σ_r²·1·1ᵀ for the gates), so plain least squares is the generalised one.
    const n = gates.length;
    const V = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? tU * tU : 0) + rU * rU));
    const L = V.map(() => new Array<number>(n).fill(0));
    for (let i = 0; i < n; i++) {
      for (let j = 0; j <= i; j++) {
        let s = V[i]![j]!;
        for (let q = 0; q < j; q++) s -= L[i]![q]! * L[j]![q]!;
        L[i]![j] = i === j ? Math.sqrt(s) : s / L[j]![j]!;
      }
    }
    const whiten = (v: number[]): number[] => {
      const out: number[] = [];
      for (let i = 0; i < n; i++) {
        let s = v[i]!;
        for (let q = 0; q < i; q++) s -= L[i]![q]! * out[q]!;
        out.push(s / L[i]![i]!);
      }
      return out;
    };
    const whitened = (k: number, delta: number, sa: number, sb: number): number[] => [
      ...a.d.map((x) => (textbook(k, x) + sa) / tU),
      ...b.d.map((x) => (textbook(k, x) + sb) / tU),
      ...whiten(c.d.map((x) => textbook(k, x) + delta)),
    ];
    const y = [...a.t.map((t) => t / tU), ...b.t.map((t) => t / tU), ...whiten(c.t)];
    const x = y.map((_, i) => i);
    const reference = levenbergMarquardt({ x, y }, ([k, delta, sa, sb]) => {
      const values = whitened(k!, delta!, sa!, sb!);
      return (i: number) => values[i]!;
    }, {
      initialValues: [0.01, 0, 0, 0],
      damping: 1e-3,
      gradientDifference: [1e-7, 1e-8, 1e-8, 1e-8],
      centralDifference: true,
      maxIterations: 2000,
      errorTolerance: 1e-30,
      improvementThreshold: 1e-12,
    });
    const [k, delta, sa, sb] = reference.parameterValues;
    // LM's finite-difference Jacobian limits it to about 1e-7 relative here (stated tolerance).
    expect(Math.abs(ours.dragConstant_per_m / k! - 1)).toBeLessThan(1e-5);
    expect(Math.abs(ours.offset_s - delta!)).toBeLessThan(1e-7);
    expect(Math.abs(ours.shifts_s[0]! - sa!)).toBeLessThan(1e-7);
    expect(Math.abs(ours.shifts_s[1]! - sb!)).toBeLessThan(1e-7);
    // χ² is the same sum of squares.
    expect(ours.sumOfSquares / reference.parameterError - 1).toBeCloseTo(0, 4);
  });

  it('weights a mark near the release less when its distance is noisy (effective variance)', () => {
    const k = 0.01;
    const d = [0.02, 0.5, 1, 1.5, 2];
    const t = d.map((x) => textbook(k, x));
    t[0]! += 0.01; // a wrong first mark
    const plain = fitDragToMarks(g, [drop(d, t, false, 0.001)], false);
    const noisy = fitDragToMarks(g, [{ ...drop(d, t, false, 0.001), distanceU_m: 0.005 }], false);
    // The slow first mark's 5 mm is 8 ms of time (v = 0.6 m/s), the others' 1–2 ms: its pull on k shrinks.
    expect(Math.abs(noisy.dragConstant_per_m - k)).toBeLessThan(Math.abs(plain.dragConstant_per_m - k) / 3);
  });
});
