import erf from '@stdlib/math-base-special-erf';
import { describe, expect, it } from 'vitest';
import ref from '../../fixtures/scipy/regression.json';
import { PLANCK18 } from '../../../src/core/cosmology/index.js';
import { integrate } from '../../../src/core/numeric/index.js';
import {
  biasMoWhite,
  biasShethTormen,
  biasSmt01,
  biasTinker10,
  makeHaloModel,
  pressSchechter,
  shethTormen,
} from '../../../src/core/halos/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const DC = { kind: 'constant', value: 1.68647 } as const;
const model = (mf: string) => makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: mf, deltaC: DC });

describe('multiplicity normalisation (closed form)', () => {
  const fOfNu = (m: typeof pressSchechter) => (lnNu: number) => m.f({ sigma: 1.68647 / Math.exp(lnNu), deltaC: 1.68647, z: 0, nEff: -2 });
  it('Press–Schechter: ∫ f dlnν = 1 to 1e-8', () => {
    expect(Math.abs(integrate(fOfNu(pressSchechter), -40, 3, 400, 8) - 1)).toBeLessThan(1e-8);
  });
  it('Sheth–Tormen with the published A = 0.3222: ∫ f dlnν = 1.00005 ± 1e-4 (exact normaliser A = 0.322184; Sheth & Tormen 1999)', () => {
    // f ∝ ν^0.4 at small ν: integrate ln ν down to −200 for convergence.
    const v = integrate(fOfNu(shethTormen), -200, 3, 2000, 8);
    expect(Math.abs(v - 0.3222 / 0.3221836)).toBeLessThan(1e-4);
  });
  it('Press–Schechter mass fraction above M equals erfc(ν/√2) (closed form) to 1e-6', () => {
    for (const nu of [1, 2]) {
      const v = integrate(fOfNu(pressSchechter), Math.log(nu), 4, 200, 8);
      expect(Math.abs(v - (1 - erf(nu / Math.SQRT2)))).toBeLessThan(1e-6);
    }
  });
});

describe('mass functions against an independent scipy implementation (regression values from test/fixtures/scipy)', () => {
  // Same published formulas, Planck 2018 preset, EH98, δc = 1.68647. Tolerances: 0.5% for ν < 3, 2% for 3 < ν < 5,
  // 5% above (a 1e-4 change in σ moves n by ~ν²·1e-4).
  const points = ref.mass_function.points;
  for (const name of ['press-schechter', 'sheth-tormen', 'jenkins01', 'tinker08', 'reed07'] as const) {
    it(`${name}: dn/dlnM at ${points.length} (z, M) points`, () => {
      const hm = model(name);
      for (const pt of points) {
        const nu = hm.nu(pt.mass_msun, pt.z);
        const tol = nu < 3 ? 0.005 : nu < 5 ? 0.02 : 0.05;
        expect(rel(hm.dndlnM(pt.mass_msun, pt.z), pt.dndlnm_mpc3[name])).toBeLessThan(tol);
      }
    });
  }
  it('cumulative n(>M) and ρ(>M) (Sheth–Tormen, PS, Tinker08) at 5 (z, M) points, 1% (ν < 4) / 3% (ν > 4)', () => {
    // Regression values from test/fixtures/scipy (scipy quad of the same dn/dlnM up to 1e18 Msun).
    const ps = model('press-schechter');
    const st = model('sheth-tormen');
    const t8 = model('tinker08');
    for (const pt of ref.cumulative.points) {
      const [z, m] = [pt.z, pt.mass_msun];
      const tol = st.nu(m, z) < 4 ? 0.01 : 0.03;
      expect(rel(ps.nAbove(m, z), pt.n_above_mpc3['press-schechter'])).toBeLessThan(tol);
      expect(rel(st.nAbove(m, z), pt.n_above_mpc3['sheth-tormen'])).toBeLessThan(tol);
      expect(rel(t8.nAbove(m, z), pt.n_above_mpc3.tinker08)).toBeLessThan(tol);
      expect(rel(st.rhoAbove(m, z), pt.rho_above_msun_mpc3['sheth-tormen'])).toBeLessThan(tol);
    }
  });
  it('Press–Schechter ρ(>M)/ρ̄m → erfc(ν/√2) (closed form) where the table top (1e19 Msun) is negligible: 1e-3', () => {
    const ps = model('press-schechter');
    for (const [z, m] of [[6, 1e11], [10, 1e10]] as const) {
      const frac = ps.rhoAbove(m, z) / ps.table.rhoMMsunMpc3;
      expect(rel(frac, 1 - erf(ps.nu(m, z) / Math.SQRT2))).toBeLessThan(1e-3);
    }
  });
});

describe('self-similar Press–Schechter (closed form): (M/ρ̄) dn/dlnM = √(2/π) ((n+3)/6) ν e^{−ν²/2}', () => {
  for (const n of [-2, -1]) {
    it(`n = ${n}: numeric mass function matches to 1e-4 at M/M* = 0.1, 1, 10`, () => {
      const hm = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'power-law', n, amplitude: 1 }, massFunction: 'press-schechter', deltaC: DC });
      const s0 = hm.table.sigma0(1e10);
      // σ ∝ M^{−(n+3)/6}: M* where σ = δc.
      const mStar = 1e10 * (s0 / 1.68647) ** (6 / (n + 3));
      for (const x of [0.1, 1, 10]) {
        const m = x * mStar;
        const nu = x ** ((n + 3) / 6);
        const exact = Math.sqrt(2 / Math.PI) * ((n + 3) / 6) * nu * Math.exp(-0.5 * nu * nu);
        expect(rel((m / hm.table.rhoMMsunMpc3) * hm.dndlnM(m, 0), exact)).toBeLessThan(1e-4);
      }
    });
  }
});

describe('halo bias (δc = 1.68647) against an independent scipy implementation (regression values from test/fixtures/scipy), 1e-5', () => {
  for (const row of ref.bias.rows) {
    it(`ν = ${row.nu}: Mo & White 1996, Sheth & Tormen 1999, Sheth, Mo & Tormen 2001, Tinker et al. 2010`, () => {
      const dc = ref.bias.delta_c;
      expect(Math.abs(biasMoWhite(row.nu, dc) - row['mo-white'])).toBeLessThan(1e-5);
      expect(Math.abs(biasShethTormen(row.nu, dc) - row['sheth-tormen'])).toBeLessThan(1e-5);
      expect(Math.abs(biasSmt01(row.nu, dc) - row.smt01)).toBeLessThan(1e-5);
      expect(Math.abs(biasTinker10(row.nu, dc) - row.tinker10)).toBeLessThan(1e-5);
    });
  }
});
