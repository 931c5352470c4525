/** A seeded stream of uniform and standard-normal deviates (xoroshiro128+; the ziggurat for normals). */
export interface RandomStream {
  uniform(): number;
  normal(): number;
  /**
   * For each of m draws in turn, one deviate of each kind in `kinds` (DEVIATE_UNIFORM or
   * DEVIATE_NORMAL), into outs[s][b] for kind s of draw b: the same numbers in the same order as the
   * calls uniform() and normal() one by one, with the generator's state held in locals over the block.
   */
  fill(kinds: Uint8Array, outs: readonly Float64Array[], m: number): void;
}

/** The kinds of deviate RandomStream.fill makes. */
export const DEVIATE_UNIFORM = 0;
export const DEVIATE_NORMAL = 1;

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
  /**
   * Prototype methods, not per-stream arrow functions: every galaxy's stream then calls the same
   * functions, which the compiler inlines into the draw loop (per-object closures defeat that).
   */
  uniform(): number {
    const a = this.next() & 0x3ffffff;
    const b = this.next() & 0x7ffffff;
    return a * 1.4901161193847656e-8 + b * 1.1102230246251565e-16;
  }
  fill(kinds: Uint8Array, outs: readonly Float64Array[], m: number): void {
    const ns = kinds.length;
    let s00 = this.s00;
    let s01 = this.s01;
    let s10 = this.s10;
    let s11 = this.s11;
    for (let b = 0; b < m; b++) {
      for (let s = 0; s < ns; s++) {
        // both kinds start with two outputs of next(), written out (the same steps)
        const o1 = (s00 + s10) | 0;
        let a0 = s10 ^ s00;
        let a1 = s11 ^ s01;
        let t00 = (s00 << 24) ^ (s01 >>> 8) ^ a0 ^ (a0 << 16);
        s01 = (s01 << 24) ^ (s00 >>> 8) ^ a1 ^ ((a1 << 16) | (a0 >>> 16));
        s00 = t00;
        s10 = (a1 << 5) ^ (a0 >>> 27);
        s11 = (a0 << 5) ^ (a1 >>> 27);
        const o2 = (s00 + s10) | 0;
        a0 = s10 ^ s00;
        a1 = s11 ^ s01;
        t00 = (s00 << 24) ^ (s01 >>> 8) ^ a0 ^ (a0 << 16);
        s01 = (s01 << 24) ^ (s00 >>> 8) ^ a1 ^ ((a1 << 16) | (a0 >>> 16));
        s00 = t00;
        s10 = (a1 << 5) ^ (a0 >>> 27);
        s11 = (a0 << 5) ^ (a1 >>> 27);
        let v: number;
        if (kinds[s] === DEVIATE_UNIFORM) {
          v = (o1 & 0x3ffffff) * 1.4901161193847656e-8 + (o2 & 0x7ffffff) * 1.1102230246251565e-16;
        } else {
          const iz = o2 >>> 25;
          if (Math.abs(o1) < ZIG_K[iz]) v = o1 * ZIG_W[iz];
          else {
            // the rare wedge and tail (~1.2%) draw from the stream itself: its state is handed over and taken back
            this.s00 = s00;
            this.s01 = s01;
            this.s10 = s10;
            this.s11 = s11;
            v = this.normalBeyond(o1, iz);
            s00 = this.s00;
            s01 = this.s01;
            s10 = this.s10;
            s11 = this.s11;
          }
        }
        outs[s][b] = v;
      }
    }
    this.s00 = s00;
    this.s01 = s01;
    this.s10 = s10;
    this.s11 = s11;
  }

  /**
   * Standard normal by the ziggurat of Marsaglia & Tsang (2000, J. Stat. Softw. 5(8), "The ziggurat
   * method for generating random variables"), 128 layers: one 32-bit output is the signed position,
   * the top 7 bits of the next the layer (separate bits, which avoids the correlation of layer and
   * value Doornik 2005 found in the original); ~98.8% of draws end at the first comparison, the rest
   * use the wedge test or Marsaglia's exponential tail beyond r = 3.442619855899.
   */
  normal(): number {
    // the first layer test, kept small so that it is inlined where it is called; the rest (~1.2%) below
    const j = this.next();
    const iz = this.next() >>> 25;
    if (Math.abs(j) < ZIG_K[iz]) return j * ZIG_W[iz];
    return this.normalBeyond(j, iz);
  }

  /** The ziggurat's wedge and tail for the position j in layer iz that failed the first test, then new tries. */
  private normalBeyond(j: number, iz: number): number {
    for (;;) {
      const x = j * ZIG_W[iz];
      if (iz === 0) {
        // the tail beyond r: x = −ln(u1)/r until −2 ln(u2) > x²
        let tx: number;
        let ty: number;
        do {
          tx = -Math.log(1 - this.uniform()) / ZIG_R;
          ty = -Math.log(1 - this.uniform());
        } while (ty + ty < tx * tx);
        return j > 0 ? ZIG_R + tx : -ZIG_R - tx;
      }
      // the wedge between layers iz and iz − 1
      if (ZIG_F[iz] + this.uniform() * (ZIG_F[iz - 1] - ZIG_F[iz]) < Math.exp(-0.5 * x * x)) return x;
      j = this.next();
      iz = this.next() >>> 25;
      if (Math.abs(j) < ZIG_K[iz]) return j * ZIG_W[iz];
    }
  }
}

/** Ziggurat tables (Marsaglia & Tsang 2000, section 3, 128 layers): r = x of the base layer, v = the area of each layer. */
const ZIG_R = 3.442619855899;
const ZIG_V = 9.91256303526217e-3;
const ZIG_K = new Float64Array(128);
const ZIG_W = new Float64Array(128);
const ZIG_F = new Float64Array(128);
{
  const m = 2147483648; // 2^31: positions are signed 32-bit integers
  let dn = ZIG_R;
  let tn = dn;
  const q = ZIG_V / Math.exp(-0.5 * dn * dn);
  ZIG_K[0] = (dn / q) * m;
  ZIG_K[1] = 0;
  ZIG_W[0] = q / m;
  ZIG_W[127] = dn / m;
  ZIG_F[0] = 1;
  ZIG_F[127] = Math.exp(-0.5 * dn * dn);
  for (let i = 126; i >= 1; i--) {
    dn = Math.sqrt(-2 * Math.log(ZIG_V / dn + Math.exp(-0.5 * dn * dn)));
    ZIG_K[i + 1] = (dn / tn) * m;
    tn = dn;
    ZIG_F[i] = Math.exp(-0.5 * dn * dn);
    ZIG_W[i] = dn / m;
  }
}

export function makeRandom(seed: number): RandomStream {
  return new Xoroshiro128Plus(seed);
}
