/**
 * Mean, standard deviation, standard error and the Student-t interval of a set of repeated
 * measurements (GUM, JCGM 100:2008, 4.2: Type A evaluation).
 */
import { studentTQuantile } from './studentT';

export function mean(values: ArrayLike<number>): number {
  const n = values.length;
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (n === 0) throw new RangeError('mean of no values');
  // Shifted sum: exact for constant input and no loss for values far from zero.
  const shift = values[0]!;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i]! - shift;
  return shift + sum / n;
}

/** Sample standard deviation (n − 1 in the denominator), by the two-pass formula. */
export function standardDeviation(values: ArrayLike<number>): number {
  const n = values.length;
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (n < 2) throw new RangeError('standard deviation needs at least two values');
  const m = mean(values);
  let ss = 0;
  let s = 0;
  for (let i = 0; i < n; i++) {
    const d = values[i]! - m;
    ss += d * d;
    s += d;
  }
  // Corrected two-pass algorithm (Chan, Golub, LeVeque 1983): removes the mean's rounding.
  return Math.sqrt((ss - (s * s) / n) / (n - 1));
}

export function standardError(values: ArrayLike<number>): number {
  return standardDeviation(values) / Math.sqrt(values.length);
}

export interface SeriesStatistics {
  count: number;
  mean: number;
  /** Null below two values. */
  standard_deviation: number | null;
  standard_error: number | null;
  /** Mean ± t_{(1+level)/2, n−1}·s/√n; null below two values. */
  t_interval: [number, number] | null;
  level: number;
}

export function seriesStatistics(values: ArrayLike<number>, level = 0.95): SeriesStatistics {
  const n = values.length;
  const m = mean(values);
  if (n < 2) {
    return { count: n, mean: m, standard_deviation: null, standard_error: null, t_interval: null, level };
  }
  const s = standardDeviation(values);
  const se = s / Math.sqrt(n);
  const t = studentTQuantile((1 + level) / 2, n - 1);
  return { count: n, mean: m, standard_deviation: s, standard_error: se, t_interval: [m - t * se, m + t * se], level };
}
