import { describe, expect, it } from 'vitest';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import erf from '@stdlib/math-base-special-erf';
import { makeRandom } from '../../../src/core/audit/random.js';

// The audit's generator is xoroshiro128+ written out; the reference is pure-rand's own
// xoroshiro128plus + uniformFloat64 (a general-purpose npm library). The normals (a ziggurat) are
// checked against the normal distribution itself: Φ from @stdlib's erf (a general-purpose npm
// library), closed-form tail probabilities and moments.
describe('random stream: the same numbers as the reference generator', () => {
  for (const seed of [0, 1, -7, 123456789, -2147483647, 2147483647]) {
    it(`seed ${seed}: 10 000 uniforms equal pure-rand's, bit for bit`, () => {
      const ref = xoroshiro128plus(seed);
      const ours = makeRandom(seed);
      for (let i = 0; i < 10000; i++) expect(ours.uniform()).toBe(uniformFloat64(ref));
    });
  }
});

describe('normal deviates: the standard normal distribution', () => {
  const N = 1_000_000;
  const phi = (x: number): number => 0.5 * (1 + erf(x / Math.SQRT2));
  for (const seed of [1, 42, -99]) {
    const rnd = makeRandom(seed);
    const x = Float64Array.from({ length: N }, () => rnd.normal());
    it(`seed ${seed}: Kolmogorov–Smirnov distance to Φ below 1.95/√N (the 0.1% critical value; Kolmogorov's asymptotic distribution)`, () => {
      const s = Float64Array.from(x).sort();
      let d = 0;
      for (let i = 0; i < N; i++) {
        const f = phi(s[i]);
        d = Math.max(d, Math.abs(f - i / N), Math.abs(f - (i + 1) / N));
      }
      expect(d).toBeLessThan(1.95 / Math.sqrt(N));
    });
    it(`seed ${seed}: mean, variance, kurtosis and lag-1 correlation within 4 standard errors of 0, 1, 3, 0`, () => {
      let m1 = 0;
      let m2 = 0;
      let m4 = 0;
      let c1 = 0;
      for (let i = 0; i < N; i++) {
        m1 += x[i];
        m2 += x[i] ** 2;
        m4 += x[i] ** 4;
        if (i > 0) c1 += x[i] * x[i - 1];
      }
      // standard errors for a normal sample: 1/√N, √(2/N), √(96/N) for Σx⁴/N (its variance is 105 − 9), 1/√N
      expect(Math.abs(m1 / N)).toBeLessThan(4 / Math.sqrt(N));
      expect(Math.abs(m2 / N - 1)).toBeLessThan(4 * Math.sqrt(2 / N));
      expect(Math.abs(m4 / N - 3)).toBeLessThan(4 * Math.sqrt(96 / N));
      expect(Math.abs(c1 / (N - 1))).toBeLessThan(4 / Math.sqrt(N));
    });
    it(`seed ${seed}: the tails beyond the ziggurat's base (|x| > 3.4426) and |x| > 4 as often as erfc says, within 4σ of the binomial count`, () => {
      for (const t of [3.442619855899, 4]) {
        const p = 2 * (1 - phi(t));
        const want = N * p;
        const got = x.reduce((c, v) => c + (Math.abs(v) > t ? 1 : 0), 0);
        expect(Math.abs(got - want)).toBeLessThan(4 * Math.sqrt(want));
      }
    });
  }
});
