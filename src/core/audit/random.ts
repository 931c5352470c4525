/** A seeded stream of uniform and standard-normal deviates (xoroshiro128+; Box–Muller). */
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

/**
 * xoroshiro128+ (Blackman & Vigna 2018, "Scrambled linear pseudorandom number generators") on four
 * 32-bit halves, written out so that a draw costs no call into a library and no object: the same
 * state, seeding and output as pure-rand's xoroshiro128plus (s01 = −1, s00 = ~seed, s11 = seed,
 * s10 = 0; out = s00 + s10), and the same uniform: two outputs, 26 + 27 bits, (a·2^27 + b)·2^−53
 * (pure-rand's uniformFloat64). random.test.ts checks both streams agree.
 */
class Xoroshiro128Plus implements RandomStream {
  private s01: number;
  private s00: number;
  private s11: number;
  private s10: number;
  private spare = 0;
  private hasSpare = false;
  constructor(seed: number) {
    this.s01 = -1;
    this.s00 = ~seed;
    this.s11 = seed | 0;
    this.s10 = 0;
  }
  /** One 32-bit output (signed), and the state advanced. */
  next(): number {
    const s00 = this.s00;
    const s01 = this.s01;
    const s10 = this.s10;
    const s11 = this.s11;
    const out = (s00 + s10) | 0;
    const a0 = s10 ^ s00;
    const a1 = s11 ^ s01;
    this.s00 = (s00 << 24) ^ (s01 >>> 8) ^ a0 ^ (a0 << 16);
    this.s01 = (s01 << 24) ^ (s00 >>> 8) ^ a1 ^ ((a1 << 16) | (a0 >>> 16));
    this.s10 = (a1 << 5) ^ (a0 >>> 27);
    this.s11 = (a0 << 5) ^ (a1 >>> 27);
    return out;
  }
  /** Bound to the stream (callers may pass rnd.uniform and rnd.normal around as functions). */
  readonly uniform = (): number => {
    const a = this.next() & 0x3ffffff;
    const b = this.next() & 0x7ffffff;
    return a * 1.4901161193847656e-8 + b * 1.1102230246251565e-16;
  };
  /** Box–Muller, the cosine deviate first and the sine deviate kept for the next call. */
  readonly normal = (): number => {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare;
    }
    let u = this.uniform();
    while (u <= 0) u = this.uniform();
    const v = this.uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    this.spare = r * Math.sin(2 * Math.PI * v);
    this.hasSpare = true;
    return r * Math.cos(2 * Math.PI * v);
  };
}

export function makeRandom(seed: number): RandomStream {
  return new Xoroshiro128Plus(seed);
}
