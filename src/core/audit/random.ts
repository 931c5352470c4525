import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';

/** A seeded stream of uniform and standard-normal deviates (xoroshiro128+ from pure-rand; Box–Muller). */
export interface RandomStream {
  uniform(): number;
  normal(): number;
}

/**
 * The seed of one galaxy's random stream, from the run seed and the galaxy's own id, so a row's
 * numbers do not depend on its position, on other (or bad) rows, or on the number of threads:
 * h = FNV-1a 32-bit over the UTF-8 bytes of the trimmed id (offset basis 2166136261, prime
 * 16777619; Fowler, Noll & Vo, common practice, no source), then h ^ (seed × 0x9e3779b1) passed
 * through the 32-bit finaliser of MurmurHash3 (fmix32: xor-shift 16, × 0x85ebca6b, xor-shift 13,
 * × 0xc2b2ae35, xor-shift 16). Returns a signed 32-bit integer.
 */
export function idSeed(seed: number, id: string): number {
  let h = (fnv1a32(new TextEncoder().encode(id.trim())) ^ Math.imul(seed | 0, 0x9e3779b1)) >>> 0;
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35);
  return (h ^ (h >>> 16)) | 0;
}

/** FNV-1a, 32 bits, over bytes (unsigned result). */
export function fnv1a32(bytes: Uint8Array): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < bytes.length; i++) h = Math.imul(h ^ bytes[i], 0x01000193);
  return h >>> 0;
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
