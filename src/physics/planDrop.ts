/**
 * Planning a test before going out: for a specimen, the day's air and a timing method, what a
 * drop from a given height looks like (fall time, impact speed and energy, how close it gets to
 * terminal velocity), and how high and how often to drop to reach a target relative
 * uncertainty of the drag coefficient, or the plain statement that no height up to a limit
 * does with that timing.
 *
 * The uncertainty of a plan is the GUM budget of the same measurement model the analysis uses,
 * evaluated on drops that fall exactly as predicted (so scatter is the declared timing only).
 */
import { airProperties, type AirInput } from './airProperties';
import type { AnalysisRequest, UncertaintyInput } from './analysisTypes';
import { checkNumber, checkOptionalNumber } from './checkNumber';
import {
  distanceToTerminalFraction,
  fallParameters,
  fallTime,
  terminalVelocity,
} from './fallModel';
import { localGravity, type SiteInput } from './normalGravity';
import { PhysicsInputError } from './physicsInputError';
import type { PhysicsWarning } from './physicsWarning';
import { checkSpecimen, type SpecimenInput } from './specimenGeometry';
import { seriesBudget } from './seriesBudget';
import { prepareSetup } from './seriesSetup';
import type { BudgetInputSpec } from './uncertaintyBudget';
import { DROP_LIMITS } from './validateAnalysisRequest';
import { fallBodyFor } from './fallBodyFor';
import { nominalAirColumn, predictedFall, predictedSphereCurveFall } from './predictedFall';
import { scaledSphereTerminalVelocity } from './dragLaw';
import { dragCrisisWarning } from './dragCrisisWarning';
import { standardSphereDragCoefficient, standardSphereDragRelativeUncertainty } from './standardSphereDrag';

export interface DropPlanRequest {
  site: SiteInput;
  air: AirInput;
  specimen: SpecimenInput;
  timing: { standard_uncertainty_s: number };
  uncertainty?: UncertaintyInput;
  options?: { buoyancy?: boolean; added_mass_coefficient?: number };
  /** Assumed C_d; default: the specimen's reference value, or for a sphere the standard drag curve (standardSphereDrag.ts). */
  drag_coefficient?: number;
  /** The height the crew has in mind, m. */
  height_m?: number;
  /** Target relative standard uncertainty of C_d, e.g. 0.05 for 5 %. */
  target_relative_uncertainty?: number;
  /** Highest release point available, m; default 100. */
  max_height_m?: number;
  /** Most drops the crew will make at one height; default 20. */
  max_drops?: number;
}

export interface DropAtHeight {
  height_m: number;
  fall_time_s: number;
  vacuum_time_s: number;
  /**
   * The fall time's standard uncertainty from the assumed drag, s: for a sphere on the standard curve, the curve's own
   * (standardSphereDragRelativeUncertainty) carried through the fall as an analysis' prediction does; null for a
   * given or reference C_d, which come without one.
   */
  fall_time_standard_uncertainty_s: number | null;
  /** How much drag lengthens the fall: the signal the measurement rests on. */
  drag_delay_s: number;
  impact_speed_m_s: number;
  impact_energy_J: number;
  reynolds_number: number;
  /** Fraction of terminal velocity reached at impact. */
  terminal_velocity_fraction: number;
  /** Relative standard uncertainty of C_d from one drop, and from max_drops drops. */
  relative_uncertainty_one_drop: number;
  relative_uncertainty_max_drops: number;
}

export interface DropPlan {
  /** The assumed C_d; on the standard sphere curve, its value at impact from the planned height (else at terminal velocity). */
  drag_coefficient: number;
  drag_coefficient_source: 'given' | 'reference' | 'standard-sphere-drag-curve';
  /** On the standard sphere curve, its relative standard uncertainty where drag_coefficient is taken; else null. */
  drag_coefficient_relative_standard_uncertainty: number | null;
  terminal_velocity_m_s: number;
  distance_to_95pct_terminal_velocity_m: number;
  distance_to_99pct_terminal_velocity_m: number;
  at_height: DropAtHeight | null;
  target: {
    relative_uncertainty: number;
    reachable: boolean;
    /** Lowest height (up to max_height_m) where max_drops drops reach the target. */
    smallest_height_m: number | null;
    /** Fewest drops that reach the target from smallest_height_m (rounded up to 0.1 m). */
    drops_at_smallest_height: number | null;
    /** Fewest drops that reach the target from the planned height_m (null if none up to max_drops, or no height given). */
    drops_at_planned_height: number | null;
    /** For several drop counts, the lowest height that reaches the target (null: none up to max_height_m). */
    heights_by_drops: { drops: number; smallest_height_m: number | null }[];
    /** The part no number of drops removes (size, mass, air, height), relative. */
    systematic_relative_uncertainty_at_max_height: number;
    message: string;
  } | null;
  warnings: PhysicsWarning[];
}

const DEFAULT_MAX_HEIGHT_M = 100;
const DEFAULT_MAX_DROPS = 20;
const MIN_PLAN_HEIGHT_M = 0.2;

export function planDrop(request: DropPlanRequest): DropPlan {
  const warnings: PhysicsWarning[] = [];
  const site = localGravity(request.site);
  const air = airProperties(request.air, request.site.elevation_m);
  warnings.push(...air.warnings);
  const specimen = checkSpecimen(request.specimen);
  const geometry = specimen.geometry;
  const timingU = checkNumber('timing.standard_uncertainty_s', request.timing?.standard_uncertainty_s, DROP_LIMITS.standard_uncertainty_s);
  const maxHeight = checkOptionalNumber('max_height_m', request.max_height_m, DROP_LIMITS.height_m) ?? DEFAULT_MAX_HEIGHT_M;
  const maxDrops = checkOptionalNumber('max_drops', request.max_drops, { min: 1, max: 10_000, text: '1 to 10 000' }) ?? DEFAULT_MAX_DROPS;
  if (!Number.isInteger(maxDrops)) throw new PhysicsInputError({ code: 'out-of-range', field: 'max_drops', value: maxDrops, allowed: 'a whole number from 1 to 10 000' });
  const plannedHeight = checkOptionalNumber('height_m', request.height_m, { ...DROP_LIMITS.height_m, max: maxHeight, text: `above 0 and at most max_height_m (${maxHeight} m)` });
  const target = checkOptionalNumber('target_relative_uncertainty', request.target_relative_uncertainty, {
    min: 0,
    minExclusive: true,
    max: 1,
    text: 'above 0 and at most 1 (a fraction: 0.05 is 5 %)',
  });
  const buoyancy = request.options?.buoyancy ?? true;
  const addedMass = checkOptionalNumber('options.added_mass_coefficient', request.options?.added_mass_coefficient, { min: 0, max: 100, text: '0 to 100' }) ?? geometry.default_added_mass_coefficient;
  const rho = air.density_kg_m3;
  const g = site.gravity_m_s2;
  const body = fallBodyFor({ mass_kg: specimen.mass_kg, geometry, density_kg_m3: rho, gravity_m_s2: g, buoyancy, added_mass_coefficient: addedMass });
  const reynoldsPerSpeed = (rho * geometry.characteristic_length_m) / air.dynamic_viscosity_Pa_s;

  // The C_d for the closed form's figures (terminal velocity, distance to it, the setup's placeholder drop), and
  // the drag the planned falls go through: a constant, or the standard sphere curve.
  let cd: number;
  let drag: number | ((reynolds: number) => number);
  let source: DropPlan['drag_coefficient_source'];
  const given = checkOptionalNumber('drag_coefficient', request.drag_coefficient, { min: 0, minExclusive: true, max: 100, text: 'above 0 and at most 100' });
  if (given !== undefined) {
    cd = drag = given;
    source = 'given';
  } else if (specimen.reference_drag_coefficient !== null) {
    cd = drag = specimen.reference_drag_coefficient;
    source = 'reference';
  } else if (geometry.shape === 'sphere') {
    // The curve an analysis predicts with, so a planned time is the time the analysis will predict. Terminal
    // velocity is where the curve's drag balances the weight; the closed form's distances to it take the curve's
    // C_d there (nearly constant in Newton's regime, where balls reach it).
    const perUnitCd = fallParameters({ ...body, drag_coefficient: 1 });
    const vT = scaledSphereTerminalVelocity(
      { effective_gravity_m_s2: perUnitCd.effective_gravity_m_s2, drag_constant_per_unit_cd_per_m: perUnitCd.drag_constant_per_m, reynolds_per_speed_s_m: reynoldsPerSpeed },
      1,
    );
    cd = standardSphereDragCoefficient(reynoldsPerSpeed * vT);
    drag = standardSphereDragCoefficient;
    source = 'standard-sphere-drag-curve';
  } else {
    throw new PhysicsInputError({
      code: 'missing-drag-coefficient',
      field: 'drag_coefficient',
      value: undefined,
      allowed: 'a positive number (or specimen.reference_drag_coefficient): only spheres have a built-in correlation',
    });
  }
  const onCurve = source === 'standard-sphere-drag-curve';

  const params = fallParameters({ ...body, drag_coefficient: cd });

  // One setup (validation, air, gravity, the body) for the whole plan; each height and drop count then costs
  // only the fit and the budget of drops that fall exactly as predicted.
  const setupRequest: AnalysisRequest = {
    site: request.site,
    air: request.air,
    specimen: request.specimen,
    drops: [{ height_m: plannedHeight ?? maxHeight, time_s: fallTime(plannedHeight ?? maxHeight, params) }],
    timing: { standard_uncertainty_s: timingU },
    options: { buoyancy, added_mass_coefficient: addedMass },
  };
  if (request.uncertainty !== undefined) setupRequest.uncertainty = request.uncertainty;
  const setup = prepareSetup(setupRequest);
  // Planned falls go through the air along the fall, as an analysis' predicted falls do (predictedFall.ts): a planned
  // 3000 m drop takes the time the analysis will predict for it, and a short one the closed form's (to 1e-5).
  const column = nominalAirColumn(setup);
  // On the curve the search's many falls take 1e-8 (far inside the curve's own 5 %); the reported one carries u(t).
  const plannedFall = (height: number) => predictedFall(setup, column, height, drag, onCurve ? 1e-8 : 1e-10, true);
  const timingOnlySpec = (s: BudgetInputSpec): boolean => s.input === 'time_s';
  const relativeUncertainty = (height: number, drops: number, timingOnly = false): number => {
    const time = checkNumber('drops[0].time_s', plannedFall(height).time_s, DROP_LIMITS.time_s);
    const synthetic = Array.from({ length: drops }, () => ({ height_m: height, time_s: time }));
    const { budget, estimate } = seriesBudget(setup, synthetic, timingOnly ? timingOnlySpec : undefined);
    return budget.combined_standard_uncertainty / estimate;
  };
  const systematicOnly = (height: number): number => {
    const total = relativeUncertainty(height, 1);
    const timing = relativeUncertainty(height, 1, true);
    return Math.sqrt(Math.max(total * total - timing * timing, 0));
  };

  const describe = (height: number): DropAtHeight => {
    const sphereFall = onCurve ? predictedSphereCurveFall(setup, column, height) : null;
    const fall = sphereFall ?? predictedFall(setup, column, height, drag);
    const time = fall.time_s;
    const v = fall.impact_speed_m_s;
    return {
      height_m: height,
      fall_time_s: time,
      fall_time_standard_uncertainty_s: sphereFall ? sphereFall.time_standard_uncertainty_s : null,
      vacuum_time_s: Math.sqrt((2 * height) / g),
      // Against the drag-free fall through the same air (buoyancy and gravity still follow the height).
      drag_delay_s: time - predictedFall(setup, column, height, 0).time_s,
      impact_speed_m_s: v,
      impact_energy_J: 0.5 * specimen.mass_kg * v * v,
      reynolds_number: reynoldsPerSpeed * v,
      terminal_velocity_fraction: v / terminalVelocity(params),
      relative_uncertainty_one_drop: relativeUncertainty(height, 1),
      relative_uncertainty_max_drops: relativeUncertainty(height, maxDrops),
    };
  };

  const atHeight = plannedHeight !== undefined ? describe(plannedHeight) : null;
  if (onCurve && atHeight) cd = standardSphereDragCoefficient(atHeight.reynolds_number);
  const crisis = dragCrisisWarning(geometry.shape, atHeight ? [atHeight.reynolds_number] : []);
  if (crisis) warnings.push(crisis);
  const cdReynolds = atHeight ? atHeight.reynolds_number : reynoldsPerSpeed * terminalVelocity(params);

  const plan: DropPlan = {
    drag_coefficient: cd,
    drag_coefficient_source: source,
    drag_coefficient_relative_standard_uncertainty: onCurve ? standardSphereDragRelativeUncertainty(cdReynolds) : null,
    terminal_velocity_m_s: terminalVelocity(params),
    distance_to_95pct_terminal_velocity_m: distanceToTerminalFraction(0.95, params),
    distance_to_99pct_terminal_velocity_m: distanceToTerminalFraction(0.99, params),
    at_height: atHeight,
    target: null,
    warnings,
  };
  if (target !== undefined) plan.target = planForTarget(target, maxHeight, maxDrops, plannedHeight, relativeUncertainty, systematicOnly(maxHeight));
  return plan;

  function planForTarget(
    goal: number,
    hMax: number,
    nMax: number,
    planned: number | undefined,
    relU: (h: number, n: number) => number,
    floor: number,
  ): NonNullable<DropPlan['target']> {
    const smallestHeight = (n: number): number | null => {
      if (relU(hMax, n) > goal) return null;
      // The relative uncertainty falls as the height grows (the drag delay grows faster than
      // the timing noise); bisect on log height.
      let lo = Math.log(Math.min(MIN_PLAN_HEIGHT_M, hMax));
      let hi = Math.log(hMax);
      if (relU(Math.exp(lo), n) <= goal) return Math.exp(lo);
      for (let i = 0; i < 40; i++) {
        const mid = 0.5 * (lo + hi);
        if (relU(Math.exp(mid), n) <= goal) hi = mid;
        else lo = mid;
      }
      return Math.exp(hi);
    };
    const fewestDrops = (h: number): number | null => {
      if (relU(h, nMax) > goal) return null;
      let lo = 0; // fails (or zero drops)
      let hi = nMax; // succeeds
      while (hi - lo > 1) {
        const mid = Math.floor((lo + hi) / 2);
        if (relU(h, mid) <= goal) hi = mid;
        else lo = mid;
      }
      return hi;
    };
    const counts = [1, 2, 3, 5, 10, 20, 50, 100].filter((n) => n < nMax);
    counts.push(nMax);
    const heightsByDrops = counts.map((n) => ({ drops: n, smallest_height_m: smallestHeight(n) }));
    const best = heightsByDrops[heightsByDrops.length - 1]!.smallest_height_m;
    const rounded = best === null ? null : Math.min(Math.ceil(best * 10) / 10, hMax);
    const dropsThere = rounded === null ? null : fewestDrops(rounded);
    const dropsPlanned = planned === undefined ? null : fewestDrops(planned);
    let message: string;
    const pct = (x: number): string => `${(100 * x).toPrecision(2)} %`;
    if (best === null) {
      const bestU = relU(hMax, nMax);
      message =
        floor >= goal
          ? `No height up to ${hMax} m reaches ${pct(goal)}: the size, mass, height and air uncertainties alone give ${pct(floor)}, whatever the number of drops.`
          : `No height up to ${hMax} m reaches ${pct(goal)} with this timing (best: ${pct(bestU)} from ${hMax} m with ${nMax} drops). Time more precisely or drop from higher.`;
    } else {
      message = `${dropsThere} drop${dropsThere === 1 ? '' : 's'} from ${rounded} m reach ${pct(goal)}.`;
    }
    return {
      relative_uncertainty: goal,
      reachable: best !== null,
      smallest_height_m: rounded,
      drops_at_smallest_height: dropsThere,
      drops_at_planned_height: dropsPlanned,
      heights_by_drops: heightsByDrops,
      systematic_relative_uncertainty_at_max_height: floor,
      message,
    };
  }
}

