// The uncertainty budget as bars: each input's contribution to u(C_d) and its share of the variance.
import type { AnalysisResult } from '../../../../physics';

export function BudgetChart({ result }: { result: AnalysisResult }) {
  const total = result.budget.reduce((s, b) => s + b.contribution ** 2, 0);
  const bars = result.budget
    .filter((b) => b.contribution > 0)
    .map((b) => ({
      label: b.description || b.input,
      value: b.contribution,
      text: `${b.contribution.toExponential(1)} (${total > 0 ? ((100 * b.contribution ** 2) / total).toFixed(0) : 0} %)`,
    }));
  return (
    <section class="card" aria-labelledby="budget-h">
      <h3 id="budget-h">Uncertainty budget</h3>
      <p class="hint">Contribution of each input to the standard uncertainty of C_d, and its share of the variance.</p>
      <pl-bars bars={bars} heading="Contributions to the uncertainty of the drag coefficient" />
    </section>
  );
}
