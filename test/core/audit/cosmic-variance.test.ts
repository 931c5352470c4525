import { describe, expect, it } from 'vitest';
import ref from '../../fixtures/scipy/regression.json';
import { makeGrowth, PLANCK18 } from '../../../src/core/cosmology/index.js';
import { makeLinearPower } from '../../../src/core/power/index.js';
import { boxSigmaDm, meanAccretionRateMsunYr } from '../../../src/core/audit/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const power = makeLinearPower(PLANCK18, { kind: 'eh98' });
const d10 = makeGrowth(PLANCK18).d(10);

describe('cosmic variance of a pencil beam (Trenti & Stiavelli 2008 window)', () => {
  // Regression values from test/fixtures/scipy, an independent scipy implementation of the same box window and
  // EH98 P(k): 38 arcmin², 9.5 < z < 10.5 → L⊥ = 17.2794 Mpc, L_z = 217.548 Mpc.
  const cv = ref.cosmic_variance;
  it('σ_dm of the 38 arcmin² box at z = 10 within 1e-3 of the reference', () => {
    // The reference integrates the same window in real space (scipy tplquad of ξ(r), ξ checked against σ of
    // spheres to 1e-7); both sides are converged to ~1e-4, so 1e-3 leaves room only for quadrature error.
    expect(rel(boxSigmaDm(power, cv.l_perp_mpc, cv.l_z_mpc) * d10, cv.box_sigma_dm_z10)).toBeLessThan(1e-3);
  });
  it('σ_dm is converged: the window cut-off q = 20, 40, 80 changes it by < 2e-4', () => {
    const v = [20, 40, 80].map((q) => boxSigmaDm(power, 17.2794, 217.548, q));
    expect(rel(v[0], v[2])).toBeLessThan(2e-4);
    expect(rel(v[1], v[2])).toBeLessThan(2e-4);
  });
  it('a sphere of the same volume (R = 24.937 Mpc) has σ = 0.05302 (within 1%; test/fixtures/scipy): the pencil shape matters', () => {
    expect(rel(power.sigmaR(cv.sphere_radius_mpc) * d10, cv.sphere_sigma_z10)).toBeLessThan(0.01);
    expect(boxSigmaDm(power, 17.2794, 217.548)).toBeLessThan(power.sigmaR(24.937));
  });
  it('a cube of side L is within 10% of a sphere of equal volume (common practice, no source: compact shapes differ little)', () => {
    const L = 100;
    const r = Math.cbrt((3 * L ** 3) / (4 * Math.PI));
    expect(rel(boxSigmaDm(power, L, L), power.sigmaR(r))).toBeLessThan(0.1);
  });
});

describe('halo accretion (Fakhouri, Ma & Boylan-Kolchin 2010)', () => {
  it('46.1 Msun/yr for 1e12 Msun at z = 0 and 902.4 Msun/yr for 1e11 Msun at z = 10 (Ωm = 0.3111; independent transcription)', () => {
    expect(rel(meanAccretionRateMsunYr(1e12, 0, 0.3111, 0.6889), 46.1)).toBeLessThan(1e-3);
    expect(rel(meanAccretionRateMsunYr(1e11, 10, 0.3111, 0.6889), 902.4)).toBeLessThan(1e-3);
  });
});
