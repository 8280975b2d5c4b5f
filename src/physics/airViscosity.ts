/**
 * Dynamic viscosity of air by Sutherland's law, μ = β·T^(3/2)/(T + S), with the constants of
 * the U.S. Standard Atmosphere 1976 and ISO 2533: β = 1.458e-6 kg m^-1 s^-1 K^-1/2, S = 110.4 K.
 * Humidity changes μ by well under 1 % outdoors, far less than it matters for a Reynolds number.
 */
const SUTHERLAND_BETA = 1.458e-6;
const SUTHERLAND_S_K = 110.4;

export function airViscosity(temperature_K: number): number {
  return (SUTHERLAND_BETA * temperature_K * Math.sqrt(temperature_K)) / (temperature_K + SUTHERLAND_S_K);
}
