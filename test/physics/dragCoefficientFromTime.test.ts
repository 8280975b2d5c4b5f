import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dragCoefficientFromTime } from '../../src/physics/dragCoefficientFromTime';
import { fallParameters, fallTime } from '../../src/physics/fallModel';
import { PhysicsInputError } from '../../src/physics/physicsInputError';

const ball = {
  mass_kg: 0.21,
  area_m2: (Math.PI * 0.095 ** 2) / 4,
  volume_m3: (Math.PI * 0.095 ** 3) / 6,
  density_kg_m3: 1.15,
  gravity_m_s2: 9.806,
  buoyancy: true,
  added_mass_coefficient: 0.5,
};

describe('dragCoefficientFromTime', () => {
  it('round-trips C_d → fall time → C_d for any specimen and height', () => {
    fc.assert(
      fc.property(
        fc.record({
          cd: fc.double({ min: 0.01, max: 3, noNaN: true }),
          mass: fc.double({ min: 0.002, max: 5, noNaN: true }),
          diameter: fc.double({ min: 0.01, max: 0.3, noNaN: true }),
          h: fc.double({ min: 0.5, max: 300, noNaN: true }),
          buoyancy: fc.boolean(),
          ca: fc.double({ min: 0, max: 2, noNaN: true }),
        }),
        ({ cd, mass, diameter, h, buoyancy, ca }) => {
          const body = {
            mass_kg: mass,
            area_m2: (Math.PI * diameter ** 2) / 4,
            volume_m3: (Math.PI * diameter ** 3) / 6,
            density_kg_m3: 1.2,
            gravity_m_s2: 9.81,
            buoyancy,
            added_mass_coefficient: ca,
          };
          fc.pre(mass > 1.2 * body.volume_m3 * 1.5);
          const p = fallParameters({ ...body, drag_coefficient: cd });
          const t = fallTime(h, p);
          // The time holds the drag only in its relative excess over the drag-free time, about
          // x/6 with x = k·h; rounding the time (2.2e-16) is magnified by the condition number ≈ 6/x.
          const x = p.drag_constant_per_m * h;
          const tolerance = 1e-12 + 10 * 2.2e-16 * (6 / x + 1);
          expect(Math.abs(dragCoefficientFromTime(body, h, t) / cd - 1)).toBeLessThan(tolerance);
        },
      ),
      { numRuns: 300, seed: 21 },
    );
  });

  it('gives zero for exactly the drag-free time', () => {
    const t0 = fallTime(12, fallParameters({ ...ball, drag_coefficient: 0 }));
    expect(dragCoefficientFromTime(ball, 12, t0)).toBe(0);
  });

  it('says "faster than free fall" for a time below the drag-free one, naming the field and the limit', () => {
    try {
      dragCoefficientFromTime(ball, 12, 1.5, 'drops[3].time_s');
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(PhysicsInputError);
      const e = error as PhysicsInputError;
      expect(e.code).toBe('faster-than-free-fall');
      expect(e.field).toBe('drops[3].time_s');
      expect(e.value).toBe(1.5);
      expect(e.message).toMatch(/faster than free fall: check the height and the timing/);
    }
  });

  it('says no finite drag explains a time far beyond anything drag can do', () => {
    expect(() => dragCoefficientFromTime(ball, 12, 1e5)).toThrow(/no finite drag explains/);
  });
});
