/**
 * The two small least-squares fits that refine a found instant to a fraction of a frame (pure).
 *
 * Release: the body rests at row y0 and is let go at t_r; just after, its row is
 *   y(t) = y0                              t ≤ t_r
 *   y(t) = y0 + ½·a·τ² + b·τ⁴, τ = t − t_r  t > t_r
 * (free fall from rest seen through the camera: ½·a·τ² with a the image's acceleration in px/s². The row is a smooth
 * function of the distance fallen, and the distance an even series in τ — d = ½gτ² − k·g²·τ⁴/12 + … with drag —
 * so the first departure from the parabola, by drag or by the camera's perspective alike, is a τ⁴ term; an odd
 * term would claim a speed at release). y0, t_r, a, b are fitted together by
 * Gauss–Newton to the rest frames and the first part of the fall, so the rest row's own uncertainty is in t_r's.
 *
 * Impact: the last frames before the landing are fitted by y(t) = c0 + c1·τ + c2·τ² (τ from the last fitted frame)
 * and the instant is where it meets the contact row (the landing line less the body's radius: its bottom touches).
 *
 * Standard uncertainties come from the fits' covariance s²·(JᵀJ)⁻¹ with s² the residual variance (JCGM 100 §4.2
 * Type A from the scatter of the frames about the trajectory, so it holds the detector's own scatter and the
 * sampling of the trajectory at the frame interval), the impact's by the law of propagation (JCGM 100 §5.1.2).
 */

export interface ReleaseFit {
  release_s: number;
  u_release_s: number;
  rest_y_px: number;
  acceleration_px_s2: number;
  /** Frames used (rest and fall), and the residual standard deviation, px. */
  frames: number;
  residual_px: number;
}

export interface ImpactFit {
  impact_s: number;
  u_impact_s: number;
  /** Image speed at the contact row, px/s. */
  speed_px_s: number;
  frames: number;
  residual_px: number;
}

/** Smallest residual standard deviation the fits admit, px (a noiseless synthetic clip would claim zero). */
const RESIDUAL_FLOOR_PX = 0.05;

export function fitRelease(t: readonly number[], y: readonly number[], frame_s: number, guess: { release_s: number; acceleration_px_s2: number; rest_y_px: number }): ReleaseFit | null {
  const n = t.length;
  // Time in frames about the guess keeps the normal equations well scaled.
  const T = t.map((ti) => (ti - guess.release_s) / frame_s);
  const moving = T.filter((x) => x > 0).length;
  const np = moving >= 6 ? 4 : 3;
  const p = [guess.rest_y_px, 0, guess.acceleration_px_s2 * frame_s * frame_s, 0];
  let cov: number[][] | null = null;
  let rss = 0;
  for (let iter = 0; iter < 30; iter++) {
    const JtJ = zeros(np);
    const Jtr = new Array<number>(np).fill(0);
    rss = 0;
    for (let i = 0; i < n; i++) {
      const tau = T[i]! - p[1]!;
      const on = tau > 0;
      const model = p[0]! + (on ? 0.5 * p[2]! * tau * tau + p[3]! * tau ** 4 : 0);
      const r = y[i]! - model;
      rss += r * r;
      const J = [1, on ? -(p[2]! * tau + 4 * p[3]! * tau ** 3) : 0, on ? 0.5 * tau * tau : 0, on ? tau ** 4 : 0].slice(0, np);
      for (let a = 0; a < np; a++) {
        Jtr[a] = Jtr[a]! + J[a]! * r;
        for (let b = 0; b < np; b++) JtJ[a]![b] = JtJ[a]![b]! + J[a]! * J[b]!;
      }
    }
    cov = invert(JtJ);
    if (!cov) return null;
    let change = 0;
    for (let a = 0; a < np; a++) {
      let d = 0;
      for (let b = 0; b < np; b++) d += cov[a]![b]! * Jtr[b]!;
      // Damp a step of the release instant to two frames: the model has a kink there.
      if (a === 1) d = Math.max(-2, Math.min(2, d));
      p[a] = p[a]! + d;
      if (a === 1) change = Math.abs(d);
    }
    if (change < 1e-7 && iter > 2) break;
  }
  if (!cov || !(p[2]! > 0)) return null;
  const s2 = Math.max(rss / Math.max(1, n - np), RESIDUAL_FLOOR_PX ** 2);
  return {
    release_s: guess.release_s + p[1]! * frame_s,
    u_release_s: Math.sqrt(s2 * cov[1]![1]!) * frame_s,
    rest_y_px: p[0]!,
    acceleration_px_s2: p[2]! / (frame_s * frame_s),
    frames: n,
    residual_px: Math.sqrt(s2),
  };
}

export function fitImpact(t: readonly number[], y: readonly number[], contact_y_px: number, frame_s: number): ImpactFit | null {
  const n = t.length;
  if (n < 3) return null;
  const t0 = t[n - 1]!;
  const T = t.map((ti) => (ti - t0) / frame_s);
  const JtJ = zeros(3);
  const Jty = [0, 0, 0];
  for (let i = 0; i < n; i++) {
    const J = [1, T[i]!, T[i]! * T[i]!];
    for (let a = 0; a < 3; a++) {
      Jty[a] = Jty[a]! + J[a]! * y[i]!;
      for (let b = 0; b < 3; b++) JtJ[a]![b] = JtJ[a]![b]! + J[a]! * J[b]!;
    }
  }
  const cov = invert(JtJ);
  if (!cov) return null;
  const c = [0, 1, 2].map((a) => cov[a]![0]! * Jty[0]! + cov[a]![1]! * Jty[1]! + cov[a]![2]! * Jty[2]!) as [number, number, number];
  let rss = 0;
  for (let i = 0; i < n; i++) rss += (y[i]! - (c[0] + c[1] * T[i]! + c[2] * T[i]! * T[i]!)) ** 2;
  const s2 = Math.max(n > 3 ? rss / (n - 3) : RESIDUAL_FLOOR_PX ** 2 * 4, RESIDUAL_FLOOR_PX ** 2);
  // The root of c2·τ² + c1·τ + c0 − y_c = 0 where the body moves down (dy/dτ > 0).
  const k = c[0] - contact_y_px;
  let tau: number;
  if (Math.abs(c[2]) < 1e-12) tau = -k / c[1];
  else {
    const disc = c[1] * c[1] - 4 * c[2] * k;
    if (disc < 0) return null;
    const q = -0.5 * (c[1] + Math.sign(c[1] || 1) * Math.sqrt(disc));
    const roots = [q / c[2], k / q].filter((r) => Number.isFinite(r) && c[1] + 2 * c[2] * r > 0);
    if (roots.length === 0) return null;
    tau = roots.reduce((best, r) => (Math.abs(r) < Math.abs(best) ? r : best));
  }
  const speed = c[1] + 2 * c[2] * tau;
  if (!(speed > 0)) return null;
  // τ(c) solves F = c0 + c1 τ + c2 τ² − y_c = 0: ∂τ/∂c_k = −τ^k / F'(τ).
  const g = [-1 / speed, -tau / speed, -(tau * tau) / speed];
  let v = 0;
  for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) v += g[a]! * cov[a]![b]! * g[b]!;
  return {
    impact_s: t0 + tau * frame_s,
    u_impact_s: Math.sqrt(s2 * v) * frame_s,
    speed_px_s: speed / frame_s,
    frames: n,
    residual_px: Math.sqrt(s2),
  };
}

function zeros(n: number): number[][] {
  return Array.from({ length: n }, () => new Array<number>(n).fill(0));
}

/** Inverse of a small symmetric positive-definite matrix by Gauss–Jordan; null when singular. */
function invert(m: number[][]): number[][] | null {
  const n = m.length;
  const a = m.map((r, i) => [...r, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  for (let col = 0; col < n; col++) {
    let p = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[p]![col]!)) p = r;
    const pivot = a[p]![col]!;
    if (!(Math.abs(pivot) > 1e-12)) return null;
    [a[col], a[p]] = [a[p]!, a[col]!];
    for (let k = 0; k < 2 * n; k++) a[col]![k] = a[col]![k]! / pivot;
    for (let r = 0; r < n; r++) {
      if (r === col) continue;
      const f = a[r]![col]!;
      if (f !== 0) for (let k = 0; k < 2 * n; k++) a[r]![k] = a[r]![k]! - f * a[col]![k]!;
    }
  }
  return a.map((r) => r.slice(n));
}
