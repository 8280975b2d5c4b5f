import psychrolib from 'psychrolib';
import { describe, expect, it } from 'vitest';
import {
  geopotentialHeight,
  seaLevelPressureFromStation,
  standardAtmosphereDensity,
  stationPressureFromSeaLevel,
} from '../../src/physics/standardAtmosphere';

psychrolib.SetUnitSystem(psychrolib.SI);

describe('standard atmosphere (ICAO / ISO 2533 / U.S. Standard Atmosphere 1976)', () => {
  it('gives the tabulated pressures at 1, 2 and 5 km geometric altitude', () => {
    // U.S. Standard Atmosphere 1976, Table I (geometric altitude) (from memory):
    // 1000 m 8.9876e4 Pa, 2000 m 7.9501e4 Pa, 5000 m 5.4048e4 Pa.
    expect(stationPressureFromSeaLevel(101325, 1000)).toBeCloseTo(89876, -0.5);
    expect(stationPressureFromSeaLevel(101325, 2000)).toBeCloseTo(79501, -0.5);
    expect(stationPressureFromSeaLevel(101325, 5000)).toBeCloseTo(54048, -0.5);
  });

  it('gives the tabulated densities at sea level, 1, 2 and 5 km', () => {
    // Same table (from memory): 1.2250, 1.1117, 1.0066, 0.73643 kg/m³.
    expect(standardAtmosphereDensity(0)).toBeCloseTo(1.225, 4);
    expect(standardAtmosphereDensity(1000)).toBeCloseTo(1.1117, 4);
    expect(standardAtmosphereDensity(2000)).toBeCloseTo(1.0066, 4);
    expect(standardAtmosphereDensity(5000)).toBeCloseTo(0.73643, 5);
  });

  it('agrees with psychrolib’s ASHRAE standard-atmosphere pressure within 3e-5', () => {
    // ASHRAE Handbook 2017 ch. 1 eq. 3: p = 101 325·(1 − 2.25577e-5·Z)^5.2559, Z read as
    // geopotential height. Its rounded constants (5.2559 for 5.255 88) account for up to 1.5e-5.
    for (let z = -400; z <= 6000; z += 200) {
      const ours = stationPressureFromSeaLevel(101325, z);
      const theirs = psychrolib.GetStandardAtmPressure(geopotentialHeight(z));
      expect(Math.abs(ours / theirs - 1)).toBeLessThan(3e-5);
    }
  });

  it('turns a sea-level (QNH) reading into station pressure and back exactly', () => {
    for (const z of [-300, 0, 430, 1500, 3800]) {
      for (const qnh of [98000, 101325, 104000]) {
        const station = stationPressureFromSeaLevel(qnh, z);
        expect(seaLevelPressureFromStation(station, z)).toBeCloseTo(qnh, 8);
      }
    }
  });

  it('uses geopotential height: 0.16 m less than the elevation at 1000 m', () => {
    // H = r0·z/(r0 + z) with r0 = 6 356 766 m (U.S. Standard Atmosphere 1976).
    expect(1000 - geopotentialHeight(1000)).toBeCloseTo(0.157, 3);
  });
});
