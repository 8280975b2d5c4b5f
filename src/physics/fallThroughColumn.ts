/**
 * A fall through air that changes along the way and may move: density, viscosity and gravity follow the height
 * (airColumn.ts), the air may rise or sink (vertical wind W, positive up) and blow sideways (horizontal wind U).
 *
 * Equations of motion. Drag acts on the velocity relative to the air. For a body accelerating through air whose
 * own motion is steady (the wind at a point does not change in time, and a horizontal wind has no vertical
 * component), the added mass acts on the body's own acceleration, buoyancy is the hydrostatic up-thrust, and
 * the fluid-acceleration force is zero. With d the distance fallen, v the downward speed, u the horizontal
 * speed, z = H − d the height above the landing surface:
 *
 *   m_e(z)·dv/dt = (m − ρ(z)·V)·g(z) − ½·ρ(z)·C_d·A·q·(v + W(z))
 *   m_e(z)·du/dt =                   − ½·ρ(z)·C_d·A·q·(u − U(z))
 *   q = √((v + W)² + (u − U)²),  m_e = m + C_a·ρ(z)·V,  C_d = C_d(Re), Re = ρ·q·L/μ(z)
 *
 * released at rest relative to the ground (a tower, a crane, a hand), so v = u = 0 at t = 0. Without horizontal
 * wind the second equation is dropped (u ≡ 0). In still uniform air it is the closed form of fallModel.ts.
 * The drag coefficient may follow the Reynolds number (constant is the special case), so the same fall serves a
 * scaled standard sphere curve. Integrated with our Dormand–Prince 5(4) until the body has fallen H.
 */
import type { AirColumn } from './airColumn';
import { integrateDormandPrince } from './integrateDormandPrince';
import { PhysicsInputError } from './physicsInputError';

export interface ColumnBody {
  mass_kg: number;
  area_m2: number;
  volume_m3: number;
  /** For the Reynolds number, m. */
  characteristic_length_m: number;
  buoyancy: boolean;
  added_mass_coefficient: number;
  /** A constant, or C_d as a function of the Reynolds number of the relative speed. */
  drag_coefficient: number | ((reynolds: number) => number);
}

export interface ColumnFall {
  time_s: number;
  /** Downward speed at the landing surface, relative to the ground, m/s. */
  impact_speed_m_s: number;
  /** Speed relative to the air at the landing surface, m/s. */
  impact_relative_speed_m_s: number;
  /** Relative speed at impact over the local speed of sound. */
  impact_mach: number;
  impact_reynolds_number: number;
  /** Horizontal distance the wind carried the body, m. */
  drift_m: number;
  steps: number;
}

export const COLUMN_FALL_TOLERANCE = 1e-11;

/** Panels of the still-air quadrature (fixed, so the time is a smooth function of the height). */
const QUADRATURE_PANELS = 48;

/**
 * Still air along the fall, constant C_d: the quadrature. With y the distance fallen and w = v², the equation of
 * motion is linear in w:
 *
 *   dw/dy = 2·g_e(y) − 2·k(y)·w,   k = ρ·C_d·A/(2·m_e),   t = ∫₀^H dy/√w
 *
 * On a panel of length Δ with g_e and k frozen at the panel's midpoint it is solved exactly,
 * w = w_t + (w₀ − w_t)·e^{−2kΔ}, w_t = g_e/k, and so is its time: with x = √(w/w_t), δ = 1 − x² (so δ₁ = δ₀·e^{−2kΔ})
 * and ∫dt = ∫dx/(k·v_t·(1 − x²)) = [ln(1 + x) − ½·ln|δ|]/(k·v_t) (atanh below the terminal velocity, acoth above),
 *
 *   t = Δ/v_t + ln((1 + x₁)/(1 + x₀))/√(g_e·k),   ln((1 + x₁)/(1 + x₀)) = log1p(δ₀·(1 − e^{−2kΔ})/((x₀ + x₁)(1 + x₀)))
 *
 * which cancels nothing at the terminal velocity, far past it (kΔ ≫ 1) or as k → 0 (where it becomes 2Δ/(v₀ + v₁)). Frozen coefficients are second order in Δ; Richardson's extrapolation of 48 and
 * 96 panels removes the leading term (checked against odex at 1e-6 up to 10 000 m).
 */
function stillAirPanels(H: number, panels: number, body: ColumnBody, cd: number, column: AirColumn): { time: number; w: number } {
  const { mass_kg: m, area_m2: A, volume_m3: V, added_mass_coefficient: Ca } = body;
  const buoyant = body.buoyancy ? 1 : 0;
  const delta = H / panels;
  let w = 0;
  let time = 0;
  for (let i = 0; i < panels; i++) {
    const z = H - (i + 0.5) * delta;
    const rho = column.density(z);
    const displaced = rho * V;
    const me = m + Ca * displaced;
    const ge = (column.gravity(z) * (m - buoyant * displaced)) / me;
    const k = (rho * cd * A) / (2 * me);
    const oneMinusE = -Math.expm1(-2 * k * delta);
    const wt = ge / k;
    const delta0 = 1 - w / wt;
    const wNext = wt * (1 - delta0 * (1 - oneMinusE));
    const x0 = Math.sqrt(w / wt);
    const x1 = Math.sqrt(wNext / wt);
    const root = Math.sqrt(ge * k);
    time += (k * delta) / root + Math.log1p((delta0 * oneMinusE) / ((x0 + x1) * (1 + x0))) / root;
    w = wNext;
  }
  return { time, w };
}

function stillAirTime(H: number, body: ColumnBody, cd: number, column: AirColumn): number {
  const coarse = stillAirPanels(H, QUADRATURE_PANELS, body, cd, column);
  const fine = stillAirPanels(H, 2 * QUADRATURE_PANELS, body, cd, column);
  return fine.time + (fine.time - coarse.time) / 3;
}

/**
 * The impact speed in still air. The panels' end speeds are only first order where kΔ ≫ 1 (the speed follows the
 * local terminal velocity of the panel's middle), so the speed integrates the same linear equation for w in y with
 * the integrator; w is smooth from y = 0, so this has no singular start.
 */
function stillAirSpeed(H: number, body: ColumnBody, cd: number, column: AirColumn, relativeTolerance: number): number {
  const { mass_kg: m, area_m2: A, volume_m3: V, added_mass_coefficient: Ca } = body;
  const buoyant = body.buoyancy ? 1 : 0;
  const rhs = (y: number, state: Float64Array, slope: Float64Array): void => {
    const z = H - y;
    const rho = column.density(z);
    const displaced = rho * V;
    const me = m + Ca * displaced;
    slope[0] = (2 * column.gravity(z) * (m - buoyant * displaced)) / me - ((rho * cd * A) / me) * state[0]!;
  };
  const result = integrateDormandPrince(rhs, 0, [0], H, { relativeTolerance, absoluteTolerance: relativeTolerance * 2 * column.gravity(0) * H, initialStep: 1e-3 * H, maxSteps: 200_000 });
  return Math.sqrt(result.y[0]!);
}

/** `timeOnly`: skip what only the impact figures need (the fits ask for times alone). */
export function fallThroughColumn(height_m: number, body: ColumnBody, column: AirColumn, relativeTolerance = COLUMN_FALL_TOLERANCE, timeOnly = false): ColumnFall {
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(height_m > 0)) throw new RangeError(`height must be positive, got ${height_m}`);
  const { mass_kg: m, area_m2: A, volume_m3: V, characteristic_length_m: L, added_mass_coefficient: Ca } = body;
  const buoyant = body.buoyancy ? 1 : 0;
  const cdOf = body.drag_coefficient;
  const constantCd = typeof cdOf === 'number' ? cdOf : NaN;
  const cdFunction = typeof cdOf === 'number' ? null : cdOf;
  const crosswind = column.hasCrosswind();
  const H = height_m;
  if (!column.hasWind(H) && cdFunction === null && constantCd > 0) {
    const time_s = stillAirTime(H, body, constantCd, column);
    const speed = timeOnly ? NaN : stillAirSpeed(H, body, constantCd, column, relativeTolerance);
    const rho0 = column.density(0);
    return {
      time_s,
      impact_speed_m_s: speed,
      impact_relative_speed_m_s: speed,
      impact_mach: speed / column.speedOfSound(0),
      impact_reynolds_number: (rho0 * speed * L) / column.viscosity(0),
      drift_m: 0,
      steps: 3 * QUADRATURE_PANELS,
    };
  }
  const rhs = (_t: number, y: Float64Array, dydt: Float64Array): void => {
    const z = H - y[0]!;
    const v = y[1]!;
    const rho = column.density(z);
    const displaced = rho * V;
    const me = m + Ca * displaced;
    const ge = (column.gravity(z) * (m - buoyant * displaced)) / me;
    const vr = v + column.verticalWind(z);
    const ur = crosswind ? y[3]! - column.windSpeed(z) : 0;
    const q = crosswind ? Math.sqrt(vr * vr + ur * ur) : Math.abs(vr);
    // At rest relative to the air there is no drag (and no Reynolds number to ask a curve about).
    const cd = cdFunction === null ? constantCd : q > 0 ? cdFunction((rho * q * L) / column.viscosity(z)) : 0;
    const kq = ((rho * cd * A) / (2 * me)) * q;
    dydt[0] = v;
    dydt[1] = ge - kq * vr;
    if (crosswind) {
      dydt[2] = y[3]!;
      dydt[3] = -kq * ur;
    }
  };
  const g0 = column.gravity(H);
  const vacuumTime = Math.sqrt((2 * H) / g0);
  let result: ReturnType<typeof integrateDormandPrince> | null = null;
  try {
    result = integrateDormandPrince(
    rhs,
    0,
    crosswind ? [0, 0, 0, 0] : [0, 0],
    1e6 * vacuumTime,
    {
      relativeTolerance,
      absoluteTolerance: relativeTolerance * H,
      initialStep: 1e-3 * vacuumTime,
      maxSteps: 200_000,
    },
    (_t, y) => y[0]! - H,
    );
  } catch (error) {
    // Too many steps or a step too small: a body the updraft holds up (or far too light to fall) never lands.
    if (!(error instanceof PhysicsInputError)) throw error;
  }
  if (result === null || !result.eventFound) {
    throw new PhysicsInputError({
      code: 'solver-failed',
      field: 'air.vertical_wind_m_s',
      value: column.verticalWind(H),
      allowed: 'an updraft slower than the body falls',
      reason: `the body does not reach the ground from ${H} m (the updraft may hold it up)`,
    });
  }
  const y = result.y;
  const v = y[1]!;
  const vr = v + column.verticalWind(0);
  const ur = crosswind ? y[3]! - column.windSpeed(0) : 0;
  const q = Math.hypot(vr, ur);
  const rho0 = column.density(0);
  return {
    time_s: result.t,
    impact_speed_m_s: v,
    impact_relative_speed_m_s: q,
    impact_mach: q / column.speedOfSound(0),
    impact_reynolds_number: (rho0 * q * L) / column.viscosity(0),
    drift_m: crosswind ? y[2]! : 0,
    steps: result.acceptedSteps,
  };
}
