/**
 * Verdict words and thresholds (our own). ε_req is the efficiency needed against the rarest halo at
 * quantile q of the slice's extreme-value distribution:
 *   over budget   — median ε_req > 1 (P(ε_req > 1) ≥ 0.5): no halo at that quantile holds enough baryons;
 *   strained      — median ε_req > ε_ref;
 *   within budget — otherwise.
 */
export type Verdict = 'within budget' | 'strained' | 'over budget';
export type Attribution = 'holds under every IMF' | 'IMF-driven' | 'redshift-driven' | 'volume-driven' | 'Eddington-driven';

export const VERDICTS: readonly Verdict[] = ['within budget', 'strained', 'over budget'];

export function verdictFor(epsMedian: number, epsRef: number): Verdict {
  if (epsMedian > 1) return 'over budget';
  if (epsMedian > epsRef) return 'strained';
  return 'within budget';
}

/** Verdict class: 0 within budget, 1 strained, 2 over budget (a cause "lowers" the class). */
export function verdictClass(v: Verdict): number {
  return VERDICTS.indexOf(v);
}
