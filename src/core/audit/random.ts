import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';

/** A seeded stream of uniform and standard-normal deviates (xoroshiro128+ from pure-rand; Box–Muller). */
export interface RandomStream {
  uniform(): number;
  normal(): number;
}

/** Mixes a user seed and a row index into one 32-bit seed (splitmix-style multiply–xorshift). */
export function mixSeed(seed: number, index: number): number {
  let h = (Math.imul(seed | 0, 0x9e3779b1) ^ Math.imul(index + 1, 0x85ebca6b)) >>> 0;
  h = Math.imul(h ^ (h >>> 16), 0x7feb352d) >>> 0;
  h = Math.imul(h ^ (h >>> 15), 0x846ca68b) >>> 0;
  return (h ^ (h >>> 16)) | 0;
}

export function makeRandom(seed: number): RandomStream {
  const rng = xoroshiro128plus(seed);
  let spare: number | undefined;
  const uniform = (): number => uniformFloat64(rng);
  return {
    uniform,
    normal: () => {
      if (spare !== undefined) {
        const s = spare;
        spare = undefined;
        return s;
      }
      let u = uniform();
      while (u <= 0) u = uniform();
      const v = uniform();
      const r = Math.sqrt(-2 * Math.log(u));
      spare = r * Math.sin(2 * Math.PI * v);
      return r * Math.cos(2 * Math.PI * v);
    },
  };
}
