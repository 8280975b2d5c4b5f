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
  if (!(target > PHI_AT_MIN)) return { x: MIN_DRAG_X, status: 'faster-than-free-fall', iterations: 0 };
  if (!(target < PHI_AT_MAX)) return { x: MAX_DRAG_X, status: 'drag-unexplained', iterations: 0 };
  let lo = MIN_DRAG_X;
  let hi = MAX_DRAG_X;
  let x = x0 !== undefined && x0 > lo && x0 < hi ? x0 : initialGuess(target);
  const phi = scratch;
  for (let i = 1; i <= 200; i++) {
    fallTimeFactorWithDerivative(x, phi);
    const f = phi[0]! - target;
    if (f === 0) return { x, status: 'ok', iterations: i };
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
      return { x: next, status: 'ok', iterations: i };
    }
    if (hi - lo <= 1e-15 * Math.max(1, Math.abs(x))) return { x: next, status: 'ok', iterations: i };
    x = next;
  }
  return { x, status: 'not-converged', iterations: 200 };
}

const scratch = new Float64Array(2);
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
  const J = heights_m.length;
  const g = effectiveGravity_m_s2;
  if (J === 1 && !fitOffset) {
    const h = heights_m[0]!;
    const target = meanTimes_s[0]! / Math.sqrt((2 * h) / g);
    const solved = solveFallTimeFactor(target, startDragConstant !== undefined ? startDragConstant * h : undefined);
    return { status: solved.status, drag_constant_per_m: solved.x / h, offset_s: 0, iterations: solved.iterations };
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
    const solved = solveFallTimeFactor(target);
    k = Math.min(Math.max(solved.x / hMax, kLo), kHi);
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

  if (!evaluate(k)) return { status: 'not-converged', drag_constant_per_m: k, offset_s: state[OFFSET]!, iterations: 0 };
  for (let iteration = 1; iteration <= 200; iteration++) {
    const currentS = state[SUM_OF_SQUARES]!;
    let next = Math.min(Math.max(k + state[STEP]!, kLo), kHi);
    let trialStep = next - k;
    if (Math.abs(trialStep) * state[MAX_SLOPE]! <= 1e-10 * timeScale) {
      // The step moves no model time by more than 1e-10 of the longest: take it and stop. The
      // offset follows the step to first order (∂δ/∂k is minus the weighted mean slope).
      return {
        status: boundStatus(next),
        drag_constant_per_m: next,
        offset_s: state[OFFSET]! - state[MEAN_SLOPE]! * trialStep,
        iterations: iteration,
      };
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
      return { status: boundStatus(k), drag_constant_per_m: k, offset_s: state[OFFSET]!, iterations: iteration };
    }
    k = next;
  }
  return { status: 'not-converged', drag_constant_per_m: k, offset_s: state[OFFSET]!, iterations: 200 };
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
