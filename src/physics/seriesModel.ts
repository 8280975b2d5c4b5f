/**
 * The measurement model of one series as a single function of all its inputs:
 *
 *   C_d = f(T, p, humidity, [ρ], g, m, dimensions…, h_1…h_J, t̄_1…t̄_J, δt, δC_a)
 *
 * δt is the declared constant start/stop delay (one value for every drop, so its error is fully correlated
 * across them) and δC_a a change of the added-mass coefficient from its nominal value; both are 0 at the
 * nominal point unless declared, and t − 0 and C_a + 0 are exact, so requests without them are unchanged.
 *
 * The GUM budget differentiates it, the Monte Carlo propagation samples it, and the reported
 * value is it at the nominal inputs, so the three can never disagree about what is computed.
 * Inputs live in one Float64Array (layout below): sampling and differentiating only write
 * numbers into it.
 */
import { fitDragConstant, type DragFit } from './fitDragConstant';
import {
  moistAirDensity,
  vapourMoleFractionFromDewPoint,
  vapourMoleFractionFromRelativeHumidity,
} from './moistAirDensity';
import { geometryFromDimensions, type SpecimenShape } from './specimenGeometry';

export type SeriesStatus = DragFit['status'] | 'not-heavier-than-air';

export type HumidityKind = 'relative-humidity' | 'dew-point' | 'none';

export interface SeriesModelSetup {
  shape: SpecimenShape;
  dimensionCount: number;
  characteristicLength?: number;
  humidity: HumidityKind;
  densityOverride: boolean;
  co2MoleFraction: number;
  buoyancy: boolean;
  /** Null: use the shape's own default (which then follows the perturbed dimensions). */
  addedMassCoefficient: number | null;
  fitOffset: boolean;
  /** Drops per distinct height. */
  counts: Float64Array;
}

/** Positions in the input vector. */
export interface SeriesModelLayout {
  temperature_K: number;
  pressure_Pa: number;
  humidity: number;
  density_kg_m3: number;
  gravity_m_s2: number;
  mass_kg: number;
  firstDimension: number;
  firstHeight: number;
  firstTime: number;
  /** The inputs every series has (up to the last mean time). */
  length: number;
  /** Optional trailing position: the declared constant delay subtracted from every mean time, s (0 when absent). */
  timingOffset_s: number;
  /** Optional trailing position: added to the added-mass coefficient (0 when absent). */
  addedMassChange: number;
  /** Optional trailing position: relative change of the computed air density (the formula's own error; 0 when absent). */
  densityRelativeChange: number;
  /** With the optional trailing positions; a shorter vector reads them as 0. */
  fullLength: number;
}

export interface SeriesEvaluation {
  dragCoefficient: number;
  offset_s: number;
  dragConstant_per_m: number;
  status: SeriesStatus;
  density_kg_m3: number;
  effectiveGravity_m_s2: number;
  effectiveMass_kg: number;
  area_m2: number;
  volume_m3: number;
  addedMassCoefficient: number;
}

export class SeriesModel {
  readonly layout: SeriesModelLayout;
  readonly groups: number;
  private readonly heights: Float64Array;
  private readonly times: Float64Array;
  private readonly dims: Float64Array;
  /** Warm start for the next fit (the nominal solution). */
  startDragConstant: number | undefined;
  // Outputs of the last evaluate(), kept in fields so the hot loop creates no objects.
  offset_s = 0;
  dragConstant_per_m = 0;
  status: SeriesStatus = 'ok';

  constructor(readonly setup: SeriesModelSetup) {
    const J = setup.counts.length;
    this.groups = J;
    const firstDimension = 6;
    const firstHeight = firstDimension + setup.dimensionCount;
    const firstTime = firstHeight + J;
    this.layout = {
      temperature_K: 0,
      pressure_Pa: 1,
      humidity: 2,
      density_kg_m3: 3,
      gravity_m_s2: 4,
      mass_kg: 5,
      firstDimension,
      firstHeight,
      firstTime,
      length: firstTime + J,
      timingOffset_s: firstTime + J,
      addedMassChange: firstTime + J + 1,
      densityRelativeChange: firstTime + J + 2,
      fullLength: firstTime + J + 3,
    };
    this.heights = new Float64Array(J);
    this.times = new Float64Array(J);
    this.dims = new Float64Array(setup.dimensionCount);
  }

  density(x: Float64Array): number {
    const L = this.layout;
    if (this.setup.densityOverride) return x[L.density_kg_m3]!;
    const formulaError = 1 + (x[L.densityRelativeChange] ?? 0);
    const T = x[L.temperature_K]!;
    const p = x[L.pressure_Pa]!;
    let xv = 0;
    if (this.setup.humidity === 'relative-humidity') {
      xv = vapourMoleFractionFromRelativeHumidity(p, T, x[L.humidity]!);
    } else if (this.setup.humidity === 'dew-point') {
      xv = vapourMoleFractionFromDewPoint(p, x[L.humidity]!);
    }
    return moistAirDensity(p, T, xv, this.setup.co2MoleFraction) * formulaError;
  }

  // Intermediate values of the last evaluate(), for evaluateDetailed().
  private lastDensity = NaN;
  private lastEffectiveGravity = NaN;
  private lastEffectiveMass = NaN;
  private lastArea = NaN;
  private lastVolume = NaN;
  private lastAddedMass = NaN;

  /** C_d at the inputs x; offset, k and status are left in the fields of the same names. */
  evaluate(x: Float64Array): number {
    const L = this.layout;
    const rho = this.density(x);
    for (let i = 0; i < this.dims.length; i++) this.dims[i] = x[L.firstDimension + i]!;
    const geometry = geometryFromDimensions(this.setup.shape, this.dims, this.setup.characteristicLength);
    const Ca = (this.setup.addedMassCoefficient ?? geometry.default_added_mass_coefficient) + (x[L.addedMassChange] ?? 0);
    const m = x[L.mass_kg]!;
    const displaced = rho * geometry.volume_m3;
    const effectiveMass = m + Ca * displaced;
    const effectiveGravity = x[L.gravity_m_s2]! * ((m - (this.setup.buoyancy ? displaced : 0)) / effectiveMass);
    this.lastDensity = rho;
    this.lastEffectiveGravity = effectiveGravity;
    this.lastEffectiveMass = effectiveMass;
    this.lastArea = geometry.area_m2;
    this.lastVolume = geometry.volume_m3;
    this.lastAddedMass = Ca;
    if (!(effectiveGravity > 0)) {
      this.status = 'not-heavier-than-air';
      this.offset_s = NaN;
      this.dragConstant_per_m = NaN;
      return NaN;
    }
    const delay = x[L.timingOffset_s] ?? 0;
    for (let j = 0; j < this.groups; j++) {
      this.heights[j] = x[L.firstHeight + j]!;
      this.times[j] = x[L.firstTime + j]! - delay;
    }
    const fit = fitDragConstant(effectiveGravity, this.heights, this.times, this.setup.counts, this.setup.fitOffset, this.startDragConstant);
    this.offset_s = fit.offset_s;
    this.dragConstant_per_m = fit.drag_constant_per_m;
    this.status = fit.status;
    return (2 * effectiveMass * fit.drag_constant_per_m) / (rho * geometry.area_m2);
  }

  evaluateDetailed(x: Float64Array): SeriesEvaluation {
    const cd = this.evaluate(x);
    return {
      dragCoefficient: cd,
      offset_s: this.offset_s,
      dragConstant_per_m: this.dragConstant_per_m,
      status: this.status,
      density_kg_m3: this.lastDensity,
      effectiveGravity_m_s2: this.lastEffectiveGravity,
      effectiveMass_kg: this.lastEffectiveMass,
      area_m2: this.lastArea,
      volume_m3: this.lastVolume,
      addedMassCoefficient: this.lastAddedMass,
    };
  }
}
