import { describe, expect, it } from 'vitest';
import { defaultAddedMassUncertainty } from '../../src/physics/addedMassCoefficient';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import type { AnalysisRequest, UncertaintyInput } from '../../src/physics/analysisTypes';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import type { SpecimenInput } from '../../src/physics/specimenGeometry';
import { validateAnalysisRequest } from '../../src/physics/validateAnalysisRequest';
import { AIR, createRandom, exactTimes, SITE } from './syntheticSeries';

// A light, bulky ball: 250 mm, 30 g (an invented specimen of our own), dropped from 3 m.
const LIGHT: SpecimenInput = { shape: 'sphere', mass_kg: 0.03, diameter_m: 0.25 };
const U: UncertaintyInput = { height_m: 0.005, mass_kg: 0.0002, diameter_m: 0.001, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 };

function lightRequest(times: number[], uCa?: number): AnalysisRequest {
  return {
    site: SITE,
    air: AIR,
    specimen: LIGHT,
    drops: times.map((t) => ({ height_m: 3, time_s: t })),
    timing: { standard_uncertainty_s: 0.002 },
    uncertainty: uCa === undefined ? U : { ...U, added_mass_coefficient: uCa },
    options: { monte_carlo_draws: 2000 },
  };
}

describe('the added-mass coefficient with its uncertainty', () => {
  it('has stated defaults: half the potential-flow value, 0.5 of the volume for a custom shape', () => {
    // Sphere: potential flow C_a = 1/2 (Lamb, Hydrodynamics §92); its default standard uncertainty 0.25.
    expect(defaultAddedMassUncertainty(0.5, false)).toBe(0.25);
    expect(defaultAddedMassUncertainty(0, true)).toBe(0.5);
  });

  it('is checked like every other uncertainty: the field, the value and the range', () => {
    const request = lightRequest([1, 1]);
    let error: unknown;
    try {
      validateAnalysisRequest({ ...request, uncertainty: { ...U, added_mass_coefficient: 11 } });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(PhysicsInputError);
    expect([(error as PhysicsInputError).field, (error as PhysicsInputError).allowed]).toEqual(['uncertainty.added_mass_coefficient', '0 to 10']);
  });

  it('enters the budget with ∂C_d/∂C_a from the model, and the Monte Carlo agrees with the GUM', () => {
    const times = exactTimes({ site: SITE, air: AIR, specimen: LIGHT }, 0.47, [3, 3, 3, 3, 3]);
    const result = analyzeSeries(lightRequest(times, 0.05));
    const row = result.budget.find((r) => r.input === 'added_mass_coefficient')!;
    expect(row.standard_uncertainty).toBe(0.05);
    // Independent check of the sensitivity: C_d from the same times with C_a = 0.5 ± 0.001 given as an option.
    const at = (ca: number): number => {
      const r = lightRequest(times);
      r.options = { ...r.options, added_mass_coefficient: ca };
      return analyzeSeries(r).drag_coefficient_estimate;
    };
    const derivative = (at(0.501) - at(0.499)) / 0.002;
    // 2e-4: each of the two requests sets its own weight of the air along the fall (columnCorrection.ts, a few
    // per mille of a 5e-4 correction here), which the budget's derivative inside one analysis holds fixed.
    expect(Math.abs(row.sensitivity / derivative - 1)).toBeLessThan(2e-4);
    // More inertia alone already slows the fall, so less drag explains the same time: the sensitivity is negative.
    expect(row.sensitivity).toBeLessThan(0);
    expect(result.monte_carlo.standard_deviation / result.drag_coefficient_standard_uncertainty).toBeGreaterThan(0.9);
    expect(result.monte_carlo.standard_deviation / result.drag_coefficient_standard_uncertainty).toBeLessThan(1.1);
  });

  it('warns when it is left out for a light, bulky body, and not for a dense ball', () => {
    const times = exactTimes({ site: SITE, air: AIR, specimen: LIGHT }, 0.47, [3, 3, 3]);
    const light = analyzeSeries(lightRequest(times));
    expect(light.warnings.map((w) => w.code)).toContain('added-mass-uncertainty-not-given');
    expect(light.budget.some((r) => r.input === 'added_mass_coefficient')).toBe(false);
    const given = analyzeSeries(lightRequest(times, 0.25));
    expect(given.warnings.map((w) => w.code)).not.toContain('added-mass-uncertainty-not-given');
    const dense: SpecimenInput = { shape: 'sphere', mass_kg: 0.21, diameter_m: 0.095 };
    const denseTimes = exactTimes({ site: SITE, air: AIR, specimen: dense }, 0.47, [12, 12, 12]);
    const denseResult = analyzeSeries({ ...lightRequest(denseTimes), specimen: dense, drops: denseTimes.map((t) => ({ height_m: 12, time_s: t })) });
    expect(denseResult.warnings.map((w) => w.code)).not.toContain('added-mass-uncertainty-not-given');
  });

  it('covers the true C_d in 93–97 % of 500 light, bulky 3 m series whose true C_a is uncertain', () => {
    // Per series the true C_a is drawn from N(0.5, 0.25²) cut at 0, every other input around its nominal value
    // by its standard uncertainty, and the crew declares u(C_a) = 0.25. Binomial standard deviation for
    // n = 500, p = 0.95: 0.97 %. 1000 Monte Carlo draws per series keep the test inside CI time.
    const random = createRandom(31415);
    const series = 500;
    let covered = 0;
    for (let i = 0; i < series; i++) {
      const ca = Math.max(0, 0.5 + 0.25 * random.normal());
      const specimen = { ...LIGHT, mass_kg: LIGHT.mass_kg + U.mass_kg! * random.normal(), diameter_m: (LIGHT as { diameter_m: number }).diameter_m + U.diameter_m! * random.normal() };
      const air = {
        ...AIR,
        temperature_C: AIR.temperature_C + U.temperature_C! * random.normal(),
        pressure_Pa: AIR.pressure_Pa + U.pressure_Pa! * random.normal(),
        relative_humidity_pct: AIR.relative_humidity_pct + U.relative_humidity_pct! * random.normal(),
      };
      const height = 3 + U.height_m! * random.normal();
      const truth = exactTimes({ site: SITE, air, specimen, options: { added_mass_coefficient: ca } }, 0.47, [height])[0]!;
      const request = lightRequest(
        Array.from({ length: 5 }, () => truth + 0.002 * random.normal()),
        0.25,
      );
      request.options = { monte_carlo_draws: 1000 };
      const [low, high] = analyzeSeries(request).drag_coefficient_interval_95;
      if (low <= 0.47 && 0.47 <= high) covered++;
    }
    expect(covered / series).toBeGreaterThanOrEqual(0.93);
    expect(covered / series).toBeLessThanOrEqual(0.97);
  }, 300_000);
});
