import { describe, expect, it } from 'vitest';
import { readingAirDensity, typedAirProperties } from '../../src/analysis';
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
});
