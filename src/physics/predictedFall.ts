/**
 * The fall of a body whose drag is known beforehand (a reference C_d, or a sphere curve C_d(Re)) through the day's
 * air: the air along the fall and its motion from the same inputs and the same model the analysis fits with
 * (airColumn.ts, fallThroughColumn.ts), so that the planner's times and an analysis' predicted times agree for the
 * same inputs at every height, and no height switches from one model to another (no step). In still air of a
 * short drop it is the closed form's fall to within the quadrature's error (1e-6 relative, fallThroughColumn.ts).
 */
import type { AirColumn } from './airColumn';
import { groupDrops } from './dropGroups';
import { fallThroughColumn, type ColumnFall } from './fallThroughColumn';
import { seriesModelAt } from './seriesFit';
import type { SeriesSetup } from './seriesSetup';
import { standardSphereDragCoefficient, standardSphereDragRelativeUncertainty } from './standardSphereDrag';

/** The air along the fall at the setup's nominal inputs (one reading with its lapse rate, or two). */
export function nominalAirColumn(setup: SeriesSetup): AirColumn {
  // The model needs one group of drops for its layout; the air does not depend on it.
  const { model, x0 } = seriesModelAt(setup, groupDrops([{ height_m: 1, time_s: 1 }]));
  return model.airColumnAt(x0);
}

/**
 * The fall from height_m with drag coefficient `cd` (a constant or a function of the Reynolds number). With
 * `timeOnly` the impact speed of a constant-C_d fall in still air is left out (NaN; fallThroughColumn.ts).
 */
export function predictedFall(
  setup: SeriesSetup,
  column: AirColumn,
  height_m: number,
  cd: number | ((reynolds: number) => number),
  relativeTolerance = 1e-10,
  timeOnly = false,
): ColumnFall {
  return fallThroughColumn(
    height_m,
    {
      mass_kg: setup.specimen.mass_kg,
      area_m2: setup.geometry.area_m2,
      volume_m3: setup.geometry.volume_m3,
      characteristic_length_m: setup.geometry.characteristic_length_m,
      buoyancy: setup.buoyancy,
      added_mass_coefficient: setup.added_mass_coefficient,
      drag_coefficient: cd,
    },
    column,
    relativeTolerance,
    timeOnly,
  );
}

export interface SphereCurveFall extends ColumnFall {
  /** The time's standard uncertainty from the curve's own (standardSphereDragRelativeUncertainty), s. */
  time_standard_uncertainty_s: number;
  /** The curve's relative standard uncertainty at the impact Reynolds number (its largest along the fall). */
  drag_coefficient_relative_standard_uncertainty: number;
}

/**
 * The fall with the standard sphere curve (standardSphereDrag.ts), and its time's standard uncertainty from the
 * curve's own. The curve's error is systematic over one fall (a standard curve is off by a smooth amount, the same
 * from one drop to the next), so the whole curve moves at once: C_d(Re)·(1 ± u_r(Re)), and u(t) is half the
 * difference of the two times (a central difference with the step of one standard uncertainty, which keeps the
 * fall's curvature in C_d where u_r is large).
 *
 * Tolerances: 1e-8 for the time, far inside the curve's own 5 %; the ±u falls differ by about 1e-3 of the time,
 * so 1e-7 keeps their half-difference to 1e-4 of itself.
 */
export function predictedSphereCurveFall(setup: SeriesSetup, column: AirColumn, height_m: number): SphereCurveFall {
  const fall = predictedFall(setup, column, height_m, standardSphereDragCoefficient, 1e-8);
  const moved = (sign: 1 | -1) => (re: number) => standardSphereDragCoefficient(re) * (1 + sign * standardSphereDragRelativeUncertainty(re));
  const up = predictedFall(setup, column, height_m, moved(1), 1e-7, true).time_s;
  const down = predictedFall(setup, column, height_m, moved(-1), 1e-7, true).time_s;
  return {
    ...fall,
    time_standard_uncertainty_s: Math.abs(up - down) / 2,
    drag_coefficient_relative_standard_uncertainty: standardSphereDragRelativeUncertainty(fall.impact_reynolds_number),
  };
}
