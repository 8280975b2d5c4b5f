import { describe, expect, it } from 'vitest';
import { airProperties } from '../../src/physics/airProperties';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import type { AnalysisRequest } from '../../src/physics/analysisTypes';
import { AIR, BALL, exactTimes, SITE, UNCERTAINTY } from './syntheticSeries';

// Invented series (our own scenario): a ball dropped five times from 14 m on a cool morning.
const request = (temperature_C: number): AnalysisRequest => {
  const air = { ...AIR, temperature_C };
  const heights = [14, 14, 14, 14, 14];
  const times = exactTimes({ site: SITE, air, specimen: BALL }, 0.47, heights);
  return {
    site: SITE,
    air,
    specimen: BALL,
    drops: heights.map((h, i) => ({ height_m: h, time_s: times[i]! })),
    timing: { standard_uncertainty_s: 0.004 },
    uncertainty: UNCERTAINTY,
    options: { monte_carlo_draws: 2000 },
  };
};

describe('the CIPM-2007 range in a series analysis', () => {
  it('on a 6 °C morning adds the formula\'s extra uncertainty as its own budget row and only notes the range', () => {
    const result = analyzeSeries(request(6));
    const row = result.budget.find((r) => r.input === 'air_density_formula');
    const uRel = airProperties({ ...AIR, temperature_C: 6 }, SITE.elevation_m).cipm_extrapolation_relative_uncertainty;
    expect(row?.standard_uncertainty).toBe(uRel);
    // Its sensitivity is ρ·∂C_d/∂ρ: the same derivative taken through the other path, the given-density override,
    // by a central difference of ±0.1 % (buoyancy and added mass move with ρ too, so it is not simply −C_d).
    const rho = result.air.density_kg_m3;
    const withDensity = (factor: number) => {
      const r = request(6);
      r.air = { ...r.air, density_kg_m3: rho * factor };
      return analyzeSeries(r).drag_coefficient_estimate;
    };
    const difference = (withDensity(1.001) - withDensity(0.999)) / 0.002;
    expect(row!.sensitivity).toBeLessThan(0);
    expect(Math.abs(row!.sensitivity / difference - 1)).toBeLessThan(1e-3);
    expect(row!.contribution).toBeCloseTo(Math.abs(row!.sensitivity) * uRel, 12);
    const note = result.warnings.find((w) => w.code === 'outside-cipm-temperature-range');
    expect(note?.severity).toBe('info');
  });

  it('has no such row inside 15–27 °C', () => {
    expect(analyzeSeries(request(20)).budget.map((r) => r.input)).not.toContain('air_density_formula');
  });
});
