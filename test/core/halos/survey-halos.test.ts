import { describe, expect, it } from 'vitest';
import ref from '../../fixtures/scipy/regression.json';
import { PLANCK18 } from '../../../src/core/cosmology/index.js';
import { makeHaloModel, makeSurveyHalos } from '../../../src/core/halos/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const hm = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen', deltaC: { kind: 'constant', value: 1.68647 } });

describe('rarest-halo statistics', () => {
  // A thin shell at z = 10 scaled to V = 6.4907e4 Mpc³ reproduces the single-redshift Poisson case
  // Φ(M) = exp(−V n(>M, z = 10)) (Harrison & Coles 2011, MNRAS 418, L20, Poisson limit).
  const thin = makeSurveyHalos(hm, 1, 9.99, 10.01);
  const area = 6.4907e4 / thin.volumeMpc3;
  const shell = makeSurveyHalos(hm, area, 9.99, 10.01);

  it('expected counts in the shell match V·n(>M) at z = 10 to 2e-4 (thin-shell limit of Ω∫dV/dz n dz)', () => {
    for (const m of [1e10, 1e11]) expect(rel(shell.expected(m), 6.4907e4 * hm.nAbove(m, 10))).toBeLessThan(2e-4);
  });

  it('expected N(>M) and P(≥1) at z = 10 match an independent scipy implementation (regression values) within 1% (3% at 3e11)', () => {
    // Regression values from test/fixtures/scipy: V·n(>M, z = 10) and 1 − exp(−V n), V = 6.4907e4 Mpc³.
    expect(ref.survey_z10.volume_mpc3).toBe(6.4907e4);
    for (const r of ref.survey_z10.expected) expect(rel(shell.expected(r.mass_msun), r.expected)).toBeLessThan(r.mass_msun > 1e11 ? 0.03 : 0.01);
    for (const r of ref.survey_z10.p_at_least_one) expect(rel(shell.pAtLeastOne(r.mass_msun), r.p_at_least_one)).toBeLessThan(0.01);
  });

  it('most-massive-halo quantiles (Poisson EVS) match an independent scipy implementation within 1% in mass', () => {
    // Regression values from test/fixtures/scipy (brentq on V·n(>M, z = 10) = −ln q).
    for (const r of ref.survey_z10.quantiles) expect(rel(shell.quantile(r.q), r.mass_msun)).toBeLessThan(0.01);
  });

  it('CDF at the q-quantile returns q (inverse consistency) and the PDF integrates to 1', () => {
    for (const q of [0.1, 0.5, 0.997]) expect(Math.abs(shell.cdfMax(shell.quantile(q)) - q)).toBeLessThan(1e-8);
    let s = 0;
    for (let l = 9; l < 13; l += 0.001) s += shell.pdfMaxPerLog10M(10 ** (l + 0.0005)) * 0.001;
    expect(Math.abs(s - 1)).toBeLessThan(1e-3);
  });

  it('exact order statistics tend to the Poisson limit for many haloes (Harrison & Coles 2011)', () => {
    const m = shell.quantile(0.5);
    expect(Math.abs(shell.cdfMaxExact(m, 1e8) - 0.5)).toBeLessThan(1e-3);
  });

  it('the whole-range count exceeds the thin-shell estimate V·n(>M, z_mid) for a steep n(z) (convexity)', () => {
    const wide = makeSurveyHalos(hm, 38, 9.5, 10.5);
    expect(wide.expected(1e11)).toBeGreaterThan(wide.volumeMpc3 * hm.nAbove(1e11, 10));
  });

  it('rejects quantiles at 0 or 1 with a message', () => {
    expect(() => shell.quantile(1)).toThrow(/quantile/);
    expect(() => shell.quantile(0)).toThrow(/quantile/);
  });
});
