import { describe, expect, it } from 'vitest';
import { airProperties, type AirInput } from '../../src/physics/airProperties';
import { moistAirDensity, vapourMoleFractionFromRelativeHumidity } from '../../src/physics/moistAirDensity';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { stationPressureFromSeaLevel } from '../../src/physics/standardAtmosphere';

const day: AirInput = { temperature_C: 20, pressure_Pa: 96120, pressure_reference: 'station', relative_humidity_pct: 55 };

function errorOf(run: () => unknown): PhysicsInputError {
  try {
    run();
  } catch (error) {
    if (error instanceof PhysicsInputError) return error;
    throw error;
  }
  throw new Error('expected a PhysicsInputError');
}

describe('airProperties', () => {
  it('returns density, station pressure, viscosity and speed of sound without warnings inside the CIPM range', () => {
    const air = airProperties(day, 430);
    const xv = vapourMoleFractionFromRelativeHumidity(96120, 293.15, 0.55);
    expect(air.density_kg_m3).toBe(moistAirDensity(96120, 293.15, xv));
    expect(air.station_pressure_Pa).toBe(96120);
    expect(air.dynamic_viscosity_Pa_s).toBeCloseTo(1.81e-5, 7); // Sutherland at 20 °C
    expect(air.speed_of_sound_m_s).toBe(343.2); // ISO 9613-1 at 20 °C
    expect(air.warnings).toEqual([]);
  });

  it('turns a sea-level (QNH) pressure into station pressure with the elevation', () => {
    const air = airProperties({ ...day, pressure_Pa: 101300, pressure_reference: 'sea_level' }, 430);
    expect(air.station_pressure_Pa).toBe(stationPressureFromSeaLevel(101300, 430));
    expect(air.sea_level_pressure_Pa).toBe(101300);
  });

  it('needs the elevation for a sea-level pressure and says so', () => {
    const e = errorOf(() => airProperties({ ...day, pressure_reference: 'sea_level' }));
    expect(e.code).toBe('missing-field');
    expect(e.field).toBe('site.elevation_m');
  });

  it('insists that every pressure says which kind it is', () => {
    const { pressure_reference: _, ...withoutReference } = day;
    const e = errorOf(() => airProperties(withoutReference));
    expect(e.field).toBe('air.pressure_reference');
    expect(e.allowed).toBe('"station" or "sea_level"');
  });

  it('still computes outside 15–27 °C and 600–1100 hPa, with an information note for each and the extra uncertainty', () => {
    const air = airProperties({ ...day, temperature_C: 4, pressure_Pa: 55000 });
    expect(Number.isFinite(air.density_kg_m3)).toBe(true);
    expect(air.warnings.map((w) => w.code).sort()).toEqual(['outside-cipm-pressure-range', 'outside-cipm-temperature-range']);
    expect(air.warnings.every((w) => w.severity === 'info')).toBe(true);
    // |1 − Z|/√3 (GUM 4.3.7, rectangular): Z from the same reading.
    expect(air.cipm_extrapolation_relative_uncertainty).toBeCloseTo(Math.abs(1 - air.compressibility_factor!) / Math.sqrt(3), 12);
    expect(air.cipm_extrapolation_relative_uncertainty).toBeGreaterThan(1e-4 / Math.sqrt(3) - 1e-12);
    expect(air.cipm_extrapolation_relative_uncertainty).toBeLessThan(1e-3);
  });

  it('adds no extrapolation uncertainty inside the CIPM range, nor to a given density', () => {
    expect(airProperties(day).cipm_extrapolation_relative_uncertainty).toBe(0);
    expect(airProperties({ ...day, temperature_C: 4, density_kg_m3: 1.2 }).cipm_extrapolation_relative_uncertainty).toBe(0);
  });

  it('asks whether a temperature above 45 °C was read in °F, and stays quiet at 45 °C', () => {
    const hot = airProperties({ ...day, temperature_C: 72, relative_humidity_pct: 10 });
    const w = hot.warnings.find((x) => x.code === 'temperature-maybe-fahrenheit');
    expect(w?.message).toContain('°F');
    // 72 °F = (72 − 32)·5/9 = 22.2 °C (the Fahrenheit scale's definition).
    expect(w?.message).toContain('22.2 °C');
    expect(airProperties({ ...day, temperature_C: 45, relative_humidity_pct: 10 }).warnings.map((x) => x.code)).not.toContain('temperature-maybe-fahrenheit');
  });

  it('asks whether a sea-level value was typed as the station pressure at an elevated site', () => {
    // At 1500 m the standard atmosphere's station pressure is 84.6 kPa (ISO 2533 table, from memory); 101 300 Pa
    // typed as station pressure is 1199 hPa at sea level, far outside 940–1060 hPa.
    const typedQnh = airProperties({ ...day, pressure_Pa: 101_300 }, 1500);
    const w = typedQnh.warnings.find((x) => x.code === 'station-pressure-unlikely');
    expect(w?.message).toContain('sea_level');
    expect(w?.message).toContain('940–1060 hPa');
    // The right station reading at 1500 m, and the same QNH given as what it is, raise nothing.
    expect(airProperties({ ...day, pressure_Pa: 84_600 }, 1500).warnings.map((x) => x.code)).not.toContain('station-pressure-unlikely');
    const asQnh = airProperties({ ...day, pressure_Pa: 101_300, pressure_reference: 'sea_level' }, 1500);
    expect(asQnh.warnings.map((x) => x.code)).not.toContain('sea-level-pressure-unlikely');
    // A station reading typed as QNH: 84 600 Pa is no sea-level pressure a day's weather gives.
    const typedStation = airProperties({ ...day, pressure_Pa: 84_600, pressure_reference: 'sea_level' }, 1500);
    expect(typedStation.warnings.map((x) => x.code)).toContain('sea-level-pressure-unlikely');
    // Near sea level the check cannot tell the two apart and stays quiet (at 100 m they differ by 1.2 %).
    expect(airProperties({ ...day, pressure_Pa: 101_300 }, 100).warnings.map((x) => x.code)).not.toContain('station-pressure-unlikely');
  });

  it('refuses a relative humidity above 100 %, naming field, value and range', () => {
    const e = errorOf(() => airProperties({ ...day, relative_humidity_pct: 104 }));
    expect(e.code).toBe('out-of-range');
    expect(e.field).toBe('air.relative_humidity_pct');
    expect(e.value).toBe(104);
    expect(e.message).toBe('air.relative_humidity_pct = 104: out of range; allowed: 0 to 100 %');
  });

  it('refuses a dew point above the air temperature', () => {
    const { relative_humidity_pct: _, ...noRh } = day;
    const e = errorOf(() => airProperties({ ...noRh, dew_point_C: 21 }));
    expect(e.code).toBe('dew-point-above-temperature');
    expect(e.value).toBe(21);
    expect(e.allowed).toContain('20 °C');
  });

  it('accepts a dew point equal to the temperature as saturated air', () => {
    const { relative_humidity_pct: _, ...noRh } = day;
    const saturated = airProperties({ ...noRh, dew_point_C: 20 });
    const rh100 = airProperties({ ...day, relative_humidity_pct: 100 });
    expect(saturated.density_kg_m3).toBeCloseTo(rh100.density_kg_m3, 12);
  });

  it('refuses zero or negative pressure and non-finite numbers', () => {
    expect(errorOf(() => airProperties({ ...day, pressure_Pa: 0 })).code).toBe('out-of-range');
    // Below 20 kPa (the standard atmosphere near 11.8 km, ISO 2533): a unit slip, refused with field and range.
    const low = errorOf(() => airProperties({ ...day, pressure_Pa: 19_999 }));
    expect([low.code, low.field, low.value, low.allowed]).toEqual(['out-of-range', 'air.pressure_Pa', 19_999, '20 000 Pa to 200 000 Pa']);
    expect(airProperties({ ...day, temperature_C: -40, pressure_Pa: 20_000 }).station_pressure_Pa).toBe(20_000);
    // A sea-level value that puts the station below 20 kPa is refused too (94 kPa at 9000 m is about 29 kPa: accepted).
    expect(errorOf(() => airProperties({ ...day, pressure_Pa: 60_000, pressure_reference: 'sea_level' }, 9000)).field).toBe('air.pressure_Pa');
    expect(errorOf(() => airProperties({ ...day, pressure_Pa: -5 })).code).toBe('out-of-range');
    expect(errorOf(() => airProperties({ ...day, temperature_C: Number.NaN })).code).toBe('not-finite');
    expect(errorOf(() => airProperties({ ...day, temperature_C: Infinity })).code).toBe('not-finite');
  });

  it('refuses both humidity readings at once rather than guessing which one counts', () => {
    expect(errorOf(() => airProperties({ ...day, dew_point_C: 10 })).code).toBe('conflicting-fields');
  });

  it('refuses humidity that would boil the air away', () => {
    // 90 °C saturated air at 30 kPa: p_sv(90 °C) ≈ 70 kPa exceeds the total pressure.
    const e = errorOf(() => airProperties({ temperature_C: 90, pressure_Pa: 30000, pressure_reference: 'station', relative_humidity_pct: 100 }));
    expect(e.code).toBe('vapour-pressure-above-total');
  });

  it('lets a density override win, still reporting what CIPM-2007 would give', () => {
    const air = airProperties({ ...day, density_kg_m3: 1.15 });
    expect(air.density_kg_m3).toBe(1.15);
    expect(air.density_source).toBe('override');
    expect(air.cipm_density_kg_m3).toBeCloseTo(airProperties(day).density_kg_m3, 12);
    expect(air.warnings.map((w) => w.code)).toContain('density-overridden');
  });

  it('needs neither pressure nor humidity when the density is given', () => {
    const air = airProperties({ temperature_C: 12, density_kg_m3: 1.2 });
    expect(air.station_pressure_Pa).toBeNull();
    expect(air.density_kg_m3).toBe(1.2);
  });

  it('lowers the density by the CO2 term when CO2 is below the reference 400 µmol/mol', () => {
    const reference = airProperties(day).density_kg_m3;
    const low = airProperties({ ...day, co2_mole_fraction: 0 }).density_kg_m3;
    // CIPM-2007: ρ scales with M_a, which changes by 12.011·0.0004/28.965 = 1.66e-4.
    expect(1 - low / reference).toBeCloseTo(1.66e-4, 5);
  });
});
