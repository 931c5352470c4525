/**
 * Verdict words and thresholds (our own). ε_req is the efficiency needed against the rarest halo at
 * quantile q of the slice's extreme-value distribution:
 *   over budget   — median ε_req > 1 (P(ε_req > 1) ≥ 0.5): no halo at that quantile holds enough baryons;
 *   strained      — median ε_req > ε_ref;
 *   within budget — otherwise.
 */
export type Verdict = 'within budget' | 'strained' | 'over budget';
export type Attribution = 'holds under every IMF' | 'IMF-driven' | 'redshift-driven' | 'volume-driven';

export function verdictFor(epsMedian: number, epsRef: number): Verdict {
  if (epsMedian > 1) return 'over budget';
  if (epsMedian > epsRef) return 'strained';
  return 'within budget';
}
