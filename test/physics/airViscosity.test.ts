import { describe, expect, it } from 'vitest';
import { airViscosity } from '../../src/physics/airViscosity';

describe('airViscosity (Sutherland)', () => {
  it('gives 1.7894e-5 Pa·s at 15 °C, the standard-atmosphere sea-level value', () => {
    // U.S. Standard Atmosphere 1976 / ISO 2533 sea-level viscosity: 1.7894e-5 Pa·s.
    expect(airViscosity(288.15)).toBeCloseTo(1.7894e-5, 9);
  });

  it('gives 1.846e-5 Pa·s at 300 K, as in the handbook table of air properties', () => {
    // Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, Table A.4 (from memory): 184.6e-7 N·s/m².
    expect(airViscosity(300)).toBeCloseTo(1.846e-5, 8);
  });

  it('grows with temperature, as for any gas', () => {
    expect(airViscosity(310)).toBeGreaterThan(airViscosity(260));
  });
});
