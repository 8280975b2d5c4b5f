import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import { createRandom } from '../../src/physics/createRandom';
import { BALL_CD, markSeriesRequest } from './markSeries';

/** Binomial standard deviation of a rate p measured on n series. */
const spread = (p: number, n: number) => Math.sqrt((p * (1 - p)) / n);

const SERIES = Number(process.env['PLUMMET_COVERAGE_SERIES'] ?? 500);

// Each series is simulated with every input, the timing and the detector drawn by their declared uncertainties
// (markSeries.ts). The interval checked is the GUM interval (estimate ± k·u_c, Welch–Satterthwaite k): it is
// analytic, so the Monte Carlo inside the loop runs at its smallest allowed size (200 draws) and the loop stays
// within CI time; the Monte Carlo interval of the same model is compared with it in analyzeMarksSeries.test.ts.
// Binomial standard deviation of the rate at 95 % over 500 series: 1.0 %.
describe('coverage: drops with marks', () => {
  for (const kind of ['video', 'gates'] as const) {
    it(`${kind}: the 95 % interval of C_d covers the truth in 93–97 % of ${SERIES} series`, () => {
      const random = createRandom(kind === 'video' ? 2_026_120_201 : 2_026_120_202);
      let covered = 0;
      let marks = 0;
      for (let i = 0; i < SERIES; i++) {
        const request = markSeriesRequest({ kind, random, stride: 8, gates: 2 + (i % 3), draws: 200 });
        marks += request.drops.reduce((n, d) => n + d.marks!.length, 0);
        const result = analyzeSeries(request);
        const [low, high] = result.gum.interval_95;
        if (low <= BALL_CD && BALL_CD <= high) covered++;
      }
      const rate = covered / SERIES;
      console.log(`${kind} marks (${(marks / SERIES / 5).toFixed(1)} marks a drop): GUM interval covered the truth in ${(100 * rate).toFixed(1)} % of ${SERIES} series (binomial sd ${(100 * spread(0.95, SERIES)).toFixed(1)} %)`);
      expect(rate).toBeGreaterThanOrEqual(0.93);
      expect(rate).toBeLessThanOrEqual(0.97);
    }, 300_000);
  }
});
