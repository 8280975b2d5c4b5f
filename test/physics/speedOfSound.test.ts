import { describe, expect, it } from 'vitest';
import { speedOfSound } from '../../src/physics/speedOfSound';

describe('speedOfSound', () => {
  it('is 343.2 m/s at 20 °C', () => {
    // ISO 9613-1:1993: c = 343.2·(T/293.15)^½ m/s.
    expect(speedOfSound(293.15)).toBe(343.2);
  });

  it('is within 0.05 m/s of the standard atmosphere’s 340.294 m/s at 15 °C', () => {
    // U.S. Standard Atmosphere 1976: c0 = √(γ·R*·T0/M0) = 340.294 m/s for dry ideal air.
    // ISO's 343.2 m/s reference is for real air; the two scalings differ by 0.03 m/s here.
    expect(Math.abs(speedOfSound(288.15) - 340.294)).toBeLessThan(0.05);
  });

  it('goes with the square root of the absolute temperature', () => {
    expect(speedOfSound(4 * 293.15)).toBeCloseTo(2 * 343.2, 10);
  });
});
