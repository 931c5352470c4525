import erf from '@stdlib/math-base-special-erf';
import { describe, expect, it } from 'vitest';
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

describe('mass functions against an independent scipy implementation (regression values computed outside this project)', () => {
  // Same published formulas, Planck 2018 preset, EH98, δc = 1.68647. Tolerances: 0.5% for ν < 3, 2% for 3 < ν < 5,
  // 5% above (a 1e-4 change in σ moves n by ~ν²·1e-4).
  const points: [number, number][] = [[0, 1e12], [0, 1e14], [6, 1e10], [6, 1e11], [10, 1e9], [10, 1e10], [10, 1e11], [10, 1e12], [15, 1e10]];
  const want: Record<string, number[]> = {
    'press-schechter': [2.5544e-3, 2.7076e-5, 4.578e-2, 1.0178e-3, 9.6944e-2, 1.1292e-3, 1.5215e-6, 1.4647e-11, 6.7905e-7],
    'sheth-tormen': [1.7395e-3, 2.0053e-5, 4.7226e-2, 1.7346e-3, 1.535e-1, 3.5631e-3, 1.8204e-5, 2.8684e-9, 1.959e-5],
    jenkins01: [1.7707e-3, 2.238e-5, 5.584e-2, 1.8764e-3, 1.6885e-1, 3.3562e-3, 1.4809e-5, 3.803e-9, 1.6673e-5],
    tinker08: [1.8411e-3, 2.3496e-5, 3.3894e-2, 1.0639e-3, 8.6059e-2, 1.5538e-3, 4.7129e-6, 2.3477e-10, 3.1722e-6],
    reed07: [1.711e-3, 2.2782e-5, 4.9134e-2, 1.8459e-3, 1.5036e-1, 3.1975e-3, 1.0697e-5, 8.4791e-10, 8.3606e-6],
  };
  for (const [name, values] of Object.entries(want)) {
    it(`${name}: dn/dlnM at 9 (z, M) points`, () => {
      const hm = model(name);
      points.forEach(([z, m], i) => {
        const nu = hm.nu(m, z);
        const tol = nu < 3 ? 0.005 : nu < 5 ? 0.02 : 0.05;
        expect(rel(hm.dndlnM(m, z), values[i])).toBeLessThan(tol);
      });
    });
  }
  it('cumulative n(>M) and ρ(>M) (Sheth–Tormen, PS, Tinker08) at 5 (z, M) points, 1% (ν < 4) / 3% (ν > 4)', () => {
    const pts: [number, number][] = [[0, 1e12], [6, 1e11], [10, 1e10], [10, 1e11], [15, 1e10]];
    const nPS = [2.83e-3, 4.7672e-4, 4.6074e-4, 3.9297e-7, 1.6532e-7];
    const nST = [1.9027e-3, 9.6383e-4, 1.7596e-3, 5.9811e-6, 6.1057e-6];
    const nT08 = [2.0506e-3, 5.5489e-4, 7.0989e-4, 1.3947e-6, 8.8556e-7];
    const rhoST = [1.2942e10, 1.8631e8, 3.146e7, 8.5502e5, 8.5871e4];
    const ps = model('press-schechter');
    const st = model('sheth-tormen');
    const t8 = model('tinker08');
    pts.forEach(([z, m], i) => {
      const tol = st.nu(m, z) < 4 ? 0.01 : 0.03;
      expect(rel(ps.nAbove(m, z), nPS[i])).toBeLessThan(tol);
      expect(rel(st.nAbove(m, z), nST[i])).toBeLessThan(tol);
      expect(rel(t8.nAbove(m, z), nT08[i])).toBeLessThan(tol);
      expect(rel(st.rhoAbove(m, z), rhoST[i])).toBeLessThan(tol);
    });
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

describe('halo bias (δc = 1.68647) against an independent scipy implementation (regression values), 1e-5', () => {
  const rows: [number, number, number, number, number][] = [
    [1, 1.0, 1.01339, 1.07579, 0.9655],
    [2, 2.77886, 2.23429, 2.47024, 2.41182],
    [3, 5.74364, 4.30975, 4.72038, 5.13618],
    [4, 9.89432, 7.23042, 7.80697, 9.3241],
  ];
  for (const [nu, mw, st, smt, t10] of rows) {
    it(`ν = ${nu}: Mo & White 1996, Sheth & Tormen 1999, Sheth, Mo & Tormen 2001, Tinker et al. 2010`, () => {
      expect(Math.abs(biasMoWhite(nu, 1.68647) - mw)).toBeLessThan(1e-5);
      expect(Math.abs(biasShethTormen(nu, 1.68647) - st)).toBeLessThan(1e-5);
      expect(Math.abs(biasSmt01(nu, 1.68647) - smt)).toBeLessThan(1e-5);
      expect(Math.abs(biasTinker10(nu, 1.68647) - t10)).toBeLessThan(1e-5);
    });
  }
});
