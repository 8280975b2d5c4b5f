import { describe, expect, it } from 'vitest';
import { airInput, readingAirDensity, typedAirProperties } from '../../src/analysis';
import { airProperties } from '../../src/physics';
import { testDay } from './day-records';

describe('the air of a reading', () => {
  const day = testDay();

  it('is the physics’ CIPM-2007 density at the site’s elevation', () => {
    const expected = airProperties({ temperature_C: 17.5, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 }, 430).density_kg_m3;
    expect(readingAirDensity(day.reading, day.site)).toBe(expected);
  });

  it('of a reading being typed names the field out of range instead of a figure', () => {
    const typed = typedAirProperties({ temperature_C: 400, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 }, day.site);
    expect(typed.ok).toBe(false);
    expect(!typed.ok && typed.message).toContain('temperature_C');
    expect(typedAirProperties({ temperature_C: 17.5, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 }, day.site)).toMatchObject({ ok: true });
  });

  it('takes a stored dew point a little above the air temperature as saturated air, as the log allows', () => {
    const reading = { ...day.reading, temperature_C: 12, humidity: { kind: 'dew_point' as const, dew_point_C: 12.6, u_dew_point_C: 0.5 } };
    expect(airInput(reading).air.dew_point_C).toBe(12);
    // Saturated air: the same density as a dew point equal to the temperature (CIPM-2007 through the physics).
    const saturated = airProperties({ temperature_C: 12, pressure_Pa: 96_120, pressure_reference: 'station', dew_point_C: 12 }, 430).density_kg_m3;
    expect(readingAirDensity(reading, day.site)).toBe(saturated);
    expect(airInput({ ...reading, humidity: { ...reading.humidity, dew_point_C: 8 } }).air.dew_point_C).toBe(8);
  });
});
