/**
 * Drag coefficient of a smooth sphere against Reynolds number, by F. A. Morrison's data
 * correlation (An Introduction to Fluid Mechanics, Cambridge University Press, 2013; in the
 * form reproduced by R. Barati et al., Powder Technology 257 (2014) 11–19):
 *
 *   C_d = 24/Re + 2.6·(Re/5)/(1 + (Re/5)^1.52)
 *         + 0.411·(Re/263 000)^−7.94/(1 + (Re/263 000)^−8) + Re^0.8/461 000
 *
 * stated for Re ≤ 1e6. It tends to Stokes' 24/Re in creeping flow and follows the drag crisis
 * near Re ≈ 3e5. (Morrison's own handout uses 0.25·(Re/1e6)/(1 + Re/1e6) as the last term;
 * the two differ by less than 0.015 below Re = 1e6.)
 */
export const MORRISON_VALID_MAX_REYNOLDS = 1e6;

/** Everything except the Stokes term 24/Re (finite and smooth down to Re = 0). */
export function morrisonSphereDragExcess(reynolds: number): number {
  const r1 = reynolds / 5;
  const r2 = reynolds / 263_000;
  // r2^−7.94/(1 + r2^−8) rewritten as r2^0.06/(r2^8 + 1) so that small Re does not overflow.
  return (
    (2.6 * r1) / (1 + Math.pow(r1, 1.52)) +
    (0.411 * Math.pow(r2, 0.06)) / (Math.pow(r2, 8) + 1) +
    Math.pow(reynolds, 0.8) / 461_000
  );
}

export function morrisonSphereDragCoefficient(reynolds: number): number {
  // Contract check, plain on purpose: callers pass values the request validation already checked, so this is a bug, not bad input.
  if (!(reynolds > 0)) throw new RangeError(`Reynolds number must be positive, got ${reynolds}`);
  return 24 / reynolds + morrisonSphereDragExcess(reynolds);
}
