import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { makeBackground, PLANCK18, type CosmologyParams } from '../../src/core/cosmology/index.js';
import { makeHaloModel, makeSurveyHalos } from '../../src/core/halos/index.js';
import { estimateMass, makePopulationCache } from '../../src/core/stars/index.js';
import { makeCeilingTable } from '../../src/core/audit/index.js';

const cosmoArb = fc.record({
  h0: fc.double({ min: 50, max: 90, noNaN: true }),
  omegaM: fc.double({ min: 0.15, max: 0.6, noNaN: true }),
  omegaK: fc.double({ min: -0.1, max: 0.1, noNaN: true }),
  w0: fc.double({ min: -1.5, max: -0.6, noNaN: true }),
  wa: fc.double({ min: -0.5, max: 0.3, noNaN: true }),
  tcmbK: fc.oneof(fc.constant(0), fc.double({ min: 1, max: 3, noNaN: true })),
});
const asParams = (c: { h0: number; omegaM: number; omegaK: number; w0: number; wa: number; tcmbK: number }): CosmologyParams => ({ ...PLANCK18, ...c, omegaB: 0.15 * c.omegaM });

describe('numeric core across its domain, property-based', () => {
  it('background for extreme but valid cosmologies: finite everywhere in 0 ≤ z ≤ 1100, D_C increasing, age decreasing', () => {
    fc.assert(
      fc.property(cosmoArb, fc.array(fc.double({ min: 0, max: 1100, noNaN: true }), { minLength: 2, maxLength: 6 }), (c, zs) => {
        const bg = makeBackground(asParams(c));
        const s = [...zs].sort((a, b) => a - b);
        for (let i = 0; i < s.length; i++) {
          const z = s[i];
          for (const v of [bg.ageGyr(z), bg.comovingDistanceMpc(z), bg.luminosityDistanceMpc(z), bg.dVdzdOmegaMpc3(z), bg.lookbackGyr(z)]) expect(Number.isFinite(v)).toBe(true);
          if (i && s[i] > s[i - 1] * (1 + 1e-9) + 1e-9) {
            expect(bg.comovingDistanceMpc(s[i])).toBeGreaterThan(bg.comovingDistanceMpc(s[i - 1]));
            expect(bg.ageGyr(s[i])).toBeLessThan(bg.ageGyr(s[i - 1]));
          }
        }
      }),
      { numRuns: 60 },
    );
  });

  const hm = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen' });
  it('n(>M) decreases with M over 1e3–1e18 Msun and is finite and ≥ 0', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 20, noNaN: true }), fc.double({ min: 3, max: 17.9, noNaN: true }), fc.double({ min: 0.01, max: 0.1, noNaN: true }), (z, l, dl) => {
        const s = hm.slice(z);
        const a = s.nAbove(10 ** l);
        const b = s.nAbove(10 ** (l + dl));
        expect(Number.isFinite(a) && a >= 0).toBe(true);
        expect(b).toBeLessThanOrEqual(a);
      }),
      { numRuns: 200 },
    );
  });

  it('for M above the non-linear mass (ν > 1), n(>M) falls with redshift', () => {
    fc.assert(
      fc.property(fc.double({ min: 8, max: 15, noNaN: true }), fc.double({ min: 0, max: 15, noNaN: true }), fc.double({ min: 0.1, max: 3, noNaN: true }), (l, z, dz) => {
        const m = 10 ** l;
        fc.pre(hm.nu(m, z) > 1);
        expect(hm.nAbove(m, z + dz)).toBeLessThan(hm.nAbove(m, z));
      }),
      { numRuns: 150 },
    );
  });

  it('the ceiling (rarest halo at any quantile) rises with survey area', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1000, noNaN: true }), fc.double({ min: 1.5, max: 20, noNaN: true }), fc.double({ min: 0.5, max: 0.999, noNaN: true }), (area, f, q) => {
        const a = makeSurveyHalos(hm, area, 8, 9).quantile(q);
        const b = makeSurveyHalos(hm, area * f, 8, 9).quantile(q);
        expect(b).toBeGreaterThan(a);
      }),
      { numRuns: 25 },
    );
  });

  it('quantiles at their edges (1e-6 and 1 − 1e-9) stay finite and ordered', () => {
    const c = makeCeilingTable(hm, 40, 0.5, 5, 12);
    const lo = c.haloMassAt(9, 1e-6);
    const mid = c.haloMassAtQuantile(9);
    const hi = c.haloMassAt(9, 1 - 1e-9);
    expect(Number.isFinite(lo) && Number.isFinite(hi)).toBe(true);
    expect(lo).toBeLessThan(mid);
    expect(mid).toBeLessThan(hi);
  });

  const cache = makePopulationCache();
  const bg = makeBackground(PLANCK18);
  it('a top-heavy IMF never raises the mass for the same UV light (any z, M_UV, SFH)', () => {
    fc.assert(
      fc.property(fc.double({ min: 6, max: 18, noNaN: true }), fc.double({ min: -24, max: -16, noNaN: true }), fc.constantFrom('burst', 'constant', 'exp-declining', 'exp-rising'), (z, muv, kind) => {
        const sfh = kind === 'burst' || kind === 'constant' ? { kind } : { kind, tauMyr: 100 };
        const b = { kind: 'absolute-uv', muv } as const;
        const s = estimateMass(cache, 'salpeter', sfh as never, b, { kind: 'none' }, z, bg);
        for (const th of ['top-heavy-flat', 'top-heavy-cmb']) {
          const t = estimateMass(cache, th, sfh as never, b, { kind: 'none' }, z, bg);
          expect(t.log10MstarBest).toBeLessThanOrEqual(s.log10MstarBest + 1e-9);
          expect(t.log10MstarMin).toBeLessThanOrEqual(s.log10MstarMin + 1e-9);
        }
      }),
      { numRuns: 40 },
    );
  });
});
