/**
 * Added mass of a body moving along its symmetry axis, as a fraction of the displaced fluid's
 * mass (C_a in m_added = C_a·ρ_air·V).
 *
 * Exact potential-flow results exist for spheroids (H. Lamb, Hydrodynamics, 6th ed. 1932,
 * §373; collected in C. E. Brennen, "A review of added mass and fluid inertial forces", 1982):
 * with α0 the spheroid's shape integral along its axis, C_a = α0/(2 − α0). A sphere gives
 * exactly 1/2, a vanishingly thin disc broadside gives m_added = (8/3)·ρ·a³ (Lamb §102).
 *
 * For cylinders, discs and boxes there is no closed form; we use the spheroid with the same
 * length along the fall and the same frontal area, and convert its added mass to a fraction
 * of the real body's volume. This is an approximation (it gets both limits right: a thin disc
 * and a long rod); callers may give their own coefficient instead.
 */

/**
 * C_a of a spheroid with semi-axis `axial_m` along the motion and equatorial radius
 * `radial_m`, relative to the spheroid's own volume.
 */
export function spheroidAddedMassCoefficient(axial_m: number, radial_m: number): number {
  const ratio = axial_m / radial_m;
  if (Math.abs(ratio - 1) < 1e-6) return 0.5;
  let alpha0: number;
  if (ratio > 1) {
    // Prolate, moving along its long axis: e² = 1 − (b/a)².
    const e2 = 1 - 1 / (ratio * ratio);
    const e = Math.sqrt(e2);
    alpha0 = ((2 * (1 - e2)) / (e2 * e)) * (0.5 * Math.log((1 + e) / (1 - e)) - e);
  } else {
    // Oblate, moving along its short (symmetry) axis: e² = 1 − (c/a)².
    const e2 = 1 - ratio * ratio;
    const e = Math.sqrt(e2);
    alpha0 = (2 / e2) * (1 - (Math.sqrt(1 - e2) / e) * Math.asin(e));
  }
  return alpha0 / (2 - alpha0);
}

/**
 * C_a relative to the body's own volume, for a body of frontal area `area_m2`, length
 * `length_m` along the fall and volume `volume_m3`, approximated by the equivalent spheroid.
 */
export function equivalentSpheroidAddedMassCoefficient(area_m2: number, length_m: number, volume_m3: number): number {
  const radial = Math.sqrt(area_m2 / Math.PI);
  const axial = length_m / 2;
  const spheroidVolume = (4 / 3) * Math.PI * radial * radial * axial;
  return (spheroidAddedMassCoefficient(axial, radial) * spheroidVolume) / volume_m3;
}

/**
 * The standard uncertainty of C_a when the crew gives none, by shape. Potential flow is the ideal: a real body
 * accelerating from rest sheds a boundary layer and a wake, and its effective added mass (with the history force
 * folded in) moves away from the ideal value as the flow develops. Measured on spheres oscillating in water,
 * C_a rose from the ideal 0.5 at small acceleration numbers A_c = v²/(d·|dv/dt|) to about 1.05 at large ones
 * (Odar & Hamilton, J. Fluid Mech. 18, 302 (1964): C_a = 1.05 − 0.066/(A_c² + 0.12), from memory); a light sphere
 * moving in a straight line through air near rest follows the ideal 0.5 (Pantaleone & Messer, "The added mass of
 * a spherical projectile", Am. J. Phys. 79, 1202 (2011)). A falling body passes from A_c = 0 at release to large
 * A_c near terminal speed, so half the ideal value is the standard uncertainty we state for a sphere (common
 * practice reading of those two sources: ±2u spans 0 to 1.0). Cylinders, discs and boxes carry the same relative
 * uncertainty on their equivalent-spheroid estimate (its approximation error is smaller than the flow's, common
 * practice); a custom shape, whose nominal value is 0, gets 0.5 of its volume (common practice), drawn no lower
 * than zero.
 */
export const ADDED_MASS_RELATIVE_UNCERTAINTY = 0.5;
export const CUSTOM_ADDED_MASS_UNCERTAINTY = 0.5;

/** The default standard uncertainty of a nominal added-mass coefficient (see above). */
export function defaultAddedMassUncertainty(nominal: number, custom: boolean): number {
  return custom ? CUSTOM_ADDED_MASS_UNCERTAINTY : ADDED_MASS_RELATIVE_UNCERTAINTY * nominal;
}
