import gamma from '@stdlib/math-base-special-gamma';
import { describe, expect, it } from 'vitest';
import ref from '../../fixtures/scipy/regression.json';
import { PLANCK18 } from '../../../src/core/cosmology/index.js';
import {
  eisensteinHuScales,
  makeBbks,
  makeEisensteinHu,
  makeEisensteinHuNoWiggle,
  makeLinearPower,
  makeSigmaTable,
} from '../../../src/core/power/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
// Setup used for the regression values below: Planck 2018 preset, EH98, σ8 = 0.8102 at 8/h Mpc.
const P = PLANCK18;

describe('Eisenstein & Hu 1998 transfer function', () => {
  it('exact sound horizon (eq. 6) agrees with the paper\'s fit eq. 26 within its stated 2%', () => {
    const s = eisensteinHuScales(P);
    expect(rel(s.soundHorizonMpc, s.soundHorizonFitMpc)).toBeLessThan(0.02);
  });

  it('EH98 test cosmology (Ω0 = 0.3, Ωb = 0.045, h = 0.7, T = 2.728 K): s, z_d, α_c, β_c match an independent scipy implementation to 1e-5', () => {
    // Regression values from test/fixtures/scipy (generate.py: the published equations written in scipy).
    const want = ref.eh98_test_cosmology;
    const s = eisensteinHuScales({ ...P, ...want.params });
    expect(rel(s.soundHorizonMpc, want.sound_horizon_mpc)).toBeLessThan(1e-5);
    expect(rel(s.zDrag, want.z_drag)).toBeLessThan(1e-5);
    expect(rel(s.alphaC, want.alpha_c)).toBeLessThan(1e-5);
    expect(rel(s.betaC, want.beta_c)).toBeLessThan(1e-5);
  });

  it('full, no-wiggle and BBKS T(k) at k = 0.01, 0.1, 1 /Mpc match an independent scipy implementation to 1e-5', () => {
    // Regression values (Planck 2018 preset) from test/fixtures/scipy, the same published equations written in scipy.
    const full = makeEisensteinHu(P);
    const nw = makeEisensteinHuNoWiggle(P);
    const bbks = makeBbks(P);
    const ks = ref.transfer.k_per_mpc;
    ref.transfer.eh98.forEach((t, i) => expect(rel(full(ks[i]), t)).toBeLessThan(1e-5));
    ref.transfer.eh98_no_wiggle.forEach((t, i) => expect(rel(nw(ks[i]), t)).toBeLessThan(1e-5));
    ref.transfer.bbks.forEach((t, i) => expect(rel(bbks(ks[i]), t)).toBeLessThan(1e-5));
  });

  it('T(k) → 1 as k → 0 for every form (closed-form limit): |1 − T| < 1e-4 at k = 1e-6 /Mpc and shrinking with k', () => {
    // BBKS approaches 1 linearly (1 − T ≈ 2.1 q), the EH98 forms quadratically, hence k = 1e-6 rather than 1e-5.
    for (const t of [makeEisensteinHu(P), makeEisensteinHuNoWiggle(P), makeBbks(P)]) {
      expect(Math.abs(t(1e-6) - 1)).toBeLessThan(1e-4);
      expect(Math.abs(t(1e-7) - 1)).toBeLessThan(Math.abs(t(1e-6) - 1));
    }
  });

  it('wiggle and no-wiggle forms agree within 3% away from the oscillations (k < 0.005 and k > 1 /Mpc) (EH98 §4)', () => {
    const full = makeEisensteinHu(P);
    const nw = makeEisensteinHuNoWiggle(P);
    for (const k of [1e-4, 1e-3, 0.005, 1, 3, 10]) expect(rel(full(k), nw(k))).toBeLessThan(0.03);
  });
});

describe('σ(M) and the top-hat integral', () => {
  const power = makeLinearPower(P, { kind: 'eh98' });
  const table = makeSigmaTable(power);

  it('σ(M, z = 0) for 1e8–1e15 Msun matches an independent scipy implementation to 2e-4', () => {
    // Regression values from test/fixtures/scipy (EH98 + top hat, same parameters, scipy quad_vec).
    const want = ref.sigma;
    want.sigma0.forEach((s, i) => expect(rel(table.sigma0(want.mass_msun[i]), s)).toBeLessThan(2e-4));
    expect(rel(table.radiusMpc(want.radius_mass_msun), want.radius_mpc)).toBeLessThan(1e-4);
    want.dlnsigma_dlnm.forEach((d, i) => expect(rel(table.dlnSigmaDlnM(want.slope_mass_msun[i]), d)).toBeLessThan(1e-3));
  });

  it('σ8 normalisation: σ(8/h Mpc) equals the preset σ8 to 1e-12 (definition)', () => {
    expect(rel(power.sigmaR(8 / 0.6766), 0.8102)).toBeLessThan(1e-12);
  });

  it('doubling the k-integration resolution changes σ(M) by < 1e-4 over 1e3–1e18 Msun (convergence)', () => {
    const fine = makeSigmaTable(makeLinearPower(P, { kind: 'eh98' }), 2);
    for (let l = 3; l <= 18; l += 0.25) expect(rel(fine.sigma0(10 ** l), table.sigma0(10 ** l))).toBeLessThan(1e-4);
  });

  describe('self-similar P = A kⁿ: σ²(R) = 9A R^-(3+n) Γ((3+n)/2) / [2π^1.5 Γ((2−n)/2)(n−3)(n−1)] (closed form, standard top-hat result)', () => {
    for (const n of [-2.5, -2, -1.5, -1, -0.5]) {
      it(`n = ${n}: numeric σ(R) matches the closed form to 1e-4 for R = 0.1, 1, 10 Mpc`, () => {
        const pl = makeLinearPower(P, { kind: 'power-law', n, amplitude: 1 });
        for (const r of [0.1, 1, 10]) {
          const s2 = (9 * r ** -(3 + n) * gamma((3 + n) / 2)) / (2 * Math.PI ** 1.5 * gamma((2 - n) / 2) * (n - 3) * (n - 1));
          expect(rel(pl.sigmaR(r), Math.sqrt(s2))).toBeLessThan(1e-4);
        }
      });
    }
    it('n = −2 gives σ² = 3/(10π) at R = 1 exactly (closed form)', () => {
      const pl = makeLinearPower(P, { kind: 'power-law', n: -2, amplitude: 1 });
      expect(rel(pl.sigmaR(1) ** 2, 3 / (10 * Math.PI))).toBeLessThan(1e-4);
    });
  });
});
