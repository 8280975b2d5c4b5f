import { describe, expect, it } from 'vitest';
import { morrisonSphereDragCoefficient, morrisonSphereDragExcess } from '../../src/physics/sphereDragCoefficient';

describe('morrisonSphereDragCoefficient', () => {
  it('matches the fluids library’s documented value at Re = 200', () => {
    // fluids (C. Bell, Chemical Engineering Design Library), drag.Morrison docstring: Morrison(200.) = 0.767731559965325.
    expect(morrisonSphereDragCoefficient(200)).toBeCloseTo(0.767731559965325, 13);
  });

  it('is about 0.4–0.5 for a smooth sphere between Re = 1e4 and 2e5', () => {
    // Common practice: the "Newton regime" plateau of the standard drag curve, C_d ≈ 0.4–0.5
    // (the curve dips to about 0.39 near Re = 1e4, hence the lower edge of 0.38).
    for (let logRe = 4; logRe <= Math.log10(2e5); logRe += 0.05) {
      const cd = morrisonSphereDragCoefficient(10 ** logRe);
      expect(cd).toBeGreaterThan(0.38);
      expect(cd).toBeLessThan(0.5);
    }
  });

  it('tends to Stokes’ law 24/Re in creeping flow', () => {
    // Stokes (1851): C_d = 24/Re for Re → 0; Oseen's correction is 1 + 3Re/16.
    expect((morrisonSphereDragCoefficient(1e-3) * 1e-3) / 24).toBeCloseTo(1, 4);
  });

  it('drops sharply through the drag crisis, to below 0.2 by Re = 5e5', () => {
    // Common practice: smooth spheres fall from ≈0.45 to ≈0.1–0.2 between 2e5 and 5e5 (Achenbach 1972).
    expect(morrisonSphereDragCoefficient(2e5)).toBeGreaterThan(0.4);
    expect(morrisonSphereDragCoefficient(5e5)).toBeLessThan(0.2);
  });

  it('keeps its non-Stokes part finite down to Re = 0, so C_d·v² never becomes 0·∞', () => {
    expect(morrisonSphereDragExcess(0)).toBe(0);
    expect(Number.isFinite(morrisonSphereDragExcess(1e-300))).toBe(true);
    expect(() => morrisonSphereDragCoefficient(0)).toThrow(RangeError);
  });
});
