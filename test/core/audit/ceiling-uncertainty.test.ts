import erf from '@stdlib/math-base-special-erf';
import { describe, expect, it } from 'vitest';
import { runAudit, type AuditChoices } from '../../../src/core/audit/index.js';
import { auditCovariance } from '../../../src/core/audit/ceiling-uncertainty.js';
import { ceilingSpreadDex } from '../../../src/core/audit/ceiling-spread.js';
import { DEFAULT_CHOICES } from '../../../src/ui/default-choices.js';

// The ceiling's spread from the cosmological parameters, folded into each draw (invented galaxy).
const choices = (over: Partial<AuditChoices> = {}): AuditChoices => ({
  ...DEFAULT_CHOICES,
  imfs: ['salpeter'],
  draws: 20000,
  seed: 9,
  survey: { name: 'test-field', areaArcmin2: 40, zMin: 9.5, zMax: 10.5 },
  ...over,
});
const normalCdf = (x: number): number => 0.5 * (1 + erf(x / Math.SQRT2));

describe('cosmological spread of the ceiling in the audit', () => {
  // a reported mass with no errors at one redshift: every draw has the same ε_req
  const r = runAudit('id,z,log_mstar,imf_ref\nP-1,10,10.52,salpeter\n', choices());
  const g = r.galaxies[0];
  const h = g.imf!.salpeter;
  it('reports the linear-response spread at the galaxy’s z (the Planck 2018 errors of the preset)', () => {
    const want = ceilingSpreadDex(DEFAULT_CHOICES, 40, 0.997, 1, [10], auditCovariance(choices()), { convergenceCheck: false })[0].log_mass_cosmo_sd_dex;
    expect(Math.abs(g.ceiling!.log_mass_cosmo_sd_dex - want)).toBeLessThan(1e-12);
    expect(auditCovariance(choices()).source).toMatch(/Planck/);
  });
  it('P(ε > 1) with the spread is Φ(log10 ε_req / σ) for a fixed ε_req (closed form), within 3 binomial errors', () => {
    expect(h.eps_required_p05).toBeCloseTo(h.eps_required_p95, 10); // no scatter without the spread
    const sd = g.ceiling!.log_mass_cosmo_sd_dex;
    const p = normalCdf(Math.log10(h.eps_required_median) / sd);
    expect(Math.abs(h.p_over_budget_cosmo - p)).toBeLessThan(3 * Math.sqrt((p * (1 - p)) / 20000) + 1e-4);
    expect(h.p_over_budget).toBe(h.eps_required_median > 1 ? 1 : 0);
  });
  it('the spread leaves every other number unchanged (its own random stream)', () => {
    const c = { matrix: [0, 1, 2, 3, 4].map(() => [0, 0, 0, 0, 0]), source: 'no uncertainty' };
    const zero = runAudit('id,z,log_mstar,imf_ref\nP-1,10,10.52,salpeter\n', choices({ cosmologyCovariance: c })).galaxies[0];
    expect(zero.ceiling!.log_mass_cosmo_sd_dex).toBe(0);
    expect(zero.imf!.salpeter.p_over_budget_cosmo).toBe(zero.imf!.salpeter.p_over_budget);
    expect(zero.imf!.salpeter.eps_required_median).toBe(h.eps_required_median);
  });
});
