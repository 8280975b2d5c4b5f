/**
 * The air along the fall and its motion inside the measurement model (seriesModel.ts).
 *
 * The model first fits the closed form in uniform still air at the reading (fallModel.ts), C_d,u. Where the air
 * along the fall or its motion matters, it also fits the fall through the column (fallThroughColumn.ts), C_d,c,
 * and reports
 *
 *   C_d = C_d,u · (1 + w·(R − 1)),  R = C_d,c / C_d,u
 *
 * with a weight w fixed once per analysis from the nominal inputs (columnWeight below): 0 where the column's
 * effect e on every mean time (its nominal shift and its inputs' shifts at one standard uncertainty, in
 * quadrature) is under a tenth of that mean time's smallest standard uncertainty (the declared timing uncertainty
 * over √n), 1 from two tenths, and a smoothstep between, so the result has no step where the closed form hands
 * over, and the part left out, (1 − w)·e, is never more than 0.11 of that uncertainty (its largest, at e ≈ 0.115).
 *
 * The GUM budget differentiates the exact model. The Monte Carlo, which evaluates the model tens of thousands of
 * times, evaluates the closed form exactly and R through a separable quadratic surrogate: for each input, a
 * parabola through R at the nominal value and at ± one standard uncertainty (JCGM 101 allows any model evaluation
 * accurate enough; the surrogate's error is third order in each input's spread and second order in the cross
 * terms it leaves out; test/physics/airColumnSeries.test.ts compares it with the exact model at draws of the
 * inputs: within 5 % of u_c (2.7 % for a 3000 m series in a crosswind, about a tenth at twice the spread).
 */
import { AirColumn } from './airColumn';

export type ColumnHumidity = 'relative-humidity' | 'dew-point' | 'none';

/** Dry air's gas factor M/R (CIPM-2007's molar mass at 400 µmol/mol CO2; CODATA 2018 R), for a density given without a pressure. */
const DRY_AIR_GAS_FACTOR = 0.028965 / 8.314462618;

export interface ColumnLayout {
  temperature_K: number;
  pressure_Pa: number;
  gravity_m_s2: number;
  lapseRate_K_per_m: number;
  verticalWind_m_s: number;
  windSpeed_m_s: number;
  aloftTemperature_K: number;
  aloftPressure_Pa: number;
  aloftHumidity: number;
  aloftVerticalWind_m_s: number;
  aloftWindSpeed_m_s: number;
}

export interface ColumnSetup {
  readingHeight_m: number;
  /** The second reading's height and humidity kind; null with one reading. */
  aloft: { height_m: number; humidity: ColumnHumidity } | null;
}

/** The column at the inputs x, given the ground reading's density and vapour mole fraction. */
export function columnAt(
  setup: ColumnSetup,
  L: ColumnLayout,
  x: Float64Array,
  density_kg_m3: number,
  vapourMoleFraction: number,
  aloftDensity: (p: number, T: number, humidity: number, kind: ColumnHumidity, groundVapour: number) => number,
): AirColumn {
  const T = x[L.temperature_K]!;
  let p = x[L.pressure_Pa]!;
  let G: number;
  if (p > 0) {
    G = (density_kg_m3 * T) / p;
  } else {
    // A density given without a pressure: a notional pressure that makes the dry-air gas factor give it.
    G = DRY_AIR_GAS_FACTOR;
    p = (density_kg_m3 * T) / G;
  }
  const reading = {
    height_m: setup.readingHeight_m,
    temperature_K: T,
    pressure_Pa: p,
    gasFactor: G,
    verticalWind_m_s: x[L.verticalWind_m_s] ?? 0,
    windSpeed_m_s: x[L.windSpeed_m_s] ?? 0,
  };
  if (setup.aloft === null) return new AirColumn(reading, x[L.gravity_m_s2]!, x[L.lapseRate_K_per_m] ?? 0);
  const TA = x[L.aloftTemperature_K]!;
  const pA = x[L.aloftPressure_Pa]!;
  const rhoA = aloftDensity(pA, TA, x[L.aloftHumidity]!, setup.aloft.humidity, vapourMoleFraction);
  return new AirColumn(reading, x[L.gravity_m_s2]!, 0, {
    height_m: setup.aloft.height_m,
    temperature_K: TA,
    pressure_Pa: pA,
    gasFactor: (rhoA * TA) / pA,
    verticalWind_m_s: x[L.aloftVerticalWind_m_s] ?? 0,
    windSpeed_m_s: x[L.aloftWindSpeed_m_s] ?? 0,
  });
}

/** The weight of the column's result from its effect over the smallest uncertainty (see the file's comment). */
export function columnWeight(effectOverUncertainty: number): number {
  const s = Math.min(Math.max((effectOverUncertainty - 0.1) / 0.1, 0), 1);
  return s * s * (3 - 2 * s);
}

/** A separable quadratic in the inputs' deviations from x0, for R and for the offset's change. */
export class ColumnSurrogate {
  private readonly indices: Int32Array;
  private readonly linear: Float64Array;
  private readonly quadratic: Float64Array;
  private readonly offsetLinear: Float64Array;
  private readonly offsetQuadratic: Float64Array;

  constructor(
    private readonly x0: Float64Array,
    readonly ratio0: number,
    readonly offsetChange0: number,
    sweeps: { index: number; u: number; ratioUp: number; ratioDown: number; offsetUp: number; offsetDown: number }[],
  ) {
    const n = sweeps.length;
    this.indices = new Int32Array(n);
    this.linear = new Float64Array(n);
    this.quadratic = new Float64Array(n);
    this.offsetLinear = new Float64Array(n);
    this.offsetQuadratic = new Float64Array(n);
    sweeps.forEach((s, i) => {
      this.indices[i] = s.index;
      this.linear[i] = (s.ratioUp - s.ratioDown) / (2 * s.u);
      this.quadratic[i] = (s.ratioUp + s.ratioDown - 2 * ratio0) / (2 * s.u * s.u);
      this.offsetLinear[i] = (s.offsetUp - s.offsetDown) / (2 * s.u);
      this.offsetQuadratic[i] = (s.offsetUp + s.offsetDown - 2 * offsetChange0) / (2 * s.u * s.u);
    });
  }

  /** R at x; the offset's change is left in `offsetChange`. */
  offsetChange = 0;
  ratio(x: Float64Array): number {
    let r = this.ratio0;
    let o = this.offsetChange0;
    for (let i = 0; i < this.indices.length; i++) {
      const index = this.indices[i]!;
      const d = x[index]! - this.x0[index]!;
      r += d * (this.linear[i]! + d * this.quadratic[i]!);
      o += d * (this.offsetLinear[i]! + d * this.offsetQuadratic[i]!);
    }
    this.offsetChange = o;
    return r;
  }
}
