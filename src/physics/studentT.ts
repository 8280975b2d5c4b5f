/**
 * Student's t distribution: density, tail probability and quantile, for any ν > 0.
 *
 *   P(T > t) = ½·I_{ν/(ν+t²)}(ν/2, ½)  for t ≥ 0
 *
 * The quantile is found by Newton's method on ln P(T > t) against ln t, which is nearly a
 * straight line for this heavy-tailed distribution, so a few steps reach full precision even
 * far out in the tail; a bracket guards every step.
 */
import { logBeta, regularizedIncompleteBeta } from './incompleteBeta';

export function studentTDensity(t: number, dof: number): number {
  return Math.exp(-0.5 * (dof + 1) * Math.log1p((t * t) / dof) - 0.5 * Math.log(dof) - logBeta(dof / 2, 0.5));
}

/** P(T > t), accurate in the far tail. */
export function studentTUpperTail(t: number, dof: number): number {
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(dof > 0)) throw new RangeError(`degrees of freedom must be positive, got ${dof}`);
  if (t < 0) return 1 - studentTUpperTail(-t, dof);
  const t2 = t * t;
  const x = dof / (dof + t2);
  const y = t2 / (dof + t2);
  return 0.5 * regularizedIncompleteBeta(x, dof / 2, 0.5, y);
}

/** P(T ≤ t) */
export function studentTCdf(t: number, dof: number): number {
  return t >= 0 ? 1 - studentTUpperTail(t, dof) : studentTUpperTail(-t, dof);
}

/** The p-quantile t_p(ν): P(T ≤ t_p) = p, 0 < p < 1. */
export function studentTQuantile(p: number, dof: number): number {
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(p > 0 && p < 1)) throw new RangeError(`probability must be in (0, 1), got ${p}`);
  if (!(dof > 0)) throw new RangeError(`degrees of freedom must be positive, got ${dof}`);
  if (p === 0.5) return 0;
  if (p < 0.5) return -upperQuantile(p, dof);
  return upperQuantile(1 - p, dof);
}

/** t > 0 with P(T > t) = q, 0 < q < ½. */
function upperQuantile(q: number, dof: number): number {
  const target = Math.log(q);
  // Start from the Cornish–Fisher expansion around the normal quantile (A&S 26.7.5).
  const z = normalUpperQuantileApprox(q);
  let t = z + (z * z * z + z) / (4 * dof) + (5 * z ** 5 + 16 * z ** 3 + 3 * z) / (96 * dof * dof);
  if (!(t > 0) || !Number.isFinite(t)) t = 1;
  let lo = 0; // in ln t: -∞ … +∞, kept as t-bounds
  let hi = Infinity;
  for (let i = 0; i < 200; i++) {
    const tail = studentTUpperTail(t, dof);
    const g = Math.log(tail) - target;
    if (g > 0) lo = Math.max(lo, t);
    else hi = Math.min(hi, t);
    // d ln(tail)/d ln t = −t·f(t)/tail
    const slope = (-t * studentTDensity(t, dof)) / tail;
    let next = t * Math.exp(-g / slope);
    if (!(next > lo && next < hi) || !Number.isFinite(next)) {
      next = hi === Infinity ? t * 4 : Math.sqrt(Math.max(lo, 1e-300) * hi);
    }
    if (Math.abs(next - t) <= 1e-15 * t) return next;
    t = next;
  }
  return t;
}

/**
 * Upper normal quantile z with P(Z > z) = q, by P. J. Acklam's rational approximation
 * (relative error below 1.2e-9): only a starting point for the t quantile's Newton steps.
 */
function normalUpperQuantileApprox(q: number): number {
  const p = 1 - q;
  const a = [-3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239];
  const b = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
  const c = [-7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
  const pLow = 0.02425;
  if (q < pLow) {
    const r = Math.sqrt(-2 * Math.log(q));
    return -(((((c[0]! * r + c[1]!) * r + c[2]!) * r + c[3]!) * r + c[4]!) * r + c[5]!) /
      ((((d[0]! * r + d[1]!) * r + d[2]!) * r + d[3]!) * r + 1);
  }
  const u = p - 0.5;
  const r = u * u;
  return ((((((a[0]! * r + a[1]!) * r + a[2]!) * r + a[3]!) * r + a[4]!) * r + a[5]!) * u) /
    (((((b[0]! * r + b[1]!) * r + b[2]!) * r + b[3]!) * r + b[4]!) * r + 1);
}
