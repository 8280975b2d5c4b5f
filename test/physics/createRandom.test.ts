import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { createRandom } from '../../src/physics/createRandom';

/** Kolmogorov–Smirnov distance of a sample from a CDF. */
function ksDistance(sample: number[], cdf: (x: number) => number): number {
  const sorted = [...sample].sort((a, b) => a - b);
  let d = 0;
  sorted.forEach((x, i) => {
    const F = cdf(x);
    d = Math.max(d, Math.abs(F - i / sorted.length), Math.abs(F - (i + 1) / sorted.length));
  });
  return d;
}

describe('createRandom', () => {
  it('replays the same sequence for the same seed and a different one for another seed', () => {
    const a = createRandom(123);
    const b = createRandom(123);
    const c = createRandom(124);
    const seqA = Array.from({ length: 5 }, () => a.uniform());
    expect(Array.from({ length: 5 }, () => b.uniform())).toEqual(seqA);
    expect(Array.from({ length: 5 }, () => c.uniform())).not.toEqual(seqA);
  });

  it('draws uniforms strictly inside (0, 1) that pass a Kolmogorov–Smirnov test', () => {
    const r = createRandom(1);
    const sample = Array.from({ length: 20000 }, () => r.uniform());
    expect(Math.min(...sample)).toBeGreaterThan(0);
    expect(Math.max(...sample)).toBeLessThan(1);
    // Critical KS distance at α = 0.001: 1.95/√n (Smirnov's asymptotic table).
    expect(ksDistance(sample, (x) => x)).toBeLessThan(1.95 / Math.sqrt(sample.length));
  });

  it('draws normals that pass a Kolmogorov–Smirnov test against jstat’s normal CDF', () => {
    const r = createRandom(2);
    const sample = Array.from({ length: 20000 }, () => r.normal());
    expect(ksDistance(sample, (x) => jStat.normal.cdf(x, 0, 1))).toBeLessThan(1.95 / Math.sqrt(sample.length));
  });

  it('draws χ² values that pass a Kolmogorov–Smirnov test against jstat’s χ² CDF, for ν = 1 and 4', () => {
    for (const dof of [1, 4]) {
      const r = createRandom(3 + dof);
      const sample = Array.from({ length: 20000 }, () => r.chiSquare(dof));
      expect(ksDistance(sample, (x) => jStat.chisquare.cdf(x, dof))).toBeLessThan(1.95 / Math.sqrt(sample.length));
    }
  });
});

describe('createRandom normals', () => {
  it('have mean 0, variance 1, kurtosis 3 and the normal tail P(|Z| > 3) = 0.0027 over 10⁶ draws', () => {
    // Standard normal: P(|Z| > 3) = 2·(1 − Φ(3)) = 0.002700 (any normal table). Each check sits
    // about 4 standard errors wide for n = 10⁶ (s.e. of the mean 0.001, of the variance 0.0014,
    // of the kurtosis 0.0049, of the tail count 5.2e-5).
    const r = createRandom(8);
    const n = 1_000_000;
    let s1 = 0;
    let s2 = 0;
    let s4 = 0;
    let tail = 0;
    for (let i = 0; i < n; i++) {
      const z = r.normal();
      s1 += z;
      s2 += z * z;
      s4 += z ** 4;
      if (Math.abs(z) > 3) tail++;
    }
    expect(Math.abs(s1 / n)).toBeLessThan(0.004);
    expect(Math.abs(s2 / n - 1)).toBeLessThan(0.006);
    expect(Math.abs(s4 / n - 3)).toBeLessThan(0.02);
    expect(Math.abs(tail / n - 0.0027)).toBeLessThan(0.00021);
  }, 60_000);
});
