import { describe, expect, it } from 'vitest';
import {
  ADVICE_DEFAULTS,
  analyzeDay,
  analyzeSeriesRecords,
  measuredDragCoefficient,
  PLAN_DEFAULTS,
  planFor,
  planRequest,
  seriesAdvice,
  seriesPlanRequest,
  specimenDragCoefficientOfDay,
} from '../../src/analysis';
import { planDrop } from '../../src/physics';
import { testDay } from './day-records';

const FORM = { u_time_s: 0.03, height_m: 10, target_relative_uncertainty: 0.05, max_height_m: 50 };

describe('the Planner screen’s request', () => {
  const day = testDay();

  it('names every default it falls back on', () => {
    // ISO 2533:1975 standard atmosphere at sea level: 15 °C and 101 325 Pa; taken as dry.
    expect(PLAN_DEFAULTS.air).toEqual({ temperature_C: 15, pressure_Pa: 101_325, pressure_reference: 'station', relative_humidity_pct: 0 });
    expect(PLAN_DEFAULTS.site).toEqual({ latitude_deg: 45, elevation_m: 0 });
    // 1 cm for a taped height (common practice).
    expect(PLAN_DEFAULTS.u_height_m).toBe(0.01);
    expect(PLAN_DEFAULTS.max_drops).toBe(30);
  });

  it('without a day falls back on those defaults, as the screen always did', () => {
    const { request, sources } = planRequest({ specimen: day.specimen, reading: null, site: null, measuredDragCoefficient: null, ...FORM });
    // The request the Planner screen built inline before it moved here.
    expect(request).toEqual({
      site: { latitude_deg: 45, elevation_m: 0 },
      air: { temperature_C: 15, pressure_Pa: 101_325, pressure_reference: 'station', relative_humidity_pct: 0 },
      specimen: { shape: 'sphere', mass_kg: 0.21, diameter_m: 0.095 },
      timing: { standard_uncertainty_s: 0.03 },
      uncertainty: { mass_kg: 0.0005, diameter_m: 0.0003, height_m: 0.01 },
      height_m: 10,
      target_relative_uncertainty: 0.05,
      max_height_m: 50,
      max_drops: 30,
    });
    expect(sources).toEqual({ air: 'default', site: 'default', dragCoefficient: 'specimen' });
  });

  it('uses the crew’s reading, site and measured C_d when it has them', () => {
    const { request, sources } = planRequest({ specimen: day.specimen, reading: day.reading, site: day.site, measuredDragCoefficient: 0.52, ...FORM });
    expect(request.site).toEqual({ latitude_deg: 46.1, elevation_m: 430 });
    expect(request.air).toEqual({ temperature_C: 17.5, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 });
    expect(request.uncertainty).toMatchObject({ temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 });
    expect(request.drag_coefficient).toBe(0.52);
    expect(sources).toEqual({ air: 'reading', site: 'site', dragCoefficient: 'measured' });
    expect(planDrop(request).drag_coefficient_source).toBe('given');
  });

  it('is planned as built', () => {
    const inputs = { specimen: day.specimen, reading: day.reading, site: day.site, measuredDragCoefficient: null, ...FORM };
    expect(planFor(inputs)).toEqual({ plan: planDrop(planRequest(inputs).request), sources: planRequest(inputs).sources });
  });

  it('never plans a drop above the highest release point', () => {
    expect(planRequest({ specimen: day.specimen, reading: null, site: null, measuredDragCoefficient: null, ...FORM, height_m: 80 }).request.height_m).toBe(50);
  });

  it('finds the C_d measured today for the specimen, and none for another', () => {
    const rows = analyzeDay({ site: day.site, readings: [day.reading], specimens: [day.specimen], series: [day.series], drops: day.drops }, { monteCarloDraws: 200 });
    const found = specimenDragCoefficientOfDay(rows, day.specimen.id);
    expect(found?.value).toBe(rows[0]!.outcome.kind === 'ready' ? rows[0]!.outcome.result.drag_coefficient : NaN);
    expect(found?.value).toBeGreaterThan(0.4);
    expect(specimenDragCoefficientOfDay(rows, 'another')).toBeNull();
  });
});

describe('a series’ “what would it take”', () => {
  const day = testDay({ timingOffset: 'none' });
  const outcome = analyzeSeriesRecords(day.site, [day.reading], day.specimen, day.series, day.drops, { monteCarloDraws: 200 });
  if (outcome.kind !== 'ready') throw new Error('the test series could not be computed');

  it('plans on the series’ own air, site, specimen, uncertainties and measured C_d', () => {
    const request = seriesPlanRequest(outcome, day.series);
    expect(request.site).toBe(outcome.request.site);
    expect(request.air).toBe(outcome.request.air);
    expect(request.specimen).toBe(outcome.request.specimen);
    expect(request.uncertainty).toBe(outcome.request.uncertainty);
    expect(request.drag_coefficient).toBe(measuredDragCoefficient(outcome.result));
    expect(request.drag_coefficient).toBe(outcome.result.drag_coefficient);
    expect(request).toMatchObject({
      timing: { standard_uncertainty_s: day.series.u_time_s },
      height_m: day.series.height_m,
      target_relative_uncertainty: day.series.target_relative_uncertainty,
      max_height_m: ADVICE_DEFAULTS.max_height_m,
      max_drops: ADVICE_DEFAULTS.max_drops,
    });
  });

  it('answers with the planner’s target on that request', () => {
    expect(seriesAdvice(outcome, day.series)).toEqual(planDrop(seriesPlanRequest(outcome, day.series)).target);
  });

  it('falls back on the upper bound when drag is not resolved', () => {
    const unresolved = { ...outcome.result, drag_coefficient: null, drag_coefficient_upper_bound_95: 0.3 };
    expect(measuredDragCoefficient(unresolved)).toBe(0.3);
    expect(measuredDragCoefficient({ ...unresolved, drag_coefficient_upper_bound_95: 0 })).toBeNull();
  });
});
