/**
 * Generalised least-squares fit of the drag constant k (and optionally the series' constant timing offset δ) to
 * every mark of every drop of a series, each mark a (distance fallen, time) point of the closed-form fall
 * (fallModel.ts):
 *
 *   t_im = T(d_im; k) + s_i + δ·[release known] + e_im,    T(d; k) = √(2d/g_e)·Φ(k·d)
 *
 * The errors of one drop are correlated, those of different drops independent (the series-wide systematic parts,
 * declared delay and rolling shutter, are inputs of the measurement model, not of the weights):
 *
 *   Cov(e_i) = D_i + σ_r,i²·1·1ᵀ,   D_i = diag(σ_t,i² + σ_d²/v(d_im)²)
 *
 * σ_t,i is each mark's own time reading, σ_d a random error of each mark's distance carried to its time over the
 * speed there, σ_d/v (the effective-variance method: Orear, Am. J. Phys. 50, 912 (1982)), σ_r,i the release instant's
 * error shared by every mark of a drop whose release is known. A drop whose release is estimated has its own
 * release shift s_i, a free parameter: it is eliminated exactly (variable projection, Golub & Pereyra 1973), which
 * also removes any error shared by the drop's marks. Both cases leave the weight matrix in one form,
 *
 *   M_i = D_i⁻¹ − c_i·w_i·w_iᵀ,   w_i = D_i⁻¹·1,   c_i = 1/Σw_i (shift fitted) or σ_r²/(1 + σ_r²·Σw_i) (Sherman–Morrison)
 *
 * so every quadratic form is two sums per drop and the fit costs O(marks) per iteration, whatever the number of
 * drops. Gauss–Newton on (k, δ) with the weights of the current k (iteratively reweighted: the speeds depend on k),
 * a step halved while it does not lower the sum of squares at those weights; it ends when a step moves no model time
 * by more than 1e-10 of the longest.
 */
import { fallSpeedAtHeight, fallTimeFactorWithDerivative, type FallParameters } from './fallModel';

/** One drop's points as the fit uses them (its declared delays already taken off). */
export interface MarkedDrop {
  distances_m: Float64Array;
  times_s: Float64Array;
  /** False: the drop's release time is estimated and its shift is fitted. */
  releaseKnown: boolean;
  /** Standard uncertainty of each mark's own time reading, s. */
  timeU_s: number;
  /** Standard uncertainty of the release instant, shared by the drop's marks (known release only), s. */
  releaseU_s: number;
  /** Standard uncertainty of each mark's distance, random from mark to mark, m. */
  distanceU_m: number;
}

export type MarksFitStatus = 'ok' | 'not-converged' | 'no-drag-information';

export interface MarksFit {
  status: MarksFitStatus;
  dragConstant_per_m: number;
  /** The fitted timing offset, s (0 when none is fitted). */
  offset_s: number;
  /** Per drop: the fitted release shift, s; null when the release is known. */
  shifts_s: (number | null)[];
  /** The weighted sum of squared residuals at the end (χ² in units of the declared uncertainties). */
  sumOfSquares: number;
  /** Marks less fitted parameters. */
  degreesOfFreedom: number;
  /** The linearised covariance of (k, δ) at the end: [var k, cov, var δ] (δ entries 0 when not fitted). */
  covariance: [number, number, number];
  iterations: number;
}

/** Lowest and highest k·d searched (as in fitDragConstant.ts). */
const MIN_DRAG_X = -20;
const MAX_DRAG_X = 1e9;

const phi = new Float64Array(2);

/** Model time and its k-slope at distance d. */
function modelTime(d: number, k: number, g: number, out: Float64Array): void {
  if (d <= 0) {
    out[0] = 0;
    out[1] = 0;
    return;
  }
  const scale = Math.sqrt((2 * d) / g);
  fallTimeFactorWithDerivative(k * d, phi);
  out[0] = scale * phi[0]!;
  out[1] = scale * d * phi[1]!;
}

// Scratch space shared by all calls (the fit runs once per Monte Carlo draw; allocating per call costs more than
// the arithmetic). Nothing here keeps state between calls.
let sharedModel = new Float64Array(64);
let sharedSlope = new Float64Array(64);
let sharedWeight = new Float64Array(64);
const state = new Float64Array(7);
const S_ = 0;
const A00 = 1;
const A01 = 2;
const A11 = 3;
const B0 = 4;
const B1 = 5;
const MAX_SLOPE = 6;

/** Fit k (and δ when `fitOffset`) to the drops' marks; `startK` a first guess, 1/m. */
export function fitDragToMarks(
  effectiveGravity_m_s2: number,
  drops: readonly MarkedDrop[],
  fitOffset: boolean,
  startK = 0,
  /**
   * `fixed`: use these weights (D⁻¹ per mark, in order) instead of reweighting, which makes the fit an ordinary
   * generalised least squares with a fixed weight matrix; `out`: receives the weights used at the end.
   */
  weights?: { fixed?: Float64Array; out?: Float64Array },
): MarksFit {
  const g = effectiveGravity_m_s2;
  const N = drops.length;
  let dMax = 0;
  let tMax = 0;
  let marks = 0;
  let shifts = 0;
  for (let i = 0; i < N; i++) {
    const drop = drops[i]!;
    marks += drop.times_s.length;
    if (!drop.releaseKnown) shifts++;
    for (let m = 0; m < drop.times_s.length; m++) {
      dMax = Math.max(dMax, drop.distances_m[m]!);
      tMax = Math.max(tMax, Math.abs(drop.times_s[m]!));
    }
  }
  if (sharedModel.length < marks) {
    sharedModel = new Float64Array(marks);
    sharedSlope = new Float64Array(marks);
    sharedWeight = new Float64Array(marks);
  }
  const model = sharedModel;
  const slope = sharedSlope;
  const weight = sharedWeight;
  const kLo = MIN_DRAG_X / dMax;
  const kHi = MAX_DRAG_X / dMax;
  const out = new Float64Array(2);
  const speedParams: FallParameters = { effective_gravity_m_s2: g, drag_constant_per_m: 0, effective_mass_kg: 1 };
  let noisyDistances = false;
  for (let i = 0; i < N; i++) if (drops[i]!.distanceU_m > 0) noisyDistances = true;

  /** Weights at k: D⁻¹ per mark (the speeds at k). */
  const fixed = weights?.fixed;
  if (fixed !== undefined) noisyDistances = false;
  const reweight = (k: number): void => {
    if (fixed !== undefined) {
      weight.set(fixed.subarray(0, marks));
      return;
    }
    speedParams.drag_constant_per_m = Math.max(k, 0);
    let at = 0;
    for (let i = 0; i < N; i++) {
      const drop = drops[i]!;
      const tu2 = drop.timeU_s * drop.timeU_s;
      const du = drop.distanceU_m;
      for (let m = 0; m < drop.times_s.length; m++, at++) {
        // A distance error δd moves the time at d by δd/v(d): nothing is known of a mark's time where v = 0.
        const v = du > 0 ? fallSpeedAtHeight(drop.distances_m[m]!, speedParams) : 1;
        weight[at] = v > 0 ? 1 / (tu2 + (du / v) ** 2) : 0;
      }
    }
  };
  // The normal equations at (k, δ): A = JᵀMJ (2×2, packed), b = JᵀMr, S = rᵀMr, into `state`.
  const evaluate = (k: number, delta: number): void => {
    let S = 0;
    let a00 = 0;
    let a01 = 0;
    let a11 = 0;
    let b0 = 0;
    let b1 = 0;
    let maxSlope = 0;
    let at = 0;
    for (let i = 0; i < N; i++) {
      const drop = drops[i]!;
      const known = drop.releaseKnown;
      const offset = known ? delta : 0;
      let sw = 0;
      let swr = 0;
      let swj = 0;
      let swrr = 0;
      let swjj = 0;
      let swjr = 0;
      const count = drop.times_s.length;
      for (let m = 0; m < count; m++, at++) {
        modelTime(drop.distances_m[m]!, k, g, out);
        const t = out[0]!;
        const j = out[1]!;
        model[at] = t;
        slope[at] = j;
        if (j > maxSlope) maxSlope = j;
        const w = weight[at]!;
        const r = drop.times_s[m]! - t - offset;
        const wr = w * r;
        const wj = w * j;
        sw += w;
        swr += wr;
        swj += wj;
        swrr += wr * r;
        swjj += wj * j;
        swjr += wj * r;
      }
      const rs = drop.releaseU_s * drop.releaseU_s;
      const c = known ? rs / (1 + rs * sw) : 1 / sw;
      // Columns of the Jacobian of the model time: ∂T/∂k and ∂(δ)/∂δ = 1 (known release, offset fitted).
      S += swrr - c * swr * swr;
      a00 += swjj - c * swj * swj;
      b0 += swjr - c * swj * swr;
      if (fitOffset && known) {
        a01 += swj - c * swj * sw;
        a11 += sw - c * sw * sw;
        b1 += swr - c * sw * swr;
      }
    }
    state[S_] = S;
    state[A00] = a00;
    state[A01] = a01;
    state[A11] = a11;
    state[B0] = b0;
    state[B1] = b1;
    state[MAX_SLOPE] = maxSlope;
  };
  const solve = (): [number, number] => {
    if (!fitOffset) return [state[B0]! / state[A00]!, 0];
    const det = state[A00]! * state[A11]! - state[A01]! * state[A01]!;
    return [(state[A11]! * state[B0]! - state[A01]! * state[B1]!) / det, (state[A00]! * state[B1]! - state[A01]! * state[B0]!) / det];
  };

  let k = Number.isFinite(startK) ? Math.min(Math.max(startK, kLo), kHi) : 0;
  let delta = 0;
  let status: MarksFitStatus = 'not-converged';
  let iterations = 0;
  for (let iteration = 1; iteration <= 100; iteration++) {
    iterations = iteration;
    // Fixed weights need no new evaluation after the first: the accepted step's evaluation is the current one.
    if (iteration === 1 || noisyDistances) {
      reweight(k);
      evaluate(k, delta);
    }
    if (!(state[A00]! > 0) || (fitOffset && !(state[A00]! * state[A11]! - state[A01]! * state[A01]! > 0))) {
      status = 'no-drag-information';
      break;
    }
    const current = state[S_]!;
    let [dk, dd] = solve();
    // Whether the step moves any model time by more than 1e-10 of the longest: else take it and stop.
    if (Math.abs(dk) * state[MAX_SLOPE]! + Math.abs(dd) <= 1e-10 * tMax) {
      k += dk;
      delta += dd;
      status = 'ok';
      break;
    }
    let accepted = false;
    for (let halving = 0; halving < 40; halving++) {
      const next = Math.min(Math.max(k + dk, kLo), kHi);
      evaluate(next, delta + dd);
      if (state[S_]! <= current * (1 + 1e-12) + 1e-300) {
        k = next;
        delta += dd;
        accepted = true;
        break;
      }
      dk *= 0.5;
      dd *= 0.5;
    }
    if (!accepted) {
      // No step lowers the sum of squares: the minimum at these weights, to rounding.
      status = 'ok';
      break;
    }
  }
  if (!(k > kLo && k < kHi)) status = 'not-converged';
  // The end state: residuals, shifts and the covariance at the final k.
  reweight(k);
  evaluate(k, delta);
  const det = fitOffset ? state[A00]! * state[A11]! - state[A01]! * state[A01]! : state[A00]!;
  const covariance: [number, number, number] = fitOffset ? [state[A11]! / det, -state[A01]! / det, state[A00]! / det] : [1 / state[A00]!, 0, 0];
  if (weights?.out !== undefined) weights.out.set(weight.subarray(0, marks));
  const shiftsOut: (number | null)[] = [];
  let at = 0;
  for (let i = 0; i < N; i++) {
    const drop = drops[i]!;
    let sw = 0;
    let swr = 0;
    for (let m = 0; m < drop.times_s.length; m++, at++) {
      sw += weight[at]!;
      swr += weight[at]! * (drop.times_s[m]! - model[at]!);
    }
    shiftsOut.push(drop.releaseKnown ? null : swr / sw);
  }
  return {
    status,
    dragConstant_per_m: k,
    offset_s: fitOffset ? delta : 0,
    shifts_s: shiftsOut,
    sumOfSquares: state[S_]!,
    degreesOfFreedom: marks - 1 - (fitOffset ? 1 : 0) - shifts,
    covariance,
    iterations,
  };
}
