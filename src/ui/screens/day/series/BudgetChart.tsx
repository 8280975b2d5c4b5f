// The uncertainty budget as bars: each input's contribution to u(C_d) and its share of the variance
// (src/charts budgetBars, the printed report's bars too).
import type { AnalysisResult } from '../../../../physics';
import { budgetBars } from '../../../../charts';

export function BudgetChart({ result }: { result: AnalysisResult }) {
  const bars = budgetBars(result);
  return (
    <section class="card" aria-labelledby="budget-h">
      <h3 id="budget-h">Uncertainty budget</h3>
      <p class="hint">Contribution of each input to the standard uncertainty of C_d, and its share of the variance.</p>
      <pl-bars bars={bars} heading="Contributions to the uncertainty of the drag coefficient" />
    </section>
  );
}
