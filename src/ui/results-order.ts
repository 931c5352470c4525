import type { GalaxyRow } from '../core/audit/index.js';

/** Which rows the results table shows, in which order: sorting by any column and filtering by verdict. */

/** Filter classes: the three verdicts and rejected rows. */
export const VERDICT_KEYS = ['over budget', 'strained', 'within budget', 'rejected'] as const;
export type VerdictKey = (typeof VERDICT_KEYS)[number];

export const verdictKey = (g: GalaxyRow): VerdictKey => (g.status === 'rejected' || !g.verdict ? 'rejected' : g.verdict);

const RANK: Record<string, number> = { 'within budget': 0, strained: 1, 'over budget': 2 };

/** Sort keys: input order, id, z, headline verdict (then its ε), attribution, ε_req under one IMF, or the Monte Carlo draws made. */
export type SortKey = 'row' | 'id' | 'z' | 'verdict' | 'attribution' | 'draws' | `imf:${string}`;

/** The value a row sorts by; NaN (missing) always sorts last. */
export function sortValue(g: GalaxyRow, key: SortKey): number | string {
  if (key === 'row') return g.row;
  if (key === 'id') return g.id;
  if (g.status !== 'ok') return NaN;
  if (key === 'z') return Number(g.input.z);
  if (key === 'attribution') return (g.attribution ?? []).join(', ');
  if (key === 'draws') return g.monte_carlo?.draws_made ?? NaN;
  if (key === 'verdict') {
    const e = g.imf?.[g.headline_imf ?? '']?.eps_required_median ?? 0;
    return RANK[g.verdict ?? ''] + e / (1 + e);
  }
  const v = g.imf?.[key.slice(4)];
  return v ? v.eps_required_median : NaN;
}

const missing = (v: number | string): boolean => typeof v === 'number' && Number.isNaN(v);

/** Rows whose verdict class is in `show` and whose id contains `text` (case-blind), sorted stably by key. */
export function orderRows(rows: readonly GalaxyRow[], key: SortKey, dir: 1 | -1, show: ReadonlySet<VerdictKey>, text = ''): GalaxyRow[] {
  const t = text.trim().toLowerCase();
  const kept = rows.filter((g) => show.has(verdictKey(g)) && (!t || g.id.toLowerCase().includes(t)));
  const vals = new Map(kept.map((g) => [g, sortValue(g, key)]));
  return kept.sort((a, b) => {
    const va = vals.get(a)!;
    const vb = vals.get(b)!;
    if (missing(va) || missing(vb)) return missing(va) === missing(vb) ? a.row - b.row : missing(va) ? 1 : -1;
    const c = typeof va === 'number' && typeof vb === 'number' ? va - vb : String(va).localeCompare(String(vb), undefined, { numeric: true });
    return c !== 0 ? dir * c : a.row - b.row;
  });
}

/** Rows per verdict class. */
export function verdictCounts(rows: readonly GalaxyRow[]): Record<VerdictKey, number> {
  const out: Record<VerdictKey, number> = { 'over budget': 0, strained: 0, 'within budget': 0, rejected: 0 };
  for (const g of rows) out[verdictKey(g)]++;
  return out;
}
