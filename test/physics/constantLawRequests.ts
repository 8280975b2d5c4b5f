/**
 * Requests whose analysis keeps a constant drag coefficient (asked for, chosen by `auto`, or fallen back to when
 * drag is not resolved), for the check that work on the scaled sphere law leaves them bit for bit as they were.
 * Every series is an invented scenario of our own (seeded noise), or one of the shipped examples.
 * `npx tsx test/physics/writeConstantLawResults.ts` writes their results to fixtures/constant-law-results.json.
 */
import { readFileSync } from 'node:fs';
import type { AnalysisRequest } from '../../src/physics/analysisTypes';
import { createRandom } from '../../src/physics/createRandom';
import { validateAnalysisRequest } from '../../src/physics/validateAnalysisRequest';
import { particleRequest } from './particleSeries';
import { measuredSeries } from './syntheticSeries';
import { TALL_CROSSWIND_SERIES } from './tallCrosswindSeries';

const example = (name: string): AnalysisRequest =>
  validateAnalysisRequest(JSON.parse(readFileSync(new URL(`../../examples/${name}`, import.meta.url), 'utf8')));

export function constantLawRequests(): { name: string; request: AnalysisRequest }[] {
  const list: { name: string; request: AnalysisRequest }[] = [];
  for (const name of ['footbridge-ball.json', 'stairwell-box-offset.json', 'meadow-seed-pod.json']) list.push({ name, request: example(name) });
  // A ball (auto keeps a constant C_d): one height; four heights with a fitted offset; a declared delay.
  list.push({ name: 'ball, five drops from 12 m', request: measuredSeries({ cd: 0.47, heights: [12, 12, 12, 12, 12], timingU: 0.004, random: createRandom(11) }) });
  list.push({
    name: 'ball, four heights, fitted offset',
    request: measuredSeries({ cd: 0.47, heights: [3, 3, 6, 6, 9, 9, 12, 12], timingU: 0.004, random: createRandom(12), fitOffset: true, offset_s: 0.01 }),
  });
  const declared = measuredSeries({ cd: 0.47, heights: [8, 8, 8, 12, 12, 12], timingU: 0.004, random: createRandom(13), offset_s: 0.02 });
  list.push({ name: 'ball, declared delay', request: { ...declared, timing: { standard_uncertainty_s: 0.004, offset_s: 0.02, offset_standard_uncertainty_s: 0.003 } } });
  list.push({ name: 'ball, adaptive Monte Carlo', request: { ...declared, options: {} } });
  // The 1 mm bead under a constant C_d when asked for: one height, three heights, three heights with an offset fitted.
  list.push({ name: 'bead, constant asked, one height', request: particleRequest({ scale: 1, heights: [1, 1, 1, 1, 1], drag_law: 'constant', random: createRandom(21) }) });
  list.push({ name: 'bead, constant asked, three heights', request: particleRequest({ scale: 1.1, heights: [0.3, 0.3, 1, 1, 3, 3], drag_law: 'constant', random: createRandom(22) }) });
  const beadOffset = particleRequest({ scale: 1, heights: [0.3, 0.3, 1, 1, 2, 2, 3, 3], drag_law: 'constant', random: createRandom(23) });
  list.push({ name: 'bead, constant asked, fitted offset', request: { ...beadOffset, timing: { ...beadOffset.timing, offset: 'fit' } } });
  // A heavy ball timed by stopwatch from 2 m: drag not resolved, so even scaled_sphere falls back to constant.
  for (const seed of [31, 32, 33]) {
    const heavy = measuredSeries({ cd: 0.47, heights: [2, 2, 2, 2, 2], timingU: 0.02, random: createRandom(seed), draws: 1000 });
    list.push({ name: `heavy ball, scaled_sphere asked, not resolved (seed ${seed})`, request: { ...heavy, options: { ...heavy.options, drag_law: 'scaled_sphere' } } });
  }
  // A tall fall through the air column with a crosswind.
  list.push({
    name: '3000 m through the air column',
    request: validateAnalysisRequest({ ...TALL_CROSSWIND_SERIES, options: { monte_carlo_draws: 2000 } }),
  });
  return list;
}

/** JSON of a result with non-finite numbers kept as words, so that the comparison sees them too. */
export function resultJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? `number:${v}` : v));
}
