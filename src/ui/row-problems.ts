import type { RowProblem } from '../core/audit/sample.js';

/**
 * The rows' problems of a result, as the sample editor is given them: the previous list itself when the new
 * one says the same (row, column and reason, in order), so a run that finds what the last one found does
 * not re-render the table.
 */
export function keepSameProblems(previous: readonly RowProblem[], next: readonly RowProblem[]): readonly RowProblem[] {
  if (previous.length !== next.length) return next;
  for (let i = 0; i < next.length; i++) {
    const a = previous[i];
    const b = next[i];
    if (a.row !== b.row || a.column !== b.column || a.reason !== b.reason) return next;
  }
  return previous;
}
