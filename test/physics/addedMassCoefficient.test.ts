import { describe, expect, it } from 'vitest';
import { equivalentSpheroidAddedMassCoefficient, spheroidAddedMassCoefficient } from '../../src/physics/addedMassCoefficient';

describe('spheroidAddedMassCoefficient', () => {
  it('is exactly one half for a sphere', () => {
    // Potential flow: the added mass of a sphere is half the displaced mass (Lamb, Hydrodynamics §92).
    expect(spheroidAddedMassCoefficient(1, 1)).toBe(0.5);
    // Nearly spherical prolate and oblate shapes join it smoothly from both sides
    // (the slope there is about −0.6 per unit of aspect ratio).
    const slopeProlate = (spheroidAddedMassCoefficient(1.001, 1) - 0.5) / 0.001;
    const slopeOblate = (0.5 - spheroidAddedMassCoefficient(0.999, 1)) / 0.001;
    expect(slopeProlate).toBeLessThan(0);
    expect(Math.abs(slopeProlate / slopeOblate - 1)).toBeLessThan(0.01);
  });

  it('tends to (8/3)·ρ·a³ for a thin disc falling flat', () => {
    // Lamb, Hydrodynamics §102: added mass of a circular disc moving broadside = (8/3)ρa³.
    const a = 0.1;
    const c = 1e-5;
    const volume = (4 / 3) * Math.PI * a * a * c;
    expect((spheroidAddedMassCoefficient(c, a) * volume) / ((8 / 3) * a ** 3)).toBeCloseTo(1, 3);
  });

  it('falls toward zero for a long rod moving end first', () => {
    // Slender-body limit: axial added mass vanishes relative to the volume (Brennen 1982, table of spheroids).
    expect(spheroidAddedMassCoefficient(50, 1)).toBeLessThan(0.01);
    expect(spheroidAddedMassCoefficient(2, 1)).toBeCloseTo(0.21, 2); // Brennen 1982: prolate 2:1, axial ≈ 0.21 (from memory)
  });
});

describe('equivalentSpheroidAddedMassCoefficient', () => {
  it('gives one half for a sphere described by its frontal area, length and volume', () => {
    const d = 0.05;
    expect(equivalentSpheroidAddedMassCoefficient((Math.PI * d * d) / 4, d, (Math.PI * d ** 3) / 6)).toBeCloseTo(0.5, 12);
  });
});
