/**
 * A fall whose drag coefficient follows the Reynolds number along the way, which has no closed
 * form: dy/dt = v, dv/dt = g_e − (ρA/2m_e)·C_d(Re(v))·v², integrated with our Dormand–Prince
 * 5(4) until the body has fallen the given height.
 */
import { integrateDormandPrince } from './integrateDormandPrince';
import { PhysicsInputError } from './physicsInputError';

export interface VariableDragBody {
  effective_gravity_m_s2: number;
  /** ρ·A/(2·m_e) in 1/m: the drag constant k per unit drag coefficient. */
  drag_constant_per_unit_cd_per_m: number;
  /** ρ·L/μ in s/m: the Reynolds number per unit speed. */
  reynolds_per_speed_s_m: number;
  dragCoefficient: (reynolds: number) => number;
}

export interface VariableDragFall {
  time_s: number;
  impact_speed_m_s: number;
  reynolds_number: number;
  drag_coefficient_at_impact: number;
  steps: number;
}

export function fallWithVariableDrag(
  height_m: number,
  body: VariableDragBody,
  relativeTolerance = 1e-11,
): VariableDragFall {
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(height_m > 0)) throw new RangeError(`height must be positive, got ${height_m}`);
  const g = body.effective_gravity_m_s2;
  const c = body.drag_constant_per_unit_cd_per_m;
  const rps = body.reynolds_per_speed_s_m;
  const cd = body.dragCoefficient;
  const rhs = (_t: number, y: Float64Array, dydt: Float64Array): void => {
    const v = y[1]!;
    dydt[0] = v;
    dydt[1] = v > 0 ? g - c * cd(rps * v) * v * v : g;
  };
  const vacuumTime = Math.sqrt((2 * height_m) / g);
  const result = integrateDormandPrince(
    rhs,
    0,
    [0, 0],
    // Generous: no fall of practical interest takes 1e6 vacuum times; the event ends it.
    1e6 * vacuumTime,
    {
      relativeTolerance,
      absoluteTolerance: relativeTolerance * height_m,
      initialStep: 1e-3 * vacuumTime,
      maxSteps: 200_000,
    },
    (_t, y) => y[0]! - height_m,
  );
  if (!result.eventFound) throw new PhysicsInputError({ code: 'solver-failed', field: 'height_m', value: height_m, allowed: 'a height the body falls within 1e6 vacuum fall times', reason: `the body did not fall ${height_m} m` });
  const v = result.y[1]!;
  const re = rps * v;
  return {
    time_s: result.t,
    impact_speed_m_s: v,
    reynolds_number: re,
    drag_coefficient_at_impact: re > 0 ? cd(re) : Infinity,
    steps: result.acceptedSteps,
  };
}
