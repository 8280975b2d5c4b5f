/**
 * Saturation vapour pressure of water and the enhancement factor of moist air, as used by the
 * CIPM-2007 air density equation (A. Picard, R. S. Davis, M. Gläser, K. Fujii, "Revised formula
 * for the density of moist air (CIPM-2007)", Metrologia 45 (2008) 149–155, equations A1.1 and
 * A1.2). The vapour-pressure formula is Davis's fit over liquid water; CIPM gives it for
 * 15–27 °C, and it stays close to IAPWS values well outside that range (0–40 °C within about
 * 1e-4 relative).
 */

const A = 1.2378847e-5; // K^-2
const B = -1.9121316e-2; // K^-1
const C = 33.93711047;
const D = -6.3431645e3; // K

/** p_sv in Pa at the thermodynamic temperature T (K). */
export function saturationVapourPressure(temperature_K: number): number {
  const T = temperature_K;
  return Math.exp(A * T * T + B * T + C + D / T);
}

const ALPHA = 1.00062;
const BETA = 3.14e-8; // Pa^-1
const GAMMA = 5.6e-7; // K^-2

/**
 * Enhancement factor f(p, t): water vapour in air saturates at a slightly higher partial
 * pressure than over pure water. t is the Celsius temperature, as in the CIPM equation.
 */
export function enhancementFactor(pressure_Pa: number, temperature_K: number): number {
  const t = temperature_K - 273.15;
  return ALPHA + BETA * pressure_Pa + GAMMA * t * t;
}
