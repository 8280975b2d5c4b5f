import { describe, expect, it } from 'vitest';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { validateAnalysisRequest } from '../../src/physics/validateAnalysisRequest';

// An invented request of our own (demo values), with one drop of video marks and one of gate times.
const good = {
  site: { latitude_deg: 46.1, elevation_m: 430 },
  air: { temperature_C: 17.5, pressure_Pa: 96120, pressure_reference: 'station', relative_humidity_pct: 55 },
  specimen: { mass_kg: 0.21, shape: 'sphere', diameter_m: 0.095 },
  drops: [
    {
      release_time_known: false,
      marks: [
        { distance_m: 0.1, time_s: 0.15 },
        { distance_m: 0.5, time_s: 0.33 },
        { distance_m: 1.2, time_s: 0.5 },
      ],
    },
    { height_m: 2, time_s: 0.65, marks: [{ distance_m: 0.5, time_s: 0.32 }, { distance_m: 1, time_s: 0.455 }] },
  ],
  timing: { standard_uncertainty_s: 0.001, offset: 'none' },
};

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

describe('validateAnalysisRequest with marks', () => {
  it('takes the last mark as the landing when none is given, and appends a landing given apart as the last mark', () => {
    const request = validateAnalysisRequest(good);
    expect(request.drops[0]).toMatchObject({ height_m: 1.2, time_s: 0.5, release_time_known: false });
    expect(request.drops[0]!.marks).toHaveLength(3);
    expect(request.drops[1]!.marks).toEqual([
      { distance_m: 0.5, time_s: 0.32 },
      { distance_m: 1, time_s: 0.455 },
      { distance_m: 2, time_s: 0.65 },
    ]);
  });

  it('reads its own validated request again unchanged (the landing is not added twice)', () => {
    const once = validateAnalysisRequest(good);
    expect(validateAnalysisRequest(structuredClone(once))).toEqual(once);
  });

  it('names the mark and its field when a mark goes back in time', () => {
    const e = rejection(variant((r) => (r.drops[0].marks[2].time_s = 0.3)));
    expect(e.code).toBe('out-of-range');
    expect(e.field).toBe('drops[0].marks[2].time_s');
    expect(e.message).toContain('strictly increasing in time');
  });

  it('refuses a mark not further than the one before', () => {
    const e = rejection(variant((r) => (r.drops[0].marks[1].distance_m = 0.1)));
    expect(e.field).toBe('drops[0].marks[1].distance_m');
  });

  it('refuses one mark, and more than 64', () => {
    expect(rejection(variant((r) => (r.drops[0].marks = [{ distance_m: 1, time_s: 0.45 }]))).field).toBe('drops[0].marks');
    const many = Array.from({ length: 65 }, (_, k) => ({ distance_m: 0.01 * (k + 1), time_s: 0.01 * (k + 1) }));
    const e = rejection(variant((r) => (r.drops[0].marks = many)));
    expect(e.field).toBe('drops[0].marks');
    expect(e.allowed).toBe('2 to 64 marks');
  });

  it('refuses a negative distance and an unknown field in a mark', () => {
    expect(rejection(variant((r) => (r.drops[0].marks[0].distance_m = -0.1))).field).toBe('drops[0].marks[0].distance_m');
    const e = rejection(variant((r) => (r.drops[0].marks[0].height_m = 1)));
    expect(e.code).toBe('unknown-field');
    expect(e.field).toBe('drops[0].marks[0].height_m');
  });

  it('lets an estimated release have a mark just before its zero, a known one not', () => {
    expect(() => validateAnalysisRequest(variant((r) => (r.drops[0].marks[0] = { distance_m: 0, time_s: -0.01 })))).not.toThrow();
    const e = rejection(variant((r) => (r.drops[1].marks[0] = { distance_m: 0, time_s: -0.01 })));
    expect(e.field).toBe('drops[1].marks[0].time_s');
    expect(e.allowed).toBe('0 to 3600 s from the release');
  });

  it('refuses a landing that contradicts the marks, and half a landing', () => {
    expect(rejection(variant((r) => (r.drops[1].height_m = 0.9))).field).toBe('drops[1].height_m');
    expect(rejection(variant((r) => (r.drops[1].time_s = 0.4))).field).toBe('drops[1].time_s');
    const e = rejection(variant((r) => delete r.drops[1].time_s));
    expect(e.code).toBe('missing-field');
    expect(e.field).toBe('drops[1].time_s');
  });

  it('refuses an unknown release on a drop with a single time, and a release flag that is not a boolean', () => {
    const e = rejection(variant((r) => (r.drops[1] = { height_m: 2, time_s: 0.65, release_time_known: false })));
    expect(e.code).toBe('conflicting-fields');
    expect(e.field).toBe('drops[1].release_time_known');
    expect(rejection(variant((r) => (r.drops[0].release_time_known = 'no'))).field).toBe('drops[0].release_time_known');
  });

  it('fits an offset only when times from a known release reach three distinct distances', () => {
    const twoGates = (r: Record<string, any>) => {
      r.timing.offset = 'fit';
      delete r.drops[1].height_m;
      delete r.drops[1].time_s;
    };
    const e = rejection(variant(twoGates));
    expect(e.code).toBe('offset-needs-three-heights');
    expect(e.message).toContain('these drops have 2');
    expect(() =>
      validateAnalysisRequest(variant((r) => {
        twoGates(r);
        r.drops[1].marks.unshift({ distance_m: 0.2, time_s: 0.2 });
      })),
    ).not.toThrow();
  });

  it('checks the marks\' own uncertainties and the release instant\'s', () => {
    expect(rejection(variant((r) => (r.uncertainty = { mark_distance_m: 2 }))).field).toBe('uncertainty.mark_distance_m');
    expect(rejection(variant((r) => (r.uncertainty = { mark_scale_relative: -0.1 }))).field).toBe('uncertainty.mark_scale_relative');
    expect(rejection(variant((r) => (r.timing.release_standard_uncertainty_s = 3))).field).toBe('timing.release_standard_uncertainty_s');
    const request = validateAnalysisRequest(variant((r) => {
      r.uncertainty = { mark_distance_m: 0.002, mark_scale_relative: 0.003 };
      r.timing.release_standard_uncertainty_s = 0.001;
    }));
    expect(request.uncertainty).toEqual({ mark_distance_m: 0.002, mark_scale_relative: 0.003 });
    expect(request.timing.release_standard_uncertainty_s).toBe(0.001);
  });
});
