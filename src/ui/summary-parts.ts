/** Galaxy paragraphs shown before "show all". */
export const FIRST_GALAXIES = 10;

/** The summary cut in three: what comes before the hidden paragraphs, the hidden paragraphs, what follows. */
export interface SummaryParts {
  readonly head: string;
  readonly hidden: readonly string[];
  readonly tail: string;
}

/**
 * Splits the Markdown summary into its paragraphs (blank-line separated) and hides the galaxy paragraphs
 * (under "## Galaxies", up to the next "## " heading) after the first `first`. Nothing is hidden when
 * there are no more than that, or no such heading.
 */
export function summaryParts(markdown: string, first = FIRST_GALAXIES): SummaryParts {
  const paras = markdown.split('\n\n');
  const g = paras.findIndex((p) => p === '## Galaxies');
  if (g < 0) return { head: markdown, hidden: [], tail: '' };
  let end = paras.findIndex((p, i) => i > g && p.startsWith('## '));
  if (end < 0) end = paras.length;
  const from = g + 1 + first;
  if (end - from <= 0) return { head: markdown, hidden: [], tail: '' };
  return { head: paras.slice(0, from).join('\n\n') + '\n\n', hidden: paras.slice(from, end), tail: paras.slice(end).join('\n\n') };
}
