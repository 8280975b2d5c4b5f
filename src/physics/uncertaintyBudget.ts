/**
 * The GUM uncertainty budget of the drag coefficient (JCGM 100:2008, sections 5.1 and G.4):
 * each input's standard uncertainty, its sensitivity coefficient c_i = ∂C_d/∂x_i (by central
 * differences of the full measurement model, fit included), its contribution |c_i|·u(x_i),
 * the combined standard uncertainty u_c = √Σ contributions², and the Welch–Satterthwaite
 * effective degrees of freedom.
 *
 * Some inputs act on several model positions at once with independent errors: the time of
 * each height's drops, and each distinct release height. Their entry lists one standard
 * uncertainty (per drop, per height) and an effective sensitivity √Σ c_j², so the entry's
 * contribution is exactly the combined effect of all of them.
 */
/**
 * What the budget and the Monte Carlo need of a measurement model: C_d at an input vector, and after it whether
 * that evaluation succeeded and the fitted offset. SeriesModel (mean times per height) and MarksModel (marks) are two.
 */
export interface MeasurementModel {
  evaluate(x: Float64Array): number;
  readonly status: string;
  readonly offset_s: number;
}

export interface BudgetInputSpec {
  /** Name with its unit, e.g. "temperature_C". */
  input: string;
  description: string;
  evaluation: 'A' | 'B';
  /** In the unit of `input`. */
  standard_uncertainty: number;
  /** Positions in the model's input vector that this input moves. */
  indices: number[];
  /** Per position: its standard uncertainty in model units per unit of `standard_uncertainty`. */
  weights: number[];
  /** Infinity for a Type B input taken as exactly known in its uncertainty. */
  degrees_of_freedom: number;
}

export interface BudgetEntry {
  input: string;
  description: string;
  evaluation: 'A' | 'B';
  standard_uncertainty: number;
  /** ∂C_d per unit of the input (signed for single inputs, root-sum-square for grouped ones). */
  sensitivity: number;
  contribution: number;
  /** Null stands for infinitely many. */
  degrees_of_freedom: number | null;
}

export interface UncertaintyBudget {
  entries: BudgetEntry[];
  combined_standard_uncertainty: number;
  /** Welch–Satterthwaite ν_eff (JCGM 100 G.4.1); null for infinitely many. */
  effective_degrees_of_freedom: number | null;
}

/** Partial derivatives of the model at x0 for the given positions, by central differences. */
export function modelDerivatives(model: MeasurementModel, x0: Float64Array, steps: Map<number, number>): Map<number, number> {
  const x = Float64Array.from(x0);
  const result = new Map<number, number>();
  for (const [index, step] of steps) {
    x[index] = x0[index]! + step;
    const up = model.evaluate(x);
    x[index] = x0[index]! - step;
    const down = model.evaluate(x);
    x[index] = x0[index]!;
    result.set(index, (up - down) / (2 * step));
  }
  return result;
}

export function uncertaintyBudget(model: MeasurementModel, x0: Float64Array, specs: BudgetInputSpec[]): UncertaintyBudget {
  // One step per position: a hundredth of its standard uncertainty (small enough for the
  // linearisation the GUM asks for, large enough to stay clear of the fit's own rounding),
  // or a millionth of its value when its uncertainty is zero.
  const steps = new Map<number, number>();
  for (const spec of specs) {
    spec.indices.forEach((index, i) => {
      const u = spec.standard_uncertainty * spec.weights[i]!;
      const step = u > 0 ? 0.01 * u : 1e-6 * Math.max(Math.abs(x0[index]!), 1e-3);
      const existing = steps.get(index);
      if (existing === undefined || (u > 0 && step < existing)) steps.set(index, step);
    });
  }
  const derivatives = modelDerivatives(model, x0, steps);
  model.evaluate(x0); // leave the model's fields at the nominal point

  const entries: BudgetEntry[] = specs.map((spec) => {
    let sensitivity: number;
    if (spec.indices.length === 1) {
      sensitivity = derivatives.get(spec.indices[0]!)! * spec.weights[0]!;
    } else {
      let ss = 0;
      spec.indices.forEach((index, i) => {
        const c = derivatives.get(index)! * spec.weights[i]!;
        ss += c * c;
      });
      sensitivity = Math.sqrt(ss);
    }
    return {
      input: spec.input,
      description: spec.description,
      evaluation: spec.evaluation,
      standard_uncertainty: spec.standard_uncertainty,
      sensitivity,
      contribution: Math.abs(sensitivity) * spec.standard_uncertainty,
      degrees_of_freedom: Number.isFinite(spec.degrees_of_freedom) ? spec.degrees_of_freedom : null,
    };
  });
  let sum = 0;
  let wsDenominator = 0;
  for (const e of entries) {
    sum += e.contribution * e.contribution;
    if (e.degrees_of_freedom !== null && e.contribution > 0) wsDenominator += e.contribution ** 4 / e.degrees_of_freedom;
  }
  const uc = Math.sqrt(sum);
  return {
    entries,
    combined_standard_uncertainty: uc,
    effective_degrees_of_freedom: wsDenominator > 0 ? uc ** 4 / wsDenominator : null,
  };
}
