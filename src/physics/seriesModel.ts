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
import { columnAt, ColumnSurrogate, type ColumnHumidity, type ColumnSetup } from './columnCorrection';
import { fallParameters, fallTime } from './fallModel';
import { fallThroughColumn, type ColumnBody } from './fallThroughColumn';
import { FIT_DRAG_CONSTANT, FIT_OFFSET, fitDragConstantInto, type DragFit } from './fitDragConstant';
import { fitDragInColumn } from './fitDragInColumn';
import {
  moistAirDensity,
  vapourMoleFractionFromDewPoint,
  vapourMoleFractionFromRelativeHumidity,
} from './moistAirDensity';
import { GEOMETRY_ADDED_MASS, GEOMETRY_AREA, GEOMETRY_LENGTH, GEOMETRY_VOLUME, writeGeometry, type SpecimenShape } from './specimenGeometry';

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
  /** The air along the fall and its motion (columnCorrection.ts); absent: uniform still air only. */
  column?: ColumnSetup;
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
  /** Optional trailing positions of the air along the fall and its motion (columnCorrection.ts). */
  lapseRate_K_per_m: number;
  verticalWind_m_s: number;
  windSpeed_m_s: number;
  aloftTemperature_K: number;
  aloftPressure_Pa: number;
  aloftHumidity: number;
  aloftVerticalWind_m_s: number;
  aloftWindSpeed_m_s: number;
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

/**
 * The integrator's tolerance inside fits (moving air only; still air is a quadrature): 1e-9 keeps its noise far
 * below the budget's differences (steps of a hundredth of a standard uncertainty move a time by 1e-6 or more).
 */
const COLUMN_FIT_TOLERANCE = 1e-9;

function vapourFraction(p: number, T: number, humidity: number, kind: HumidityKind, otherwise: number): number {
  if (kind === 'relative-humidity') return vapourMoleFractionFromRelativeHumidity(p, T, humidity);
  if (kind === 'dew-point') return vapourMoleFractionFromDewPoint(p, humidity);
  return otherwise;
}

export class SeriesModel {
  readonly layout: SeriesModelLayout;
  readonly groups: number;
  private readonly heights: Float64Array;
  /** Mean times less the declared delay, as last fitted. */
  private readonly times: Float64Array;
  private readonly dims: Float64Array;
  // Scratch for the geometry and the fit of each evaluation (writeGeometry, fitDragConstantInto): no objects per draw.
  private readonly geometry = new Float64Array(5);
  private readonly fitResult = new Float64Array(3);
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
      lapseRate_K_per_m: firstTime + J + 2,
      verticalWind_m_s: firstTime + J + 3,
      windSpeed_m_s: firstTime + J + 4,
      aloftTemperature_K: firstTime + J + 5,
      aloftPressure_Pa: firstTime + J + 6,
      aloftHumidity: firstTime + J + 7,
      aloftVerticalWind_m_s: firstTime + J + 8,
      aloftWindSpeed_m_s: firstTime + J + 9,
      densityRelativeChange: firstTime + J + 10,
      fullLength: firstTime + J + 11,
    };
    this.columnSlopes = new Float64Array(J).fill(NaN);
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
    const xv = vapourFraction(p, T, x[L.humidity]!, this.setup.humidity, 0);
    this.lastVapour = xv;
    return moistAirDensity(p, T, xv, this.setup.co2MoleFraction) * formulaError;
  }

  /** The air along the fall: 0 keeps the closed form in uniform still air (set from columnEffect, see columnCorrection.ts). */
  columnWeight = 0;
  /** While set, the Monte Carlo's surrogate stands in for the column's fit. */
  columnSurrogate: ColumnSurrogate | null = null;
  /** The last exact C_d in the column over the closed form's (a warm start). */
  columnRatio = 1;
  private lastVapour = 0;
  /** ∂T_j/∂C_d of the column's fall, from the first column fit (see fitDragInColumn.ts). */
  private readonly columnSlopes: Float64Array;
  private readonly aloftDensity = (p: number, T: number, humidity: number, kind: ColumnHumidity, groundVapour: number): number =>
    moistAirDensity(p, T, vapourFraction(p, T, humidity, kind, groundVapour), this.setup.co2MoleFraction);

  private columnBody(): ColumnBody {
    return {
      mass_kg: this.lastMass,
      area_m2: this.lastArea,
      volume_m3: this.lastVolume,
      characteristic_length_m: this.lastLength,
      buoyancy: this.setup.buoyancy,
      added_mass_coefficient: this.lastAddedMass,
      drag_coefficient: 0,
    };
  }

  /** The column at x from its air inputs alone (no fit: for predictions of a fall with a known C_d). */
  airColumnAt(x: Float64Array) {
    const rho = this.density(x);
    return columnAt(this.setup.column!, this.layout, x, rho, this.lastVapour, this.aloftDensity);
  }

  /** The column at x (after evaluate(x) has set the reading's density). */
  column(x: Float64Array) {
    return columnAt(this.setup.column!, this.layout, x, this.lastDensity, this.lastVapour, this.aloftDensity);
  }

  /**
   * The column's effect on the fall times at x (evaluated first), over the smallest standard uncertainty of each
   * mean time (timingU/√n_j), largest over the heights: the nominal shift and the given inputs' shifts at one
   * standard uncertainty, in quadrature (see columnCorrection.ts).
   */
  columnEffect(x: Float64Array, timingU: number, inputs: { index: number; u: number }[]): number {
    const cd = this.evaluate(x);
    if (this.setup.column === undefined || this.status !== 'ok' || !Number.isFinite(cd)) return 0;
    const body = this.columnBody();
    body.drag_coefficient = Math.max(cd, 0);
    const closed = fallParameters({ ...body, drag_coefficient: 0, density_kg_m3: this.lastDensity, gravity_m_s2: x[this.layout.gravity_m_s2]! });
    closed.drag_constant_per_m = Math.max(this.dragConstant_per_m, 0);
    const column = this.column(x);
    const shifted = Float64Array.from(x);
    let worst = 0;
    for (let j = 0; j < this.groups; j++) {
      const h = this.heights[j]!;
      const t = fallThroughColumn(h, body, column, COLUMN_FIT_TOLERANCE, true).time_s;
      let spread = 0;
      for (const input of inputs) {
        shifted[input.index] = x[input.index]! + input.u;
        const moved = fallThroughColumn(h, body, this.column(shifted), COLUMN_FIT_TOLERANCE, true).time_s;
        shifted[input.index] = x[input.index]!;
        spread += (moved - t) ** 2;
      }
      const effect = Math.sqrt((t - fallTime(h, closed)) ** 2 + spread);
      worst = Math.max(worst, effect / (timingU / Math.sqrt(this.setup.counts[j]!)));
    }
    this.evaluate(x);
    return worst;
  }

  /** The column's own fit at x, after the closed form's (in evaluate); null when it has none. */
  private columnFit(x: Float64Array, closedCd: number): { cd: number; offset: number } | null {
    const column = this.column(x);
    const body = this.columnBody();
    try {
      const fit = fitDragInColumn(
        (j, c) => {
          body.drag_coefficient = c;
          return fallThroughColumn(this.heights[j]!, body, column, COLUMN_FIT_TOLERANCE, true).time_s;
        },
        this.times,
        this.setup.counts,
        this.setup.fitOffset,
        closedCd * this.columnRatio,
        this.columnSlopes,
      );
      return fit.status === "ok" ? { cd: fit.drag_coefficient, offset: fit.offset_s } : null;
    } catch {
      // The fall has no solution at these inputs (an updraft that holds the body up): no value for this draw.
      return null;
    }
  }

  /**
   * Freezes the Monte Carlo surrogate of the column's ratio at x0: a parabola per input through ± its standard
   * uncertainty (see columnCorrection.ts). Unfreeze by setting columnSurrogate to null.
   */
  freezeColumn(x0: Float64Array, inputs: { index: number; u: number }[]): void {
    this.columnSurrogate = null;
    if (this.columnWeight === 0) return;
    const ratioAt = (x: Float64Array): [number, number] => {
      const closedCd = this.evaluateClosed(x);
      const closedOffset = this.offset_s;
      const fit = this.status === 'ok' ? this.columnFit(x, closedCd) : null;
      return fit === null ? [this.columnRatio, 0] : [fit.cd / closedCd, fit.offset - closedOffset];
    };
    const [ratio0, offset0] = ratioAt(x0);
    this.columnRatio = ratio0;
    const x = Float64Array.from(x0);
    const sweeps = inputs.map(({ index, u }) => {
      x[index] = x0[index]! + u;
      const [ratioUp, offsetUp] = ratioAt(x);
      x[index] = x0[index]! - u;
      const [ratioDown, offsetDown] = ratioAt(x);
      x[index] = x0[index]!;
      return { index, u, ratioUp, ratioDown, offsetUp, offsetDown };
    });
    this.columnRatio = ratio0;
    this.columnSurrogate = new ColumnSurrogate(Float64Array.from(x0), ratio0, offset0, sweeps);
  }

  // Intermediate values of the last evaluate(), for evaluateDetailed().
  private lastDensity = NaN;
  private lastEffectiveGravity = NaN;
  private lastEffectiveMass = NaN;
  private lastArea = NaN;
  private lastVolume = NaN;
  private lastAddedMass = NaN;
  private lastMass = NaN;
  private lastLength = NaN;

  /** C_d at the inputs x; offset, k and status are left in the fields of the same names. */
  evaluate(x: Float64Array): number {
    const closedCd = this.evaluateClosed(x);
    if (this.columnWeight === 0 || this.status !== 'ok' || !Number.isFinite(closedCd)) return closedCd;
    let ratio: number;
    let offsetChange: number;
    if (this.columnSurrogate !== null) {
      ratio = this.columnSurrogate.ratio(x);
      offsetChange = this.columnSurrogate.offsetChange;
    } else {
      const fit = this.columnFit(x, closedCd);
      if (fit === null) {
        this.status = 'not-converged';
        return NaN;
      }
      ratio = fit.cd / closedCd;
      offsetChange = fit.offset - this.offset_s;
      this.columnRatio = ratio;
    }
    const w = this.columnWeight;
    this.offset_s += w * offsetChange;
    return closedCd * (1 + w * (ratio - 1));
  }

  /** The closed form in uniform still air at the reading: C_d,u of columnCorrection.ts. */
  private evaluateClosed(x: Float64Array): number {
    const L = this.layout;
    const rho = this.density(x);
    for (let i = 0; i < this.dims.length; i++) this.dims[i] = x[L.firstDimension + i]!;
    const geometry = this.geometry;
    writeGeometry(this.setup.shape, this.dims, this.setup.characteristicLength, geometry);
    const area = geometry[GEOMETRY_AREA]!;
    const volume = geometry[GEOMETRY_VOLUME]!;
    const Ca = (this.setup.addedMassCoefficient ?? geometry[GEOMETRY_ADDED_MASS]!) + (x[L.addedMassChange] ?? 0);
    const m = x[L.mass_kg]!;
    const displaced = rho * volume;
    const effectiveMass = m + Ca * displaced;
    const effectiveGravity = x[L.gravity_m_s2]! * ((m - (this.setup.buoyancy ? displaced : 0)) / effectiveMass);
    this.lastDensity = rho;
    this.lastEffectiveGravity = effectiveGravity;
    this.lastEffectiveMass = effectiveMass;
    this.lastArea = area;
    this.lastVolume = volume;
    this.lastAddedMass = Ca;
    this.lastMass = m;
    this.lastLength = geometry[GEOMETRY_LENGTH]!;
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
    const fit = this.fitResult;
    this.status = fitDragConstantInto(effectiveGravity, this.heights, this.times, this.setup.counts, this.setup.fitOffset, this.startDragConstant, fit);
    this.offset_s = fit[FIT_OFFSET]!;
    this.dragConstant_per_m = fit[FIT_DRAG_CONSTANT]!;
    return (2 * effectiveMass * this.dragConstant_per_m) / (rho * area);
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
