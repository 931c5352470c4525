import { describe, expect, it } from 'vitest';
import {
  BASE_PARAM_NAMES,
  CovarianceCsvError,
  PLANCK18,
  PLANCK18_UNCERTAINTY,
  WMAP9,
  WMAP9_UNCERTAINTY,
  choleskyLower,
  covarianceProblems,
  covarianceSd,
  drawBaseDelta,
  parseCovarianceCsv,
  perturbCosmology,
  presetCovariance,
  toBaseParams,
} from '../../../src/core/cosmology/index.js';
import { makeRandom } from '../../../src/core/audit/random.js';

const matMul = (a: number[][], b: number[][]): number[][] => a.map((r) => b[0].map((_, j) => r.reduce((s, v, k) => s + v * b[k][j], 0)));
const transpose = (a: number[][]): number[][] => a[0].map((_, j) => a.map((r) => r[j]));
/** A correlated, positive-definite test covariance (invented): σ = (1e-4, 1e-3, 0.5, 4e-3, 6e-3). */
const SD = [1e-4, 1e-3, 0.5, 4e-3, 6e-3];
const CORR = [
  [1, 0.3, 0.5, 0.2, 0.1],
  [0.3, 1, -0.6, 0.1, 0.4],
  [0.5, -0.6, 1, 0.3, -0.2],
  [0.2, 0.1, 0.3, 1, 0.05],
  [0.1, 0.4, -0.2, 0.05, 1],
];
const COV = CORR.map((r, i) => r.map((c, j) => c * SD[i] * SD[j]));
const csv = (m: number[][], names = BASE_PARAM_NAMES): string => [`param,${names.join(',')}`, ...names.map((n, i) => `${n},${m[i].join(',')}`)].join('\n');

describe('base parameters and preset uncertainties', () => {
  it('Planck 2018 preset: ω_b = 0.02242, ω_c = 0.11933 and Ω_m h² = 0.14240 of Table 2 (TT,TE,EE+lowE+lensing+BAO; physics.md §1.4, [V]) within the preset’s rounding of Ω_m (5e-5)', () => {
    const b = toBaseParams(PLANCK18, PLANCK18_UNCERTAINTY.omegaNuH2);
    expect(Math.abs(b.omegaBh2 - 0.02242)).toBeLessThan(1e-12);
    expect(Math.abs(b.omegaCh2 - 0.11933)).toBeLessThan(5e-5);
    expect(Math.abs(PLANCK18.omegaM * (PLANCK18.h0 / 100) ** 2 - 0.1424)).toBeLessThan(5e-5);
    expect(PLANCK18_UNCERTAINTY.sd).toEqual({ omegaBh2: 0.00014, omegaCh2: 0.00091, h0: 0.42, ns: 0.0038, sigma8: 0.006 });
  });

  it('WMAP9 preset: ω_b = 0.02223 and ω_c = 0.1153 of Hinshaw et al. 2013, Table 4, WMAP+eCMB+BAO+H0 (from memory) within the preset’s rounding', () => {
    const b = toBaseParams(WMAP9, WMAP9_UNCERTAINTY.omegaNuH2);
    expect(Math.abs(b.omegaBh2 - 0.02223)).toBeLessThan(2e-5);
    expect(Math.abs(b.omegaCh2 - 0.1153)).toBeLessThan(2e-4);
  });

  it('perturbCosmology keeps ω_b and ω_m when H0 moves, so Ω_m ∝ 1/h² (the Ω_m–H0 degeneracy, closed form), and adds the other offsets', () => {
    const p = perturbCosmology(PLANCK18, { h0: 1 });
    const r = (PLANCK18.h0 / (PLANCK18.h0 + 1)) ** 2;
    expect(p.omegaM / PLANCK18.omegaM).toBeCloseTo(r, 14);
    expect(p.omegaB / PLANCK18.omegaB).toBeCloseTo(r, 14);
    const q = perturbCosmology(PLANCK18, { omegaCh2: 0.001, omegaBh2: 0.0001, ns: 0.01, sigma8: -0.02 });
    const h2 = (PLANCK18.h0 / 100) ** 2;
    expect(q.omegaM).toBeCloseTo(PLANCK18.omegaM + 0.0011 / h2, 14);
    expect(q.omegaB).toBeCloseTo(PLANCK18.omegaB + 0.0001 / h2, 14);
    expect(q.ns).toBeCloseTo(PLANCK18.ns + 0.01, 14);
    expect(q.sigma8).toBeCloseTo(PLANCK18.sigma8 - 0.02, 14);
    expect(perturbCosmology(PLANCK18, {})).toBe(PLANCK18);
  });

  it('independent Planck base errors give a derived Ω_m strongly anti-correlated with H0 (ρ ≈ −0.89 by linear propagation) and σ(Ω_m) ≈ 0.0044 (Table 2 quotes 0.0056 with the full correlations)', () => {
    const L = choleskyLower(presetCovariance('planck18').matrix);
    const rng = makeRandom(7);
    const n = 20000;
    const om: number[] = [];
    const h: number[] = [];
    for (let i = 0; i < n; i++) {
      const p = perturbCosmology(PLANCK18, drawBaseDelta(L, () => rng.normal()));
      om.push(p.omegaM);
      h.push(p.h0);
    }
    const mean = (v: number[]): number => v.reduce((a, b) => a + b, 0) / v.length;
    const mo = mean(om);
    const mh = mean(h);
    const so = Math.sqrt(mean(om.map((x) => (x - mo) ** 2)));
    const sh = Math.sqrt(mean(h.map((x) => (x - mh) ** 2)));
    const rho = mean(om.map((x, i) => (x - mo) * (h[i] - mh))) / (so * sh);
    // linear propagation: σ(Ω_m)/Ω_m = √[(σ_ωm/ω_m)² + (2σ_h/h)²], ρ = −(2σ_h/h)/(σ(Ω_m)/Ω_m)
    const wm = PLANCK18.omegaM * (PLANCK18.h0 / 100) ** 2;
    const a = Math.hypot(0.00014, 0.00091) / wm;
    const b = (2 * 0.42) / PLANCK18.h0;
    const sLin = PLANCK18.omegaM * Math.hypot(a, b);
    expect(Math.abs(so / sLin - 1)).toBeLessThan(0.03); // MC error of an sd at n = 20000: 0.5%
    expect(Math.abs(rho - -b / Math.hypot(a, b))).toBeLessThan(0.02);
    expect(rho).toBeLessThan(-0.85);
  });

  it('presetCovariance is diagonal in the base parameters with the source’s 1σ errors; an unknown preset is refused', () => {
    expect(covarianceSd(presetCovariance('wmap9'))).toEqual(WMAP9_UNCERTAINTY.sd);
    expect(presetCovariance('planck18').source).toMatch(/Planck Collaboration 2020, A&A 641, A6, Table 2, TT,TE,EE\+lowE\+lensing\+BAO/);
    expect(() => presetCovariance('mine')).toThrow(/no parameter uncertainties for cosmology preset "mine" \(known: planck18, wmap9\)/);
  });
});

describe('covariance checks and Cholesky factor', () => {
  it('L Lᵀ reproduces a correlated covariance to 1e-12 relative, and draws L g have that covariance (MC, 40000 draws, 4σ of the sampling error)', () => {
    const L = choleskyLower(COV);
    const back = matMul(L, transpose(L));
    back.forEach((r, i) => r.forEach((v, j) => expect(Math.abs(v - COV[i][j])).toBeLessThan(1e-12 * SD[i] * SD[j])));
    const rng = makeRandom(3);
    const n = 40000;
    const acc = COV.map((r) => r.map(() => 0));
    const keys = ['omegaBh2', 'omegaCh2', 'h0', 'ns', 'sigma8'] as const;
    for (let k = 0; k < n; k++) {
      const d = drawBaseDelta(L, () => rng.normal());
      keys.forEach((a, i) => keys.forEach((b, j) => (acc[i][j] += d[a] * d[b])));
    }
    // the sample correlation's standard error is (1 − ρ²)/√n ≤ 0.005
    acc.forEach((r, i) => r.forEach((v, j) => expect(Math.abs(v / n / (SD[i] * SD[j]) - CORR[i][j])).toBeLessThan(0.02)));
  });

  it('accepts a semi-definite (rank-one) matrix and zero variances; refuses an indefinite one naming row and column', () => {
    const v = [1e-4, -1e-3, 0.4, 0, 5e-3];
    const rank1 = v.map((a) => v.map((b) => a * b));
    expect(covarianceProblems(rank1)).toEqual([]);
    const L = choleskyLower(rank1);
    matMul(L, transpose(L)).forEach((r, i) => r.forEach((x, j) => expect(Math.abs(x - rank1[i][j])).toBeLessThan(1e-9 * (Math.abs(v[i] * v[j]) + 1e-30))));
    // ρ12 = ρ13 = 0.9 but ρ23 = −0.9: each pair is fine, the 3×3 block is not
    const bad = COV.map((r) => [...r]);
    const set = (i: number, j: number, c: number): void => void (bad[i][j] = bad[j][i] = c * SD[i] * SD[j]);
    set(0, 1, 0.9);
    set(0, 2, 0.9);
    set(1, 2, -0.9);
    const p = covarianceProblems(bad);
    expect(p).toHaveLength(1);
    expect(p[0]).toMatchObject({ row: 'h0', column: 'h0' });
    expect(p[0].message).toMatch(/not positive semi-definite/);
  });

  it('names asymmetry, negative variances, correlations beyond ±1 and non-finite entries with row and column', () => {
    const m = (f: (x: number[][]) => void): number[][] => {
      const c = COV.map((r) => [...r]);
      f(c);
      return c;
    };
    expect(covarianceProblems(m((c) => (c[1][3] *= 1.01)))[0]).toMatchObject({ row: 'omega_c_h2', column: 'n_s' });
    expect(covarianceProblems(m((c) => (c[4][4] = -1e-6)))[0]).toMatchObject({ row: 'sigma8', column: 'sigma8', message: expect.stringMatching(/negative/) });
    expect(covarianceProblems(m((c) => (c[0][2] = c[2][0] = 1.5 * SD[0] * SD[2])))[0]).toMatchObject({ row: 'omega_b_h2', column: 'h0', message: expect.stringMatching(/correlation beyond ±1/) });
    expect(covarianceProblems(m((c) => (c[3][3] = Number.NaN)))[0]).toMatchObject({ row: 'n_s', column: 'n_s', message: expect.stringMatching(/finite/) });
    expect(covarianceProblems([[1]])[0].message).toMatch(/5×5/);
  });
});

describe('covariance CSV', () => {
  it('reads a full matrix, in any row and column order, to the same numbers', () => {
    const a = parseCovarianceCsv(csv(COV), 'cov.csv');
    expect(a.source).toBe('cov.csv');
    a.matrix.forEach((r, i) => r.forEach((v, j) => expect(v).toBe(Number(String(COV[i][j])))));
    const order = [4, 2, 0, 3, 1];
    const names = order.map((i) => BASE_PARAM_NAMES[i]);
    const shuffled = order.map((i) => order.map((j) => COV[i][j]));
    const lines = [`,${names.join(',')}`, ...[...names].reverse().map((n) => `${n},${shuffled[names.indexOf(n)].join(',')}`)];
    expect(parseCovarianceCsv(`\uFEFF${lines.join('\r\n')}\r\n\r\n`).matrix).toEqual(a.matrix);
  });

  it('holds left-out parameters fixed (zero rows and columns) and says so', () => {
    const r = parseCovarianceCsv('param,h0,sigma8\nh0,0.1764,0.0001\nsigma8,0.0001,3.6e-5\n', 'two.csv');
    expect(r.source).toBe('two.csv; held fixed: omega_b_h2, omega_c_h2, n_s');
    expect(r.matrix[2][2]).toBe(0.1764);
    expect(r.matrix[2][4]).toBe(0.0001);
    expect(r.matrix[0]).toEqual([0, 0, 0, 0, 0]);
  });

  const problems = (text: string): unknown[] => {
    try {
      parseCovarianceCsv(text, 'f.csv');
    } catch (e) {
      expect(e).toBeInstanceOf(CovarianceCsvError);
      expect((e as Error).message).toMatch(/^f\.csv: /);
      return [...(e as CovarianceCsvError).problems];
    }
    throw new Error('no error');
  };

  it('names line and column of every problem', () => {
    expect(problems('')).toEqual([expect.objectContaining({ message: expect.stringMatching(/empty/) })]);
    expect(problems('param,h0,omega_m\nh0,1,0\nomega_m,0,1')).toEqual([expect.objectContaining({ row: 1, column: 'omega_m', message: expect.stringMatching(/unknown parameter "omega_m" \(allowed: omega_b_h2, omega_c_h2, h0, n_s, sigma8\)/) })]);
    expect(problems('param,h0,h0\nh0,1,0')).toEqual([expect.objectContaining({ row: 1, column: 'h0', message: expect.stringMatching(/twice/) })]);
    // a blank line does not shift the numbering
    expect(problems('param,h0,sigma8\n\nh0,0.17,x\nsigma8,0,1e-5')).toEqual([expect.objectContaining({ row: 3, column: 'sigma8', message: expect.stringMatching(/"x" is not a finite number/) })]);
    expect(problems('param,h0,sigma8\nh0,0,5\nsigma8,0,NaN')).toEqual([expect.objectContaining({ row: 3, column: 'sigma8' })]);
    expect(problems('param,h0,sigma8\nh0,0,5,6\nsigma8,0,1')).toEqual([expect.objectContaining({ row: 2, message: expect.stringMatching(/has 4 cells where the header has 3/) })]);
    expect(problems('param,h0,sigma8\nh0,1,0')).toEqual([expect.objectContaining({ column: 'sigma8', message: expect.stringMatching(/has a column but no row/) })]);
    expect(problems('param,h0,sigma8\nh0,1,0\nn_s,0,1')).toEqual([expect.objectContaining({ row: 3, column: 'param', message: expect.stringMatching(/row name "n_s"/) })]);
    expect(problems('param,h0,sigma8\nh0,1,0\nh0,1,0')).toEqual([expect.objectContaining({ row: 3, message: expect.stringMatching(/second row \(first on line 2\)/) })]);
    // a decimal comma splits the cell: caught as a wrong cell count, never read as two numbers
    expect(problems('param,h0\nh0,0,17')).toEqual([expect.objectContaining({ row: 2, message: expect.stringMatching(/3 cells/) })]);
    // only commas separate cells (no guessing of semicolons)
    expect(problems('param;h0\nh0;1')).toEqual([expect.objectContaining({ row: 1, message: expect.stringMatching(/header needs a name column/) })]);
  });

  it('refuses an asymmetric or indefinite matrix, naming the row’s line and the column', () => {
    expect(problems('param,h0,sigma8\nh0,0.17,1e-4\nsigma8,2e-4,3.6e-5')).toEqual([expect.objectContaining({ row: 2, column: 'sigma8', message: expect.stringMatching(/\(row h0\) .*symmetric/) })]);
    expect(problems('param,h0,sigma8\nh0,1,0\nsigma8,0,-1')).toEqual([expect.objectContaining({ row: 3, column: 'sigma8', message: expect.stringMatching(/negative/) })]);
    expect(problems('param,omega_b_h2,h0,sigma8\nomega_b_h2,1,0.9,0.9\nh0,0.9,1,-0.9\nsigma8,0.9,-0.9,1')).toEqual([
      expect.objectContaining({ row: 4, column: 'sigma8', message: expect.stringMatching(/not positive semi-definite/) }),
    ]);
  });
});
