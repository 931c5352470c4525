import { describe, expect, it } from 'vitest';
import type { GalaxyRow } from '../../src/core/audit/index.js';
import { orderRows, sortValue, verdictCounts, VERDICT_KEYS } from '../../src/ui/results-order.js';

/** Invented rows (test data for the ordering only). */
const ok = (row: number, id: string, z: number, verdict: string, eps: Record<string, number>): GalaxyRow =>
  ({
    row,
    id,
    status: 'ok',
    errors: [],
    survey: '',
    input: { z: String(z) },
    verdict,
    headline_imf: Object.keys(eps)[0],
    attribution: [],
    imf: Object.fromEntries(Object.entries(eps).map(([k, e]) => [k, { eps_required_median: e }])),
  }) as unknown as GalaxyRow;
const bad = (row: number, id: string): GalaxyRow => ({ row, id, status: 'rejected', errors: [{ row, column: 'z', reason: 'not a number' }], survey: '', input: {} }) as unknown as GalaxyRow;

const rows = [ok(1, 'T-10', 9, 'strained', { a: 0.5, b: 0.1 }), ok(2, 'T-2', 7.5, 'over budget', { a: 3, b: 0.9 }), bad(3, 'T-bad'), ok(4, 'T-1', 11, 'within budget', { a: 0.01, b: 0.002 }), ok(5, 'T-3', 8, 'over budget', { a: 1.5 })];
const all = new Set(VERDICT_KEYS);

describe('results order', () => {
  it('sorts by the Monte Carlo draws made (the galaxies that needed most first when descending), rejected rows last', () => {
    const withDraws = rows.map((g, k) => (g.status === 'ok' ? ({ ...g, monte_carlo: { draws_made: [3000, 2000, 0, 5000, 2000][k] } } as unknown as GalaxyRow) : g));
    expect(orderRows(withDraws, 'draws', -1, all).map((g) => g.id)).toEqual(['T-1', 'T-10', 'T-2', 'T-3', 'T-bad']);
    expect(orderRows(withDraws, 'draws', 1, all).map((g) => g.id)).toEqual(['T-2', 'T-3', 'T-10', 'T-1', 'T-bad']);
  });
  it('sorts by ε under one IMF, either way, with missing values (rejected, IMF not run) last', () => {
    expect(orderRows(rows, 'imf:b', -1, all).map((g) => g.id)).toEqual(['T-2', 'T-10', 'T-1', 'T-bad', 'T-3']);
    expect(orderRows(rows, 'imf:b', 1, all).map((g) => g.id)).toEqual(['T-1', 'T-10', 'T-2', 'T-bad', 'T-3']);
  });
  it('sorts by headline verdict severity, then by the headline ε', () => {
    expect(orderRows(rows, 'verdict', -1, all).map((g) => g.id)).toEqual(['T-2', 'T-3', 'T-10', 'T-1', 'T-bad']);
    expect(sortValue(rows[1], 'verdict')).toBeGreaterThan(sortValue(rows[4], 'verdict') as number);
  });
  it('sorts ids in natural order and z as numbers', () => {
    expect(orderRows(rows, 'id', 1, all).map((g) => g.id)).toEqual(['T-1', 'T-2', 'T-3', 'T-10', 'T-bad']);
    expect(orderRows(rows, 'z', 1, all).map((g) => g.id)).toEqual(['T-2', 'T-3', 'T-10', 'T-1', 'T-bad']);
  });
  it('filters by verdict and by id text, and counts every class', () => {
    expect(orderRows(rows, 'row', 1, new Set(['over budget'] as const)).map((g) => g.id)).toEqual(['T-2', 'T-3']);
    expect(orderRows(rows, 'row', 1, all, ' t-1').map((g) => g.id)).toEqual(['T-10', 'T-1']);
    expect(verdictCounts(rows)).toEqual({ 'over budget': 2, strained: 1, 'within budget': 1, rejected: 1 });
  });
});
