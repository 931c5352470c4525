import { describe, expect, it } from 'vitest';
import { runAudit, type AuditChoices } from '../../../src/core/audit/index.js';
import { eddingtonPosterior } from '../../../src/core/audit/eddington.js';
import { makeHaloModel } from '../../../src/core/halos/index.js';
import { DEFAULT_CHOICES } from '../../../src/ui/default-choices.js';

// Invented test field and galaxies; each expectation follows from the definitions in the README.
const choices = (over: Partial<AuditChoices> = {}): AuditChoices => ({
  ...DEFAULT_CHOICES,
  draws: 2000,
  seed: 11,
  survey: { name: 'test-field', areaArcmin2: 40, zMin: 9.5, zMax: 10.5 },
  ...over,
});

describe('headline IMF: never the order of the list', () => {
  const csv = 'id,z,z_lo,z_hi,muv,mag_err,log_mstar,imf_ref,log_mstar_err\nL-1,10,9.8,10.2,-21.5,0.1,,,\nM-1,10,9.9,10.1,,,10.4,kroupa,0.1\n';
  const a = runAudit(csv, choices({ imfs: ['salpeter', 'chabrier', 'top-heavy-flat'], headlineImf: 'chabrier' }));
  const b = runAudit(csv, choices({ imfs: ['top-heavy-flat', 'salpeter', 'chabrier'], headlineImf: 'chabrier' }));
  it('a light row takes the run’s headline IMF whatever the order, with identical numbers', () => {
    expect(a.galaxies[0].headline_imf).toBe('chabrier');
    expect(b.galaxies[0].headline_imf).toBe('chabrier');
    expect(JSON.stringify(a.galaxies[0].imf!.chabrier)).toBe(JSON.stringify(b.galaxies[0].imf!.chabrier));
    expect(a.galaxies[0].verdict).toBe(b.galaxies[0].verdict);
  });
  it('a reported mass is always headlined by its imf_ref, which is compared even if not listed', () => {
    for (const r of [a, b]) {
      expect(r.galaxies[1].headline_imf).toBe('kroupa');
      expect(Object.keys(r.galaxies[1].imf!)).toContain('kroupa');
    }
  });
  it('without a headline choice the first listed IMF heads light rows', () => {
    expect(runAudit(csv, choices({ imfs: ['kroupa', 'salpeter'] })).galaxies[0].headline_imf).toBe('kroupa');
  });
});

describe('per-galaxy physics in the audit', () => {
  // B-1: σ = 0.3 dex on a massive reported mass; C-1: no errors at all.
  const csv = 'id,z,z_lo,z_hi,log_mstar,imf_ref,log_mstar_err\nB-1,10,9.9,10.1,10.5,salpeter,0.3\nC-1,10,,,10.0,salpeter,0\n';
  const r = runAudit(csv, choices({ imfs: ['salpeter', 'chabrier'] }));
  const [g, c] = r.galaxies;
  it('time budget: the ratio (mass formed / baryons accreted) is never below ε_req, nor its P(> 1) below P(ε_req > 1)', () => {
    for (const x of [g, c]) {
      for (const v of Object.values(x.imf!)) {
        expect(v.time_budget_ratio_median!).toBeGreaterThanOrEqual(v.eps_required_median);
        expect(v.p_time_budget_over!).toBeGreaterThanOrEqual(v.p_over_budget);
      }
      const tb = x.time_budget!;
      expect(tb.ratio).toBe(x.imf![x.headline_imf!].time_budget_ratio_median);
      expect(tb.formed_mass_msun).toBeGreaterThan(10 ** x.imf!.salpeter.log_mstar_median); // formed > surviving
      expect(tb.accreted_baryons_msun).toBeLessThanOrEqual(x.ceiling!.stellar_ceiling_msun * 1.01);
    }
  });
  it('Eddington: the reported shift is the exact posterior median under the Sheth–Tormen prior, below the first-order value', () => {
    const e = g.eddington!;
    const hm = makeHaloModel({ cosmology: DEFAULT_CHOICES.cosmology, transfer: DEFAULT_CHOICES.transfer, massFunction: 'sheth-tormen', deltaC: DEFAULT_CHOICES.deltaC });
    const h = g.imf!.salpeter;
    const epsHost = Math.min(1, Math.max(h.eps_required_median, DEFAULT_CHOICES.epsRef));
    const lfe = Math.log10(hm.baryonFraction * epsHost);
    const want = eddingtonPosterior((x) => Math.log(hm.dndlnM(10 ** (x - lfe), 10)), h.log_mstar_median, 0.3).shiftMedianDex;
    expect(Math.abs(e.shift_dex - want)).toBeLessThan(1e-12);
    expect(e.shift_dex).toBeGreaterThan(0.3);
    expect(e.shift_dex).toBeLessThan(e.shift_first_order_dex);
    expect(Math.abs(h.eps_required_median_debiased / (h.eps_required_median * 10 ** -e.shift_dex) - 1)).toBeLessThan(1e-12);
    expect(c.eddington!.shift_dex).toBe(0);
  });
  it('the sample at quantile q agrees with the galaxy: one galaxy needs the same ε at sample level (k = 1) as on its own, within 1%', () => {
    const alone = runAudit('id,z,log_mstar,imf_ref\nS-1,10,10.5,salpeter\n', choices({ imfs: ['salpeter'], draws: 400 }));
    const pt = alone.sample.bins[0].points[0];
    const eps = alone.galaxies[0].imf!.salpeter.eps_required_median;
    // same criterion (N(>M*/(ε f_b)) = −ln q); the bin (9.5–10.5) and the galaxy's slice (9.5–10.5) coincide here.
    // 1%: the bin uses node tables interpolated in log–log, the ceiling a Simpson sum on a 0.1 z grid.
    expect(Math.abs(pt.eps_required_q / eps - 1)).toBeLessThan(0.01);
  });
});
