import { describe, expect, it } from 'vitest';
import { poissonAtLeast, poissonMeanForChance } from '../../../src/core/audit/poisson.js';
import tail from '../../fixtures/scipy/poisson-tail.json';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const fact = (k: number): number => (k <= 1 ? 1 : k * fact(k - 1));

describe('P(N ≥ k) of a Poisson count (regularised lower incomplete gamma; closed forms)', () => {
  it('k = 1 is 1 − e^−μ, k = 2 is 1 − e^−μ(1 + μ), k = 3 is 1 − e^−μ(1 + μ + μ²/2), to 1e-12', () => {
    for (const mu of [1e-6, 0.003, 0.5, 2, 7.5, 30]) {
      expect(rel(poissonAtLeast(1, mu), -Math.expm1(-mu))).toBeLessThan(1e-12);
      if (mu >= 0.5) { // below, the closed forms themselves lose digits to cancellation
        expect(rel(poissonAtLeast(2, mu), 1 - Math.exp(-mu) * (1 + mu))).toBeLessThan(1e-9);
        expect(rel(poissonAtLeast(3, mu), 1 - Math.exp(-mu) * (1 + mu + (mu * mu) / 2))).toBeLessThan(1e-9);
      }
    }
  });
  it('small probabilities keep full precision: P(N ≥ 4; μ = 1e-3) ≈ μ⁴/4! (leading term of the tail), 1e-3', () => {
    expect(rel(poissonAtLeast(4, 1e-3), 1e-12 / 24)).toBeLessThan(1e-3);
  });
  it('the recurrence P(k+1, μ) = P(k, μ) − e^−μ μ^k/k! holds across both summation branches (k = 1–14, μ = 0.3–12)', () => {
    for (const mu of [0.3, 3, 6.5, 12]) {
      for (let k = 1; k < 15; k++) {
        const step = (Math.exp(-mu) * mu ** k) / fact(k);
        expect(Math.abs(poissonAtLeast(k + 1, mu) - (poissonAtLeast(k, mu) - step))).toBeLessThan(1e-12);
      }
    }
  });
  it('edges: k = 0 is certain, μ = 0 gives nothing, bad arguments are refused by name', () => {
    expect(poissonAtLeast(0, 3)).toBe(1);
    expect(poissonAtLeast(3, 0)).toBe(0);
    expect(() => poissonAtLeast(1.5, 1)).toThrow(/k must be a whole number/);
    expect(() => poissonAtLeast(1, Number.NaN)).toThrow(/μ must be finite/);
  });
  it('poissonMeanForChance inverts P(k, μ): k = 1 gives −ln(1 − p) exactly; k = 1–20 round-trip to 1e-9', () => {
    expect(poissonMeanForChance(1, 0.003)).toBe(-Math.log1p(-0.003));
    for (const k of [1, 2, 5, 20]) for (const p of [0.003, 0.16, 0.5, 0.997]) expect(Math.abs(poissonAtLeast(k, poissonMeanForChance(k, p)) - p)).toBeLessThan(1e-9 * Math.max(p, 1e-3));
  });
  it('large k (a sample of up to 10⁵ galaxies): P(k, μ) against scipy.special.gammainc, k = 2–10⁵, μ/k = 0.5–2 (test/fixtures/scipy/poisson_tail.py)', () => {
    // Tolerance 1e-9 relative + 1e-14 absolute: Stirling's series for ln k! (k > 170) is truncated after
    // 1/(360 k³) (next term ~1/(1260 k⁵)), and the O(√k) summed terms each carry rounding ~1e-16.
    expect(tail.cases.length).toBe(49);
    for (const c of tail.cases) expect(Math.abs(poissonAtLeast(c.k, c.mu) - c.p_at_least), `k = ${c.k}, μ = ${c.mu}`).toBeLessThan(1e-9 * c.p_at_least + 1e-14);
  });
  it('poissonMeanForChance round-trips at k = 10⁵ too (the sample level asks it once per galaxy)', () => {
    for (const p of [0.003, 0.5, 0.997]) expect(Math.abs(poissonAtLeast(100000, poissonMeanForChance(100000, p)) - p)).toBeLessThan(1e-9);
  });
});
