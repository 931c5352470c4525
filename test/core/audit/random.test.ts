import { describe, expect, it } from 'vitest';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import erf from '@stdlib/math-base-special-erf';
import { ceilingOffsets } from '../../../src/core/audit/galaxy-audit.js';
import { DEVIATE_NORMAL, DEVIATE_UNIFORM, idSeed, makeRandom } from '../../../src/core/audit/random.js';
import { makeScratch } from '../../../src/core/numeric/scratch.js';

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

describe('random stream: a block of deviates (fill) is the same numbers as the calls one by one', () => {
  const U = DEVIATE_UNIFORM;
  const N = DEVIATE_NORMAL;
  for (const [seed, kinds] of [[3, [U, N, U, N, N, N]], [-11, [N, U, N]], [2147483647, [N]], [0, [U]]] as const) {
    it(`seed ${seed}, kinds ${kinds.join('')}: 5 000 draws in blocks of 512 and a rest, then the stream goes on alike`, () => {
      const one = makeRandom(seed);
      const block = makeRandom(seed);
      const m = 5000;
      const outs = kinds.map(() => new Float64Array(m));
      const codes = Uint8Array.from(kinds);
      for (let b0 = 0; b0 < m; b0 += 512) {
        const len = Math.min(512, m - b0);
        block.fill(codes, outs.map((o) => o.subarray(b0, b0 + len)), len);
      }
      let beyond = 0;
      for (let b = 0; b < m; b++) {
        for (let s = 0; s < kinds.length; s++) {
          const v = kinds[s] === U ? one.uniform() : one.normal();
          expect(outs[s][b]).toBe(v);
          // the ziggurat's wedge and tail (|v| beyond the base layer's edge is one sign of it) are among them
          if (kinds[s] === N && Math.abs(v) > 3.442619855899) beyond++;
        }
      }
      if ((kinds as readonly number[]).includes(N)) expect(beyond).toBeGreaterThan(0);
      expect(block.uniform()).toBe(one.uniform());
      expect(block.normal()).toBe(one.normal());
    });
  }
});

describe("the ceiling offsets' deviates: N(0, sd²) dex from a stream of their own", () => {
  it('20 000 offsets at sd = 0.07 dex: mean and standard deviation within 4 standard errors of 0 and 0.07 (a normal sample: sd/√n and sd/√(2n); common practice, no source)', () => {
    const n = 20000;
    const sd = 0.07;
    const o = ceilingOffsets(3, 'CO-1', n, sd, makeScratch());
    let m1 = 0;
    let m2 = 0;
    for (let i = 0; i < n; i++) {
      m1 += o[i];
      m2 += o[i] * o[i];
    }
    const mean = m1 / n;
    const s = Math.sqrt(m2 / n - mean * mean);
    expect(Math.abs(mean)).toBeLessThan((4 * sd) / Math.sqrt(n));
    expect(Math.abs(s - sd)).toBeLessThan((4 * sd) / Math.sqrt(2 * n));
    // not the galaxy's own stream: its first normals are other numbers
    const own = makeRandom(idSeed(3, 'CO-1'));
    expect(o[0]).not.toBe(sd * own.normal());
  });
});
