import { describe, expect, it } from 'vitest';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { validateAnalysisRequest } from '../../src/physics/validateAnalysisRequest';

const good = {
  site: { latitude_deg: 46.1, elevation_m: 430 },
  air: { temperature_C: 17.5, pressure_Pa: 96120, pressure_reference: 'station', relative_humidity_pct: 55 },
  specimen: { mass_kg: 0.21, shape: 'sphere', diameter_m: 0.095 },
  drops: [
    { height_m: 12, time_s: 1.642 },
    { height_m: 12, time_s: 1.638 },
  ],
  timing: { standard_uncertainty_s: 0.004, offset: 'none' },
  uncertainty: { height_m: 0.01, mass_kg: 0.0005, diameter_m: 0.0003, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 },
  options: { buoyancy: true, added_mass_coefficient: 0.5 },
};

/** A deep copy of the good request with one change applied. */
function variant(change: (r: Record<string, any>) => void): unknown {
  const copy = structuredClone(good) as Record<string, any>;
  change(copy);
  return copy;
}

function rejection(json: unknown): PhysicsInputError {
  try {
    validateAnalysisRequest(json);
  } catch (error) {
    if (error instanceof PhysicsInputError) return error;
    throw error;
  }
  throw new Error('expected the request to be refused');
}

describe('validateAnalysisRequest', () => {
  it('accepts the request of the documented shape and returns it typed', () => {
    const request = validateAnalysisRequest(good);
    expect(request.drops).toHaveLength(2);
    expect(request.timing.offset).toBe('none');
  });

  it('names field, value and allowed range for each kind of bad value', () => {
    const cases: [unknown, string, unknown, RegExp][] = [
      [variant((r) => (r.air.relative_humidity_pct = 120)), 'air.relative_humidity_pct', 120, /0 to 100 %/],
      [variant((r) => (r.air.pressure_Pa = -1)), 'air.pressure_Pa', -1, /20 000 Pa to 200 000 Pa/],
      [variant((r) => (r.site.latitude_deg = 123)), 'site.latitude_deg', 123, /-90 to 90/],
      [variant((r) => (r.drops[1].time_s = 0)), 'drops[1].time_s', 0, /above 0/],
      [variant((r) => (r.drops[0].height_m = '12')), 'drops[0].height_m', '12', /a number/],
      [variant((r) => (r.specimen.diameter_m = 0)), 'specimen.diameter_m', 0, /above 0/],
      [variant((r) => (r.timing.standard_uncertainty_s = 0)), 'timing.standard_uncertainty_s', 0, /above 0/],
      [variant((r) => (r.uncertainty.mass_kg = -0.1)), 'uncertainty.mass_kg', -0.1, /0 to 100 kg/],
      [variant((r) => (r.options.monte_carlo_draws = 10.5)), 'options.monte_carlo_draws', 10.5, /whole number/],
      [variant((r) => (r.options.buoyancy = 'yes')), 'options.buoyancy', 'yes', /true or false/],
    ];
    for (const [json, field, value, allowed] of cases) {
      const e = rejection(json);
      expect(e.field).toBe(field);
      expect(e.value).toEqual(value);
      expect(e.allowed).toMatch(allowed);
      expect(e.message).toContain(field);
    }
  });

  it('refuses unknown fields, which are usually typos or a missing unit', () => {
    const e = rejection(variant((r) => (r.air.temperature = 17.5)));
    expect(e.code).toBe('unknown-field');
    expect(e.field).toBe('air.temperature');
    expect(e.allowed).toContain('temperature_C');
    expect(rejection(variant((r) => (r.extra = 1))).field).toBe('extra');
  });

  it('refuses a request that is not an object, and missing sections', () => {
    expect(rejection(null).code).toBe('wrong-type');
    expect(rejection([]).code).toBe('wrong-type');
    expect(rejection(variant((r) => delete r.drops)).field).toBe('drops');
    expect(rejection(variant((r) => delete r.timing)).field).toBe('timing');
  });

  it('refuses an empty list of drops', () => {
    const e = rejection(variant((r) => (r.drops = [])));
    expect(e.field).toBe('drops');
    expect(e.allowed).toBe('1 to 10 000 drops');
  });

  it('allows a fitted timing offset only with at least three distinct heights', () => {
    const e = rejection(variant((r) => (r.timing.offset = 'fit')));
    expect(e.code).toBe('offset-needs-three-heights');
    expect(e.field).toBe('timing.offset');
    expect(e.allowed).toContain('these drops have 1');
    const ok = variant((r) => {
      r.timing.offset = 'fit';
      r.drops = [4, 8, 12].map((h) => ({ height_m: h, time_s: Math.sqrt(h / 4.9) + 0.01 }));
    });
    expect(validateAnalysisRequest(ok).timing.offset).toBe('fit');
  });

  it('accepts only the uncertainties that belong to the specimen’s shape and the air readings given', () => {
    expect(rejection(variant((r) => (r.uncertainty.length_m = 0.001))).field).toBe('uncertainty.length_m');
    expect(rejection(variant((r) => (r.uncertainty.dew_point_C = 0.5))).field).toBe('uncertainty.dew_point_C');
    const box = variant((r) => {
      r.specimen = { shape: 'box', mass_kg: 0.45, length_m: 0.3, width_m: 0.2, thickness_m: 0.12 };
      r.uncertainty = { length_m: 0.001, width_m: 0.001, thickness_m: 0.001 };
    });
    expect(validateAnalysisRequest(box).uncertainty?.thickness_m).toBe(0.001);
  });

  it('refuses an unknown timing-offset mode and an unknown pressure reference', () => {
    expect(rejection(variant((r) => (r.timing.offset = 'auto'))).allowed).toBe('"none" or "fit"');
    expect(rejection(variant((r) => (r.air.pressure_reference = 'QNH'))).allowed).toBe('"station" or "sea_level"');
  });
});
