/**
 * Exact closed forms for a body released from rest in still air, with quadratic drag,
 * buoyancy and added mass:
 *
 *   (m + C_a·ρ·V)·dv/dt = (m − ρ·V)·g − ½·ρ·C_d·A·v²
 *
 * which is dv/dt = g_e − k·v² with the effective gravity g_e = g·(m − ρV)/(m + C_aρV) and the
 * drag constant k = ρ·C_d·A / (2·(m + C_aρV)) (1/m). With v_t = √(g_e/k) and τ = 1/√(g_e·k):
 *
 *   v(t) = v_t·tanh(t/τ)          y(t) = ln cosh(t/τ) / k
 *   t(h) = τ·arccosh(e^{k·h})     v(h) = v_t·√(1 − e^{−2kh})
 *
 * (textbook results, e.g. any mechanics text's treatment of quadratic air resistance).
 *
 * Numerics. Written as written above, these lose everything as k → 0 (τ → ∞ times
 * arccosh → 0; v_t → ∞ times √(…) → 0) and overflow for long falls (cosh, e^{kh}). So each is
 * rewritten as the vacuum result times a dimensionless factor of one variable, and that factor
 * is evaluated without cancellation:
 *
 *   t(h) = √(2h/g_e)·Φ(kh),  Φ(x) = arccosh(e^x)/√(2x) = (x + log1p(√(−expm1(−2x))))/√(2x)
 *   y(t) = ½·g_e·t²·Λ(s),    Λ(s) = 2·ln cosh(s)/s², s = t·√(g_e·k)
 *   v(t) = g_e·t·tanh(s)/s
 *   v(h) = √(2·g_e·h·R(2kh)), R(y) = −expm1(−y)/y
 *
 * with Taylor series near zero (coefficients derived symbolically, checked against the closed
 * forms where both are accurate) and ln cosh(s) = s − ln 2 + log1p(e^{−2s}) for large s. No
 * step takes an exponential of a growing argument, so a 10 km fall of a feather is as safe as
 * a short one.
 *
 * The fit also needs Φ for small negative x: the same ODE with the drag sign reversed gives
 * Φ(x) = arccos(e^x)/√(−2x), the analytic continuation of the same power series. It lets a
 * least-squares fit pass smoothly through C_d = 0 when drag is hidden in timing noise.
 */
import { PhysicsInputError } from './physicsInputError';

export interface FallParameters {
  /** g_e = g·(m − ρV)/(m + C_aρV), m/s² */
  effective_gravity_m_s2: number;
  /** k = ρ·C_d·A/(2·(m + C_aρV)), 1/m */
  drag_constant_per_m: number;
  /** m + C_aρV, kg */
  effective_mass_kg: number;
}

export interface FallBody {
  mass_kg: number;
  /** Frontal area, m² */
  area_m2: number;
  volume_m3: number;
  drag_coefficient: number;
  density_kg_m3: number;
  gravity_m_s2: number;
  /** Default true: the air's up-thrust ρ·V·g is subtracted from the weight. */
  buoyancy?: boolean;
  /** Default 0: the air dragged along adds C_a·ρ·V to the inertia. */
  added_mass_coefficient?: number;
}

/** Effective gravity, effective mass and the drag constant of a body in air. */
export function fallParameters(body: FallBody): FallParameters {
  const buoyancy = body.buoyancy ?? true;
  const Ca = body.added_mass_coefficient ?? 0;
  const displaced = body.density_kg_m3 * body.volume_m3;
  const weightMass = body.mass_kg - (buoyancy ? displaced : 0);
  if (!(weightMass > 0)) {
    throw new PhysicsInputError({
      code: 'not-heavier-than-air',
      field: 'specimen.mass_kg',
      value: body.mass_kg,
      allowed: `more than the displaced air, ${displaced.toPrecision(4)} kg`,
    });
  }
  const effectiveMass = body.mass_kg + Ca * displaced;
  return {
    // The ratio first: it is exactly 1 without buoyancy and added mass, so g_e is exactly g.
    effective_gravity_m_s2: body.gravity_m_s2 * (weightMass / effectiveMass),
    drag_constant_per_m: (body.density_kg_m3 * body.drag_coefficient * body.area_m2) / (2 * effectiveMass),
    effective_mass_kg: effectiveMass,
  };
}

/** Below this, distance and speed use their own short series (their closed forms cancel there). */
const SERIES_LIMIT = 2e-3;

/**
 * Taylor coefficients of Φ(x) = arccosh(e^x)/√(2x) about 0 (exact rationals, derived with a
 * computer-algebra system from w² = arccosh(e^x)², which is analytic). Φ's nearest singularity
 * is at x = ±iπ, so at |x| ≤ ½ the first omitted term is below 3e-20: the series is exact to
 * rounding there, and cheaper than the exponentials and logarithms of the closed form.
 */
const PHI_SERIES = [
  1,
  1 / 6,
  1 / 120,
  -1 / 336,
  -1 / 5760,
  19 / 126720,
  79 / 12579840,
  -11 / 1161216,
  -2339 / 7896268800,
  11813 / 17650483200,
  677 / 40874803200,
  -2117 / 41783132160,
  -308963 / 297568567296000,
  64604977 / 16068702633984000,
  131301607 / 1863969505542144000,
  -263101079 / 797007650645606400,
  -5614643 / 1110015775604736000,
  1768132943 / 63573630784634880000,
  46949081169401 / 123886951488110544814080000,
  -9606907803497 / 4017955183398179831808000,
];
const PHI_SERIES_LIMIT = 0.5;

const phiScratch = new Float64Array(2);

/**
 * Φ(x) = t(h)/t_0(h) with x = k·h: the fall time over the drag-free time √(2h/g_e).
 * Φ(0) = 1, increasing in x; defined for every real x (x < 0 is the continuation used by fits).
 */
export function fallTimeFactor(x: number): number {
  fallTimeFactorWithDerivative(x, phiScratch);
  return phiScratch[0]!;
}

/** dΦ/dx, for Newton steps and sensitivities. */
export function fallTimeFactorDerivative(x: number): number {
  fallTimeFactorWithDerivative(x, phiScratch);
  return phiScratch[1]!;
}

/**
 * Φ(x) and Φ′(x) together, sharing their exponentials and roots (the fits call this in their
 * inner loops): writes Φ to out[0] and Φ′ to out[1].
 */
export function fallTimeFactorWithDerivative(x: number, out: Float64Array): void {
  if (Math.abs(x) < PHI_SERIES_LIMIT) {
    // Horner for Φ and Φ′ at once.
    const n = PHI_SERIES.length - 1;
    let value = PHI_SERIES[n]!;
    let derivative = 0;
    for (let i = n - 1; i >= 0; i--) {
      derivative = derivative * x + value;
      value = value * x + PHI_SERIES[i]!;
    }
    out[0] = value;
    out[1] = derivative;
    return;
  }
  if (x > 0) {
    const oneMinus = -Math.expm1(-2 * x);
    const root = Math.sqrt(oneMinus);
    const w = x + Math.log1p(root);
    const r2x = Math.sqrt(2 * x);
    out[0] = w / r2x;
    out[1] = (1 / root - w / (2 * x)) / r2x;
    return;
  }
  const q = -x;
  const u = -Math.expm1(-q);
  const arccos = 2 * Math.asin(Math.sqrt(u / 2));
  const r2q = Math.sqrt(2 * q);
  out[0] = arccos / r2q;
  out[1] = (arccos / (2 * q) - 1 / Math.sqrt(Math.expm1(2 * q))) / r2q;
}

/** Time to fall `height_m` from rest. */
export function fallTime(height_m: number, p: FallParameters): number {
  if (height_m <= 0) return 0;
  return Math.sqrt((2 * height_m) / p.effective_gravity_m_s2) * fallTimeFactor(p.drag_constant_per_m * height_m);
}

/** ∂t/∂k at fixed height: how much a fall lengthens per unit of the drag constant. */
export function fallTimeDragDerivative(height_m: number, p: FallParameters): number {
  if (height_m <= 0) return 0;
  return (
    Math.sqrt((2 * height_m) / p.effective_gravity_m_s2) *
    height_m *
    fallTimeFactorDerivative(p.drag_constant_per_m * height_m)
  );
}

/** Time between passing `from_m` and `to_m` below the release point (a pair of light gates). */
export function timeBetweenHeights(from_m: number, to_m: number, p: FallParameters): number {
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(to_m >= from_m && from_m >= 0)) {
    throw new RangeError(`timeBetweenHeights needs 0 <= from_m <= to_m, got ${from_m}, ${to_m}`);
  }
  return fallTime(to_m, p) - fallTime(from_m, p);
}

/** ln cosh(s) for s ≥ 0 without overflow or cancellation. */
export function logCosh(s: number): number {
  const a = Math.abs(s);
  if (a <= 1) {
    const half = Math.sinh(a / 2);
    return Math.log1p(2 * half * half); // cosh s − 1 = 2 sinh²(s/2)
  }
  return a - Math.LN2 + Math.log1p(Math.exp(-2 * a));
}

function requireNonNegativeDrag(p: FallParameters): void {
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(p.drag_constant_per_m >= 0)) {
    throw new RangeError(`this closed form needs a drag constant >= 0, got ${p.drag_constant_per_m}`);
  }
}

/** Distance fallen after `time_s`. */
export function fallDistance(time_s: number, p: FallParameters): number {
  requireNonNegativeDrag(p);
  if (time_s <= 0) return 0;
  const g = p.effective_gravity_m_s2;
  const s = time_s * Math.sqrt(g * p.drag_constant_per_m);
  let factor: number;
  if (s < SERIES_LIMIT) {
    const s2 = s * s;
    // Λ = 1 − s²/6 + 2s⁴/45 − 17s⁶/1260 + O(s⁸)
    factor = 1 + s2 * (-1 / 6 + s2 * (2 / 45 + s2 * (-17 / 1260)));
  } else {
    factor = (2 * logCosh(s)) / (s * s);
  }
  return 0.5 * g * time_s * time_s * factor;
}

/** Speed after `time_s`. */
export function fallSpeedAtTime(time_s: number, p: FallParameters): number {
  requireNonNegativeDrag(p);
  if (time_s <= 0) return 0;
  const g = p.effective_gravity_m_s2;
  const s = time_s * Math.sqrt(g * p.drag_constant_per_m);
  let factor: number;
  if (s < SERIES_LIMIT) {
    const s2 = s * s;
    factor = 1 + s2 * (-1 / 3 + s2 * (2 / 15 + s2 * (-17 / 315)));
  } else {
    factor = Math.tanh(s) / s;
  }
  return g * time_s * factor;
}

/** Speed after falling `height_m` (the impact speed at the ground). */
export function fallSpeedAtHeight(height_m: number, p: FallParameters): number {
  if (height_m <= 0) return 0;
  const y = 2 * p.drag_constant_per_m * height_m;
  const r = Math.abs(y) < 1e-5 ? 1 + y * (-1 / 2 + y / 6) : -Math.expm1(-y) / y;
  return Math.sqrt(2 * p.effective_gravity_m_s2 * height_m * r);
}

/** v_t = √(g_e/k); infinite without drag. */
export function terminalVelocity(p: FallParameters): number {
  requireNonNegativeDrag(p);
  return p.drag_constant_per_m === 0 ? Infinity : Math.sqrt(p.effective_gravity_m_s2 / p.drag_constant_per_m);
}

/** Distance fallen until the speed reaches `fraction` (0–1) of v_t: −ln(1 − f²)/(2k). */
export function distanceToTerminalFraction(fraction: number, p: FallParameters): number {
  requireNonNegativeDrag(p);
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(fraction > 0 && fraction < 1)) throw new RangeError(`fraction must be in (0, 1), got ${fraction}`);
  if (p.drag_constant_per_m === 0) return Infinity;
  return -Math.log1p(-fraction * fraction) / (2 * p.drag_constant_per_m);
}
