/**
 * Each drop's own C_d: the one that makes the closed-form fall reproduce its time, less the fitted timing offset
 * when one is fitted. One function for drops in the fit and drops left out of it, so a table column never mixes
 * two meanings.
 */
import type { DropInput } from './analysisTypes';
import { dragCoefficientFromTime } from './dragCoefficientFromTime';
import { fallParameters, fallTime, type FallBody, type FallParameters } from './fallModel';
import { PhysicsInputError } from './physicsInputError';
import type { SeriesSetup } from './seriesSetup';

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

export interface DropDragCoefficients {
  /** Per drop, in the order of the series. */
  values: (number | null)[];
  /** Drops not slower than a drag-free fall, described for the warning. */
  slow: string[];
}

/**
 * Every drop's own C_d from its time less `offset` (the fitted offset, or the declared delay); a drop faster than
 * free fall by far more than its noise is an error naming it.
 */
export function dropDragCoefficients(setup: SeriesSetup, drops: readonly DropInput[], offset: number): DropDragCoefficients {
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
    const value = ownDragCoefficient(body, drop.height_m, drop.time_s, offset, `drops[${i}].time_s`, noDrag);
    if (value === null) slow.push(`drop ${i + 1} of the series (${drop.time_s} s from ${drop.height_m} m, drag-free ${noDragTime.toFixed(4)} s)`);
    return value;
  });
  return { values, slow };
}
