import { describe, expect, it } from 'vitest';
import { grubbsCriticalValue, grubbsTest } from '../../src/physics/grubbsTest';

describe('Grubbs critical values', () => {
  it('reproduce the published two-sided α = 0.05 table from n = 4 to 30', () => {
    // Grubbs (1969) / ASTM E178 two-sided 5 % critical values, as used with the NIST/SEMATECH
    // e-Handbook 1.3.5.17 formula. The table rounds to 3 decimals, and the t-based formula is the
    // Bonferroni form of the exact values, so agreement to 0.0015 is what to expect.
    const table: [number, number][] = [
      [4, 1.481],
      [5, 1.715],
      [6, 1.887],
      [7, 2.02],
      [8, 2.126],
      [9, 2.215],
      [10, 2.29],
      [12, 2.412],
      [15, 2.549],
      [20, 2.709],
      [25, 2.822],
      [30, 2.908],
    ];
    for (const [n, g] of table) expect(Math.abs(grubbsCriticalValue(n) - g)).toBeLessThan(0.0015);
  });

  it('gives exactly 1.715 for n = 5 at α = 0.05', () => {
    expect(grubbsCriticalValue(5, 0.05)).toBeCloseTo(1.715, 3);
  });

  it('never exceeds the largest possible G, (n − 1)/√n', () => {
    for (let n = 3; n <= 50; n++) expect(grubbsCriticalValue(n)).toBeLessThan((n - 1) / Math.sqrt(n));
  });
});

describe('grubbsTest', () => {
  it('flags 245.57 in the NIST/SEMATECH example (G = 2.4687 > 2.1266)', () => {
    // NIST/SEMATECH e-Handbook 1.3.5.17.1, Grubbs' test example (from memory).
    const data = [199.31, 199.53, 200.19, 200.82, 201.92, 201.95, 202.18, 245.57];
    const result = grubbsTest(data)!;
    expect(result.statistic).toBeCloseTo(2.4687, 3); // the handbook prints four decimals
    expect(result.critical_value).toBeCloseTo(2.1266, 3);
    expect(result.outlier).toBe(true);
    expect(result.suspect_index).toBe(7);
  });

  it('does not flag an ordinary series of fall times', () => {
    const result = grubbsTest([1.642, 1.638, 1.651, 1.645, 1.640])!;
    expect(result.outlier).toBe(false);
  });

  it('declines to test fewer than three values or values without any scatter', () => {
    expect(grubbsTest([1, 2])).toBeNull();
    expect(grubbsTest([2, 2, 2, 2])).toBeNull();
  });
});
