/**
 * The scatter of a series about its fit (GUM Type A): the residual standard deviation, the part of it the
 * declared timing uncertainty does not explain, and the standard uncertainty of each height's mean time. The fit
 * is the series' drag law: the constant C_d's closed-form fall, or the scaled sphere curve's with its own offset.
 */
import type { DropInput } from './analysisTypes';
import type { ScaledSphereLaw } from './dropDragCoefficient';
import type { DropGroups } from './dropGroups';
import { scaledSphereFallTime } from './dragLaw';
import { fallTime } from './fallModel';
import { PhysicsInputError } from './physicsInputError';
import type { PhysicsWarning } from './physicsWarning';
import type { SeriesFit } from './seriesFit';
import type { SeriesSetup } from './seriesSetup';

/** A whole series faster than the drag-free model by more than this many standard uncertainties is an error. */
export const SERIES_FASTER_SIGMAS = 3;

export interface SeriesScatter {
  /** Per drop: the fitted model's time (offset included). */
  fittedTimes: number[];
  /** Per drop: measured minus fitted. */
  residuals: number[];
  /** Degrees of freedom of the scatter: drops less fitted parameters. */
  dof: number;
  /** Residual standard deviation, s; null without a degree of freedom. */
  scatter: number | null;
  /** The scatter beyond the declared timing uncertainty, s (0 when within it). */
  excess: number;
  /** Standard uncertainty of the mean time at height j (declared timing, excess scatter and the declared delay's). */
  meanTimeU(j: number): number;
  warnings: PhysicsWarning[];
}

export function seriesScatter(
  setup: SeriesSetup,
  drops: readonly DropInput[],
  groups: DropGroups,
  fit: SeriesFit,
  law: ScaledSphereLaw | null = null,
): SeriesScatter {
  const { timingU } = setup;
  const warnings: PhysicsWarning[] = [];
  let fittedTimes: number[];
  if (law === null) {
    // The model's time: the fitted offset, or the declared delay (one of them is 0).
    const delay = fit.offset_s + setup.subtractedOffset_s;
    fittedTimes = drops.map((d) => fallTime(d.height_m, fit.fitted) + delay);
  } else {
    // The scaled curve's fall, once per height, with the scaled fit's own offset (or the declared delay).
    const delay = law.offset_s + setup.subtractedOffset_s;
    const byHeight = new Map(groups.heights.map((h) => [h, scaledSphereFallTime(h, law.body, law.scale) + delay]));
    fittedTimes = drops.map((d) => byHeight.get(d.height_m)!);
  }
  const residuals = drops.map((d, i) => d.time_s - fittedTimes[i]!);
  const dof = drops.length - (setup.fitOffset ? 2 : 1);
  const scatter = dof > 0 ? Math.sqrt(residuals.reduce((s, r) => s + r * r, 0) / dof) : null;
  const excess = scatter !== null && scatter > timingU ? Math.sqrt(scatter * scatter - timingU * timingU) : 0;
  if (scatter === null) {
    warnings.push({
      code: 'scatter-not-assessed',
      message: 'Too few drops to see their scatter: the uncertainty rests on the declared timing uncertainty alone.',
    });
  } else if (dof >= 2 && scatter > 2 * timingU) {
    warnings.push({
      code: 'scatter-exceeds-timing-uncertainty',
      message: `The drops scatter by ${scatter.toPrecision(3)} s, more than twice the declared timing uncertainty of ${timingU} s; the excess enters the budget as a Type A component.`,
    });
  }
  const counts = groups.counts;
  const uDelay = setup.subtractedOffsetU_s;
  const meanTimeU = (j: number): number => Math.sqrt((timingU * timingU + excess * excess) / counts[j]! + uDelay * uDelay);
  return { fittedTimes, residuals, dof, scatter, excess, meanTimeU, warnings };
}

/** A series faster than the drag-free model by far more than its noise is an error. */
export function checkNotFasterThanFreeFall(setup: SeriesSetup, groups: DropGroups, fit: SeriesFit, scatter: SeriesScatter): void {
  if (fit.dragConstant_per_m >= 0) return;
  for (let j = 0; j < groups.heights.length; j++) {
    const h = groups.heights[j]!;
    const deficit = fallTime(h, setup.noDrag) - fallTime(h, fit.fitted);
    if (deficit > SERIES_FASTER_SIGMAS * scatter.meanTimeU(j)) {
      throw new PhysicsInputError({
        code: 'faster-than-free-fall',
        field: 'drops',
        value: `mean ${groups.meanTimes[j]!.toFixed(4)} s from ${h} m`,
        allowed: `no faster than the drag-free fall (${fallTime(h, setup.noDrag).toFixed(4)} s) by more than about ${SERIES_FASTER_SIGMAS} standard uncertainties (${(SERIES_FASTER_SIGMAS * scatter.meanTimeU(j)).toFixed(4)} s)`,
      });
    }
  }
}
