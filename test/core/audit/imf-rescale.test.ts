import { describe, expect, it } from 'vitest';
import { makePopulationCache, parseSfh } from '../../../src/core/stars/index.js';
import { rescaleLogMass } from '../../../src/core/audit/imf-rescale.js';
import { runAudit } from '../../../src/core/audit/index.js';
import { DEFAULT_CHOICES } from '../../../src/ui/default-choices.js';

// Rescaling a reported mass between IMFs "at the same light" (common practice, no source): the
// project anchors it at rest 0.4 μm (README, "Sample columns"), for the drawn age and the run's SFH.
describe('IMF rescaling of a reported stellar mass', () => {
  const cache = makePopulationCache(0.02);
  const sfh = parseSfh('constant');
  const sal = cache.table('salpeter', 10, sfh);
  const chab = cache.table('chabrier', 10, sfh);
  it('equals M_ref × (M/L_ν)_target / (M/L_ν)_ref at rest 0.4 μm, read from the population tables, to 1e-12', () => {
    for (const ageMyr of [3, 30, 300]) {
      const want = 10.4 - sal.logMassToLight(ageMyr, 0.4) + chab.logMassToLight(ageMyr, 0.4);
      expect(Math.abs(rescaleLogMass(10.4, Math.log10(ageMyr), sal, chab) - want)).toBeLessThan(1e-12);
    }
  });
  it('is the identity for the same IMF, and Salpeter → Chabrier lowers the mass by 0.1–0.35 dex (Madau & Dickinson 2014: ×0.61 for old populations)', () => {
    expect(Math.abs(rescaleLogMass(10.4, Math.log10(100), sal, sal) - 10.4)).toBeLessThan(1e-12);
    const d = rescaleLogMass(10.4, Math.log10(1000), sal, chab) - 10.4;
    expect(d).toBeLessThan(-0.1);
    expect(d).toBeGreaterThan(-0.35);
  });
  it('the audit applies it: a reported Salpeter mass with no errors keeps its value under Salpeter and is rescaled under Chabrier', () => {
    const r = runAudit('id,z,log_mstar,imf_ref\nR-1,10,10.4,salpeter\n', { ...DEFAULT_CHOICES, imfs: ['salpeter', 'chabrier'], draws: 400 });
    const g = r.galaxies[0];
    expect(Math.abs(g.imf!.salpeter.log_mstar_median - 10.4)).toBeLessThan(1e-12);
    // the Chabrier median lies within the rescalings over the age prior's range (1 Myr – t(z = 10))
    const lo = Math.min(...[1, 10, 100, 470].map((a) => rescaleLogMass(10.4, Math.log10(a), sal, chab)));
    const hi = Math.max(...[1, 10, 100, 470].map((a) => rescaleLogMass(10.4, Math.log10(a), sal, chab)));
    expect(g.imf!.chabrier.log_mstar_median).toBeGreaterThanOrEqual(lo - 1e-9);
    expect(g.imf!.chabrier.log_mstar_median).toBeLessThanOrEqual(hi + 1e-9);
  });
});
