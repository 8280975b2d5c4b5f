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
 * 6 % of the reproduced standard curve for 1 ≤ Re ≤ 6e4; measured curves themselves differ by up to about 10 %
 * between wind tunnels at 2e3–2e5 (Roos & Willmarth 1971 lie above, the reproduced Wieselsberger curve below).
 * Hence the standard uncertainty we state for a prediction from it: 5 % of C_d (common practice reading of that
 * spread) up to Re = 2e5; beyond, the drag crisis makes any smooth-sphere value unreliable.
 */
export const STANDARD_SPHERE_DRAG_VALID_MAX_REYNOLDS = 2e5;
/** The Reynolds numbers where the pieces below meet (each piece's upper limit, taken in it): the curve jumps or kinks there. */
export const STANDARD_SPHERE_DRAG_PIECE_LIMITS: readonly number[] = [0.01, 20, 260, 1500, 1.2e4, 4.4e4, 3.38e5, 4e5, 1e6];
export const STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY = 0.05;

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
