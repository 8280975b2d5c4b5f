/**
 * Speed-dependent drag: the drag law a series is fitted with.
 *
 * - `constant`: one C_d for the whole fall (the closed form of fallModel.ts).
 * - `scaled_sphere`: C_d(Re) = s · C_d,std(Re), the standard sphere curve (standardSphereDrag.ts) scaled by one
 *   fitted factor s, in still uniform air (fallWithVariableDrag.ts integrates each fall).
 *
 * `auto` picks `scaled_sphere` when the standard curve changes by more than the series' relative standard
 * uncertainty across the Reynolds numbers where the drag acts (chooseDragLaw), for spheres and custom shapes;
 * sharp-edged bodies (box, cylinder, disc) keep `constant`, since a fixed separation line makes their drag nearly
 * independent of Re above about 10³ (common practice).
 *
 * For a monotone relation the scaled-sphere result follows from the constant-C_d one: both are fitted to the same
 * mean times, so every Monte Carlo draw of the constant fit is mapped to its scaled-sphere value through a table
 * made by fitting both laws to the nominal mean times with their drag delay scaled (scaledSphereMap). With one
 * height the map is exact; with several it follows the direction in which timing noise moves the times most.
 */
import type { VariableDragBody } from './fallWithVariableDrag';
import { STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY, standardSphereDragCoefficient } from './standardSphereDrag';

export type DragLaw = 'constant' | 'scaled_sphere';
export type DragLawOption = DragLaw | 'auto';

/** The body of a series without its drag law: g_e, ρA/(2m_e) and ρL/μ, in still uniform air. */
export type SphereScaleBody = Omit<VariableDragBody, 'dragCoefficient'>;

/**
 * Fall time from rest through height h with C_d = s·C_d,std(Re), in still uniform air.
 *
 * In the height fallen y the motion is v·dv/dy = g_e − k·s·C_d,std(Re(v))·v² and dt/dy = 1/v. With y = u² the
 * speed grows linearly from the release (v ≈ √(2g_e)·u) and both dv/du = 2u·a(v)/v and dt/du = 2u/v are smooth
 * there, so classical Runge–Kutta on a fixed grid of u in [0, √h] integrates them; a fixed grid makes the time a
 * smooth function of s, which the fit differentiates. The steps follow the stiffness near the settling speed v_T:
 * relaxing over v_T²/(2g_e) of height needs about 3·g_e·h/v_T² steps for stability, and 48 more for accuracy
 * (within 1e-6 of fallWithVariableDrag and odex, test/physics/dragLaw.test.ts).
 */
export function scaledSphereFallTime(height_m: number, body: SphereScaleBody, scale: number): number {
  const g = body.effective_gravity_m_s2;
  const c = body.drag_constant_per_unit_cd_per_m * scale;
  const rps = body.reynolds_per_speed_s_m;
  const vT = scaledSphereTerminalVelocity(body, scale, 1e-6);
  const steps = Math.min(20_000, 48 + Math.ceil((3 * g * height_m) / (vT * vT)));
  const du = Math.sqrt(height_m) / steps;
  const release = Math.sqrt(2 * g); // dv/du at the release; dt/du there is 2/√(2g)
  const slopeV = (u: number, v: number) => (v > 0 ? (2 * u * (g - c * standardSphereDragCoefficient(rps * v) * v * v)) / v : release);
  const slopeT = (u: number, v: number) => (v > 0 ? (2 * u) / v : 2 / release);
  let v = 0;
  let t = 0;
  for (let i = 0; i < steps; i++) {
    const u = i * du;
    const k1v = slopeV(u, v);
    const k1t = slopeT(u, v);
    const v2 = v + 0.5 * du * k1v;
    const k2v = slopeV(u + 0.5 * du, v2);
    const k2t = slopeT(u + 0.5 * du, v2);
    const v3 = v + 0.5 * du * k2v;
    const k3v = slopeV(u + 0.5 * du, v3);
    const k3t = slopeT(u + 0.5 * du, v3);
    const v4 = v + du * k3v;
    const k4v = slopeV(u + du, v4);
    const k4t = slopeT(u + du, v4);
    v += (du / 6) * (k1v + 2 * k2v + 2 * k3v + k4v);
    t += (du / 6) * (k1t + 2 * k2t + 2 * k3t + k4t);
  }
  return t;
}

export interface SphereScaleFit {
  scale: number;
  offset_s: number;
  converged: boolean;
}

/**
 * The factor s (and the constant timing offset when fitted) that best reproduces the mean times, weighted by
 * the drops at each height (Gauss–Newton; ∂t/∂s by a central difference, ∂t/∂offset = 1).
 */
export function fitSphereScale(
  body: SphereScaleBody,
  heights_m: ArrayLike<number>,
  meanTimes_s: ArrayLike<number>,
  counts: ArrayLike<number>,
  fitOffset: boolean,
  startScale: number,
): SphereScaleFit {
  const J = heights_m.length;
  let s = startScale > 0 ? startScale : 1;
  let offset = 0;
  for (let iteration = 0; iteration < 40; iteration++) {
    let a11 = 0;
    let a12 = 0;
    let a22 = 0;
    let b1 = 0;
    let b2 = 0;
    const ds = 1e-5 * Math.max(Math.abs(s), 1e-3);
    for (let j = 0; j < J; j++) {
      const h = heights_m[j]!;
      const n = counts[j]!;
      const t = scaledSphereFallTime(h, body, s);
      const derivative = (scaledSphereFallTime(h, body, s + ds) - scaledSphereFallTime(h, body, s - ds)) / (2 * ds);
      const r = meanTimes_s[j]! - (t + offset);
      a11 += n * derivative * derivative;
      a12 += n * derivative;
      a22 += n;
      b1 += n * derivative * r;
      b2 += n * r;
    }
    let stepS: number;
    let stepOffset = 0;
    if (fitOffset) {
      const det = a11 * a22 - a12 * a12;
      stepS = (b1 * a22 - b2 * a12) / det;
      stepOffset = (a11 * b2 - a12 * b1) / det;
    } else {
      stepS = b1 / a11;
    }
    if (!Number.isFinite(stepS)) return { scale: s, offset_s: offset, converged: false };
    // Keep s positive: at most halve it per step.
    const next = stepS < -0.5 * s ? 0.5 * s : s + stepS;
    offset += stepOffset;
    const change = Math.abs(next - s);
    s = next;
    if (change <= 1e-11 * s && Math.abs(stepOffset) < 1e-12) return { scale: s, offset_s: offset, converged: true };
  }
  return { scale: s, offset_s: offset, converged: false };
}

/** Terminal (settling) speed with C_d = s·C_d,std(Re): g_e = (ρA/2m_e)·s·C_d,std(ρLv/μ)·v², by bisection on ln v. */
export function scaledSphereTerminalVelocity(body: SphereScaleBody, scale: number, relativeTolerance = 1e-13): number {
  const g = body.effective_gravity_m_s2;
  const c = body.drag_constant_per_unit_cd_per_m * scale;
  const excess = (v: number) => c * standardSphereDragCoefficient(body.reynolds_per_speed_s_m * v) * v * v - g;
  let low = 1e-9;
  let high = 1;
  while (excess(high) < 0 && high < 1e6) high *= 4;
  for (let i = 0; i < 200 && high - low > relativeTolerance * high; i++) {
    const mid = Math.sqrt(low * high);
    if (excess(mid) < 0) low = mid;
    else high = mid;
  }
  return Math.sqrt(low * high);
}

export interface DragLawChoice {
  law: DragLaw;
  /** The Reynolds numbers over which the law was judged: half the lowest impact Re up to the highest. */
  reynolds_range: [number, number];
  /** |C_d,std(low)/C_d,std(high) − 1|, both Reynolds numbers capped at NEWTON_REGIME_REYNOLDS. */
  sphere_curve_change: number;
  reason: string;
}

/**
 * Above this Reynolds number a sphere is in Newton's regime, where its drag is nearly constant (about 0.4–0.5 up
 * to the drag crisis; common practice) and measured standard curves differ by up to about 10 % between wind tunnels
 * (standardSphereDrag.ts): the curve's shape there cannot be told from a constant, so `auto` counts only the change
 * below it.
 */
export const NEWTON_REGIME_REYNOLDS = 2e3;

/**
 * The rule of `auto`: the standard sphere curve's relative change between half the lowest impact Reynolds number
 * (below half its impact speed a body feels at most a quarter of its drag) and the highest impact Reynolds number,
 * both capped at NEWTON_REGIME_REYNOLDS, against the series' relative standard uncertainty of C_d, and at least the
 * curve's own stated 5 % (STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY). Larger: a constant C_d is the wrong model. In
 * practice this picks the scaled curve for seeds, particles and small light bodies, and a constant C_d for balls.
 */
export function chooseDragLaw(
  option: DragLawOption,
  shape: string,
  impactReynolds: readonly number[],
  relativeUncertainty: number,
): DragLawChoice {
  const low = 0.5 * Math.min(...impactReynolds);
  const high = Math.max(...impactReynolds);
  const lowCapped = Math.min(low, NEWTON_REGIME_REYNOLDS);
  const highCapped = Math.min(high, NEWTON_REGIME_REYNOLDS);
  const change = low > 0 && high > 0 ? Math.abs(standardSphereDragCoefficient(lowCapped) / standardSphereDragCoefficient(highCapped) - 1) : 0;
  const range: [number, number] = [low, high];
  if (option !== 'auto') return { law: option, reynolds_range: range, sphere_curve_change: change, reason: 'requested' };
  if (shape !== 'sphere' && shape !== 'custom') {
    return { law: 'constant', reynolds_range: range, sphere_curve_change: change, reason: `a ${shape} has sharp edges: its drag depends little on Re` };
  }
  const threshold = Math.max(relativeUncertainty, STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY);
  const speedDependent = change > threshold;
  return {
    law: speedDependent ? 'scaled_sphere' : 'constant',
    reynolds_range: range,
    sphere_curve_change: change,
    reason: speedDependent
      ? `a sphere's drag changes by ${(100 * change).toPrecision(2)} % across Re ${low.toPrecision(3)}–${high.toPrecision(3)}, more than the ${(100 * threshold).toPrecision(2)} % the series (or the curve itself) can tell`
      : `a sphere's drag changes by ${(100 * change).toPrecision(2)} % across Re ${low.toPrecision(3)}–${high.toPrecision(3)}, within the ${(100 * threshold).toPrecision(2)} % the series (or the curve itself) can tell`,
  };
}

/** One row of the map from a constant-C_d fit to the scaled-sphere fit of the same times. */
export interface ScaledSphereRow {
  constantCd: number;
  scale: number;
  terminalVelocity_m_s: number;
  /** s·C_d,std at the terminal Reynolds number. */
  terminalCd: number;
  /** With a fitted offset: the scaled law's fitted offset less the constant law's, on the same times; else 0. */
  offsetShift_s: number;
}

/** Piecewise-linear interpolation in a table sorted by constantCd, extended linearly beyond both ends. */
export function interpolateRow(
  table: readonly ScaledSphereRow[],
  constantCd: number,
  key: 'scale' | 'terminalCd' | 'terminalVelocity_m_s' | 'offsetShift_s',
): number {
  let i = 0;
  while (i < table.length - 2 && constantCd > table[i + 1]!.constantCd) i++;
  const a = table[i]!;
  const b = table[i + 1]!;
  const f = (constantCd - a.constantCd) / (b.constantCd - a.constantCd);
  return a[key] + f * (b[key] - a[key]);
}

/** Weighted least-squares slope of values against x, with its standard error from the values' own uncertainties. */
export function weightedTrend(x: readonly number[], values: readonly number[], u: readonly number[]): { slope: number; standard_error: number } {
  let sw = 0;
  let swx = 0;
  let swy = 0;
  for (let j = 0; j < x.length; j++) {
    const w = 1 / (u[j]! * u[j]!);
    sw += w;
    swx += w * x[j]!;
    swy += w * values[j]!;
  }
  const mx = swx / sw;
  const my = swy / sw;
  let sxx = 0;
  let sxy = 0;
  for (let j = 0; j < x.length; j++) {
    const w = 1 / (u[j]! * u[j]!);
    sxx += w * (x[j]! - mx) ** 2;
    sxy += w * (x[j]! - mx) * (values[j]! - my);
  }
  return { slope: sxy / sxx, standard_error: 1 / Math.sqrt(sxx) };
}
