/**
 * The standard drag curve of a smooth sphere: C_d against Reynolds number as tabulated piecewise by R. Clift,
 * J. R. Grace and M. E. Weber, Bubbles, Drops, and Particles (Academic Press, 1978), Table 5.2 (coefficients from
 * memory, and the same in an independent open-source transcription; the pieces join within 0.8 % at every boundary
 * below Re = 3.38e5, which checks them). w = log10 Re.
 *
 *   Re ≤ 0.01            C_d = 9/2 + 24/Re       (Oseen: 24/Re·(1 + 3Re/16))
 *   0.01 < Re ≤ 20       C_d = 24/Re·(1 + 0.1315·Re^(0.82 − 0.05w))
 *   20 < Re ≤ 260        C_d = 24/Re·(1 + 0.1935·Re^0.6305)
 *   260 < Re ≤ 1500      log10 C_d = 1.6435 − 1.1242w + 0.1558w²
 *   1500 < Re ≤ 1.2e4    log10 C_d = −2.4571 + 2.5558w − 0.9295w² + 0.1049w³
 *   1.2e4 < Re ≤ 4.4e4   log10 C_d = −1.9181 + 0.6370w − 0.0636w²
 *   4.4e4 < Re ≤ 3.38e5  log10 C_d = −4.3390 + 1.5809w − 0.1546w²
 *   3.38e5 < Re ≤ 4e5    C_d = 29.78 − 5.3w           (the drag crisis: least certain, and they
 *   4e5 < Re ≤ 1e6       C_d = 0.1w − 0.49             do not join at 4e5; a warning goes with them)
 *   Re > 1e6             C_d = 0.19 − 8e4/Re
 *
 * Accuracy (tested in test/physics/standardSphereDrag.test.ts against tables outside the project): within 4 % of
 * Pruppacher & Klett's Table 10.1 (Re 10–300), within 0.5 % of the Proudman–Pearson expansion (Re 0.1–0.5), within
 * 6 % of the reproduced standard curve for 1 ≤ Re ≤ 6e4, within 4.8 % of Morsi & Alexander's fit to the standard
 * table (1972, Re 0.1–5e4). Correlations fitted to compiled data (Clift & Gauvin 1970; Haider & Levenspiel 1989;
 * Brown & Lawler 2003, 480 points corrected for wall effects) lie within 5.5 % of it up to Re 7e4 but 6–8 % below
 * it at 1e5–2e5, where Hoerner's chart lies on it. Measured curves differ more among themselves: Roos & Willmarth's
 * tunnel (1971) reads 9–12 % above the curve at Re 5e3–5e4.
 *
 * Its stated relative standard uncertainty, standardSphereDragRelativeUncertainty(Re), continuous in Re:
 *
 *   Re ≤ 1e5       5 %. The ±5 % agreement with the tabulated standard values is taken as one standard uncertainty,
 *                  not as the half-width of a rectangular distribution (GUM 4.3.7 would give 5 %/√3 = 2.9 %): single
 *                  measured data sets scatter about the standard curve by more than that bound (Roos & Willmarth's
 *                  122 points: 65 % within ±5 %, 85 % within ±10 %, near the 68 % and 95 % of a normal distribution
 *                  with σ = 5 %; with 2.9 % only 71 % would lie within ±2 u and 82 % within ±3 u).
 *   1e5 … 2e5      rising smoothly to 10 % at 2e5: published tables and correlations differ by 8–12 % there (the
 *                  figures above), and turbulent tunnels begin the drag crisis early; that spread as one u.
 *   2e5 … 3e5      rising smoothly to 50 % at 3e5 and staying there: the drag crisis (C_d of a smooth sphere falls from
 *                  about 0.5 to about 0.07–0.1 between 2e5 and 5e5 depending on the free stream's turbulence and the
 *                  surface; Achenbach 1972, from memory); the curve's value there is a guess.
 *
 * Both rises are cubic smoothsteps in log10 Re (continuous with their first derivative). A prediction carries it by
 * moving the whole curve by ±u(Re) at once (the error of a standard curve is systematic over one fall; predictedFall.ts).
 */
export const STANDARD_SPHERE_DRAG_VALID_MAX_REYNOLDS = 2e5;
/** The Reynolds numbers where the pieces below meet (each piece's upper limit, taken in it): the curve jumps or kinks there. */
export const STANDARD_SPHERE_DRAG_PIECE_LIMITS: readonly number[] = [0.01, 20, 260, 1500, 1.2e4, 4.4e4, 3.38e5, 4e5, 1e6];
/** The curve's relative standard uncertainty up to Re = 1e5 (standardSphereDragRelativeUncertainty). */
export const STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY = 0.05;
/** At Re = 2e5, where published tables differ by 8–12 %. */
const RELATIVE_UNCERTAINTY_AT_2E5 = 0.1;
/** In the drag crisis and beyond (Re ≥ 3e5): the curve there is a guess. */
const RELATIVE_UNCERTAINTY_IN_CRISIS = 0.5;

/** Reynolds numbers of the drag crisis of smooth spheres (common practice: 2e5 to 5e5). */
export const DRAG_CRISIS_REYNOLDS: readonly [number, number] = [2e5, 5e5];

/** 0 below 0, 1 above 1, 3x² − 2x³ between: continuous with its first derivative. */
function smoothstep(x: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  return x * x * (3 - 2 * x);
}

/** The stated relative standard uncertainty of standardSphereDragCoefficient(Re) (see the table above). */
export function standardSphereDragRelativeUncertainty(reynolds: number): number {
  // Contract check, plain on purpose: callers pass Reynolds numbers of validated inputs.
  if (!(reynolds > 0)) throw new RangeError(`Reynolds number must be positive, got ${reynolds}`);
  const w = Math.log10(reynolds);
  const rise1 = smoothstep((w - 5) / Math.log10(2));
  const rise2 = smoothstep((w - Math.log10(2e5)) / Math.log10(1.5));
  return (
    STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY +
    (RELATIVE_UNCERTAINTY_AT_2E5 - STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY) * rise1 +
    (RELATIVE_UNCERTAINTY_IN_CRISIS - RELATIVE_UNCERTAINTY_AT_2E5) * rise2
  );
}

export function standardSphereDragCoefficient(reynolds: number): number {
  // Contract check, plain on purpose: callers pass Reynolds numbers of validated inputs.
  if (!(reynolds > 0)) throw new RangeError(`Reynolds number must be positive, got ${reynolds}`);
  const Re = reynolds;
  const w = Math.log10(Re);
  if (Re <= 0.01) return 9 / 2 + 24 / Re;
  if (Re <= 20) return (24 / Re) * (1 + 0.1315 * Math.pow(Re, 0.82 - 0.05 * w));
  if (Re <= 260) return (24 / Re) * (1 + 0.1935 * Math.pow(Re, 0.6305));
  if (Re <= 1500) return 10 ** (1.6435 - 1.1242 * w + 0.1558 * w * w);
  if (Re <= 1.2e4) return 10 ** (-2.4571 + 2.5558 * w - 0.9295 * w * w + 0.1049 * w * w * w);
  if (Re <= 4.4e4) return 10 ** (-1.9181 + 0.637 * w - 0.0636 * w * w);
  if (Re <= 3.38e5) return 10 ** (-4.339 + 1.5809 * w - 0.1546 * w * w);
  if (Re <= 4e5) return 29.78 - 5.3 * w;
  if (Re <= 1e6) return 0.1 * w - 0.49;
  return 0.19 - 8e4 / Re;
}
