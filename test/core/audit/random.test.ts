import { describe, expect, it } from 'vitest';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { makeRandom } from '../../../src/core/audit/random.js';

// The audit's generator is xoroshiro128+ written out; the reference is pure-rand's own
// xoroshiro128plus + uniformFloat64 (a general-purpose npm library), and Box–Muller is written here
// from its definition (Box & Muller 1958, Ann. Math. Stat. 29, 610: r = √(−2 ln u), r cos 2πv, r sin 2πv).
describe('random stream: the same numbers as the reference generator', () => {
  for (const seed of [0, 1, -7, 123456789, -2147483647, 2147483647]) {
    it(`seed ${seed}: 10 000 uniforms equal pure-rand's, bit for bit`, () => {
      const ref = xoroshiro128plus(seed);
      const ours = makeRandom(seed);
      for (let i = 0; i < 10000; i++) expect(ours.uniform()).toBe(uniformFloat64(ref));
    });
    it(`seed ${seed}: normals are Box–Muller pairs of those uniforms (cosine first), also when the methods are passed around`, () => {
      const ref = xoroshiro128plus(seed);
      const { normal } = makeRandom(seed);
      for (let i = 0; i < 2000; i++) {
        let u = uniformFloat64(ref);
        while (u <= 0) u = uniformFloat64(ref);
        const v = uniformFloat64(ref);
        const r = Math.sqrt(-2 * Math.log(u));
        expect(normal()).toBe(r * Math.cos(2 * Math.PI * v));
        expect(normal()).toBe(r * Math.sin(2 * Math.PI * v));
      }
    });
  }
});
