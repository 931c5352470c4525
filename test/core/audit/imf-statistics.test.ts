import { describe, expect, it } from 'vitest';
import { fillGridCells, type GridCells } from '../../../src/core/audit/grid-cells.js';
import { imfStatistics, makeLookState, medianLook, type SharedDraws } from '../../../src/core/audit/imf-statistics.js';
import { eddingtonPosterior } from '../../../src/core/audit/eddington.js';
import { logSurvivingAt } from '../../../src/core/audit/time-budget.js';
import { PLANCK18 } from '../../../src/core/cosmology/index.js';
import { makeHaloModel } from '../../../src/core/halos/index.js';
import { quantileSorted } from '../../../src/core/numeric/index.js';
import { makePopulationCache, parseSfh } from '../../../src/core/stars/index.js';

// The per-IMF statistics against the definitions computed the plain way: the table's own M/L lookup
// (logMassToLightAt, logSurvivingAt) at each draw, type-7 quantiles of the sorted values (Hyndman &
// Fan 1996), counts, and the Eddington posterior with the halo model's dn/dlnM itself.
describe('imfStatistics: the shared-cell M/L rule, bucket quantiles and tabulated prior equal the plain computation', () => {
  const cache = makePopulationCache();
  const sfh = parseSfh('constant');
  const halo = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen', deltaC: { kind: 'constant', value: 1.686 } });
  const n = 3000;
  let s = 7;
  const u = (): number => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
  const grid = cache.table('salpeter', 9, sfh);
  const d: SharedDraws = {
    n,
    base: Float64Array.from({ length: n }, () => 28.3 + 0.4 * u()),
    gx: Float64Array.from({ length: n }, () => (grid.nAge - 1) * u()),
    gy: Float64Array.from({ length: n }, () => 2 + 0.5 * u()),
    logCeil: Float64Array.from({ length: n }, () => 9.6 + 0.2 * u()),
    logCeilCv: Float64Array.from({ length: n }, () => 9.8 + 0.2 * u()),
    logAccretedBaryons: Float64Array.from({ length: n }, () => 9 + u()),
    cosmoOffset: Float64Array.from({ length: n }, () => 0.1 * (u() - 0.5)),
  };
  const sorted = (f: (i: number) => number): Float64Array => Float64Array.from({ length: n }, (_, i) => f(i)).sort();
  for (const imf of ['salpeter', 'top-heavy-flat']) {
    it(`${imf}: percentiles, probabilities, time budget and Eddington shift`, () => {
      const tab = cache.table(imf, 9, sfh);
      // a redshift between the shared prior table's z nodes (0.05 apart), so its interpolation is exercised
      const zEd = 9.0137;
      const ed = { halo, z: zEd, sigmaDex: 0.1, epsRef: 0.3 };
      const st = imfStatistics(tab, d, ed, true);
      const lm = (i: number): number => d.base[i] + tab.logMassToLightAt(d.gx[i], d.gy[i]);
      const lmS = sorted(lm);
      const leS = sorted((i) => lm(i) - d.logCeil[i]);
      const r = st.result;
      expect(r.log_mstar_p16).toBe(quantileSorted(lmS, 0.16));
      expect(r.log_mstar_median).toBe(quantileSorted(lmS, 0.5));
      expect(r.log_mstar_p84).toBe(quantileSorted(lmS, 0.84));
      expect(r.eps_required_median).toBe(10 ** quantileSorted(leS, 0.5));
      expect(r.eps_required_p95).toBe(10 ** quantileSorted(leS, 0.95));
      expect(r.eps_required_median_cv).toBe(10 ** quantileSorted(sorted((i) => lm(i) - d.logCeilCv[i]), 0.5));
      let over = 0;
      let cosmo = 0;
      let tb = 0;
      let strained = 0;
      for (let i = 0; i < n; i++) {
        const e = lm(i) - d.logCeil[i];
        if (e > 0) over++;
        if (e > Math.log10(ed.epsRef)) strained++;
        if (e > d.cosmoOffset[i]) cosmo++;
        if (lm(i) - logSurvivingAt(tab, d.gx[i]) - d.logAccretedBaryons![i] > 0) tb++;
      }
      expect(r.p_over_budget).toBe(over / n);
      // p_strained: the share of draws with ε_req above the reference efficiency
      expect(strained).toBeGreaterThan(0);
      expect(strained).toBeLessThan(n);
      expect(r.p_strained).toBe(strained / n);
      expect(r.p_over_budget_cosmo).toBe(cosmo / n);
      expect(r.p_time_budget_over).toBe(tb / n);
      expect(r.time_budget_ratio_median).toBe(10 ** quantileSorted(sorted((i) => lm(i) - logSurvivingAt(tab, d.gx[i]) - d.logAccretedBaryons![i]), 0.5));
      expect(st.formedMassMedianMsun).toBe(10 ** quantileSorted(sorted((i) => lm(i) - logSurvivingAt(tab, d.gx[i])), 0.5));
      // the prior from the per-galaxy node table against dn/dlnM itself
      const epsHost = Math.min(1, Math.max(r.eps_required_median, 0.3));
      const lfe = Math.log10(halo.baryonFraction * epsHost);
      const exact = eddingtonPosterior((x) => Math.log(halo.dndlnM(10 ** (x - lfe), zEd)), r.log_mstar_median, 0.1).shiftMedianDex;
      // The prior's nodes come from the shared (z, log10 M) table (≤ 1e-4 from ln dn/dlnM: mass-function-grid.test.ts).
      // Multiplying the prior by e^δ(x), |δ| ≤ δmax, moves the posterior CDF at the median by ≤ δmax/2, so the
      // median by ≤ δmax/2 / p(median) ≈ δmax σ √(2π)/2 (Gaussian posterior): ≤ 1.3 σ × 1e-4 dex.
      expect(Math.abs(r.eddington_shift_dex - exact)).toBeLessThan(1.3 * 0.1 * 1e-4);
      expect(r.eddington_shift_dex).toBeGreaterThan(0);
    });
  }
  it('time budget with empty star-formation intervals (accreted baryons −∞, the ratio +∞): the ratio median and its share over 1 as defined', () => {
    // below the window median's reach (3000 draws) the ratio is bucketed in the statistics' own loop unless a bound is infinite
    const tab = cache.table('chabrier', 9, sfh);
    const acc = Float64Array.from(d.logAccretedBaryons!, (v, i) => (i % 3 === 0 ? Number.NEGATIVE_INFINITY : v));
    const r = imfStatistics(tab, { ...d, logAccretedBaryons: acc }, { halo, z: 9.0137, sigmaDex: 0.1, epsRef: 0.3 }, true).result;
    const ratio = (i: number): number => d.base[i] + tab.logMassToLightAt(d.gx[i], d.gy[i]) - logSurvivingAt(tab, d.gx[i]) - acc[i];
    expect(r.time_budget_ratio_median).toBe(10 ** quantileSorted(sorted(ratio), 0.5));
    let over = 0;
    for (let i = 0; i < n; i++) over += +(ratio(i) > 0);
    expect(r.p_time_budget_over).toBe(over / n);
  });
  it("with the adaptive rule's look vectors (medianLook at 2000 of the 3000 draws, then extended; or at all 3000, its quantiles kept) the statistics are the same, bit for bit", () => {
    const tab = cache.table('kroupa', 9, sfh);
    const ed = { halo, z: 9.0137, sigmaDex: 0.1, epsRef: 0.3 };
    const cells: GridCells = { nAge: tab.nAge, nLam: tab.nLam, cell: new Int32Array(n), ageIndex: new Int32Array(n), tx: new Float64Array(n), ty: new Float64Array(n) };
    fillGridCells(d.gx, d.gy, 0, n, cells);
    const look = makeLookState(new Float64Array(n), new Float64Array(n));
    medianLook(tab, cells, d.base, d.logCeil, 2000, look);
    const withLook = imfStatistics(tab, d, ed, true, look);
    expect(look.n).toBe(n);
    expect(withLook).toEqual(imfStatistics(tab, d, ed, true));
    // a look over all the draws: its quantiles are taken as they are
    const full = makeLookState(new Float64Array(n), new Float64Array(n));
    medianLook(tab, cells, d.base, d.logCeil, n, full);
    expect(full.quantilesOf).toBe(n);
    expect(imfStatistics(tab, d, ed, true, full)).toEqual(imfStatistics(tab, d, ed, true));
    // the draws' own cells (made with the draws) give the same statistics as the cells found here
    expect(imfStatistics(tab, { ...d, cells }, ed, true, full)).toEqual(imfStatistics(tab, d, ed, true));
    expect(imfStatistics(tab, { ...d, cells }, ed, true)).toEqual(imfStatistics(tab, d, ed, true));
  });
});
