import { describe, expect, it } from 'vitest';
import { ARCMIN2_SR } from '../../../src/core/constants.js';
import {
  PLANCK18,
  choleskyLower,
  diagonalCovariance,
  drawBaseDelta,
  perturbCosmology,
  presetCovariance,
  type ParamCovariance,
} from '../../../src/core/cosmology/index.js';
import { makeHaloModel, ST_A, ST_P, ST_SMALL_A } from '../../../src/core/halos/index.js';
import { ceilingLog10Mass, ceilingSpreadDex, type CeilingPhysics } from '../../../src/core/audit/ceiling-spread.js';
import { makeRandom } from '../../../src/core/audit/random.js';

const PHYS: CeilingPhysics = { cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen' };
const AREA = 40;
const Q = 0.997;
const DZ = 1;
const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe('ceiling spread from the cosmological parameters (linear response)', () => {
  it('matches brute-force sampling of 64 cosmologies from the same covariance (seeded multivariate normal via Cholesky) within 15%', () => {
    // 15%: the Monte Carlo error of a standard deviation from N samples is ~1/√(2N) ≈ 9% at N = 64
    // (common practice, no source), plus the non-linearity of the ceiling in the parameters.
    const cov = presetCovariance('planck18');
    const zs = [10, 16];
    const lin = ceilingSpreadDex(PHYS, AREA, Q, DZ, zs, cov, { convergenceCheck: false });
    const L = choleskyLower(cov.matrix);
    // Standard normals by Box–Muller (Box & Muller 1958) from the seeded uniforms: the sampling this
    // check was written with, independent of the audit's own normal generator (a ziggurat since).
    // At N = 64 the 15% bound is only ~1.7σ of the sampling error of an sd: another seed or generator
    // fails it about one time in ten.
    const rng = makeRandom(1);
    let spare: number | undefined;
    const normal = (): number => {
      if (spare !== undefined) {
        const s = spare;
        spare = undefined;
        return s;
      }
      let u = rng.uniform();
      while (u <= 0) u = rng.uniform();
      const r = Math.sqrt(-2 * Math.log(u));
      const t = 2 * Math.PI * rng.uniform();
      spare = r * Math.sin(t);
      return r * Math.cos(t);
    };
    const N = 64;
    const draws = Array.from({ length: N }, () => ceilingLog10Mass({ ...PHYS, cosmology: perturbCosmology(PLANCK18, drawBaseDelta(L, normal)) }, AREA, Q, DZ, zs));
    zs.forEach((z, k) => {
      const v = draws.map((d) => d[k]);
      const mean = v.reduce((a, b) => a + b, 0) / N;
      const sd = Math.sqrt(v.reduce((a, b) => a + (b - mean) ** 2, 0) / (N - 1));
      expect(lin[k].log_mass_cosmo_sd_dex).toBeGreaterThan(0.01);
      expect(rel(sd, lin[k].log_mass_cosmo_sd_dex)).toBeLessThan(0.15);
      // the sample mean lies within 3 standard errors of the central ceiling (the sampling is centred)
      expect(Math.abs(mean - lin[k].log_mass_central)).toBeLessThan((3 * sd) / Math.sqrt(N));
    });
  });

  it('σ8 alone: the finite-difference derivative matches the closed form from σ(M) ∝ σ8 (the ceiling moves only through ν = δc/σ) to 1%', () => {
    // With σ ∝ σ8, ∂f/∂lnσ8 = −f dlnf/dlnν, and for Sheth–Tormen
    //   dlnf/dlnν = 1 − aν² − 2p (aν²)^−p / (1 + (aν²)^−p)   (from Sheth & Tormen 1999, eq. 10).
    // At the ceiling N(>M_q) = −ln q, so dlnM_q/dlnσ8 = −(∂N/∂lnσ8)/(∂N/∂lnM), with
    //   ∂N/∂lnσ8 = −Ω∫dz dV/dz ∫_{M_q} (ρ̄/M)|dlnσ/dlnM| f g dlnM,   ∂N/∂lnM = −Ω∫dz dV/dz dn/dlnM(M_q).
    // Both integrals are done here directly (Simpson in z and in ln M), not with the ceiling table.
    const s8 = PLANCK18.sigma8;
    const only = (sd: number): ParamCovariance => diagonalCovariance({ omegaBh2: 0, omegaCh2: 0, h0: 0, ns: 0, sigma8: sd }, 'σ8 only');
    const zs = [10, 16];
    const fd = ceilingSpreadDex(PHYS, AREA, Q, DZ, zs, only(0.006));
    const halo = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen' });
    const omega = AREA * ARCMIN2_SR;
    const dc = halo.deltaC(10);
    const simpson = (a: number, b: number, n: number, f: (x: number) => number): number => {
      const h = (b - a) / n;
      let s = f(a) + f(b);
      for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(a + i * h);
      return (s * h) / 3;
    };
    zs.forEach((z, k) => {
      expect(Object.keys(fd[k].jacobian)).toEqual(['sigma8']);
      const mq = 10 ** fd[k].log_mass_central;
      const dNdlnS8 = -simpson(z - 0.5, z + 0.5, 50, (zz) => {
        const d = halo.growth.d(zz);
        const inner = simpson(Math.log(mq), Math.log(mq) + Math.log(1e4), 400, (lm) => {
          const m = Math.exp(lm);
          const nu = dc / (halo.table.sigma0(m) * d);
          const x = ST_SMALL_A * nu * nu;
          const f = ST_A * Math.sqrt((2 * ST_SMALL_A) / Math.PI) * (1 + x ** -ST_P) * nu * Math.exp(-0.5 * x);
          const g = 1 - x - (2 * ST_P * x ** -ST_P) / (1 + x ** -ST_P);
          return (halo.table.rhoMMsunMpc3 / m) * Math.abs(halo.table.dlnSigmaDlnM(m)) * f * g;
        });
        return omega * halo.background.dVdzdOmegaMpc3(zz) * inner;
      });
      const dNdlnM = -simpson(z - 0.5, z + 0.5, 50, (zz) => omega * halo.background.dVdzdOmegaMpc3(zz) * halo.dndlnM(mq, zz));
      const closed = -dNdlnS8 / dNdlnM / (Math.LN10 * s8);
      expect(rel(fd[k].jacobian.sigma8!, closed)).toBeLessThan(0.01);
      expect(rel(fd[k].log_mass_cosmo_sd_dex, Math.abs(closed) * 0.006)).toBeLessThan(0.01);
      expect(fd[k].fd_relative_change!).toBeLessThan(0.01);
    });
  });

  it('correlations count: for a rank-one covariance C = v vᵀ the spread √(J C Jᵀ) equals the central difference along v, ½|f(p + v) − f(p − v)| (identity of linear response), to 2%', () => {
    // v moves all five base parameters by 1σ at once, H0 against the others.
    const v = { omegaBh2: 0.00014, omegaCh2: 0.00091, h0: -0.42, ns: 0.0038, sigma8: 0.006 };
    const keys = Object.keys(v) as (keyof typeof v)[];
    const cov: ParamCovariance = { matrix: keys.map((a) => keys.map((b) => v[a] * v[b])), source: 'rank one' };
    const zs = [12];
    const lin = ceilingSpreadDex(PHYS, AREA, Q, DZ, zs, cov, { convergenceCheck: false });
    const neg = Object.fromEntries(keys.map((k) => [k, -v[k]]));
    const up = ceilingLog10Mass({ ...PHYS, cosmology: perturbCosmology(PLANCK18, v) }, AREA, Q, DZ, zs)[0];
    const dn = ceilingLog10Mass({ ...PHYS, cosmology: perturbCosmology(PLANCK18, neg) }, AREA, Q, DZ, zs)[0];
    expect(rel(lin[0].log_mass_cosmo_sd_dex, Math.abs(up - dn) / 2)).toBeLessThan(0.02);
    // and it differs from the same errors taken as independent (the correlations matter here)
    const indep = Math.sqrt(keys.reduce((s, k) => s + (lin[0].jacobian[k]! * v[k]) ** 2, 0));
    expect(rel(indep, lin[0].log_mass_cosmo_sd_dex)).toBeGreaterThan(0.2);
  });

  it('a zero covariance gives zero spread (nothing is varied)', () => {
    const zero = diagonalCovariance({ omegaBh2: 0, omegaCh2: 0, h0: 0, ns: 0, sigma8: 0 }, 'none');
    const r = ceilingSpreadDex(PHYS, AREA, Q, DZ, [12], zero);
    expect(r[0].log_mass_cosmo_sd_dex).toBe(0);
    expect(r[0].jacobian).toEqual({});
    expect(r[0].log_mass_central).toBeGreaterThan(10);
  });

  it('refuses a bad covariance naming row and column, and bad redshifts or steps', () => {
    const m = presetCovariance('planck18').matrix.map((r) => [...r]);
    m[0][4] = 1e-7;
    expect(() => ceilingSpreadDex(PHYS, AREA, Q, DZ, [12], { matrix: m, source: 'test matrix' })).toThrow(/test matrix: row omega_b_h2, column sigma8: .*symmetric/);
    expect(() => ceilingSpreadDex(PHYS, AREA, Q, DZ, [0], presetCovariance('planck18'))).toThrow(/redshift must be a finite number > 0/);
    expect(() => ceilingSpreadDex(PHYS, AREA, Q, DZ, [12], presetCovariance('planck18'), { stepSd: 0 })).toThrow(/step must lie in/);
    expect(ceilingSpreadDex(PHYS, AREA, Q, DZ, [], presetCovariance('planck18'))).toEqual([]);
  });
});
