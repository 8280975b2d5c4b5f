/**
 * Each drop's own C_d: the one that makes the series' drag law reproduce its time, less the fitted timing offset
 * (or the declared delay). Under a constant C_d that is the closed-form fall's C_d; under the scaled sphere curve
 * it is the drop's own factor s on the curve, reported as the series reports its C_d: s·C_d,std at the terminal
 * Reynolds number of that factor (dragLaw.ts). One function for drops in the fit and drops left out of it, so a
 * table column never mixes two meanings.
 */
import type { DropInput } from './analysisTypes';
import { dragCoefficientFromTime } from './dragCoefficientFromTime';
import { fitSphereScale, scaledSphereFallTime, scaledSphereTerminalVelocity, type SphereScaleBody } from './dragLaw';
import { fallParameters, fallTime, type FallBody, type FallParameters } from './fallModel';
import { PhysicsInputError } from './physicsInputError';
import type { SeriesSetup } from './seriesSetup';
import { standardSphereDragCoefficient } from './standardSphereDrag';

/** A drop faster than the drag-free time by more than this many standard uncertainties is an error. */
export const FASTER_THAN_FREE_FALL_SIGMAS = 5;

/**
 * One drop's own C_d from `time_s − offset_s`; null when that time is not longer than a drag-free fall (timing
 * noise explains it). Throws a PhysicsInputError when no finite drag explains the time.
 */
export function ownDragCoefficient(
  body: Omit<FallBody, 'drag_coefficient'>,
  height_m: number,
  time_s: number,
  offset_s = 0,
  field = 'time_s',
  noDrag: FallParameters = fallParameters({ ...body, drag_coefficient: 0 }),
): number | null {
  const time = time_s - offset_s;
  if (time <= fallTime(height_m, noDrag)) return null;
  return dragCoefficientFromTime(body, height_m, time, field);
}

/**
 * One drop's own C_d under the scaled sphere curve: the factor s that makes the curve's fall through `height_m`
 * take `time_s − offset_s` (fitSphereScale on this drop alone, started from `startScale`, the series' factor),
 * given as s·C_d,std(Re_T) at the terminal Reynolds number of s, the value the series reports. Null when the time
 * is not longer than a drag-free fall. Throws a PhysicsInputError when no factor reproduces the time.
 */
export function ownScaledSphereDragCoefficient(
  body: SphereScaleBody,
  height_m: number,
  time_s: number,
  offset_s: number,
  startScale: number,
  field = 'time_s',
): number | null {
  const time = time_s - offset_s;
  if (time <= Math.sqrt((2 * height_m) / body.effective_gravity_m_s2)) return null;
  const fit = fitSphereScale(body, [height_m], [time], [1], false, startScale);
  const s = fit.scale;
  // The fit stops on a step of 1e-11 of s; a time it does not reproduce to 1e-9 of itself is one no factor explains.
  if (!fit.converged || !(Math.abs(scaledSphereFallTime(height_m, body, s) - time) <= 1e-9 * time)) {
    throw new PhysicsInputError({
      code: 'drag-unexplained',
      field,
      value: time_s,
      allowed: `a time the standard sphere curve, scaled by one factor, reproduces from ${height_m} m`,
    });
  }
  return s * standardSphereDragCoefficient(body.reynolds_per_speed_s_m * scaledSphereTerminalVelocity(body, s));
}

/** The scaled sphere law a series is fitted with: its body, its factor and its fitted offset (0 without one). */
export interface ScaledSphereLaw {
  body: SphereScaleBody;
  scale: number;
  offset_s: number;
}

export interface DropDragCoefficients {
  /** Per drop, in the order of the series. */
  values: (number | null)[];
  /** Drops not slower than a drag-free fall, described for the warning. */
  slow: string[];
}

/**
 * Every drop's own C_d from its time less `offset` (the fitted offset, or the declared delay), under a constant C_d
 * or, given `law`, under the scaled sphere curve; a drop faster than free fall by far more than its noise is an
 * error naming it.
 */
export function dropDragCoefficients(setup: SeriesSetup, drops: readonly DropInput[], offset: number, law: ScaledSphereLaw | null = null): DropDragCoefficients {
  const { noDrag, timingU, heightU, body } = setup;
  const slow: string[] = [];
  const values = drops.map((drop, i) => {
    const time = drop.time_s - offset;
    const noDragTime = fallTime(drop.height_m, noDrag);
    const heightTerm = (noDragTime * heightU) / (2 * drop.height_m);
    const sigma = setup.subtractedOffsetU_s > 0 ? Math.hypot(timingU, heightTerm, setup.subtractedOffsetU_s) : Math.hypot(timingU, heightTerm);
    if (time < noDragTime - FASTER_THAN_FREE_FALL_SIGMAS * sigma) {
      throw new PhysicsInputError({
        code: 'faster-than-free-fall',
        field: `drops[${i}].time_s`,
        value: drop.time_s,
        allowed: `at least about ${(noDragTime - FASTER_THAN_FREE_FALL_SIGMAS * sigma + offset).toFixed(4)} s (the drag-free fall from ${drop.height_m} m takes ${noDragTime.toFixed(4)} s${offset !== 0 ? `, plus the ${setup.fitOffset ? 'fitted' : 'declared'} timing offset ${offset.toFixed(4)} s` : ''})`,
      });
    }
    const value =
      law === null
        ? ownDragCoefficient(body, drop.height_m, drop.time_s, offset, `drops[${i}].time_s`, noDrag)
        : ownScaledSphereDragCoefficient(law.body, drop.height_m, drop.time_s, offset, law.scale, `drops[${i}].time_s`);
    if (value === null) slow.push(`drop ${i + 1} of the series (${drop.time_s} s from ${drop.height_m} m, drag-free ${noDragTime.toFixed(4)} s)`);
    return value;
  });
  return { values, slow };
}
