import { describe, expect, it } from 'vitest';
import { makeGrowth, PLANCK18, type CosmologyParams } from '../../../src/core/cosmology/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const flat = (om: number, extra: Partial<CosmologyParams> = {}): CosmologyParams => ({ ...PLANCK18, omegaM: om, omegaB: 0.045, tcmbK: 0, nEff: 0, ...extra });

describe('linear growth', () => {
  it('Einstein–de Sitter: D(z) = 1/(1+z) exactly (closed form), to 1e-9', () => {
    const g = makeGrowth(flat(1));
    for (const z of [0.5, 3, 10, 100]) expect(rel(g.d(z), 1 / (1 + z))).toBeLessThan(1e-9);
  });

  it('flat Ω_m = 0.3: Heath integral D(a = 1) = 0.778981 (D → a early) matches an independent scipy implementation to 1e-6', () => {
    expect(rel(makeGrowth(flat(0.3)).dToday, 0.778981)).toBeLessThan(1e-6);
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
    const g = makeGrowth(flat(0.3111));
    const zs = [1, 3, 6, 8, 10, 12, 15, 20];
    const want = [0.608041, 0.316276, 0.181642, 0.141365, 0.115691, 0.097904, 0.079554, 0.060616];
    zs.forEach((z, i) => expect(rel(g.d(z), want[i])).toBeLessThan(1e-5));
  });

  it('CPL w0 = −0.9, wa = 0.2, Ω_m = 0.3: ODE D(a = 1) = 0.737780 and f(0) = 0.50975 (independent scipy implementation) to 1e-5 / 1e-4', () => {
    const g = makeGrowth(flat(0.3, { w0: -0.9, wa: 0.2 }));
    expect(g.method).toBe('ode');
    expect(rel(g.dToday, 0.73778)).toBeLessThan(1e-5);
    expect(Math.abs(g.rate(0) - 0.50975)).toBeLessThan(1e-4);
  });
});
