import { describe, expect, it } from 'vitest';
import { auditRow, prepareAudit, runAudit, type AuditChoices } from '../../../src/core/audit/index.js';
import { slopeImfName } from '../../../src/core/audit/reconcile.js';
import { makeBackground } from '../../../src/core/cosmology/index.js';
import { DEFAULT_CHOICES } from '../../../src/ui/default-choices.js';

// Self-consistency of "what it would take": re-running the audit with the one change that a
// reconciliation reports must bring the headline median ε_req to the target ε. Invented galaxies.
const DRAWS = 4000;
// Fixed draws: the re-runs must use the same draws as the audit they check (under the adaptive rule a
// changed ceiling can change where a galaxy stops, and so its draws).
const choices = (over: Partial<AuditChoices> = {}): AuditChoices => ({
  ...DEFAULT_CHOICES,
  imfs: ['salpeter', 'chabrier'],
  draws: DRAWS,
  fixedDraws: true,
  seed: 5,
  survey: { name: 'test-field', areaArcmin2: 40, zMin: 9.5, zMax: 10.5 },
  ...over,
});
const HEADER = 'id,z,z_lo,z_hi,m_ab,lambda_obs_um,mag_err,log_mstar,imf_ref,log_mstar_err';
const LIGHT = 'RL-1,10.0,9.9,10.1,22.2,1.5,0.1,,,';
const MASS = 'RM-1,10.0,9.9,10.1,,,,10.9,salpeter,0.1';
const base = runAudit(`${HEADER}\n${LIGHT}\n${MASS}\n`, choices());
const [light, mass] = base.galaxies;

/** MC error of a median in log10: 1.2533 σ/√N with σ from the 16–84% range (Kendall & Stuart; common practice, no source). */
const medianError = (p16: number, p84: number, n: number): number => (1.2533 * (p84 - p16)) / 2 / Math.sqrt(n);
const rerunEps = (csv: string, c: AuditChoices, imf?: string): number => {
  const g = runAudit(`${HEADER}\n${csv}\n`, c).galaxies[0];
  return g.imf![imf ?? g.headline_imf!].eps_required_median;
};

describe('reconciliation: each reported change, applied, brings the median ε_req to the target', () => {
  it('both test galaxies are in tension and get one entry for ε = 1 and one for ε_ref', () => {
    for (const g of [light, mass]) {
      expect(g.verdict).not.toBe('within budget');
      expect(g.reconcile!.map((r) => r.eps)).toEqual([1, 0.3]);
    }
  });
  for (const [label, row, g] of [['light row', LIGHT, light], ['reported mass', MASS, mass]] as const) {
    const h = () => g.imf![g.headline_imf!];
    // the same draws with only the ceiling changed: the interpolations of the ceiling tables leave ~1e-3 dex
    const tolSame = () => Math.max(2e-3, medianError(h().log_mstar_p16, h().log_mstar_p84, DRAWS));
    it(`${label}: --sigma8 σ8_min gives the target (same draws, only the ceiling moves)`, () => {
      for (const r of g.reconcile!) {
        if (r.sigma8_min === null) {
          expect(r.reasons.sigma8_min).toMatch(/σ8/);
          continue;
        }
        const c = choices({ cosmology: { ...DEFAULT_CHOICES.cosmology, sigma8: r.sigma8_min } });
        expect(Math.abs(Math.log10(rerunEps(row, c) / r.eps))).toBeLessThan(tolSame());
        expect(r.power_boost_min).toBeCloseTo((r.sigma8_min! / DEFAULT_CHOICES.cosmology.sigma8) ** 2, 12);
      }
    });
    it(`${label}: --area-arcmin2 area_min gives the target`, () => {
      for (const r of g.reconcile!) {
        if (r.area_min_arcmin2 === null) {
          expect(r.reasons.area_min_arcmin2).toMatch(/sky/);
          continue;
        }
        const c = choices({ survey: { name: 'test-field', areaArcmin2: r.area_min_arcmin2, zMin: 9.5, zMax: 10.5 } });
        expect(Math.abs(Math.log10(rerunEps(row, c) / r.eps))).toBeLessThan(tolSame());
      }
    });
    it(`${label}: the IMF ${slopeImfName(1.7).replace('1.7', 'α')} at α = imf_slope_max gives the target (or the search range is exhausted, with a reason)`, () => {
      for (const r of g.reconcile!) {
        if (r.imf_slope_max === null || r.reasons.imf_slope_max) {
          expect(r.reasons.imf_slope_max).toMatch(/slope/);
          continue;
        }
        const imf = slopeImfName(r.imf_slope_max);
        const c = choices({ imfs: [imf, 'salpeter'], headlineImf: imf });
        // the slope grid is interpolated every 0.05 in α: ≲ 2e-3 dex beside the MC error
        expect(Math.abs(Math.log10(rerunEps(row, c, imf) / r.eps))).toBeLessThan(tolSame() + 2e-3);
      }
    });
    it(`${label}: the galaxy placed at z = z_max gives the target (its own draws: within 4 MC errors)`, () => {
      for (const r of g.reconcile!) {
        const at = row.split(',');
        at[1] = String(r.z_max);
        at[2] = '';
        at[3] = '';
        // a reported mass is the same observation at z_max when scaled by D_L²/(1+z) (a light row keeps its band and flux)
        if (at[7] !== '') {
          const bg = makeBackground(DEFAULT_CHOICES.cosmology);
          const f = (bg.luminosityDistanceMpc(r.z_max!) / bg.luminosityDistanceMpc(10)) ** 2 * (11 / (1 + r.z_max!));
          at[7] = String(Number(at[7]) + Math.log10(f));
        }
        const e = rerunEps(at.join(","), choices());
        // reconciliation used 2000 draws at fixed z, the re-run 4000 of its own: two independent medians
        const err = medianError(h().log_mstar_p16, h().log_mstar_p84, 2000) * Math.SQRT2;
        // at the edge of the searched range (a reason is given) it only has to fit there
        if (r.reasons.z_max) expect(Math.log10(e / r.eps)).toBeLessThan(4 * err + 2e-3);
        else expect(Math.abs(Math.log10(e / r.eps))).toBeLessThan(4 * err + 2e-3);
      }
    });
  }
  it('expected_hosts: the field expects fewer than one such host for ε = 1 when the galaxy is over budget', () => {
    for (const g of [light, mass]) {
      const r = g.reconcile![0];
      if (g.verdict === 'over budget') expect(r.expected_hosts).toBeLessThan(-Math.log(0.997) * 1.05);
      expect(r.expected_hosts).toBeGreaterThan(0);
    }
  });
  it('a galaxy within budget gets no reconciliation', () => {
    const r = runAudit(`${HEADER}\nOK-1,10.0,,,28,1.5,0.1,,,\n`, choices());
    expect(r.galaxies[0].verdict).toBe('within budget');
    expect(r.galaxies[0].reconcile).toEqual([]);
  });
  it('a first look (reconcile: false) is the whole audit, draw for draw, without the reconciliation; the page shows it before the whole', () => {
    const csv = `${HEADER}\n${LIGHT}\n${MASS}\nOK-1,10.0,,,28,1.5,0.1,,,\n`;
    const prep = prepareAudit(csv, choices());
    const whole = [0, 1, 2].map((i) => auditRow(prep, i));
    const first = [0, 1, 2].map((i) => auditRow(prep, i, undefined, { reconcile: false }));
    expect(whole.slice(0, 2)).toEqual([light, mass]);
    for (let i = 0; i < 3; i++) expect({ ...first[i], reconcile: whole[i].reconcile }).toEqual(whole[i]);
    expect(first.map((g) => g.reconcile)).toEqual([[], [], []]);
    expect(whole[0].reconcile!.length + whole[1].reconcile!.length).toBe(4);
  });
});
