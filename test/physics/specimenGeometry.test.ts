import { describe, expect, it } from 'vitest';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { checkSpecimen, geometryFromDimensions } from '../../src/physics/specimenGeometry';

describe('specimen geometry', () => {
  it('gives a sphere πd²/4 of frontal area, πd³/6 of volume and C_a = 1/2', () => {
    const g = geometryFromDimensions('sphere', [0.1]);
    expect(g.area_m2).toBeCloseTo(0.00785398163, 10);
    expect(g.volume_m3).toBeCloseTo(0.000523598776, 12);
    expect(g.characteristic_length_m).toBe(0.1);
    expect(g.default_added_mass_coefficient).toBe(0.5);
  });

  it('stands a cylinder on its end: circle face down, length along the fall', () => {
    const g = geometryFromDimensions('cylinder', [0.04, 0.2]);
    expect(g.area_m2).toBeCloseTo((Math.PI * 0.04 ** 2) / 4, 15);
    expect(g.volume_m3).toBeCloseTo((Math.PI * 0.04 ** 2 * 0.2) / 4, 15);
    expect(g.length_along_fall_m).toBe(0.2);
    // A rod 5 diameters long moving end first drags little air along.
    expect(g.default_added_mass_coefficient).toBeLessThan(0.1);
  });

  it('lays a disc flat, with a large added mass as for a plate moving broadside', () => {
    const g = geometryFromDimensions('disc', [0.2, 0.002]);
    expect(g.area_m2).toBeCloseTo((Math.PI * 0.04) / 4, 15);
    // Thin disc: m_a → (8/3)ρa³ (Lamb §102), i.e. C_a·V → (8/3)·0.1³ within the spheroid approximation.
    expect((g.default_added_mass_coefficient * g.volume_m3) / ((8 / 3) * 0.001)).toBeGreaterThan(0.9);
    expect((g.default_added_mass_coefficient * g.volume_m3) / ((8 / 3) * 0.001)).toBeLessThan(1.05);
  });

  it('lays a box with its length × width face down', () => {
    const g = geometryFromDimensions('box', [0.3, 0.2, 0.05]);
    expect(g.area_m2).toBeCloseTo(0.06, 15);
    expect(g.volume_m3).toBeCloseTo(0.003, 15);
    expect(g.characteristic_length_m).toBeCloseTo(Math.sqrt((4 * 0.06) / Math.PI), 15);
  });

  it('takes a custom shape’s area and volume as given, with an optional Reynolds length', () => {
    expect(geometryFromDimensions('custom', [0.01, 1e-5]).characteristic_length_m).toBeCloseTo(Math.sqrt(0.04 / Math.PI), 15);
    expect(geometryFromDimensions('custom', [0.01, 1e-5], 0.2).characteristic_length_m).toBe(0.2);
  });
});

describe('checkSpecimen', () => {
  it('refuses an unknown shape, listing the shapes it knows', () => {
    try {
      checkSpecimen({ shape: 'cone', mass_kg: 0.1 });
      expect.unreachable();
    } catch (error) {
      const e = error as PhysicsInputError;
      expect(e.field).toBe('specimen.shape');
      expect(e.value).toBe('cone');
      expect(e.allowed).toContain('"sphere"');
      expect(e.allowed).toContain('"box"');
    }
  });

  it('refuses a dimension that belongs to another shape', () => {
    expect(() => checkSpecimen({ shape: 'sphere', mass_kg: 0.1, diameter_m: 0.05, length_m: 0.1 })).toThrow(
      /specimen\.length_m = 0\.1: not a field/,
    );
  });

  it('refuses a zero diameter and a missing mass, naming each field', () => {
    expect(() => checkSpecimen({ shape: 'sphere', mass_kg: 0.1, diameter_m: 0 })).toThrow(/specimen\.diameter_m = 0: out of range/);
    expect(() => checkSpecimen({ shape: 'sphere', diameter_m: 0.05 })).toThrow(/specimen\.mass_kg = \(missing\): missing/);
  });

  it('keeps the reference drag coefficient', () => {
    expect(checkSpecimen({ shape: 'sphere', mass_kg: 0.1, diameter_m: 0.05, reference_drag_coefficient: 0.47 }).reference_drag_coefficient).toBe(0.47);
    expect(() => checkSpecimen({ shape: 'sphere', mass_kg: 0.1, diameter_m: 0.05, reference_drag_coefficient: -1 })).toThrow(PhysicsInputError);
  });
});

describe('a dimension too small to compute with', () => {
  // The smallest positive normal binary64 is 2^-1022 ≈ 2.2250738585072014e-308 (IEEE 754-2019, §3.4); 5e-324 is the
  // smallest subnormal (Number.MIN_VALUE, ECMAScript 2023 §21.1.2.8).
  const refusal = (specimen: unknown) => {
    try {
      checkSpecimen(specimen);
    } catch (error) {
      expect(error).toBeInstanceOf(PhysicsInputError);
      const e = error as PhysicsInputError;
      return { code: e.code, field: e.field, value: e.value };
    }
    return null;
  };

  it('refuses a denormal diameter, naming the field, the value and the range', () => {
    expect(refusal({ shape: 'sphere', mass_kg: 0.1, diameter_m: 5e-324 })).toEqual({ code: 'out-of-range', field: 'specimen.diameter_m', value: 5e-324 });
    expect(() => checkSpecimen({ shape: 'sphere', mass_kg: 0.1, diameter_m: 5e-324 })).toThrow(/allowed: above 0 and at most 10 m, large enough/);
  });

  it('refuses a diameter whose frontal area underflows, and names the smallest side of a box', () => {
    expect(refusal({ shape: 'sphere', mass_kg: 0.1, diameter_m: 1e-160 })).toMatchObject({ field: 'specimen.diameter_m' });
    expect(refusal({ shape: 'box', mass_kg: 0.1, length_m: 0.1, width_m: 1e-310, thickness_m: 0.1 })).toMatchObject({ field: 'specimen.width_m' });
    expect(refusal({ shape: 'custom', mass_kg: 0.1, area_m2: 0.01, volume_m3: 0, characteristic_length_m: 5e-324 })).toMatchObject({
      field: 'specimen.characteristic_length_m',
    });
  });

  it('still takes every size the log stores down to its smallest edge tried (1e-9 m)', () => {
    expect(refusal({ shape: 'sphere', mass_kg: 0.1, diameter_m: 1e-9 })).toBeNull();
    expect(refusal({ shape: 'sphere', mass_kg: 0.1, diameter_m: 1e-150 })).toBeNull();
    expect(refusal({ shape: 'custom', mass_kg: 0.1, area_m2: 0.01, volume_m3: 5e-324 })).toBeNull();
  });
});
