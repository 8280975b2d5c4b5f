/** Speed of sound in air, c = 343.2·√(T/293.15) m/s (ISO 9613-1:1993, the reference speed used for atmospheric absorption). */
export function speedOfSound(temperature_K: number): number {
  return 343.2 * Math.sqrt(temperature_K / 293.15);
}
