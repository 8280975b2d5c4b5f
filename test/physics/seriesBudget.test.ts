import { describe, expect, it } from 'vitest';
import { analyzeSeries, prepareSeries } from '../../src/physics/analyzeSeries';
import { fallBodyOf } from '../../src/physics/fallBodyOf';
import { ownDragCoefficient } from '../../src/physics/dropDragCoefficient';
import { seriesBudget } from '../../src/physics/seriesBudget';
import { prepareSetup } from '../../src/physics/seriesSetup';
import { uncertaintyBudget } from '../../src/physics/uncertaintyBudget';
import { AIR, BALL, exactTimes, SITE, UNCERTAINTY } from './syntheticSeries';

const heights = [4, 4, 9, 9, 16, 16];
const times = exactTimes({ site: SITE, air: AIR, specimen: BALL }, 0.47, heights).map((t, i) => t + 0.03 + (i % 2 ? 0.001 : -0.001));
const request = {
  site: SITE,
  air: AIR,
  specimen: BALL,
  drops: heights.map((h, i) => ({ height_m: h, time_s: times[i]! })),
  timing: { standard_uncertainty_s: 0.004, offset: 'fit' as const },
  uncertainty: UNCERTAINTY,
  options: { monte_carlo_draws: 200 },
};

describe('the narrow budget on one prepared setup', () => {
  it('gives the very budget the whole preparation gives', () => {
    const prepared = prepareSeries(request);
    const full = uncertaintyBudget(prepared.fit.model, prepared.fit.x0, prepared.inputs.specs);
    const narrow = seriesBudget(prepareSetup(request), request.drops);
    expect(narrow.estimate).toBe(prepared.fit.estimate);
    expect(narrow.budget.combined_standard_uncertainty).toBe(full.combined_standard_uncertainty);
    expect(narrow.budget.entries.map((e) => e.contribution)).toEqual(full.entries.map((e) => e.contribution));
  });

  it('keeps only the inputs asked for', () => {
    const narrow = seriesBudget(prepareSetup(request), request.drops, (s) => s.input === 'time_s');
    expect(narrow.budget.entries.map((e) => e.input)).toEqual(['time_s']);
  });
});

describe('the body of an analysed series', () => {
  const result = analyzeSeries(request);

  it('is the body the analysis used: each drop’s own C_d comes back from it and the fitted offset', () => {
    for (const drop of result.drops) {
      expect(ownDragCoefficient(fallBodyOf(result), drop.height_m, drop.time_s, result.timing_offset_s)).toBe(drop.drag_coefficient);
    }
  });

  it('carries the given C_d when asked', () => {
    expect(fallBodyOf(result, 0.5)).toMatchObject({ mass_kg: BALL.mass_kg, drag_coefficient: 0.5, density_kg_m3: result.air.density_kg_m3, gravity_m_s2: result.gravity_m_s2 });
  });
});
