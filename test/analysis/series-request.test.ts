import { describe, expect, it } from 'vitest';
import { analyzeSeriesRecords, buildRequest, MISSING_PART_MESSAGES, seriesParts } from '../../src/analysis';
import { validateAnalysisRequest } from '../../src/physics';
import { excludedCopy, revise, testDay, DEVICE, HEIGHTS } from './day-records';

describe('a series request built from the records', () => {
  it('carries the site, the air, the specimen, the used drops with their ids, the timing and every uncertainty', () => {
    const day = testDay();
    const copy = excludedCopy(day.drops[0]!, 7, '00000000-0000-4000-8000-000000000007');
    const request = buildRequest(day.site, day.reading, day.specimen, day.series, [...day.drops, copy]);
    expect(request).toEqual({
      site: { latitude_deg: 46.1, elevation_m: 430 },
      air: { temperature_C: 17.5, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 },
      specimen: { shape: 'sphere', mass_kg: 0.21, diameter_m: 0.095 },
      drops: day.drops.map((d, i) => ({ id: d.id, height_m: HEIGHTS[i], time_s: d.time_s })),
      timing: { standard_uncertainty_s: 0.004, offset: 'fit', method: 'typed' },
      uncertainty: { mass_kg: 0.0005, diameter_m: 0.0003, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3, height_m: 0.01 },
    });
  });

  it('carries a declared timing delay and the timing method, whose defaults the physics applies', () => {
    const day = testDay();
    const series = { ...day.series, timing_method: 'tap' as const, timing_delay_s: -0.03, u_timing_delay_s: 0.02 };
    expect(buildRequest(day.site, day.reading, day.specimen, series, day.drops).timing).toEqual({
      standard_uncertainty_s: 0.004,
      offset: 'fit',
      method: 'tap',
      offset_s: -0.03,
      offset_standard_uncertainty_s: 0.02,
    });
    // Without a declared delay the method's own applies: nothing is sent, the physics fills it in.
    expect(buildRequest(day.site, day.reading, day.specimen, { ...series, timing_delay_s: null, u_timing_delay_s: null }, day.drops).timing).not.toHaveProperty('offset_s');
  });

  it('sends the reading’s height and vertical air motion only when they say something', () => {
    const day = testDay();
    const plain = buildRequest(day.site, day.reading, day.specimen, day.series, day.drops);
    expect(plain.air).not.toHaveProperty('height_m');
    expect(plain.air).not.toHaveProperty('vertical_wind_m_s');
    const aloft = { ...day.reading, height_m: 120, vertical_wind_m_s: 0.4, u_vertical_wind_m_s: 0.2 };
    const request = buildRequest(day.site, aloft, day.specimen, day.series, day.drops);
    expect(request.air).toMatchObject({ height_m: 120, vertical_wind_m_s: 0.4 });
    expect(request.uncertainty).toMatchObject({ vertical_wind_m_s: 0.2 });
  });

  it('fits a timing offset only with drops from three heights', () => {
    const day = testDay();
    const twoHeights = day.drops.slice(0, 4);
    expect(buildRequest(day.site, day.reading, day.specimen, day.series, twoHeights).timing.offset).toBe('none');
  });

  it('uses the series height for a drop without its own', () => {
    const day = testDay();
    const plain = revise(day.drops[0]!, { height_m: null }, Date.UTC(2026, 6, 3, 12), DEVICE);
    expect(buildRequest(day.site, day.reading, day.specimen, day.series, [plain]).drops[0]!.height_m).toBe(day.series.height_m);
  });
});

describe('drops with marks in the request', () => {
  // Invented gate times, a vacuum fall t = √(2d/g) (g = 9.81 m/s²) plus a little: demo values, not measurements.
  const gates = [0.5, 1, 1.5];
  const gateTimes = (k: number) => gates.map((d) => Number((Math.sqrt((2 * d) / 9.81) + 0.002 * k).toFixed(6)));

  it('passes a gates series’ distances through each drop’s marks, the landing being the last gate', () => {
    const day = testDay();
    const series = { ...day.series, timing_method: 'gates' as const, gate_distances_m: gates };
    const drops = day.drops.map((d, k) => {
      const times = gateTimes(k);
      return { ...d, marks: gates.map((g, i) => ({ distance_m: g, time_s: times[i]! })), release_time_known: true, time_s: times[2]!, height_m: 1.5 };
    });
    const request = buildRequest(day.site, day.reading, day.specimen, series, drops);
    expect(request.drops[1]).toEqual({
      id: drops[1]!.id,
      height_m: 1.5,
      time_s: gateTimes(1)[2],
      marks: gates.map((g, i) => ({ distance_m: g, time_s: gateTimes(1)[i] })),
    });
    // Three distinct distances from a known release: the offset can be fitted.
    expect(request.timing.offset).toBe('fit');
    // A gate distance corrected on the series reaches every drop's marks and its landing.
    const moved = buildRequest(day.site, day.reading, day.specimen, { ...series, gate_distances_m: [0.5, 1, 1.52] }, drops);
    expect(moved.drops.map((d) => [d.marks![2]!.distance_m, d.height_m])).toEqual(drops.map(() => [1.52, 1.52]));
    // The physics' own validation takes the request as built.
    expect(() => validateAnalysisRequest(request)).not.toThrow();
  });

  it('passes a clip’s marks with its release time unknown, and its landing after the last mark', () => {
    const day = testDay();
    const drops = day.drops.map((d) => ({ ...d, marks: [{ distance_m: 0.2, time_s: 0.202 }, { distance_m: 0.6, time_s: 0.35 }], release_time_known: false }));
    const request = buildRequest(day.site, day.reading, day.specimen, day.series, drops);
    expect(request.drops[0]).toEqual({ id: drops[0]!.id, height_m: HEIGHTS[0], time_s: drops[0]!.time_s, marks: drops[0]!.marks, release_time_known: false });
    // No known release anywhere: a constant delay cannot be told from the release shifts.
    expect(request.timing.offset).toBe('none');
    expect(() => validateAnalysisRequest(request)).not.toThrow();
  });
});

describe('the one missing-parts check', () => {
  const day = testDay();
  const parts = { series: day.series, site: day.site, specimen: day.specimen, reading: day.reading, drops: day.drops };

  it('names each missing part by a stable code, in the order site, specimen, reading, drops', () => {
    expect(seriesParts({ ...parts, site: null, specimen: null, reading: null, drops: [] })).toMatchObject({ kind: 'missing', code: 'series-without-site' });
    expect(seriesParts({ ...parts, specimen: null, reading: null, drops: [] })).toMatchObject({ kind: 'missing', code: 'series-without-specimen' });
    expect(seriesParts({ ...parts, reading: null, drops: [] })).toMatchObject({ kind: 'missing', code: 'series-without-reading' });
    expect(seriesParts({ ...parts, drops: [] })).toMatchObject({ kind: 'missing', code: 'series-without-drops' });
  });

  it('counts a series whose drops are all excluded or deleted as one without drops', () => {
    const gone = [revise(day.drops[0]!, { excluded: true, exclusion_reason: 'wind' }, Date.UTC(2026, 6, 3, 12), DEVICE), revise(day.drops[1]!, { deleted: true }, Date.UTC(2026, 6, 3, 12), DEVICE)];
    expect(seriesParts({ ...parts, drops: gone })).toMatchObject({ kind: 'missing', code: 'series-without-drops' });
  });

  it('gives the screens a sentence for people and the tables one naming the series', () => {
    const missing = seriesParts({ ...parts, specimen: undefined });
    expect(missing).toMatchObject({ message: MISSING_PART_MESSAGES['series-without-specimen'] });
    expect(missing.kind === 'missing' && missing.detail).toContain(day.series.id);
    expect(missing.kind === 'missing' && missing.detail).toContain(day.series.specimen_id);
  });

  it('is what the screens read', () => {
    const outcome = analyzeSeriesRecords(day.site, [], day.specimen, day.series, day.drops, { monteCarloDraws: 200 });
    expect(outcome).toEqual({ kind: 'missing', code: 'series-without-reading', message: MISSING_PART_MESSAGES['series-without-reading'] });
  });

  it('hands back the complete parts with the drops the fit uses', () => {
    const complete = seriesParts(parts);
    expect(complete.kind).toBe('complete');
    expect(complete.kind === 'complete' && complete.drops).toEqual(day.drops);
  });
});
