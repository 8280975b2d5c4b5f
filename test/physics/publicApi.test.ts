import { describe, expect, expectTypeOf, it } from 'vitest';
import * as physics from '../../src/physics/index';
import type { AirInput, AirProperties, AnalysisRequest, AnalysisResult, DropPlan, DropPlanRequest } from '../../src/physics/index';

describe('the physics public face', () => {
  it('exports the analysis entry point, its validator and its typed error', () => {
    expectTypeOf(physics.analyzeSeries).toEqualTypeOf<(request: AnalysisRequest) => AnalysisResult>();
    expectTypeOf(physics.validateAnalysisRequest).toEqualTypeOf<(json: unknown) => AnalysisRequest>();
    expectTypeOf(physics.planDrop).toEqualTypeOf<(request: DropPlanRequest) => DropPlan>();
    expectTypeOf(physics.airProperties).parameter(0).toEqualTypeOf<AirInput>();
    expectTypeOf(physics.airProperties).returns.toEqualTypeOf<AirProperties>();
    const error = new physics.PhysicsInputError({ code: 'out-of-range', field: 'air.temperature_C', value: 300, allowed: '-100 to 100 °C' });
    expect(error).toBeInstanceOf(Error);
    expectTypeOf(error.code).toEqualTypeOf<physics.PhysicsInputErrorCode>();
    expect([error.field, error.value, error.allowed]).toEqual(['air.temperature_C', 300, '-100 to 100 °C']);
  });

  it('keeps the unit in the name of every number of the result', () => {
    expectTypeOf<AnalysisResult['air']['density_kg_m3']>().toEqualTypeOf<number>();
    expectTypeOf<AnalysisResult['gravity_m_s2']>().toEqualTypeOf<number>();
    expectTypeOf<AnalysisResult['drag_coefficient_interval_95']>().toEqualTypeOf<[number, number]>();
    expectTypeOf<AnalysisResult['drops'][number]['impact_energy_J']>().toEqualTypeOf<number>();
  });
});
