import { describe, expect, it } from 'vitest';
import fixture from '../../fixtures/astropy/background.json';
import { makeBackground, type CosmologyParams } from '../../../src/core/cosmology/index.js';

const base = { sigma8: 0.8, ns: 0.96 };
const rel = (a: number, b: number): number => Math.abs(a / b - 1);
/** Redshifts log-spaced and jittered over 0–1100 (deterministic LCG), zero included. */
const redshifts = (n: number): Float64Array => {
  let s = 12345;
  const out = new Float64Array(n);
  for (let i = 1; i < n; i++) {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    out[i] = Math.expm1(Math.log(1101) * (i + s / 2 ** 32) / n);
  }
  return out;
};

describe('luminosityDistancesMpc: the batch of D_L', () => {
  it('Einstein–de Sitter closed form D_L = 2 D_H (1+z)(1 − 1/√(1+z)) (Hogg 1999, eq. 16 with Ω_M = 1) to 1e-9 relative', () => {
    const bg = makeBackground({ ...base, h0: 70, omegaM: 1, omegaB: 0.05, omegaK: 0, tcmbK: 0, nEff: 0, w0: -1, wa: 0 } as CosmologyParams);
    const zs = redshifts(20000);
    const dl = bg.luminosityDistancesMpc(zs);
    let worst = 0;
    for (let i = 1; i < zs.length; i++) worst = Math.max(worst, rel(dl[i], 2 * bg.hubbleDistanceMpc * (1 + zs[i]) * (1 - 1 / Math.sqrt(1 + zs[i]))));
    expect(worst).toBeLessThan(1e-9);
    expect(dl[0]).toBe(0);
  });
  for (const c of fixture.cases) {
    it(`${c.name}: equals the per-point luminosityDistanceMpc to 1e-9 relative over 0 < z ≤ 1100, and astropy ${fixture.meta.version} to 1e-4 (test/fixtures/astropy)`, () => {
      const bg = makeBackground({ ...base, ...c.params } as CosmologyParams);
      const zs = redshifts(20000);
      const dl = bg.luminosityDistancesMpc(zs);
      let worst = 0;
      for (let i = 1; i < zs.length; i++) worst = Math.max(worst, rel(dl[i], bg.luminosityDistanceMpc(zs[i])));
      expect(worst).toBeLessThan(1e-9);
      const rows = c.rows.filter((r) => r.z > 0);
      const fromAstropy = bg.luminosityDistancesMpc(rows.map((r) => r.z));
      rows.forEach((r, i) => expect(rel(fromAstropy[i], r.luminosity_distance_mpc)).toBeLessThan(1e-4));
    });
  }
  it('writes into a given array, and names the first bad redshift by its index', () => {
    const bg = makeBackground({ ...base, ...fixture.cases[0].params } as CosmologyParams);
    const out = new Float64Array(3);
    expect(bg.luminosityDistancesMpc([1, 2, 3], out)).toBe(out);
    expect(out[1]).toBe(bg.luminosityDistancesMpc([2])[0]);
    expect(() => bg.luminosityDistancesMpc([1, Number.NaN])).toThrow(/index 1/);
    expect(() => bg.luminosityDistancesMpc([-1])).toThrow(/index 0/);
    expect(() => bg.luminosityDistancesMpc([1, 2], new Float64Array(1))).toThrow(/fewer than the 2/);
  });
});
