/**
 * A deletion says why. deleteRecord() keeps the reason with the version the tombstone replaced (that version
 * goes into the history with it), and a merge never drops a version nor prefers a copy without its reason
 * (merge.ts), so every deleted version of a record made by this app follows, in the history, a version with
 * a reason. A tombstone without one was made by hand or by a broken tool: it is refused at the gate.
 */
import type { Problem } from './errors';

const RULE = 'a deletion needs a reason: the version it replaced must be in the history with the reason';

const hasReason = (entry: unknown) => {
  const reason = (entry as { reason?: unknown } | null)?.reason;
  return typeof reason === 'string' && reason.trim() !== '';
};

/** A problem for each deleted version (the current one or an earlier one) that follows no version with a reason. */
export function deletionReasonProblems(record: { rev?: unknown; deleted?: unknown; history?: unknown }): Problem[] {
  if (!Array.isArray(record.history)) return [];
  // Nearly every record: live, with no earlier version (nothing to look through).
  if (record.history.length === 0 && record.deleted !== true) return [];
  const history = record.history as unknown[];
  const reasonedBefore = (rev: unknown) =>
    typeof rev === 'string' && history.some((h) => hasReason(h) && typeof (h as { rev?: unknown }).rev === 'string' && (h as { rev: string }).rev < rev);
  const problems: Problem[] = [];
  const check = (path: string, version: { rev?: unknown; deleted?: unknown } | null) => {
    if (version?.deleted !== true || reasonedBefore(version.rev)) return;
    problems.push({ path, value: true, rule: RULE, message: `${path}: true is a deletion without a reason: ${RULE}` });
  };
  check('deleted', record);
  history.forEach((h, i) => check(`history[${i}].deleted`, h as { rev?: unknown; deleted?: unknown } | null));
  return problems;
}
