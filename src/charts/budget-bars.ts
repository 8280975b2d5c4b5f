// The uncertainty budget as bars: each input's contribution to u(C_d), largest first, with its share of the
// variance. The series screen's <pl-bars> and the printed report show the same bars.
import type { AnalysisResult } from '../physics';

export interface Bar {
  label: string;
  value: number;
  /** The value as text, with its share (also what a screen reader hears). */
  text: string;
  /** The bar's length as a percentage of the available width (the largest is 62 %, none below 0.5 %). */
  widthPct: number;
}

export function budgetBars(result: AnalysisResult): Bar[] {
  const total = result.budget.reduce((s, b) => s + b.contribution ** 2, 0);
  const rows = result.budget
    .filter((b) => b.contribution > 0)
    .map((b) => ({
      label: b.description || b.input,
      value: b.contribution,
      text: `${b.contribution.toExponential(1)} (${total > 0 ? ((100 * b.contribution ** 2) / total).toFixed(0) : 0} %)`,
    }));
  return barWidths(rows);
}

/** Sorts bars largest first and gives each its width. */
export function barWidths(rows: readonly Omit<Bar, 'widthPct'>[]): Bar[] {
  const sorted = [...rows].sort((a, b) => b.value - a.value);
  const max = Math.max(...sorted.map((b) => b.value), 0) || 1;
  return sorted.map((b) => ({ ...b, widthPct: Math.max(0.5, (b.value / max) * 62) }));
}
