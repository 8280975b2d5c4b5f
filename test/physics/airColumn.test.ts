import { describe, expect, it } from 'vitest';
import { AirColumn, STANDARD_LAPSE_RATE_K_PER_M } from '../../src/physics/airColumn';
import { moistAirDensity, vapourMoleFractionFromRelativeHumidity } from '../../src/physics/moistAirDensity';
import { geopotentialHeight } from '../../src/physics/standardAtmosphere';

// The ISA sea-level reading: 288.15 K, 101 325 Pa, 1.2250 kg/m³ (ISO 2533; U.S. Standard Atmosphere 1976).
const isaSeaLevel = {
  height_m: 0,
  temperature_K: 288.15,
  pressure_Pa: 101325,
  gasFactor: (1.225 * 288.15) / 101325,
  verticalWind_m_s: 0,
  windSpeed_m_s: 0,
};
// The standard takes gravity constant (9.806 65 m/s²) along the geopotential height: the column is compared at
// the geopotential height of each tabulated geometric altitude.
const column = new AirColumn(isaSeaLevel, 9.80665, STANDARD_LAPSE_RATE_K_PER_M);

describe('the air along a fall from one reading (ISO 2533 lapse, hydrostatic pressure)', () => {
  // U.S. Standard Atmosphere 1976, Table I, geometric altitude (identical to ISO 2533 below 32 km) (from memory):
  // altitude m, temperature K, pressure Pa, density kg/m³.
  const table: [number, number, number, number][] = [
    [1000, 281.651, 89876, 1.1117],
    [2000, 275.154, 79501, 1.0066],
    [3000, 268.659, 70121, 0.90925],
    [5000, 255.676, 54048, 0.73643],
    [10000, 223.252, 26500, 0.41351],
  ];
  it.each(table)('matches the standard atmosphere at %i m (temperature 0.01 K, pressure and density 1e-4)', (z, T, p, rho) => {
    const H = geopotentialHeight(z);
    expect(column.temperature(H)).toBeCloseTo(T, 2);
    expect(Math.abs(column.pressure(H) / p - 1)).toBeLessThan(1e-4);
    expect(Math.abs(column.density(H) / rho - 1)).toBeLessThan(1.5e-4);
  });

  it('reproduces the reading at its own height, wherever the reading is taken', () => {
    const reading = { ...isaSeaLevel, height_m: 120, temperature_K: 280, pressure_Pa: 95000, gasFactor: 0.00348 };
    const c = new AirColumn(reading, 9.81, 0.008);
    expect(c.temperature(120)).toBe(280);
    expect(c.pressure(120)).toBe(95000);
    expect(c.density(120)).toBeCloseTo((0.00348 * 95000) / 280, 12);
    expect(c.temperature(0)).toBeCloseTo(280 + 0.96, 10);
  });

  it('is smooth through an isothermal column (lapse rate 0): the exponential atmosphere', () => {
    const c0 = new AirColumn(isaSeaLevel, 9.80665, 0);
    const scaleHeight = 288.15 / (isaSeaLevel.gasFactor * 9.80665); // R·T/(M·g), about 8.4 km
    expect(c0.pressure(3000) / 101325).toBeCloseTo(Math.exp(-3000 / scaleHeight), 12);
    // A lapse of 1e-9 K/m lowers ln p at 3000 m by ln(p₀/p)·Γz/(2T₀) ≈ 1.9e-9 (first order): no jump at Γ = 0.
    const tiny = new AirColumn(isaSeaLevel, 9.80665, 1e-9);
    const expected = (Math.log(101325 / c0.pressure(3000)) * 1e-9 * 3000) / (2 * 288.15);
    expect(Math.log(c0.pressure(3000) / tiny.pressure(3000)) / expected).toBeCloseTo(1, 4);
  });

  it('keeps hydrostatic balance: dp/dz = −ρ·g along the column', () => {
    for (const z of [10, 500, 2500, 8000]) {
      const dz = 0.01;
      const slope = (column.pressure(z + dz) - column.pressure(z - dz)) / (2 * dz);
      expect(slope / (-column.density(z) * 9.80665)).toBeCloseTo(1, 8);
    }
  });
});

describe('the air along a fall between two readings', () => {
  const ground = { height_m: 0, temperature_K: 290, pressure_Pa: 98000, gasFactor: 0.003485, verticalWind_m_s: 0.2, windSpeed_m_s: 2 };
  const top = { height_m: 300, temperature_K: 288.5, pressure_Pa: 94700, gasFactor: 0.00348, verticalWind_m_s: 0.5, windSpeed_m_s: 5 };
  const c = new AirColumn(ground, 9.81, STANDARD_LAPSE_RATE_K_PER_M, top);
  it('meets both readings exactly', () => {
    expect(c.temperature(300)).toBeCloseTo(288.5, 10);
    expect(c.pressure(300)).toBeCloseTo(94700, 7);
    expect(c.density(300)).toBeCloseTo((0.00348 * 94700) / 288.5, 12);
    expect(c.verticalWind(300)).toBeCloseTo(0.5, 12);
    expect(c.windSpeed(150)).toBeCloseTo(3.5, 12);
  });
  it('interpolates between them monotonically', () => {
    let previous = c.pressure(0);
    for (let z = 30; z <= 300; z += 30) {
      expect(c.pressure(z)).toBeLessThan(previous);
      previous = c.pressure(z);
    }
  });
});

describe('the gas factor carries CIPM-2007 humidity into the column', () => {
  it('gives the CIPM-2007 density of the reading back', () => {
    const T = 293.15;
    const p = 100000;
    const xv = vapourMoleFractionFromRelativeHumidity(p, T, 0.6);
    const rho = moistAirDensity(p, T, xv, 0.0004);
    const c = new AirColumn({ height_m: 2, temperature_K: T, pressure_Pa: p, gasFactor: (rho * T) / p, verticalWind_m_s: 0, windSpeed_m_s: 0 }, 9.81, 0.0065);
    expect(c.density(2)).toBeCloseTo(rho, 12);
  });
});
