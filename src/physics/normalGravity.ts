/**
 * Local gravity from the WGS84 normal gravity formula (Somigliana's closed form, NIMA TR8350.2,
 * 3rd ed., 2000, chapter 4, with its constants γe, k and e²) and the normal free-air gradient
 * 0.3086 mGal/m:
 *
 *   γ(φ) = γe·(1 + k·sin²φ)/√(1 − e²·sin²φ),   g ≈ γ(φ) − 3.086e-6 s^-2 · h
 *
 * The linear free-air term ignores terrain and the rock below (Bouguer) and real anomalies,
 * which can reach 1e-4 relative: a measured value overrides the formula.
 */
import { checkNumber, checkOptionalNumber } from './checkNumber';

export const WGS84_EQUATORIAL_GRAVITY = 9.7803253359; // m/s²
const SOMIGLIANA_K = 0.00193185265241;
const FIRST_ECCENTRICITY_SQUARED = 0.00669437999013;
export const FREE_AIR_GRADIENT = 3.086e-6; // s^-2

/** WGS84 normal gravity on the ellipsoid at geodetic latitude φ (degrees). */
export function normalGravity(latitude_deg: number): number {
  const s = Math.sin((latitude_deg * Math.PI) / 180);
  const s2 = s * s;
  return (WGS84_EQUATORIAL_GRAVITY * (1 + SOMIGLIANA_K * s2)) / Math.sqrt(1 - FIRST_ECCENTRICITY_SQUARED * s2);
}

export interface SiteInput {
  latitude_deg?: number;
  elevation_m?: number;
  /** A measured local value; wins over the formula. */
  gravity_m_s2?: number;
}

export interface SiteGravity {
  gravity_m_s2: number;
  source: 'wgs84-normal-gravity' | 'override';
  /** The formula's value when latitude and elevation were given, also when overridden. */
  normal_gravity_m_s2: number | null;
}

export const GRAVITY_LIMITS = {
  latitude_deg: { min: -90, max: 90, text: '-90 to 90°' },
  elevation_m: { min: -500, max: 9000, text: '-500 to 9000 m' },
  gravity_m_s2: { min: 9.7, max: 9.9, text: '9.7 to 9.9 m/s² (Earth’s surface)' },
} as const;

/** g at a site: normal gravity minus the free-air gradient, unless a measured value is given. */
export function localGravity(site: SiteInput, field = 'site'): SiteGravity {
  const override = checkOptionalNumber(`${field}.gravity_m_s2`, site.gravity_m_s2, GRAVITY_LIMITS.gravity_m_s2);
  let formula: number | null = null;
  if (override === undefined || (site.latitude_deg !== undefined && site.elevation_m !== undefined)) {
    const lat = checkNumber(`${field}.latitude_deg`, site.latitude_deg, GRAVITY_LIMITS.latitude_deg);
    const h = checkNumber(`${field}.elevation_m`, site.elevation_m, GRAVITY_LIMITS.elevation_m);
    formula = normalGravity(lat) - FREE_AIR_GRADIENT * h;
  }
  if (override !== undefined) return { gravity_m_s2: override, source: 'override', normal_gravity_m_s2: formula };
  return { gravity_m_s2: formula as number, source: 'wgs84-normal-gravity', normal_gravity_m_s2: formula };
}
