import { describe, expect, it } from 'vitest';
import { dragCoefficientFromTime } from '../../src/physics/dragCoefficientFromTime';
import { moistAirDensity, vapourMoleFractionFromRelativeHumidity } from '../../src/physics/moistAirDensity';
import { SeriesModel } from '../../src/physics/seriesModel';

function ballModel(counts: number[], fitOffset = false): SeriesModel {
  return new SeriesModel({
    shape: 'sphere',
    dimensionCount: 1,
    humidity: 'relative-humidity',
    densityOverride: false,
    co2MoleFraction: 0.0004,
    buoyancy: true,
    addedMassCoefficient: null,
    fitOffset,
    counts: Float64Array.from(counts),
  });
}

describe('SeriesModel', () => {
  it('lays out air, gravity, mass, dimensions, heights and times in one vector', () => {
    const L = ballModel([2, 3]).layout;
    expect([L.temperature_K, L.pressure_Pa, L.humidity, L.density_kg_m3, L.gravity_m_s2, L.mass_kg]).toEqual([0, 1, 2, 3, 4, 5]);
    expect(L.firstDimension).toBe(6);
    expect(L.firstHeight).toBe(7);
    expect(L.firstTime).toBe(9);
    expect(L.length).toBe(11);
  });

  it('at one height gives the same C_d as inverting that single time', () => {
    const model = ballModel([1]);
    const x = Float64Array.from([290.65, 96120, 0.55, 0, 9.8058, 0.21, 0.095, 12, 1.5966]);
    const rho = moistAirDensity(96120, 290.65, vapourMoleFractionFromRelativeHumidity(96120, 290.65, 0.55));
    const direct = dragCoefficientFromTime(
      {
        mass_kg: 0.21,
        area_m2: (Math.PI * 0.095 ** 2) / 4,
        volume_m3: (Math.PI * 0.095 ** 3) / 6,
        density_kg_m3: rho,
        gravity_m_s2: 9.8058,
        added_mass_coefficient: 0.5,
      },
      12,
      1.5966,
    );
    expect(model.evaluate(x)).toBeCloseTo(direct, 12);
    expect(model.status).toBe('ok');
  });

  it('reports a specimen lighter than air instead of a number', () => {
    const model = ballModel([1]);
    const x = Float64Array.from([290.65, 96120, 0.55, 0, 9.8058, 1e-5, 0.095, 12, 1.6]);
    expect(Number.isNaN(model.evaluate(x))).toBe(true);
    expect(model.status).toBe('not-heavier-than-air');
  });
});
