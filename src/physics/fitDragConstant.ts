/**
 * Least-squares fit of the drag constant k (and optionally a constant timing offset δ) to the
 * mean fall times of drops from one or more heights:
 *
 *   minimise  Σ_j n_j·( t̄_j − T(h_j; k) − δ )²,   T(h; k) = √(2h/g_e)·Φ(k·h)
 *
 * Grouping drops by height loses nothing: the sum over single drops differs from this one by a
 * constant. With one height (and no offset) the minimum is where T(h; k) equals the mean time,
 * so it is solved directly by a bracketed Newton iteration on Φ. With several heights the
 * Gauss–Newton iteration runs on k alone; the optimal δ for a given k is the weighted mean
 * residual, so it is eliminated exactly (variable projection, Golub & Pereyra 1973).
 *
 * Every path is bracketed and counted, so it always ends: with a value, or with a status that
 * says why there is none (a mean time below any drag-free fall, or one no finite drag reaches).
 */
import { fallTimeFactor, fallTimeFactorWithDerivative } from './fallModel';

/** Lowest k·h searched: Φ(−20) ≈ 0.25, i.e. times down to a quarter of the drag-free time. */
const MIN_DRAG_X = -20;
/** Highest k·h searched: Φ(1e9) ≈ 22 000 drag-free times. */
const MAX_DRAG_X = 1e9;

export type DragFitStatus = 'ok' | 'faster-than-free-fall' | 'drag-unexplained' | 'not-converged';

export interface DragFit {
  status: DragFitStatus;
  drag_constant_per_m: number;
  offset_s: number;
  iterations: number;
}

/**
 * Solve Φ(x) = target for x in [MIN_DRAG_X, MAX_DRAG_X], starting near x0.
 * Returns NaN-free results: the bound itself with a status when the target is outside.
 */
export function solveFallTimeFactor(target: number, x0?: number): { x: number; status: DragFitStatus; iterations: number } {
  const status = solveFallTimeFactorInto(target, x0, solveScratch);
  return { x: solveScratch[0]!, status, iterations: solveScratch[1]! };
}

const solveScratch = new Float64Array(2);

/**
 * solveFallTimeFactor without an object per call (the Monte Carlo solves once per draw): x goes to out[0], the
 * iterations to out[1]; the status is returned.
 */
export function solveFallTimeFactorInto(target: number, x0: number | undefined, out: Float64Array): DragFitStatus {
  out[1] = 0;
  if (!(target > PHI_AT_MIN)) {
    out[0] = MIN_DRAG_X;
    return 'faster-than-free-fall';
  }
  if (!(target < PHI_AT_MAX)) {
    out[0] = MAX_DRAG_X;
    return 'drag-unexplained';
  }
  let lo = MIN_DRAG_X;
  let hi = MAX_DRAG_X;
  let x = x0 !== undefined && x0 > lo && x0 < hi ? predictedStart(target, x0) : initialGuess(target);
  const phi = scratch;
  for (let i = 1; i <= 200; i++) {
    out[1] = i;
    fallTimeFactorWithDerivative(x, phi);
    const f = phi[0]! - target;
    if (f === 0) {
      out[0] = x;
      return 'ok';
    }
    if (f < 0) lo = x;
    else hi = x;
    const step = f / phi[1]!;
    let next = x - step;
    if (!(next > lo && next < hi)) {
      // Newton left the bracket: bisect (geometrically when the bracket spans decades).
      next = lo > 0 && hi / lo > 4 ? Math.sqrt(lo * hi) : 0.5 * (lo + hi);
    } else if (Math.abs(step) <= 1e-7 * Math.max(Math.abs(x), 1e-6)) {
      // Newton converges quadratically here: the error left after this step is about
      // |Φ″/2Φ′|·step² ≤ 0.1·step², far below rounding, so no further evaluation is needed.
      out[0] = next;
      return 'ok';
    }
    if (hi - lo <= 1e-15 * Math.max(1, Math.abs(x))) {
      out[0] = next;
      return 'ok';
    }
    x = next;
  }
  out[0] = x;
  return 'not-converged';
}

const scratch = new Float64Array(2);

/**
 * A remembered expansion point of Φ: x_m, Φ(x_m), Φ′(x_m) and Φ″/(2Φ′) there (a pure function's memo of one point;
 * it changes only where the next solve starts, never its result beyond rounding).
 */
const expansion = Float64Array.of(NaN, NaN, NaN, NaN);

/**
 * Where Newton starts for a target near a given start x0: the inverse of Φ's second-order expansion about x0,
 * x = x_m + d − (Φ″/2Φ′)·d² with d = (target − Φ(x_m))/Φ′(x_m), whose error is O(d³). The Monte Carlo solves once
 * per draw from (nearly) the same nominal start, with targets a few tenths of a per cent apart: from this start the
 * first Newton step is already below the stopping size, so a draw costs one evaluation of Φ instead of three.
 * The expansion is made again (three evaluations, once) when x0 moves by more than 5 %.
 */
function predictedStart(target: number, x0: number): number {
  const e = expansion;
  if (!(Math.abs(x0 - e[0]!) <= 0.05 * Math.abs(x0))) {
    const phi = scratch;
    const step = 1e-4 * Math.max(Math.abs(x0), 1e-2);
    fallTimeFactorWithDerivative(x0 + step, phi);
    const up = phi[1]!;
    fallTimeFactorWithDerivative(x0 - step, phi);
    const down = phi[1]!;
    fallTimeFactorWithDerivative(x0, phi);
    e[0] = x0;
    e[1] = phi[0]!;
    e[2] = phi[1]!;
    e[3] = (up - down) / (2 * step) / (2 * phi[1]!);
  }
  const d = (target - e[1]!) / e[2]!;
  const x = e[0]! + d - e[3]! * d * d;
  // Far from the expansion the quadratic term can overshoot; the plain start is then the safer one.
  return Number.isFinite(x) && x > MIN_DRAG_X && x < MAX_DRAG_X && Math.abs(d) <= 0.5 * Math.max(Math.abs(e[0]!), 0.1) ? x : x0;
}
let sharedScale = new Float64Array(8);
let sharedModel = new Float64Array(8);
let sharedSlope = new Float64Array(8);
const PHI_AT_MIN = fallTimeFactor(MIN_DRAG_X);
const PHI_AT_MAX = fallTimeFactor(MAX_DRAG_X);

/** Starting point: Φ ≈ 1 + x/6 for small x, Φ ≈ (x + ln 2)/√(2x) for large x. */
function initialGuess(target: number): number {
  if (target < 1.3) return 6 * (target - 1);
  const b = Math.SQRT2 * target;
  const s = 0.5 * (b + Math.sqrt(Math.max(b * b - 4 * Math.LN2, 0)));
  return s * s;
}

/**
 * Fit k (and δ when `fitOffset`) to groups of drops.
 * heights, meanTimes and counts have one entry per distinct height.
 */
export function fitDragConstant(
  effectiveGravity_m_s2: number,
  heights_m: ArrayLike<number>,
  meanTimes_s: ArrayLike<number>,
  counts: ArrayLike<number>,
  fitOffset: boolean,
  startDragConstant?: number,
): DragFit {
  const out = fitScratch;
  const status = fitDragConstantInto(effectiveGravity_m_s2, heights_m, meanTimes_s, counts, fitOffset, startDragConstant, out);
  return { status, drag_constant_per_m: out[FIT_DRAG_CONSTANT]!, offset_s: out[FIT_OFFSET]!, iterations: out[FIT_ITERATIONS]! };
}

/** Positions in the array fitDragConstantInto fills. */
export const FIT_DRAG_CONSTANT = 0;
export const FIT_OFFSET = 1;
export const FIT_ITERATIONS = 2;
const fitScratch = new Float64Array(3);

/**
 * fitDragConstant without an object per call (the Monte Carlo fits once per draw): k, δ and the iterations go to
 * `out` at the FIT_* positions; the status is returned.
 */
export function fitDragConstantInto(
  effectiveGravity_m_s2: number,
  heights_m: ArrayLike<number>,
  meanTimes_s: ArrayLike<number>,
  counts: ArrayLike<number>,
  fitOffset: boolean,
  startDragConstant: number | undefined,
  out: Float64Array,
): DragFitStatus {
  const J = heights_m.length;
  const g = effectiveGravity_m_s2;
  if (J === 1 && !fitOffset) {
    const h = heights_m[0]!;
    const target = meanTimes_s[0]! / Math.sqrt((2 * h) / g);
    const status = solveFallTimeFactorInto(target, startDragConstant !== undefined ? startDragConstant * h : undefined, solveScratch);
    return written(out, solveScratch[0]! / h, 0, solveScratch[1]!, status);
  }

  let hMax = 0;
  let jMax = 0;
  let total = 0;
  let timeScale = 0;
  for (let j = 0; j < J; j++) {
    const h = heights_m[j]!;
    if (h > hMax) {
      hMax = h;
      jMax = j;
    }
    total += counts[j]!;
    timeScale = Math.max(timeScale, meanTimes_s[j]!);
  }
  const kLo = MIN_DRAG_X / hMax;
  const kHi = MAX_DRAG_X / hMax;
  let k: number;
  if (startDragConstant !== undefined && startDragConstant > kLo && startDragConstant < kHi) {
    k = startDragConstant;
  } else {
    // Start from the tallest height's own solution: it carries the most drag information.
    const target = meanTimes_s[jMax]! / Math.sqrt((2 * hMax) / g);
    solveFallTimeFactorInto(target, undefined, solveScratch);
    k = Math.min(Math.max(solveScratch[0]! / hMax, kLo), kHi);
  }

  // Scratch space shared by all calls (the fit runs once per Monte Carlo draw; allocating typed
  // arrays each time costs more than the arithmetic). Nothing here keeps state between calls.
  if (sharedModel.length < J) {
    sharedScale = new Float64Array(J);
    sharedModel = new Float64Array(J);
    sharedSlope = new Float64Array(J);
  }
  const scale = sharedScale;
  const model = sharedModel;
  const slope = sharedSlope;
  const phi = scratch;
  for (let j = 0; j < J; j++) scale[j] = Math.sqrt((2 * heights_m[j]!) / g);
  const boundStatus = (value: number): DragFitStatus =>
    value <= kLo ? 'faster-than-free-fall' : value >= kHi ? 'drag-unexplained' : 'ok';
  const state = gaussNewtonState;
  const evaluate = (kk: number): boolean =>
    evaluateProjected(kk, J, heights_m, meanTimes_s, counts, total, fitOffset, scale, model, slope);

  if (!evaluate(k)) return written(out, k, state[OFFSET]!, 0, 'not-converged');
  for (let iteration = 1; iteration <= 200; iteration++) {
    const currentS = state[SUM_OF_SQUARES]!;
    let next = Math.min(Math.max(k + state[STEP]!, kLo), kHi);
    let trialStep = next - k;
    if (Math.abs(trialStep) * state[MAX_SLOPE]! <= 1e-10 * timeScale) {
      // The step moves no model time by more than 1e-10 of the longest: take it and stop. The
      // offset follows the step to first order (∂δ/∂k is minus the weighted mean slope).
      return written(out, next, state[OFFSET]! - state[MEAN_SLOPE]! * trialStep, iteration, boundStatus(next));
    }
    // Accept the step if it does not increase S; otherwise halve it (at most 40 times).
    let accepted = false;
    for (let halving = 0; halving < 40; halving++) {
      if (evaluate(next) && state[SUM_OF_SQUARES]! <= currentS * (1 + 1e-12)) {
        accepted = true;
        break;
      }
      trialStep *= 0.5;
      next = k + trialStep;
      if (Math.abs(trialStep) * state[MAX_SLOPE]! <= 1e-14 * timeScale) break;
    }
    if (!accepted) {
      evaluate(k);
      return written(out, k, state[OFFSET]!, iteration, boundStatus(k));
    }
    k = next;
  }
  return written(out, k, state[OFFSET]!, 200, 'not-converged');
}

function written(out: Float64Array, dragConstant: number, offset: number, iterations: number, status: DragFitStatus): DragFitStatus {
  out[FIT_DRAG_CONSTANT] = dragConstant;
  out[FIT_OFFSET] = offset;
  out[FIT_ITERATIONS] = iterations;
  return status;
}

// Results of evaluateProjected, in a typed array rather than captured variables: the fit's
// inner loop then keeps its numbers unboxed.
const SUM_OF_SQUARES = 0;
const STEP = 1;
const OFFSET = 2;
const MEAN_SLOPE = 3;
const MAX_SLOPE = 4;
const gaussNewtonState = new Float64Array(5);

/**
 * At drag constant k: model times and slopes, the optimal offset, the (projected) residual sum of
 * squares and the Gauss–Newton step, written to gaussNewtonState. False when the step is undefined.
 */
function evaluateProjected(
  k: number,
  J: number,
  heights: ArrayLike<number>,
  times: ArrayLike<number>,
  counts: ArrayLike<number>,
  total: number,
  fitOffset: boolean,
  scale: Float64Array,
  model: Float64Array,
  slope: Float64Array,
): boolean {
  const phi = scratch;
  let sumR = 0;
  let sumD = 0;
  for (let j = 0; j < J; j++) {
    const h = heights[j]!;
    fallTimeFactorWithDerivative(k * h, phi);
    const m = scale[j]! * phi[0]!;
    const d = scale[j]! * h * phi[1]!;
    model[j] = m;
    slope[j] = d;
    sumR += counts[j]! * (times[j]! - m);
    sumD += counts[j]! * d;
  }
  const offset = fitOffset ? sumR / total : 0;
  const meanSlope = fitOffset ? sumD / total : 0;
  let S = 0;
  let num = 0;
  let den = 0;
  let maxSlope = 0;
  for (let j = 0; j < J; j++) {
    const r = times[j]! - model[j]! - offset;
    const d = slope[j]! - meanSlope;
    const n = counts[j]!;
    S += n * r * r;
    num += n * d * r;
    den += n * d * d;
    const a = Math.abs(d);
    if (a > maxSlope) maxSlope = a;
  }
  const state = gaussNewtonState;
  state[SUM_OF_SQUARES] = S;
  state[OFFSET] = offset;
  state[MEAN_SLOPE] = meanSlope;
  state[MAX_SLOPE] = maxSlope;
  if (!(den > 0)) return false;
  state[STEP] = num / den;
  return true;
}
