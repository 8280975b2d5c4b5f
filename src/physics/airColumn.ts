/**
 * The air along a fall: temperature, pressure, density, viscosity, speed of sound and wind as functions of the
 * height z above the landing surface, from one reading (at its own height) or from two readings at different
 * heights.
 *
 * One reading. Temperature falls with height at the lapse rate Γ (ISO 2533 troposphere: 6.5 K/km; the request
 * may give another, and always its standard uncertainty, see DEFAULT_LAPSE_RATE_STANDARD_UNCERTAINTY). Pressure
 * follows hydrostatic balance dp/dz = −ρ·g(z) with the air's gas factor G = ρT/p (= M/(Z·R)) held at the
 * reading's value. Humidity rule: the water-vapour mole fraction of the reading is kept along the column (a
 * well-mixed layer, no condensation or evaporation), so the molar mass is constant; the compressibility factor
 * Z is taken at the reading (over 3000 m CIPM-2007's Z changes by about 1e-4, from its pressure term). Then
 *
 *   T(z) = T₀ − Γ·(z − z₀),   ln(p/p₀) = −(G·g/T₀)·(z − z₀)·F(Γ·(z − z₀)/T₀),   ρ = G·p/T
 *
 * with F(a) = ln(1 − a)/(−a) (F → 1 as Γ → 0, the isothermal atmosphere), which is the closed form of
 * ∫dz/T for a linear T. Gravity in the hydrostatic integral is the site's, taken constant over the column: its
 * free-air change (0.3086 mGal/m, about 1e-3 over 3000 m) moves the pressure at the top by well under 1e-4.
 *
 * Two readings (the second typically at the release point). Temperature is linear between them (and beyond them,
 * with the same slope), the pressure follows the same polytropic law through both readings (the exponent chosen
 * so that both pressures are met exactly), and the gas factor G (which carries the humidity) is linear in z
 * between the readings' own values, so both readings' CIPM-2007 densities are reproduced exactly.
 *
 * Wind: the vertical wind (positive up) and the horizontal wind speed are linear in z between two readings, and
 * constant with one.
 */
import { airViscosity } from './airViscosity';
import { speedOfSound } from './speedOfSound';

/** ISO 2533 (ICAO standard atmosphere) troposphere lapse rate, K/m. */
export const STANDARD_LAPSE_RATE_K_PER_M = 0.0065;

/**
 * Default standard uncertainty of the lapse rate, K/m: 3.3 K/km, the gap between the standard 6.5 K/km and the dry
 * adiabatic 9.8 K/km. A steeper lapse is convectively unstable and does not last (except in a shallow layer over
 * hot ground), so real lapse rates lie mostly within one such gap above the standard; below it the same spread
 * reaches an isothermal layer at one standard uncertainty and a mild inversion at two. Our own choice, stated.
 */
export const DEFAULT_LAPSE_RATE_STANDARD_UNCERTAINTY_K_PER_M = 0.0033;

/** Free-air gradient of gravity, (m/s²)/m (0.3086 mGal/m, the standard free-air correction; from memory). */
export const FREE_AIR_GRAVITY_GRADIENT_PER_S2 = 3.086e-6;

export interface AirReadingAt {
  /** Height of the reading above the landing surface, m. */
  height_m: number;
  temperature_K: number;
  pressure_Pa: number;
  /** ρ·T/p of the reading (kg·K/(m³·Pa)): the CIPM-2007 density divided by p/T. */
  gasFactor: number;
  /** Positive up, m/s. */
  verticalWind_m_s: number;
  /** Horizontal wind speed, m/s (its direction does not matter to the fall time). */
  windSpeed_m_s: number;
}

/** ln(1 − a)/(−a), smooth through a = 0. */
function logFactor(a: number): number {
  if (Math.abs(a) < 1e-4) return 1 + a * (0.5 + a / 3);
  return Math.log1p(-a) / -a;
}

/**
 * The column, built once per set of inputs; its functions allocate nothing (the fall's integrator calls them at
 * every stage of every step).
 */
export class AirColumn {
  readonly z0: number;
  readonly T0: number;
  readonly p0: number;
  /** dT/dz, K/m (minus the lapse rate). */
  readonly temperatureSlope: number;
  /** ln(p/p₀) = pressureScale·(z − z₀)·F(…) */
  private readonly pressureScale: number;
  private readonly gasFactor0: number;
  private readonly gasFactorSlope: number;
  private readonly w0: number;
  private readonly wSlope: number;
  private readonly u0: number;
  private readonly uSlope: number;
  /** Gravity at the landing surface, m/s². */
  readonly gravity0: number;

  /**
   * One reading and a lapse rate, or two readings (then the lapse rate is theirs and `lapseRate` is ignored).
   * `gravity_m_s2` is gravity at the landing surface.
   */
  constructor(reading: AirReadingAt, gravity_m_s2: number, lapseRate_K_per_m: number, aloft?: AirReadingAt) {
    this.z0 = reading.height_m;
    this.T0 = reading.temperature_K;
    this.p0 = reading.pressure_Pa;
    this.gravity0 = gravity_m_s2;
    this.gasFactor0 = reading.gasFactor;
    this.w0 = reading.verticalWind_m_s;
    this.u0 = reading.windSpeed_m_s;
    if (aloft === undefined) {
      this.temperatureSlope = -lapseRate_K_per_m;
      this.pressureScale = -(reading.gasFactor * gravity_m_s2) / reading.temperature_K;
      this.gasFactorSlope = 0;
      this.wSlope = 0;
      this.uSlope = 0;
    } else {
      const dz = aloft.height_m - reading.height_m;
      this.temperatureSlope = (aloft.temperature_K - reading.temperature_K) / dz;
      const a = (-this.temperatureSlope * dz) / reading.temperature_K;
      this.pressureScale = Math.log(aloft.pressure_Pa / reading.pressure_Pa) / (dz * logFactor(a));
      this.gasFactorSlope = (aloft.gasFactor - reading.gasFactor) / dz;
      this.wSlope = (aloft.verticalWind_m_s - reading.verticalWind_m_s) / dz;
      this.uSlope = (aloft.windSpeed_m_s - reading.windSpeed_m_s) / dz;
    }
  }

  temperature(z: number): number {
    return this.T0 + this.temperatureSlope * (z - this.z0);
  }

  pressure(z: number): number {
    const dz = z - this.z0;
    return this.p0 * Math.exp(this.pressureScale * dz * logFactor((-this.temperatureSlope * dz) / this.T0));
  }

  density(z: number): number {
    return ((this.gasFactor0 + this.gasFactorSlope * (z - this.z0)) * this.pressure(z)) / this.temperature(z);
  }

  viscosity(z: number): number {
    return airViscosity(this.temperature(z));
  }

  speedOfSound(z: number): number {
    return speedOfSound(this.temperature(z));
  }

  /** Gravity at height z above the landing surface (free-air gradient). */
  gravity(z: number): number {
    return this.gravity0 - FREE_AIR_GRAVITY_GRADIENT_PER_S2 * z;
  }

  /** Vertical wind, positive up, m/s. */
  verticalWind(z: number): number {
    return this.w0 + this.wSlope * (z - this.z0);
  }

  windSpeed(z: number): number {
    return this.u0 + this.uSlope * (z - this.z0);
  }

  /** True when the air moves anywhere in [0, top]. */
  hasWind(top: number): boolean {
    return this.w0 !== 0 || this.u0 !== 0 || ((this.wSlope !== 0 || this.uSlope !== 0) && top > 0);
  }

  hasCrosswind(): boolean {
    return this.u0 !== 0 || this.uSlope !== 0;
  }
}
