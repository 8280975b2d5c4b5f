import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import { createRandom } from '../../src/physics/createRandom';
import { particleRequest } from './particleSeries';

/** Binomial standard deviation of a rate p measured on n series. */
const spread = (p: number, n: number) => Math.sqrt((p * (1 - p)) / n);

const SERIES = Number(process.env['PLUMMET_COVERAGE_SERIES'] ?? 500);

describe('coverage: a 1 mm glass bead at low Reynolds number (Re up to about 260)', () => {
  it(`the reported 95 % interval of the sphere-curve factor covers the truth in 93–97 % of ${SERIES} series`, () => {
    // Truth: drag follows the standard sphere curve exactly (factor 1); every input drawn by its declared
    // uncertainty, timing noise 4 ms as declared, five drops from 1 m (particleSeries.ts). Binomial standard
    // deviation at 95 % over 500 series: 1.0 %.
    const random = createRandom(1_000_001);
    let covered = 0;
    let scaled = 0;
    for (let i = 0; i < SERIES; i++) {
      const result = analyzeSeries(particleRequest({ scale: 1, heights: [1, 1, 1, 1, 1], random, draws: 1000 }));
      if (result.drag_law === 'scaled_sphere') scaled++;
      const [low, high] = result.drag_law_details.scale_factor_interval_95 ?? [NaN, NaN];
      if (low <= 1 && 1 <= high) covered++;
    }
    const rate = covered / SERIES;
    console.log(`1 mm bead: factor interval covered the truth in ${(100 * rate).toFixed(1)} % of ${SERIES} series (binomial sd ${(100 * spread(0.95, SERIES)).toFixed(1)} %)`);
    expect(scaled).toBe(SERIES);
    expect(rate).toBeGreaterThanOrEqual(0.93);
    expect(rate).toBeLessThanOrEqual(0.97);
  }, 300_000);

  it(`keeps the factor's interval at 93–97 % from three heights, with a trend warning on at most 5 % of ${SERIES} clean series`, () => {
    // The same bead from 0.3, 1 and 3 m, two drops each, drag exactly the standard curve (factor 1). The trend test
    // warns at |z| > 2, which a normal z passes 4.6 % of the time (two-sided); binomial standard deviation of a 5 %
    // rate over 500 series: 1.0 %.
    const random = createRandom(3_000_005);
    let covered = 0;
    let warned = 0;
    for (let i = 0; i < SERIES; i++) {
      const result = analyzeSeries(particleRequest({ scale: 1, heights: [0.3, 0.3, 1, 1, 3, 3], random, draws: 1000 }));
      expect(result.drag_law).toBe('scaled_sphere');
      const [low, high] = result.drag_law_details.scale_factor_interval_95!;
      if (low <= 1 && 1 <= high) covered++;
      if (result.warnings.some((w) => w.code === 'drag-law-misfit')) warned++;
    }
    const rate = covered / SERIES;
    const alarms = warned / SERIES;
    console.log(`1 mm bead, three heights: factor interval covered ${(100 * rate).toFixed(1)} %, trend warning on ${(100 * alarms).toFixed(1)} % of ${SERIES} clean series (binomial sd at 95 %: ${(100 * spread(0.95, SERIES)).toFixed(1)} %, at 5 %: ${(100 * spread(0.05, SERIES)).toFixed(1)} %)`);
    expect(rate).toBeGreaterThanOrEqual(0.93);
    expect(rate).toBeLessThanOrEqual(0.97);
    expect(alarms).toBeLessThanOrEqual(0.05);
  }, 300_000);

  it(`fits the timing offset under the law: factor and offset intervals at 93–97 %, trend warnings on at most 5 % of ${SERIES} series`, () => {
    // Four heights, two drops each, the offset fitted (true offset 0). Before the scaled law took over the offset,
    // the constant fit read the curve's shape as a delay of about 4 ms and the factor's interval covered 84.5 %
    // (200 series).
    const random = createRandom(3_000_007);
    let covered = 0;
    let offsetCovered = 0;
    let warned = 0;
    for (let i = 0; i < SERIES; i++) {
      const request = particleRequest({ scale: 1, heights: [0.3, 0.3, 1, 1, 2, 2, 3, 3], random, draws: 1000 });
      const result = analyzeSeries({ ...request, timing: { ...request.timing, offset: 'fit' } });
      expect(result.drag_law).toBe('scaled_sphere');
      const [low, high] = result.drag_law_details.scale_factor_interval_95!;
      if (low <= 1 && 1 <= high) covered++;
      const [early, late] = result.timing_offset_interval_95_s!;
      if (early <= 0 && 0 <= late) offsetCovered++;
      if (result.warnings.some((w) => w.code === 'drag-law-misfit')) warned++;
    }
    const rate = covered / SERIES;
    const offsetRate = offsetCovered / SERIES;
    const alarms = warned / SERIES;
    console.log(`1 mm bead, four heights, offset fitted: factor interval covered ${(100 * rate).toFixed(1)} %, offset interval ${(100 * offsetRate).toFixed(1)} %, trend warning on ${(100 * alarms).toFixed(1)} % of ${SERIES} series (binomial sd at 95 %: ${(100 * spread(0.95, SERIES)).toFixed(1)} %)`);
    expect(rate).toBeGreaterThanOrEqual(0.93);
    expect(rate).toBeLessThanOrEqual(0.97);
    expect(offsetRate).toBeGreaterThanOrEqual(0.93);
    expect(offsetRate).toBeLessThanOrEqual(0.97);
    expect(alarms).toBeLessThanOrEqual(0.05);
  }, 300_000);
});
