import { describe, expect, it } from 'vitest';
import { localGravity, normalGravity } from '../../src/physics/normalGravity';
import { PhysicsInputError } from '../../src/physics/physicsInputError';

describe('normalGravity (WGS84, Somigliana)', () => {
  it('is 9.7803253359 m/s² at the equator', () => {
    // NIMA TR8350.2 (2000), Table 3.4: γe = 9.7803253359 m/s².
    expect(normalGravity(0)).toBeCloseTo(9.7803253359, 10);
  });

  it('is 9.8321849378 m/s² at both poles', () => {
    // NIMA TR8350.2 (2000), Table 3.4: γp = 9.8321849378 m/s².
    expect(normalGravity(90)).toBeCloseTo(9.8321849378, 9);
    expect(normalGravity(-90)).toBeCloseTo(9.8321849378, 9);
  });

  it('follows Somigliana’s closed form between equator and pole', () => {
    // With γe and γp fixed (above), the closed form γ = (a·γe·cos²φ + b·γp·sin²φ)/√(a²cos²φ + b²sin²φ)
    // (NIMA TR8350.2 eq. 4-1, a = 6 378 137 m, b = 6 356 752.3142 m, Table 3.1/3.3) must give the
    // same values as the k, e² form used in the code, at every latitude.
    const a = 6378137;
    const b = 6356752.3142;
    for (let lat = -85; lat <= 85; lat += 5) {
      const phi = (lat * Math.PI) / 180;
      const c2 = Math.cos(phi) ** 2;
      const s2 = Math.sin(phi) ** 2;
      const expected = (a * 9.7803253359 * c2 + b * 9.8321849378 * s2) / Math.sqrt(a * a * c2 + b * b * s2);
      expect(normalGravity(lat)).toBeCloseTo(expected, 9);
    }
  });

  it('grows steadily from equator to pole', () => {
    let previous = 0;
    for (let lat = 0; lat <= 90; lat += 1) {
      const g = normalGravity(lat);
      expect(g).toBeGreaterThan(previous);
      previous = g;
    }
  });
});

describe('localGravity', () => {
  it('subtracts 3.086e-6 s⁻² per metre of elevation (free-air gradient)', () => {
    const sea = localGravity({ latitude_deg: 46.1, elevation_m: 0 }).gravity_m_s2;
    const high = localGravity({ latitude_deg: 46.1, elevation_m: 1000 }).gravity_m_s2;
    expect(sea - high).toBeCloseTo(0.003086, 12);
  });

  it('lets a measured value win over the formula, which is still reported', () => {
    const result = localGravity({ latitude_deg: 46.1, elevation_m: 430, gravity_m_s2: 9.8055 });
    expect(result.gravity_m_s2).toBe(9.8055);
    expect(result.source).toBe('override');
    expect(result.normal_gravity_m_s2).toBeCloseTo(normalGravity(46.1) - 3.086e-6 * 430, 12);
  });

  it('needs no latitude when gravity is given', () => {
    expect(localGravity({ gravity_m_s2: 9.81 }).gravity_m_s2).toBe(9.81);
  });

  it('names the field, the value and the range for a latitude beyond the pole', () => {
    try {
      localGravity({ latitude_deg: 91, elevation_m: 0 });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(PhysicsInputError);
      const e = error as PhysicsInputError;
      expect(e.code).toBe('out-of-range');
      expect(e.field).toBe('site.latitude_deg');
      expect(e.value).toBe(91);
      expect(e.message).toContain('-90 to 90');
    }
  });

  it('refuses a gravity override that is not an Earth-surface value', () => {
    expect(() => localGravity({ gravity_m_s2: 98.1 })).toThrow(/site\.gravity_m_s2 = 98\.1.*9\.7 to 9\.9/);
  });
});
