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
import { STANDARD_SPHERE_DRAG_PIECE_LIMITS, STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY, standardSphereDragCoefficient } from './standardSphereDrag';

export type DragLaw = 'constant' | 'scaled_sphere';
export type DragLawOption = DragLaw | 'auto';

/** The body of a series without its drag law: g_e, ρA/(2m_e) and ρL/μ, in still uniform air. */
export type SphereScaleBody = Omit<VariableDragBody, 'dragCoefficient'>;

/**
 * Fall time from rest through height h with C_d = s·C_d,std(Re), in still uniform air.
 *
 * With the speed as the variable the fall is two quadratures: dt/dv = 1/a(v) and dy/dv = v/a(v), where
 * a(v) = g_e − k·s·C_d,std(ρLv/μ)·v² vanishes at the settling speed v_T. Substituting w = −ln(1 − v/v_T) removes that
 * end's singularity (dv = (v_T − v)·dw, and (v_T − v)/a(v) stays finite), so dt/dw = (v_T − v)/a and
 * dy/dw = v·(v_T − v)/a are smooth within each piece of the standard curve. The curve's pieces meet at fixed Reynolds
 * numbers with a jump of up to 0.8 % (standardSphereDrag.ts); every piece is integrated on its own, by 8-point
 * Gauss–Legendre panels (Abramowitz & Stegun, Table 25.4) at most half a unit of w wide, and at most three times as
 * far from w = 0 as they start, where the pieces' formulas have their singularity (Re = 0). The fall ends at the w
 * where y = h (Newton within the last panel). Past w = 12 (within 6e-6 of v_T) the rest of the fall follows the
 * linearised approach to v_T in closed form. No fixed steps and no jumps: the time is as smooth in s as the curve
 * itself, for the fit to differentiate, and agrees with odex to about 1e-10 (test/physics/dragLaw.test.ts).
 */
export function scaledSphereFallTime(height_m: number, body: SphereScaleBody, scale: number): number {
  return fallTimeAtSettlingSpeed(height_m, body, scale, scaledSphereTerminalVelocity(body, scale));
}

/** scaledSphereFallTime with the settling speed of this factor already known (a fit needs it once per factor, not per height). */
function fallTimeAtSettlingSpeed(height_m: number, body: SphereScaleBody, scale: number, vT: number): number {
  const g = body.effective_gravity_m_s2;
  const c = body.drag_constant_per_unit_cd_per_m * scale;
  const rps = body.reynolds_per_speed_s_m;
  const acceleration = (v: number) => (v > 0 ? g - c * standardSphereDragCoefficient(rps * v) * v * v : g);
  // t and y gained over [w0, w1], one panel.
  const panel = (w0: number, w1: number, out: Float64Array): void => {
    const half = 0.5 * (w1 - w0);
    const mid = w0 + half;
    let t = 0;
    let y = 0;
    for (let i = 0; i < GAUSS_NODES.length; i++) {
      for (const sign of SIGNS) {
        const w = mid + sign * half * GAUSS_NODES[i]!;
        const gap = vT * Math.exp(-w);
        const v = -vT * Math.expm1(-w);
        const dt = (GAUSS_WEIGHTS[i]! * gap) / acceleration(v);
        t += dt;
        y += dt * v;
      }
    }
    out[0] = t * half;
    out[1] = y * half;
  };
  // The pieces in w: from the release to each of the curve's limits below v_T, then on to W_END.
  const edges = [0];
  for (const re of STANDARD_SPHERE_DRAG_PIECE_LIMITS) {
    const v = re / rps;
    if (v >= vT) break;
    const w = -Math.log1p(-v / vT);
    if (w >= W_END) break;
    edges.push(w);
  }
  edges.push(W_END);
  const gained = panelScratch;
  let t = 0;
  let y = 0;
  for (let p = 0; p + 1 < edges.length; p++) {
    const end = edges[p + 1]!;
    let w0 = edges[p]!;
    while (w0 < end) {
      const w1 = Math.min(end, w0 + PANEL_WIDTH, w0 > 0 && p > 0 ? 3 * w0 : end);
      panel(w0, w1, gained);
      if (y + gained[1]! >= height_m) {
        // The fall ends in this panel: Newton on the end point ω, y(ω) = h, with dy/dω = v(v_T − v)/a at ω.
        let omega = w0 + ((w1 - w0) * (height_m - y)) / gained[1]!;
        for (let i = 0; i < 60; i++) {
          panel(w0, omega, gained);
          const v = -vT * Math.expm1(-omega);
          const slope = (v * vT * Math.exp(-omega)) / acceleration(v);
          const step = (y + gained[1]! - height_m) / slope;
          omega = Math.min(w1, Math.max(w0, omega - step));
          if (Math.abs(step) <= 1e-14 * Math.max(omega, 1e-3)) break;
        }
        panel(w0, omega, gained);
        return t + gained[0]!;
      }
      t += gained[0]!;
      y += gained[1]!;
      w0 = w1;
    }
  }
  // Within 6e-6 of v_T: a(v) ≈ −λ·(v − v_T), so the gap to v_T decays as e^(−λτ) and y grows by
  // v_T·τ − gap·(1 − e^(−λτ))/λ; solve that for the rest of the height (Newton; dy/dτ is the speed).
  const gap = vT * Math.exp(-W_END);
  const lambda = (acceleration(vT * (1 - 1e-7)) - acceleration(vT * (1 + 1e-7))) / (2e-7 * vT);
  const rest = height_m - y;
  let tau = rest / vT;
  for (let i = 0; i < 60; i++) {
    const decay = Math.exp(-lambda * tau);
    const step = (vT * tau - (gap * -Math.expm1(-lambda * tau)) / lambda - rest) / (vT - gap * decay);
    tau -= step;
    if (Math.abs(step) <= 1e-15 * tau) break;
  }
  return t + tau;
}

/** Abscissae (±) and weights of 8-point Gauss–Legendre quadrature on [−1, 1] (Abramowitz & Stegun, Table 25.4). */
const GAUSS_NODES = [0.1834346424956498, 0.525532409916329, 0.7966664774136267, 0.9602898564975363];
const GAUSS_WEIGHTS = [0.362683783378362, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];
const SIGNS = [-1, 1] as const;
/** The widest panel in w (a unit of w is one e-fold of the gap to the settling speed). */
const PANEL_WIDTH = 0.5;
/** Where the quadrature hands over to the linearised approach: the gap to v_T is then e^−12 ≈ 6e-6 of v_T. */
const W_END = 12;
const panelScratch = new Float64Array(2);

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
    const vT = scaledSphereTerminalVelocity(body, s);
    const vUp = scaledSphereTerminalVelocity(body, s + ds);
    const vDown = scaledSphereTerminalVelocity(body, s - ds);
    for (let j = 0; j < J; j++) {
      const h = heights_m[j]!;
      const n = counts[j]!;
      const t = fallTimeAtSettlingSpeed(h, body, s, vT);
      const derivative = (fallTimeAtSettlingSpeed(h, body, s + ds, vUp) - fallTimeAtSettlingSpeed(h, body, s - ds, vDown)) / (2 * ds);
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
