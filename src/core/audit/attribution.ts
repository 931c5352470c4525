import { verdictClass, type Attribution, type Verdict } from './verdict.js';

/** One cause that lowers the headline verdict class, and how. */
export interface AttributionDetail {
  readonly cause: Attribution;
  /** The verdict with that one change. */
  readonly verdict_after: Verdict;
  /** What the change is: the IMF, the redshift solution, the variance or the Eddington shift. */
  readonly via: string;
}

/** The alternatives evaluated for one galaxy, each with the verdict it gives. */
export interface AttributionInputs {
  readonly headlineImf: string;
  readonly headlineVerdict: Verdict;
  /** Verdict under every compared IMF (the headline included). */
  readonly imfVerdicts: Readonly<Record<string, Verdict>>;
  /** Fixed-redshift checks: the alternative solution and the lower bound of the interval. */
  readonly redshiftChecks: readonly { readonly kind: string; readonly z: number; readonly verdict: Verdict }[];
  /** Headline verdict against the ceiling widened by cosmic variance. */
  readonly verdictCosmicVariance: Verdict;
  /** Headline verdict with the Eddington-corrected ε_req, and the shift applied (dex). */
  readonly verdictEddington: Verdict;
  readonly eddingtonShiftDex: number;
}

/**
 * The project's attribution rules (our own words). When the headline verdict is `strained` or
 * `over budget`, a cause applies whenever its one change LOWERS the verdict class (over budget →
 * strained counts as well as → within budget):
 *   IMF-driven       — another compared IMF gives a lower class (one detail per such IMF);
 *   redshift-driven  — the alternative redshift solution or the interval's lower bound does;
 *   volume-driven    — the ceiling widened by cosmic variance does;
 *   Eddington-driven — the Eddington-corrected ε_req does.
 * `holds under every IMF` when no compared IMF lowers the class. Nothing is attributed to a galaxy
 * within budget.
 */
export function attribute(a: AttributionInputs): { attribution: Attribution[]; attribution_detail: AttributionDetail[] } {
  const head = verdictClass(a.headlineVerdict);
  if (head === 0) return { attribution: [], attribution_detail: [] };
  const detail: AttributionDetail[] = [];
  const lowers = (v: Verdict): boolean => verdictClass(v) < head;
  const imfLowering = Object.entries(a.imfVerdicts).filter(([name, v]) => name !== a.headlineImf && lowers(v));
  if (!imfLowering.length) {
    const all = Object.keys(a.imfVerdicts).join(', ');
    detail.push({ cause: 'holds under every IMF', verdict_after: a.headlineVerdict, via: all });
  }
  for (const [name, v] of imfLowering) detail.push({ cause: 'IMF-driven', verdict_after: v, via: name });
  for (const r of a.redshiftChecks) if (lowers(r.verdict)) detail.push({ cause: 'redshift-driven', verdict_after: r.verdict, via: `${r.kind} = ${r.z}` });
  if (lowers(a.verdictCosmicVariance)) detail.push({ cause: 'volume-driven', verdict_after: a.verdictCosmicVariance, via: 'cosmic variance of the halo counts' });
  if (lowers(a.verdictEddington)) {
    detail.push({ cause: 'Eddington-driven', verdict_after: a.verdictEddington, via: `mass lowered by ${a.eddingtonShiftDex.toFixed(2)} dex` });
  }
  const attribution = [...new Set(detail.map((d) => d.cause))];
  return { attribution, attribution_detail: detail };
}
