import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { mean, seriesStatistics, standardDeviation, standardError } from '../../src/physics/seriesStatistics';

describe('series statistics', () => {
  it('reproduces NIST StRD NumAcc1: mean 10000002, standard deviation 1', () => {
    // NIST Statistical Reference Datasets, univariate "NumAcc1" (from memory): 10000001, 10000003, 10000002.
    const data = [10000001, 10000003, 10000002];
    expect(mean(data)).toBe(10000002);
    expect(standardDeviation(data)).toBeCloseTo(1, 12);
  });

  it('reproduces NIST StRD NumAcc4: mean 10000000.2, standard deviation 0.1, where the naive formula fails', () => {
    // NumAcc4 (from memory): 10000000.2 followed by 500 pairs 10000000.1, 10000000.3 (1001 values);
    // certified mean 10000000.2, standard deviation 0.1.
    const data = [10000000.2];
    for (let i = 0; i < 500; i++) data.push(10000000.1, 10000000.3);
    expect(mean(data)).toBeCloseTo(10000000.2, 8);
    expect(standardDeviation(data)).toBeCloseTo(0.1, 8);
    const sumSq = data.reduce((s, x) => s + x * x, 0);
    const naive = Math.sqrt((sumSq - data.length * mean(data) ** 2) / (data.length - 1));
    // The one-pass textbook formula cancels catastrophically here (it even goes negative: NaN).
    expect(Number.isNaN(naive) || Math.abs(naive - 0.1) > 1e-4).toBe(true);
  });

  it('agrees with jstat on an ordinary series of fall times', () => {
    const times = [1.642, 1.638, 1.651, 1.645, 1.640];
    expect(mean(times)).toBeCloseTo(jStat.mean(times), 14);
    expect(standardDeviation(times)).toBeCloseTo(jStat.stdev(times, true), 14);
    expect(standardError(times)).toBeCloseTo(jStat.stdev(times, true) / Math.sqrt(5), 14);
  });

  it('gives the Student-t interval mean ± t(0.975, n−1)·s/√n', () => {
    const times = [1.642, 1.638, 1.651, 1.645, 1.640];
    const stats = seriesStatistics(times);
    const half = 2.776445105 * (stats.standard_deviation! / Math.sqrt(5)); // t(0.975, 4), NIST 1.3.6.7.2
    expect(stats.t_interval![0]).toBeCloseTo(stats.mean - half, 9);
    expect(stats.t_interval![1]).toBeCloseTo(stats.mean + half, 9);
  });

  it('reports no spread for a single value instead of inventing one', () => {
    const stats = seriesStatistics([1.5]);
    expect(stats.standard_deviation).toBeNull();
    expect(stats.t_interval).toBeNull();
    expect(() => standardDeviation([1.5])).toThrow(RangeError);
  });
});
