/**
 * The measurement model of a series whose drops carry marks, as one function of all its inputs:
 *
 *   C_d = f(T, p, humidity, [ρ], g, m, dimensions…, δt, δC_a, [column…], t_1…t_M, e_1…e_G, r_1…r_N, σ_1…σ_N, ρ_rs)
 *
 * The physical inputs sit where SeriesModel puts them (a SeriesModel with no heights lends its layout and its air
 * density); after them come every mark's time t (a drop without marks is one mark: its landing), a correction e of
 * each distinct distance (a gate's or a tape's position, shared by every mark at that distance in any drop), each
 * drop's release error r (known release: subtracted from all its marks), each drop's relative distance scale
 * change σ (a clip's scale marks) and the rolling shutter's delay at the bottom of a video's fall ρ_rs (each mark of
 * a video drop is read ρ_rs·d/d_max late, see timingMethodDefaults.ts). All the added positions are 0 at the
 * nominal point. The fit inside is fitDragToMarks (generalised least squares, its weights from the declared
 * per-mark, release and distance uncertainties); the GUM budget differentiates this function and the Monte Carlo
 * samples it, as for SeriesModel.
 */
import { fitDragToMarks, type MarkedDrop, type MarksFit } from './fitDragToMarks';
import type { SeriesModel, SeriesModelLayout } from './seriesModel';
import { geometryFromDimensions, type SpecimenShape } from './specimenGeometry';

export interface MarksDropSetup {
  /** The nominal distances and times (the landing included; a drop without marks: its one landing). */
  distances_m: number[];
  times_s: number[];
  releaseKnown: boolean;
  /** True when the drop carries marks (a video's rolling shutter and the scale act on these only). */
  marked: boolean;
  timeU_s: number;
  releaseU_s: number;
  distanceU_m: number;
}

export interface MarksModelSetup {
  shape: SpecimenShape;
  characteristicLength?: number;
  buoyancy: boolean;
  /** Null: the shape's own default (which follows the perturbed dimensions). */
  addedMassCoefficient: number | null;
  fitOffset: boolean;
  /** Whether the marks came from video: the rolling shutter's delay acts on marked drops. */
  video: boolean;
  drops: MarksDropSetup[];
}

export interface MarksLayout {
  physics: SeriesModelLayout;
  /** Per drop, per mark: the position of its time. */
  markTime: number[][];
  /** Per drop, per mark: the position of its distance's correction (one per distinct distance). */
  markDistance: number[][];
  /** The distinct distances, m, in order of their positions. */
  distinctDistances: number[];
  firstDistance: number;
  firstRelease: number;
  firstScale: number;
  rollingShutter_s: number;
  fullLength: number;
}

export class MarksModel {
  readonly layout: MarksLayout;
  private readonly drops: MarkedDrop[];
  private readonly dims: Float64Array;
  private readonly reach: number[];
  // Outputs of the last evaluate().
  status: string = 'ok';
  offset_s = 0;
  dragConstant_per_m = 0;
  lastFit: MarksFit | null = null;
  effectiveGravity_m_s2 = NaN;
  effectiveMass_kg = NaN;
  density_kg_m3 = NaN;
  area_m2 = NaN;
  /** Warm start of the fit (the nominal solution once known). */
  startDragConstant = 0;
  /**
   * The weights of the nominal fit, once frozen (freezeWeights): every later evaluation (budget, Monte Carlo) is the
   * generalised least squares with this fixed weight matrix, the nominal one's value unchanged.
   */
  private frozenWeights: Float64Array | null = null;

  /** Evaluates at x0 and keeps the weights of that fit for every later evaluation. */
  freezeWeights(x0: Float64Array): number {
    this.frozenWeights = null;
    const out = new Float64Array(this.layout.markTime.reduce((n, t) => n + t.length, 0));
    const cd = this.evaluate(x0, out);
    this.frozenWeights = out;
    return cd;
  }

  constructor(
    readonly setup: MarksModelSetup,
    /** A SeriesModel without heights: its layout and its air density for the physical inputs. */
    private readonly physics: SeriesModel,
    dimensionCount: number,
  ) {
    const L = physics.layout;
    let position = L.fullLength;
    const markTime = setup.drops.map((d) => d.times_s.map(() => position++));
    const distinct = new Map<number, number>();
    const firstDistance = position;
    const markDistance = setup.drops.map((d) =>
      d.distances_m.map((distance) => {
        let index = distinct.get(distance);
        if (index === undefined) {
          index = firstDistance + distinct.size;
          distinct.set(distance, index);
        }
        return index;
      }),
    );
    position = firstDistance + distinct.size;
    const firstRelease = position;
    position += setup.drops.length;
    const firstScale = position;
    position += setup.drops.length;
    const rollingShutter_s = position++;
    this.layout = {
      physics: L,
      markTime,
      markDistance,
      distinctDistances: [...distinct.keys()],
      firstDistance,
      firstRelease,
      firstScale,
      rollingShutter_s,
      fullLength: position,
    };
    this.drops = setup.drops.map((d) => ({
      distances_m: Float64Array.from(d.distances_m),
      times_s: Float64Array.from(d.times_s),
      releaseKnown: d.releaseKnown,
      timeU_s: d.timeU_s,
      releaseU_s: d.releaseU_s,
      distanceU_m: d.distanceU_m,
    }));
    this.reach = setup.drops.map((d) => Math.max(...d.distances_m));
    this.dims = new Float64Array(dimensionCount);
  }

  /** C_d at the inputs x; offset, k and status are left in the fields of the same names. */
  evaluate(x: Float64Array, weightsOut?: Float64Array): number {
    const L = this.layout.physics;
    // The body, as SeriesModel's closed form computes it (seriesModel.ts, evaluateClosed).
    const rho = this.physics.density(x);
    for (let i = 0; i < this.dims.length; i++) this.dims[i] = x[L.firstDimension + i]!;
    const geometry = geometryFromDimensions(this.setup.shape, this.dims, this.setup.characteristicLength);
    const Ca = (this.setup.addedMassCoefficient ?? geometry.default_added_mass_coefficient) + (x[L.addedMassChange] ?? 0);
    const m = x[L.mass_kg]!;
    const displaced = rho * geometry.volume_m3;
    const effectiveMass = m + Ca * displaced;
    const effectiveGravity = x[L.gravity_m_s2]! * ((m - (this.setup.buoyancy ? displaced : 0)) / effectiveMass);
    this.effectiveGravity_m_s2 = effectiveGravity;
    this.effectiveMass_kg = effectiveMass;
    this.density_kg_m3 = rho;
    this.area_m2 = geometry.area_m2;
    if (!(effectiveGravity > 0)) {
      this.status = 'not-heavier-than-air';
      this.offset_s = NaN;
      this.dragConstant_per_m = NaN;
      return NaN;
    }
    const M = this.layout;
    const delay = x[L.timingOffset_s] ?? 0;
    const shutter = this.setup.video ? x[M.rollingShutter_s]! : 0;
    for (let i = 0; i < this.drops.length; i++) {
      const setup = this.setup.drops[i]!;
      const drop = this.drops[i]!;
      const release = x[M.firstRelease + i]!;
      const scale = 1 + x[M.firstScale + i]!;
      const shutterHere = setup.marked ? shutter / this.reach[i]! : 0;
      const times = M.markTime[i]!;
      const distances = M.markDistance[i]!;
      for (let k = 0; k < times.length; k++) {
        const d0 = setup.distances_m[k]!;
        const d = d0 * (setup.marked ? scale : 1) + x[distances[k]!]!;
        drop.distances_m[k] = d;
        drop.times_s[k] = x[times[k]!]! - delay - release - shutterHere * d0;
      }
    }
    const fit = fitDragToMarks(effectiveGravity, this.drops, this.setup.fitOffset, this.startDragConstant, {
      ...(this.frozenWeights !== null ? { fixed: this.frozenWeights } : {}),
      ...(weightsOut !== undefined ? { out: weightsOut } : {}),
    });
    this.lastFit = fit;
    this.status = fit.status;
    this.offset_s = fit.offset_s;
    this.dragConstant_per_m = fit.dragConstant_per_m;
    return (2 * effectiveMass * fit.dragConstant_per_m) / (rho * geometry.area_m2);
  }
}
