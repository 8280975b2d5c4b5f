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

interface Work {
  model: Float64Array;
  slope: Float64Array;
  weight: Float64Array;
}

function workFor(drops: readonly MarkedDrop[]): Work[] {
  return drops.map((d) => ({ model: new Float64Array(d.times_s.length), slope: new Float64Array(d.times_s.length), weight: new Float64Array(d.times_s.length) }));
}

/** Fit k (and δ when `fitOffset`) to the drops' marks; `startK` a first guess, 1/m. */
export function fitDragToMarks(effectiveGravity_m_s2: number, drops: readonly MarkedDrop[], fitOffset: boolean, startK = 0): MarksFit {
  const g = effectiveGravity_m_s2;
  const work = workFor(drops);
  let dMax = 0;
  let tMax = 0;
  let marks = 0;
  let shifts = 0;
  for (const drop of drops) {
    marks += drop.times_s.length;
    if (!drop.releaseKnown) shifts++;
    for (let m = 0; m < drop.times_s.length; m++) {
      dMax = Math.max(dMax, drop.distances_m[m]!);
      tMax = Math.max(tMax, Math.abs(drop.times_s[m]!));
    }
  }
  const kLo = MIN_DRAG_X / dMax;
  const kHi = MAX_DRAG_X / dMax;
  const out = new Float64Array(2);
  const speedParams: FallParameters = { effective_gravity_m_s2: g, drag_constant_per_m: 0, effective_mass_kg: 1 };

  /** Weights at k: D⁻¹ per mark (the speeds at k), kept in work[i].weight. */
  const reweight = (k: number): void => {
    speedParams.drag_constant_per_m = Math.max(k, 0);
    drops.forEach((drop, i) => {
      const w = work[i]!.weight;
      for (let m = 0; m < w.length; m++) {
        // A distance error δd moves the time at d by δd/v(d): nothing is known of a mark's time where v = 0.
        const v = drop.distanceU_m > 0 ? fallSpeedAtHeight(drop.distances_m[m]!, speedParams) : 1;
        w[m] = v > 0 ? 1 / (drop.timeU_s * drop.timeU_s + (drop.distanceU_m / v) ** 2) : 0;
      }
    });
  };
  // The normal equations at (k, δ): A = JᵀMJ (2×2, packed), b = JᵀMr, S = rᵀMr.
  const state = { S: 0, a00: 0, a01: 0, a11: 0, b0: 0, b1: 0, maxSlope: 0 };
  const evaluate = (k: number, delta: number): void => {
    let S = 0;
    let a00 = 0;
    let a01 = 0;
    let a11 = 0;
    let b0 = 0;
    let b1 = 0;
    let maxSlope = 0;
    drops.forEach((drop, i) => {
      const { model, slope, weight } = work[i]!;
      const known = drop.releaseKnown;
      const offset = known ? delta : 0;
      const uses = fitOffset && known ? 1 : 0;
      let sw = 0;
      let swr = 0;
      let swj = 0;
      let swrr = 0;
      let swjj = 0;
      let swjr = 0;
      for (let m = 0; m < model.length; m++) {
        modelTime(drop.distances_m[m]!, k, g, out);
        model[m] = out[0]!;
        slope[m] = out[1]!;
        if (out[1]! > maxSlope) maxSlope = out[1]!;
        const w = weight[m]!;
        const r = drop.times_s[m]! - out[0]! - offset;
        sw += w;
        swr += w * r;
        swj += w * out[1]!;
        swrr += w * r * r;
        swjj += w * out[1]! * out[1]!;
        swjr += w * out[1]! * r;
      }
      const rs = drop.releaseU_s * drop.releaseU_s;
      const c = known ? rs / (1 + rs * sw) : 1 / sw;
      // Columns of the Jacobian of the model time: ∂T/∂k and ∂(δ)/∂δ = 1 (known release, offset fitted).
      S += swrr - c * swr * swr;
      a00 += swjj - c * swj * swj;
      b0 += swjr - c * swj * swr;
      if (uses) {
        a01 += swj - c * swj * sw;
        a11 += sw - c * sw * sw;
        b1 += swr - c * sw * swr;
      }
    });
    Object.assign(state, { S, a00, a01, a11, b0, b1, maxSlope });
  };
  const solve = (): [number, number] => {
    if (!fitOffset) return [state.b0 / state.a00, 0];
    const det = state.a00 * state.a11 - state.a01 * state.a01;
    return [(state.a11 * state.b0 - state.a01 * state.b1) / det, (state.a00 * state.b1 - state.a01 * state.b0) / det];
  };

  let k = Number.isFinite(startK) ? Math.min(Math.max(startK, kLo), kHi) : 0;
  let delta = 0;
  let status: MarksFitStatus = 'not-converged';
  let iterations = 0;
  for (let iteration = 1; iteration <= 100; iteration++) {
    iterations = iteration;
    reweight(k);
    evaluate(k, delta);
    if (!(state.a00 > 0) || (fitOffset && !(state.a00 * state.a11 - state.a01 * state.a01 > 0))) {
      status = 'no-drag-information';
      break;
    }
    const current = state.S;
    let [dk, dd] = solve();
    // Whether the step moves any model time by more than 1e-10 of the longest: else take it and stop.
    if (Math.abs(dk) * state.maxSlope + Math.abs(dd) <= 1e-10 * tMax) {
      k += dk;
      delta += dd;
      status = 'ok';
      break;
    }
    let accepted = false;
    for (let halving = 0; halving < 40; halving++) {
      const next = Math.min(Math.max(k + dk, kLo), kHi);
      evaluate(next, delta + dd);
      if (state.S <= current * (1 + 1e-12) + 1e-300) {
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
  const det = fitOffset ? state.a00 * state.a11 - state.a01 * state.a01 : state.a00;
  const covariance: [number, number, number] = fitOffset ? [state.a11 / det, -state.a01 / det, state.a00 / det] : [1 / state.a00, 0, 0];
  const shiftsOut = drops.map((drop, i) => {
    if (drop.releaseKnown) return null;
    const { model, weight } = work[i]!;
    let sw = 0;
    let swr = 0;
    for (let m = 0; m < model.length; m++) {
      sw += weight[m]!;
      swr += weight[m]! * (drop.times_s[m]! - model[m]!);
    }
    return swr / sw;
  });
  return {
    status,
    dragConstant_per_m: k,
    offset_s: fitOffset ? delta : 0,
    shifts_s: shiftsOut,
    sumOfSquares: state.S,
    degreesOfFreedom: marks - 1 - (fitOffset ? 1 : 0) - shifts,
    covariance,
    iterations,
  };
}
