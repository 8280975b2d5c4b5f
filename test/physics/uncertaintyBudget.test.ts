import { describe, expect, it } from 'vitest';
import { fallTimeDragDerivative } from '../../src/physics/fallModel';
import { SeriesModel } from '../../src/physics/seriesModel';
import { uncertaintyBudget, type BudgetInputSpec } from '../../src/physics/uncertaintyBudget';

// A dense ball at one height without buoyancy or added mass: C_d = 2mk/(ρA), so the
// sensitivities to mass, diameter and time follow in closed form.
const model = new SeriesModel({
  shape: 'sphere',
  dimensionCount: 1,
  humidity: 'none',
  densityOverride: true,
  co2MoleFraction: 0.0004,
  buoyancy: false,
  addedMassCoefficient: 0,
  fitOffset: false,
  counts: Float64Array.from([4]),
});
const x0 = Float64Array.from([290, 0, 0, 1.2, 9.81, 0.2, 0.08, 15, 1.8]);
const spec = (input: string, index: number, u: number, weight = 1, evaluation: 'A' | 'B' = 'B', dof = Infinity): BudgetInputSpec => ({
  input,
  description: input,
  evaluation,
  standard_uncertainty: u,
  indices: [index],
  weights: [weight],
  degrees_of_freedom: dof,
});

describe('uncertaintyBudget', () => {
  const cd = model.evaluate(x0);
  const k = model.dragConstant_per_m;
  const budget = uncertaintyBudget(model, x0, [
    spec('mass_kg', 5, 0.001),
    spec('diameter_m', 6, 0.0002),
    spec('time_s', 8, 0.004, 1 / 2),
    spec('scatter_s', 8, 0.003, 1 / 2, 'A', 3),
  ]);
  const row = (name: string) => budget.entries.find((e) => e.input === name)!;

  it('finds ∂C_d/∂m = C_d/m and ∂C_d/∂d = −2C_d/d, as C_d = 2mk/(ρπd²/4) says', () => {
    expect(row('mass_kg').sensitivity / (cd / 0.2)).toBeCloseTo(1, 8);
    expect(row('diameter_m').sensitivity / ((-2 * cd) / 0.08)).toBeCloseTo(1, 8);
  });

  it('finds ∂C_d/∂t̄ = (2m/ρA)/(∂t/∂k), and scales a per-drop uncertainty by 1/√n', () => {
    const area = (Math.PI * 0.08 ** 2) / 4;
    const dtdk = fallTimeDragDerivative(15, { effective_gravity_m_s2: 9.81, drag_constant_per_m: k, effective_mass_kg: 0.2 });
    const dcdT = (2 * 0.2) / (1.2 * area) / dtdk;
    expect(row('time_s').sensitivity / (dcdT / 2)).toBeCloseTo(1, 6);
    expect(row('time_s').contribution).toBeCloseTo((0.004 * dcdT) / 2, 9);
  });

  it('combines contributions in quadrature and gives Welch–Satterthwaite degrees of freedom', () => {
    const uc = budget.combined_standard_uncertainty;
    expect(uc).toBeCloseTo(Math.sqrt(budget.entries.reduce((s, e) => s + e.contribution ** 2, 0)), 15);
    // ν_eff = u_c⁴ / (u_A⁴/ν_A) with only the Type A entry finite (JCGM 100 G.4.1).
    expect(budget.effective_degrees_of_freedom).toBeCloseTo(uc ** 4 / (row('scatter_s').contribution ** 4 / 3), 8);
  });

  it('leaves the model at its nominal point afterwards', () => {
    expect(model.evaluate(x0)).toBe(cd);
  });
});
