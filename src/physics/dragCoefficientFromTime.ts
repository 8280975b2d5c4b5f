/**
 * The drag coefficient of one drop: the C_d for which the closed-form fall from `height_m`
 * takes exactly `time_s`. Fall time grows strictly with C_d, so there is at most one; the
 * bracketed solver finds it or says why there is none.
 */
import { fallParameters, fallTime, type FallBody } from './fallModel';
import { solveFallTimeFactor } from './fitDragConstant';
import { PhysicsInputError } from './physicsInputError';

export function dragCoefficientFromTime(
  body: Omit<FallBody, 'drag_coefficient'>,
  height_m: number,
  time_s: number,
  field = 'time_s',
): number {
  const noDrag = fallParameters({ ...body, drag_coefficient: 0 });
  const dragFree = fallTime(height_m, noDrag);
  if (time_s < dragFree) {
    throw new PhysicsInputError({
      code: 'faster-than-free-fall',
      field,
      value: time_s,
      allowed: `at least the drag-free fall time from ${height_m} m, ${dragFree.toPrecision(6)} s`,
    });
  }
  if (time_s === dragFree) return 0;
  const solved = solveFallTimeFactor(time_s / Math.sqrt((2 * height_m) / noDrag.effective_gravity_m_s2));
  if (solved.status !== 'ok') {
    throw new PhysicsInputError({
      code: solved.status === 'drag-unexplained' ? 'drag-unexplained' : 'solver-failed',
      field,
      value: time_s,
      allowed: `a time a finite drag explains for this body from ${height_m} m`,
    });
  }
  const k = solved.x / height_m;
  return (2 * noDrag.effective_mass_kg * k) / (body.density_kg_m3 * body.area_m2);
}
