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
