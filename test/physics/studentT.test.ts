import jStat from 'jstat';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { studentTCdf, studentTQuantile, studentTUpperTail } from '../../src/physics/studentT';

describe('studentTQuantile', () => {
  it('matches the NIST/SEMATECH table of upper critical values t(0.975, ν)', () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.2 "Critical Values of the Student's t Distribution".
    const table: [number, number][] = [
      [1, 12.706],
      [2, 4.303],
      [3, 3.182],
      [4, 2.776],
      [5, 2.571],
      [10, 2.228],
      [20, 2.086],
      [30, 2.042],
      [100, 1.984],
    ];
    for (const [dof, t] of table) expect(studentTQuantile(0.975, dof)).toBeCloseTo(t, 3);
  });

  it('matches the same table at 0.995 and 0.95', () => {
    // NIST/SEMATECH 1.3.6.7.2: t(0.995, 4) = 4.604, t(0.95, 10) = 1.812, t(0.995, 1) = 63.657.
    expect(studentTQuantile(0.995, 4)).toBeCloseTo(4.604, 3);
    expect(studentTQuantile(0.95, 10)).toBeCloseTo(1.812, 3);
    expect(studentTQuantile(0.995, 1)).toBeCloseTo(63.657, 3);
  });

  it('is exact where the quantile has a closed form (ν = 1: Cauchy; ν = 2)', () => {
    for (const p of [0.6, 0.9, 0.975, 0.999, 0.9999]) {
      // Written with q = 1 − p (exact in floating point): tan(π(p − ½)) itself is ill-conditioned near p = 1.
      const q = 1 - p;
      expect(studentTQuantile(p, 1) / (1 / Math.tan(Math.PI * q)) - 1).toBeCloseTo(0, 14);
      expect(studentTQuantile(p, 2) / ((1 - 2 * q) / Math.sqrt(2 * p * q)) - 1).toBeCloseTo(0, 14);
    }
  });

  it('agrees with jstat.studentt.inv to 1e-7 relative over a grid of ν and p', () => {
    // jstat inverts its incomplete beta to about 1e-8 (it misses the exact ν = 1 value by 1e-11
    // relative), so 1e-7 is the agreement to expect, not a sign of error on either side.
    for (const dof of [1, 2, 3, 4, 5, 7, 10, 15, 30, 60, 120, 500]) {
      for (const p of [0.55, 0.75, 0.9, 0.95, 0.975, 0.99, 0.995, 0.999]) {
        const ours = studentTQuantile(p, dof);
        expect(Math.abs(ours / jStat.studentt.inv(p, dof) - 1)).toBeLessThan(1e-7);
      }
    }
  });

  it('inverts its own CDF, for fractional degrees of freedom too', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.3, max: 300, noNaN: true }), fc.double({ min: 1e-6, max: 1 - 1e-6, noNaN: true }), (dof, p) => {
        const t = studentTQuantile(p, dof);
        expect(Math.abs(studentTCdf(t, dof) - p)).toBeLessThan(1e-12);
      }),
      { numRuns: 300, seed: 5 },
    );
  });

  it('is symmetric about zero and approaches the normal 1.959964 for large ν', () => {
    expect(studentTQuantile(0.025, 7)).toBeCloseTo(-studentTQuantile(0.975, 7), 14);
    expect(studentTQuantile(0.975, 1e7)).toBeCloseTo(1.959964, 6);
  });

  it('keeps far-tail probabilities accurate instead of rounding them to zero', () => {
    // P(T > 1e4) for ν = 3 is about 6.4e-13 (the tail ~ C·t^−3); 1 − CDF in double would lose it.
    expect(studentTUpperTail(1e4, 3)).toBeGreaterThan(1e-13);
    expect(studentTUpperTail(1e4, 3) / jStat.studentt.cdf(-1e4, 3)).toBeCloseTo(1, 6);
  });
});
