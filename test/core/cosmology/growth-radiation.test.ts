import { describe, expect, it } from 'vitest';
import fixture from '../../fixtures/growth-radiation/growth.json';
import { makeGrowth, parseGrowthModel, PLANCK18, radiationDensity, type CosmologyParams } from '../../../src/core/cosmology/index.js';
import { makeHaloModel } from '../../../src/core/halos/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe('growth with radiation in H(z)', () => {
  it('matches an independent scipy solve_ivp solution (test/fixtures/growth-radiation) for D(z)/D(0) to 1e-9 and f(z) to 1e-8 (two double-precision ODE solutions; the radiation effect itself is 1e-3–1), for ΛCDM, open, CPL and a radiation-heavy universe', () => {
    for (const c of fixture.cases) {
      const p = c.params as CosmologyParams;
      // Ω_r from the project's constants and from scipy.constants (both CODATA 2018).
      expect(rel(radiationDensity(p), c.omega_r)).toBeLessThan(1e-6);
      const g = makeGrowth(p, false, 'with-radiation');
      expect(g.model).toBe('with-radiation');
      for (const r of c.with_radiation.rows) {
        expect(rel(g.d(r.z), r.d_over_d0)).toBeLessThan(1e-9);
        expect(Math.abs(g.rate(r.z) - r.rate)).toBeLessThan(1e-8);
      }
      // The default model is the same equation without Ω_r (same scipy script with Ω_r = 0).
      const g0 = makeGrowth(p);
      for (const r of c.matter_lambda.rows) expect(rel(g0.d(r.z), r.d_over_d0)).toBeLessThan(1e-9);
    }
  });

  it('pure matter + radiation: D(z)/D(0) is the Mészáros growing mode (1 + 3y/2)/(1 + 3/(2a_eq)), y = a/a_eq (closed form), to 1e-7', () => {
    // T_CMB = 10 K and H0 = 30 make radiation weigh Ω_r ≈ 0.08, so a_eq ≈ 0.09 lies inside the range tested.
    const base: CosmologyParams = { ...PLANCK18, h0: 30, tcmbK: 10, omegaB: 0.04, omegaK: 0 };
    const orr = radiationDensity(base);
    const p: CosmologyParams = { ...base, omegaM: 1 - orr };
    const aeq = orr / p.omegaM;
    expect(aeq).toBeGreaterThan(0.05);
    const g = makeGrowth(p, false, 'with-radiation');
    const closed = (z: number): number => (1 + (1.5 / (1 + z)) / aeq) / (1 + 1.5 / aeq);
    for (const z of [0.5, 3, 10, 30, 100, 1e3, 1e6]) expect(rel(g.d(z), closed(z))).toBeLessThan(1e-7);
    // f = dlnD/dlna = (3y/2)/(1 + 3y/2)
    const y = 1 / (1 + 10) / aeq;
    expect(Math.abs(g.rate(10) - (1.5 * y) / (1 + 1.5 * y))).toBeLessThan(1e-7);
  });

  it('with no radiation (T_CMB = 0) both growth models agree to 1e-9 (same equation)', () => {
    const p: CosmologyParams = { ...PLANCK18, tcmbK: 0 };
    const a = makeGrowth(p);
    const b = makeGrowth(p, false, 'with-radiation');
    for (const z of [0, 1, 8, 16, 30, 1e4]) expect(rel(a.d(z), b.d(z))).toBeLessThan(1e-9);
  });

  it('the halo-model option: absent and `matter-lambda` give bit-identical abundances; `with-radiation` raises n(>1e12 Msun, z = 16) by 10–40% (growth raised by ~0.3%, times ν²)', () => {
    const opts = { cosmology: PLANCK18, transfer: { kind: 'eh98' } as const, massFunction: 'sheth-tormen' };
    const h0 = makeHaloModel(opts);
    const h1 = makeHaloModel({ ...opts, growth: 'matter-lambda' });
    const h2 = makeHaloModel({ ...opts, growth: 'with-radiation' });
    expect(h0.growth.model).toBe('matter-lambda');
    for (const z of [8, 12, 16]) {
      expect(h1.slice(z).nAboveNodes).toEqual(h0.slice(z).nAboveNodes);
      expect(h1.growth.d(z)).toBe(h0.growth.d(z));
    }
    const r = h2.nAbove(1e12, 16) / h0.nAbove(1e12, 16);
    expect(r).toBeGreaterThan(1.1);
    expect(r).toBeLessThan(1.4);
    expect(() => makeHaloModel({ ...opts, growth: 'with-radiation' }, h0)).toThrow(/shared growth factor is "matter-lambda"/);
  });

  it('an unknown growth model name is refused with the allowed names', () => {
    expect(() => parseGrowthModel('radiation')).toThrow(/unknown growth model "radiation" \(allowed: matter-lambda, with-radiation\)/);
    expect(() => makeGrowth(PLANCK18, false, 'x' as never)).toThrow(/unknown growth model/);
  });
});
