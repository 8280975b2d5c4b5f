/**
 * Grubbs' test for one outlier in a normal sample (F. E. Grubbs, Technometrics 11 (1969) 1–21),
 * two-sided, with the critical value computed from the Student-t quantile as given in the
 * NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.5.17:
 *
 *   G = max|x_i − x̄| / s,   G_crit = (n−1)/√n · √( t² / (n − 2 + t²) ),  t = t_{1−α/(2n), n−2}
 *
 * The test only flags; nothing is ever removed from a series because of it.
 *
 * A series runs the test once per height, so at α = 0.05 per height a clean four-height series would be flagged
 * about 1 − 0.95⁴ ≈ 19 % of the time. grubbsPerSeries keeps the false-alarm rate per series at α instead: each of
 * the m heights it can test runs at α_h = 1 − (1 − α)^(1/m) (Šidák's correction for m independent tests; the
 * heights' drops are independent, so it is exact up to the test's own slight conservatism).
 */
import { mean, standardDeviation } from './seriesStatistics';
import { studentTQuantile } from './studentT';

export function grubbsCriticalValue(count: number, alpha = 0.05): number {
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(count >= 3)) throw new RangeError(`Grubbs' test needs at least 3 values, got ${count}`);
  const t = studentTQuantile(1 - alpha / (2 * count), count - 2);
  return ((count - 1) / Math.sqrt(count)) * Math.sqrt((t * t) / (count - 2 + t * t));
}

export interface GrubbsResult {
  statistic: number;
  critical_value: number;
  alpha: number;
  /** Index of the value farthest from the mean. */
  suspect_index: number;
  /** True when G exceeds the critical value. */
  outlier: boolean;
}

/** Null when the test cannot run: fewer than 3 values, or no scatter at all. */
export function grubbsTest(values: ArrayLike<number>, alpha = 0.05): GrubbsResult | null {
  const n = values.length;
  if (n < 3) return null;
  const s = standardDeviation(values);
  if (!(s > 0)) return null;
  const m = mean(values);
  let worst = 0;
  let index = 0;
  for (let i = 0; i < n; i++) {
    const d = Math.abs(values[i]! - m);
    if (d > worst) {
      worst = d;
      index = i;
    }
  }
  const statistic = worst / s;
  const critical = grubbsCriticalValue(n, alpha);
  return { statistic, critical_value: critical, alpha, suspect_index: index, outlier: statistic > critical };
}

/** The false-alarm rate per series of grubbsPerSeries: clean data is flagged in at most this share of series. */
export const SERIES_OUTLIER_FALSE_ALARM_RATE = 0.05;

/** Each group's own α so that m independent tests together raise a false alarm with probability familyAlpha. */
export function perGroupAlpha(testedGroups: number, familyAlpha = SERIES_OUTLIER_FALSE_ALARM_RATE): number {
  return testedGroups <= 1 ? familyAlpha : 1 - Math.pow(1 - familyAlpha, 1 / testedGroups);
}

/** Grubbs' test on every group (height) of a series, at the per-group α that keeps the series' rate at familyAlpha. */
export function grubbsPerSeries(groups: readonly ArrayLike<number>[], familyAlpha = SERIES_OUTLIER_FALSE_ALARM_RATE): (GrubbsResult | null)[] {
  const testable = groups.filter((g) => g.length >= 3 && standardDeviation(g) > 0).length;
  const alpha = perGroupAlpha(testable, familyAlpha);
  return groups.map((g) => grubbsTest(g, alpha));
}
