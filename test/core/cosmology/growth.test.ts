import { describe, expect, it } from 'vitest';
import ref from '../../fixtures/scipy/regression.json';
import { makeGrowth, PLANCK18, type CosmologyParams } from '../../../src/core/cosmology/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const flat = (om: number, extra: Partial<CosmologyParams> = {}): CosmologyParams => ({ ...PLANCK18, omegaM: om, omegaB: 0.045, tcmbK: 0, nEff: 0, ...extra });

describe('linear growth', () => {
  it('Einstein–de Sitter: D(z) = 1/(1+z) exactly (closed form), to 1e-9', () => {
    const g = makeGrowth(flat(1));
    for (const z of [0.5, 3, 10, 100]) expect(rel(g.d(z), 1 / (1 + z))).toBeLessThan(1e-9);
  });

  it('flat Ω_m = 0.3: Heath integral D(a = 1) = 0.778981 (D → a early) matches an independent scipy implementation to 1e-6', () => {
    // Regression value from test/fixtures/scipy (scipy quad of the Heath integral).
    expect(rel(makeGrowth(flat(ref.growth.heath_flat_om_0p3.omegaM)).dToday, ref.growth.heath_flat_om_0p3.d_today)).toBeLessThan(1e-6);
  });

  it('the ODE and the exact Heath integral agree to 1e-6 for ΛCDM and for an open model (closed form vs quadrature)', () => {
    for (const p of [flat(0.3111), flat(0.3, { omegaK: 0.1 })]) {
      const a = makeGrowth(p);
      const b = makeGrowth(p, true);
      expect(a.method).toBe('heath-integral');
      expect(b.method).toBe('ode');
      for (const z of [0, 1, 5, 10, 20]) expect(rel(a.d(z), b.d(z))).toBeLessThan(1e-6);
    }
  });

  it('Ω_m = 0.3111: D(z)/D(0) at z = 1–20 matches an independent scipy implementation to 1e-5', () => {
    // Regression values from test/fixtures/scipy (scipy quad of the Heath integral).
    const want = ref.growth.heath_flat_om_0p3111;
    const g = makeGrowth(flat(want.omegaM));
    want.z.forEach((z, i) => expect(rel(g.d(z), want.d_ratio[i])).toBeLessThan(1e-5));
  });

  it('CPL w0 = −0.9, wa = 0.2, Ω_m = 0.3: ODE D(a = 1) = 0.737780 and f(0) = 0.50975 (independent scipy implementation) to 1e-5 / 1e-4', () => {
    // Regression values from test/fixtures/scipy (scipy solve_ivp, DOP853, of the same growth equation).
    const want = ref.growth.cpl;
    const g = makeGrowth(flat(want.omegaM, { w0: want.w0, wa: want.wa }));
    expect(g.method).toBe('ode');
    expect(rel(g.dToday, want.d_today)).toBeLessThan(1e-5);
    expect(Math.abs(g.rate(0) - want.rate_z0)).toBeLessThan(1e-4);
  });
});
