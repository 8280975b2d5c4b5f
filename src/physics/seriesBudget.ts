/**
 * The narrow part of a series' preparation the planner needs: for a set of drops on one prepared setup, the
 * fit, the scatter and the budget inputs (no per-drop C_d, no validation again, no air or gravity again).
 * Each stage is the same function prepareSeries runs, so a plan and an analysis share one budget.
 */
import type { DropInput } from './analysisTypes';
import { budgetInputs } from './budgetInputs';
import { groupDrops } from './dropGroups';
import { fitSeries } from './seriesFit';
import { checkNotFasterThanFreeFall, seriesScatter } from './seriesScatter';
import type { SeriesSetup } from './seriesSetup';
import { uncertaintyBudget, type BudgetInputSpec, type UncertaintyBudget } from './uncertaintyBudget';

export interface SeriesBudget {
  /** C_d at the nominal inputs. */
  estimate: number;
  budget: UncertaintyBudget;
}

/** The GUM budget of C_d for these drops; `only` keeps the inputs it accepts (e.g. the timing alone). */
export function seriesBudget(setup: SeriesSetup, drops: readonly DropInput[], only?: (spec: BudgetInputSpec) => boolean): SeriesBudget {
  const groups = groupDrops(drops);
  const fit = fitSeries(setup, groups);
  const scatter = seriesScatter(setup, drops, groups, fit);
  checkNotFasterThanFreeFall(setup, groups, fit, scatter);
  const { specs } = budgetInputs(setup, groups, fit, scatter);
  return { estimate: fit.estimate, budget: uncertaintyBudget(fit.model, fit.x0, only ? specs.filter(only) : specs) };
}
