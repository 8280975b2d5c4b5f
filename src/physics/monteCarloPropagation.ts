/**
 * Propagation of distributions by Monte Carlo (JCGM 101:2008): draw every input from its
 * distribution, evaluate the full measurement model (fit included) for each draw, and read the
 * coverage interval off the order statistics of the results (probabilistically symmetric,
 * JCGM 101 7.7). The few order statistics needed are found by selection, not a full sort.
 *
 * Inputs are normal (Type B, or a declared timing uncertainty). The scatter between drops,
 * when it exceeds the declared timing uncertainty, is a Type A input with ν = N − p degrees of
 * freedom: following JCGM 101 6.4.9 its scale is not taken as known but drawn, s²·ν/χ²_ν, once
 * per draw, which makes the mean of a single height exactly a scaled-and-shifted t-distribution
 * and extends the same reasoning to several heights. Conditional on that draw, each height's mean
 * time is normal with variance (u_timing² + s_excess²·ν/χ²)/n_j, so one normal per height is
 * enough and the loop stays short.
 */
import { createRandom, type RandomSource } from './createRandom';
import type { BudgetInputSpec, MeasurementModel } from './uncertaintyBudget';

export interface NormalInput {
  index: number;
  /** Standard uncertainty in model units. */
  u: number;
  min?: number;
  max?: number;
}

/**
 * The drawn inputs of a budget: one normal per input index, its u weighted as in the budget. The times and the
 * scatter are drawn apart (MonteCarloSpec.times). A humidity stays within 0–1; a drawn added-mass coefficient
 * below zero has no meaning, so its change is clipped at minus the nominal value `addedMassCoefficient`.
 */
export function monteCarloNormals(specs: readonly BudgetInputSpec[], addedMassCoefficient: number): NormalInput[] {
  const normals: NormalInput[] = [];
  for (const spec of specs) {
    if (spec.input === 'time_s' || spec.input === 'scatter_s' || !(spec.standard_uncertainty > 0)) continue;
    spec.indices.forEach((index, i) => {
      const input: NormalInput = { index, u: spec.standard_uncertainty * spec.weights[i]! };
      if (spec.input === 'relative_humidity_pct') {
        input.min = 0;
        input.max = 1;
      }
      if (spec.input === 'added_mass_coefficient') input.min = -addedMassCoefficient;
      normals.push(input);
    });
  }
  return normals;
}

export interface MonteCarloSpec {
  draws: number;
  seed: number;
  normals: NormalInput[];
  /** A dew point drawn above the drawn air temperature is clipped to it. */
  dewPoint?: { index: number; temperatureIndex: number };
  times: {
    indices: number[];
    counts: number[];
    /** Declared per-drop timing standard uncertainty, s. */
    declared_s: number;
    /** Scatter in excess of it (Type A), s; 0 when none. */
    excess_s: number;
    /** Degrees of freedom of the scatter. */
    degrees_of_freedom: number;
  };
}

export interface MonteCarloSummary {
  draws: number;
  /** Draws whose model evaluation failed (no value); they are left out. */
  failed: number;
  mean: number;
  standard_deviation: number;
  interval_95: [number, number];
  /** One-sided 95 % upper bound (the 95th percentile). */
  upper_bound_95: number;
}

export interface MonteCarloResult {
  dragCoefficient: MonteCarloSummary;
  /** Same for the fitted timing offset, when there is one. */
  offset: MonteCarloSummary | null;
  /** The successful draws (partly reordered by the selection). */
  values: Float64Array;
  /**
   * With a fitted offset: the successful draws in the order drawn, each C_d beside its offset (copies taken before
   * the summaries reorder them), for a map that needs both. Null without an offset.
   */
  offsetDraws: { values: Float64Array; offsets: Float64Array } | null;
}

export function monteCarloPropagation(
  model: MeasurementModel,
  x0: Float64Array,
  spec: MonteCarloSpec,
  withOffset: boolean,
): MonteCarloResult {
  const run = new MonteCarloRun(model, x0, spec, withOffset, spec.draws);
  run.drawBatch(spec.draws);
  return run.result();
}

/**
 * The adaptive procedure of JCGM 101:2008 §7.9: draws in batches of `batch_size` until every quantity reported
 * from the draws is numerically stable. After h ≥ 2 batches, for each of the mean, the standard deviation, the
 * two ends of the 95 % interval and the one-sided 95 % bound, s = (standard deviation of its h batch values)/√h;
 * stable when 2s ≤ δ for all of them (§7.9.4 f–h), then the results come from all h·M draws together.
 *
 * Our choices, stated: M = 2000 draws per batch, J = 100/(1 − p) for p = 0.95, the least §7.2.2 allows for a
 * 95 % interval (§7.9.4 b) suggests max(J, 10⁴); the smaller batch lets a phone stop early when the result is
 * already stable, and the h ≥ 2 batches are pooled anyway). δ = u/20: the tolerance §7.9.2 gives for u stated to
 * two significant digits with leading digits 10, fixed relative to u so the cost does not jump with u's leading
 * digits. At most `max_draws` draws (a cap, so a phone never waits long); a run that reaches it says so.
 */
export interface AdaptiveMonteCarloOptions {
  batch_size: number;
  /** δ as a fraction of the standard deviation of the draws. */
  relative_tolerance: number;
  max_draws: number;
}

export const ADAPTIVE_MONTE_CARLO: AdaptiveMonteCarloOptions = { batch_size: 2000, relative_tolerance: 1 / 20, max_draws: 200_000 };

export interface AdaptiveMonteCarloResult extends MonteCarloResult {
  adaptive: {
    batch_size: number;
    batches: number;
    /** δ, in the quantity's units. */
    tolerance: number;
    relative_tolerance: number;
    max_draws: number;
    /** False when the cap stopped the draws before every quantity met the tolerance. */
    stabilized: boolean;
    /** Twice the largest s/δ ratio at the end (≤ 1 when stabilized). */
    worst_ratio: number;
  };
}

export function adaptiveMonteCarloPropagation(
  model: MeasurementModel,
  x0: Float64Array,
  spec: Omit<MonteCarloSpec, 'draws'>,
  withOffset: boolean,
  options: AdaptiveMonteCarloOptions = ADAPTIVE_MONTE_CARLO,
): AdaptiveMonteCarloResult {
  const M = options.batch_size;
  const maxBatches = Math.max(2, Math.floor(options.max_draws / M));
  // Room for a few batches at first (most runs stop early); it grows when more are needed.
  const run = new MonteCarloRun(model, x0, { ...spec, draws: maxBatches * M }, withOffset, Math.min(8, maxBatches) * M);
  // Per batch: mean, standard deviation, 2.5 %, 97.5 % and 95 % points.
  const stats: number[][] = [[], [], [], [], []];
  // The pooled mean and sum of squared deviations of all draws so far, batch by batch (Chan, Golub & LeVeque's
  // pairwise update), so that each batch's check does not pass over every earlier draw again.
  let pooledCount = 0;
  let pooledMean = 0;
  let pooledSquares = 0;
  let h = 0;
  let stabilized = false;
  let worst = Infinity;
  let tolerance = NaN;
  while (h < maxBatches) {
    const start = run.ok;
    run.drawBatch(M);
    h++;
    const batch = run.values.slice(start, run.ok);
    const summary = summarise(batch, M, 0);
    [summary.mean, summary.standard_deviation, summary.interval_95[0], summary.interval_95[1], summary.upper_bound_95].forEach((v, i) => stats[i]!.push(v));
    const n = batch.length;
    if (n > 0) {
      const squares = n > 1 ? summary.standard_deviation ** 2 * (n - 1) : 0;
      const total = pooledCount + n;
      const delta = summary.mean - pooledMean;
      pooledSquares += squares + (delta * delta * pooledCount * n) / total;
      pooledMean += (delta * n) / total;
      pooledCount = total;
    }
    if (h < 2) continue;
    tolerance = options.relative_tolerance * (pooledCount > 1 ? Math.sqrt(pooledSquares / (pooledCount - 1)) : NaN);
    worst = 0;
    for (const series of stats) worst = Math.max(worst, (2 * standardDeviationOf(series)) / Math.sqrt(h) / tolerance);
    if (worst <= 1) {
      stabilized = true;
      break;
    }
  }
  return {
    ...run.result(),
    adaptive: {
      batch_size: M,
      batches: h,
      tolerance,
      relative_tolerance: options.relative_tolerance,
      max_draws: maxBatches * M,
      stabilized,
      worst_ratio: worst,
    },
  };
}

function standardDeviationOf(v: ArrayLike<number>): number {
  const n = v.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += v[i]!;
  const m = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (v[i]! - m) ** 2;
  return n > 1 ? Math.sqrt(ss / (n - 1)) : NaN;
}

/** One stream of draws from one seed, drawn in as many batches as wanted; the same seed gives the same draws. */
class MonteCarloRun {
  private readonly random: RandomSource;
  values: Float64Array;
  private offsets: Float64Array | null;
  private readonly x: Float64Array;
  // The normal inputs as flat arrays (absent bounds as ±∞): one shape in the draw loop, whichever bounds are given.
  private readonly normalIndex: Int32Array;
  private readonly normalU: Float64Array;
  private readonly normalMin: Float64Array;
  private readonly normalMax: Float64Array;
  private readonly timeIndex: Int32Array;
  private readonly timeCount: Float64Array;
  ok = 0;
  failed = 0;
  drawn = 0;

  constructor(
    private readonly model: MeasurementModel,
    private readonly x0: Float64Array,
    private readonly spec: MonteCarloSpec,
    withOffset: boolean,
    capacity: number,
  ) {
    this.random = createRandom(spec.seed);
    this.values = new Float64Array(capacity);
    this.offsets = withOffset ? new Float64Array(capacity) : null;
    this.x = Float64Array.from(x0);
    const normals = spec.normals;
    this.normalIndex = Int32Array.from(normals, (n) => n.index);
    this.normalU = Float64Array.from(normals, (n) => n.u);
    this.normalMin = Float64Array.from(normals, (n) => n.min ?? -Infinity);
    this.normalMax = Float64Array.from(normals, (n) => n.max ?? Infinity);
    this.timeIndex = Int32Array.from(spec.times.indices);
    this.timeCount = Float64Array.from(spec.times.counts);
  }

  drawBatch(count: number): void {
    if (this.ok + count > this.values.length) {
      const size = Math.max(2 * this.values.length, this.ok + count);
      const grown = new Float64Array(size);
      grown.set(this.values.subarray(0, this.ok));
      this.values = grown;
      if (this.offsets) {
        const grownOffsets = new Float64Array(size);
        grownOffsets.set(this.offsets.subarray(0, this.ok));
        this.offsets = grownOffsets;
      }
    }
    const { model, x0, x, random, values, offsets, normalIndex, normalU, normalMin, normalMax, timeIndex, timeCount } = this;
    const { times, dewPoint } = this.spec;
    const normalCount = normalIndex.length;
    const timeInputs = timeIndex.length;
    const declaredVariance = times.declared_s * times.declared_s;
    const excessVariance = times.excess_s * times.excess_s;
    const dof = times.degrees_of_freedom;
    let ok = this.ok;
    for (let draw = 0; draw < count; draw++) {
      for (let i = 0; i < normalCount; i++) {
        const index = normalIndex[i]!;
        let value = x0[index]! + normalU[i]! * random.normal();
        if (value < normalMin[i]!) value = normalMin[i]!;
        if (value > normalMax[i]!) value = normalMax[i]!;
        x[index] = value;
      }
      if (dewPoint && x[dewPoint.index]! > x[dewPoint.temperatureIndex]!) x[dewPoint.index] = x[dewPoint.temperatureIndex]!;
      const variance = excessVariance > 0 ? declaredVariance + (excessVariance * dof) / random.chiSquare(dof) : declaredVariance;
      for (let j = 0; j < timeInputs; j++) {
        const index = timeIndex[j]!;
        x[index] = x0[index]! + Math.sqrt(variance / timeCount[j]!) * random.normal();
      }
      const cd = model.evaluate(x);
      if (model.status === 'ok' && Number.isFinite(cd)) {
        values[ok] = cd;
        if (offsets) offsets[ok] = model.offset_s;
        ok++;
      } else {
        this.failed++;
      }
    }
    this.ok = ok;
    this.drawn += count;
    model.evaluate(x0); // leave the model at its nominal point
  }

  result(): MonteCarloResult {
    const used = this.values.subarray(0, this.ok);
    const offsetDraws = this.offsets ? { values: used.slice(), offsets: this.offsets.slice(0, this.ok) } : null;
    return {
      dragCoefficient: summarise(used, this.drawn, this.failed),
      offset: this.offsets ? summarise(this.offsets.subarray(0, this.ok), this.drawn, this.failed) : null,
      values: used,
      offsetDraws,
    };
  }
}

/** Linear interpolation between order statistics of sorted values, p in [0, 1]. */
export function sortedQuantile(sorted: ArrayLike<number>, p: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const position = p * (n - 1);
  const lower = Math.floor(position);
  const upper = Math.min(lower + 1, n - 1);
  const fraction = position - lower;
  return sorted[lower]! + fraction * (sorted[upper]! - sorted[lower]!);
}

/**
 * The same quantile as sortedQuantile, of unsorted values, by selection (Hoare's FIND with
 * median-of-three pivots): reorders `values` in place, O(n) on average instead of a sort.
 */
export function selectQuantile(values: Float64Array, p: number): number {
  const n = values.length;
  if (n === 0) return NaN;
  const position = p * (n - 1);
  const lower = Math.floor(position);
  const fraction = position - lower;
  const a = selectOrderStatistic(values, lower);
  if (fraction === 0 || lower + 1 >= n) return a;
  // After selection everything right of `lower` is ≥ a: the next order statistic is their minimum.
  let b = Infinity;
  for (let i = lower + 1; i < n; i++) if (values[i]! < b) b = values[i]!;
  return a + fraction * (b - a);
}

/**
 * Reorders v[left..right] so that v[k] is its k-th smallest value, smaller ones left, larger right (the range must
 * hold the order statistics left…right of the whole array as a set).
 */
function selectOrderStatistic(v: Float64Array, k: number, left = 0, right = v.length - 1): number {
  while (right > left) {
    const mid = (left + right) >> 1;
    // Median of three as the pivot, moved to v[k]'s side of the range.
    if (v[mid]! < v[left]!) swap(v, mid, left);
    if (v[right]! < v[left]!) swap(v, right, left);
    if (v[right]! < v[mid]!) swap(v, right, mid);
    const pivot = v[mid]!;
    let i = left;
    let j = right;
    while (i <= j) {
      while (v[i]! < pivot) i++;
      while (v[j]! > pivot) j--;
      if (i <= j) {
        swap(v, i, j);
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return v[k]!;
  }
  return v[k]!;
}

function swap(v: Float64Array, i: number, j: number): void {
  const t = v[i]!;
  v[i] = v[j]!;
  v[j] = t;
}

/** The summary of a set of draws (reorders them). */
export function summariseDraws(values: Float64Array, draws: number, failed: number): MonteCarloSummary {
  return summarise(values, draws, failed);
}

function summarise(values: Float64Array, draws: number, failed: number): MonteCarloSummary {
  const n = values.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i]!;
  const m = n > 0 ? sum / n : NaN;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i]! - m) ** 2;
  // The highest quantile first: each later selection then searches only the values left of the previous one.
  const upper = selectQuantile(values, 0.975);
  const bound = n > 0 ? quantileAtOrBelow(values, 0.95, Math.floor(0.975 * (n - 1))) : NaN;
  const lower = n > 0 ? quantileAtOrBelow(values, 0.025, Math.floor(0.95 * (n - 1))) : NaN;
  return {
    draws,
    failed,
    mean: m,
    standard_deviation: n > 1 ? Math.sqrt(ss / (n - 1)) : NaN,
    interval_95: [lower, upper],
    upper_bound_95: bound,
  };
}

/**
 * selectQuantile after an earlier selection put the `last`-th order statistic in place (every value left of it
 * smaller or equal): the selection searches values[0..last] only.
 */
function quantileAtOrBelow(values: Float64Array, p: number, last: number): number {
  const n = values.length;
  const position = p * (n - 1);
  const lower = Math.floor(position);
  const fraction = position - lower;
  const a = selectOrderStatistic(values, lower, 0, last);
  if (fraction === 0 || lower + 1 >= n) return a;
  // The next order statistic: the least value right of `lower` (within the range, which holds the smaller ones).
  let b = Infinity;
  const end = lower + 1 <= last ? last : n - 1;
  for (let i = lower + 1; i <= end; i++) if (values[i]! < b) b = values[i]!;
  return a + fraction * (b - a);
}
