import type { Background } from '../cosmology/background.js';
import { LYMAN_ALPHA_UM } from '../constants.js';
import { attenuationFromBeta } from '../stars/dust.js';
import { ML_AGE_MIN_MYR } from '../stars/mass-to-light.js';
import { MUV_REST_UM } from '../stars/mass-estimate.js';
import { apparentFromAbsolute, log10LnuFromApparent, MODEL_LAMBDA_MAX_UM } from '../stars/photometry.js';
import type { Scratch } from '../numeric/scratch.js';
import { DEVIATE_NORMAL, DEVIATE_UNIFORM, makeRandom } from './random.js';
import type { GalaxyInput } from './sample.js';

/**
 * ln D_L and ln t tabulated on 4096 uniform nodes in ln(1+z) for 0.01 ≤ z ≤ 31 and interpolated
 * linearly (error < 1e-7 relative against the direct integrals: the node spacing is 8e-4 in ln(1+z)),
 * so a draw costs two table lookups.
 */
interface FastBackground {
  /** The tables themselves (x = ln(1+z) on x0 + i h), for the benchmarks' side-by-side scripts. */
  readonly x0: number;
  /** The upper end of the tables' range, ln(1 + 31). */
  readonly x1: number;
  readonly h: number;
  readonly lnDl: Float64Array;
  readonly lnAge: Float64Array;
  luminosityDistanceMpc(z: number): number;
  ageGyr(z: number): number;
  /** ln D_L [Mpc] and ln t [Gyr] from x = ln(1+z), without the exp/log round trip. */
  lnDlAt(x: number): number;
  lnAgeAt(x: number): number;
}
const fastCache = new WeakMap<Background, FastBackground>();
export function fastBackground(bg: Background): FastBackground {
  let f = fastCache.get(bg);
  if (f) return f;
  const n = 4096;
  const x0 = Math.log1p(0.01);
  const x1 = Math.log1p(31);
  const h = (x1 - x0) / (n - 1);
  const ld = new Float64Array(n);
  const la = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const z = Math.expm1(x0 + h * i);
    ld[i] = Math.log(bg.luminosityDistanceMpc(z));
    la[i] = Math.log(bg.ageGyr(z));
  }
  const lnAt = (tab: Float64Array, x: number): number => {
    const t = (x - x0) / h;
    const i = Math.min(Math.max(Math.floor(t), 0), n - 2);
    const u = t - i;
    return tab[i] + u * (tab[i + 1] - tab[i]);
  };
  const inRange = (z: number): boolean => z >= 0.01 && z <= 31;
  f = {
    x0,
    x1,
    h,
    lnDl: ld,
    lnAge: la,
    luminosityDistanceMpc: (z) => (inRange(z) ? Math.exp(lnAt(ld, Math.log1p(z))) : bg.luminosityDistanceMpc(z)),
    ageGyr: (z) => (inRange(z) ? Math.exp(lnAt(la, Math.log1p(z))) : bg.ageGyr(z)),
    lnDlAt: (x) => (x >= x0 && x <= x1 ? lnAt(ld, x) : Math.log(bg.luminosityDistanceMpc(Math.expm1(x)))),
    lnAgeAt: (x) => (x >= x0 && x <= x1 ? lnAt(la, x) : Math.log(bg.ageGyr(Math.expm1(x)))),
  };
  fastCache.set(bg, f);
  return f;
}

const tabulatedCache = new WeakMap<Background, Background>();
/**
 * The background with D_L and the age read from the tables above inside 0.01 ≤ z ≤ 31 (relative error
 * < 1e-7) and everything else the background's own: for per-draw work such as the time budget. One
 * object per background, so caches keyed on it are built once.
 */
export function tabulatedBackground(bg: Background): Background {
  let t = tabulatedCache.get(bg);
  if (!t) {
    const f = fastBackground(bg);
    t = Object.assign(Object.create(bg) as Background, { ageGyr: f.ageGyr, luminosityDistanceMpc: f.luminosityDistanceMpc });
    tabulatedCache.set(bg, t);
  }
  return t;
}

/**
 * The Monte Carlo draws of one galaxy, shared by every IMF (common random numbers):
 * redshift from the primary solution (split normal with σ = z − z_lo below and z_hi − z above; a
 * point if no interval) or, with probability p_alt, from the alternative (a normal of the same
 * fractional width in 1+z); population age log-uniform from 1 Myr to the cosmic age at the drawn z;
 * magnitude, β and reported-mass errors as normals. A muv row is carried as the apparent magnitude it
 * implies at the nominal z, in the observed band that samples 1500 Å there.
 */
export interface GalaxyDraws {
  readonly n: number;
  readonly z: Float64Array;
  /** ln(1 + z) of each draw (the variable of the background tables), and ln t(z) [Gyr] read there. */
  readonly lnOnePlusZ: Float64Array;
  readonly lnAgeGyr: Float64Array;
  /** log10 of the population age (Myr) and of the rest wavelength (μm; NaN where excluded). */
  readonly log10AgeMyr: Float64Array;
  readonly log10LambdaRestUm: Float64Array;
  /** For brightness rows: log10 of the dust-corrected L_ν; NaN = excluded draw. */
  readonly log10Lnu: Float64Array;
  /** For reported-mass rows: log10 M* (under imf_ref) before IMF rescaling. */
  readonly log10MassRef: Float64Array;
  /** Number of draws whose band fell outside the model's rest range (excluded). */
  readonly excluded: number;
}

/** Draws made in steps: extend(n) adds draws up to n in all, continuing the same random stream. */
export interface GalaxyDrawStream {
  /** The draws made so far (n and excluded grow with each extend; the arrays hold `capacity` values). */
  readonly draws: GalaxyDraws;
  readonly capacity: number;
  extend(n: number): void;
}

/** Draws whose deviates are made in one go before their arithmetic (galaxyDrawStream), and the buffers that hold them. */
const DEVIATE_BLOCK = 512;

/** One deviate of each kind per draw (entries 0 … m − 1 for m draws): a uniform for the alternative, normals for z, magnitude, β and mass, a uniform for the age. */
export interface Deviates {
  readonly alt: Float64Array;
  readonly z: Float64Array;
  readonly age: Float64Array;
  readonly mag: Float64Array;
  readonly beta: Float64Array;
  readonly mass: Float64Array;
}
/** A galaxy's first n draws' deviates, kept for its draws at fixed redshifts (galaxyDeviates). */
export type KeptDeviates = Deviates & { readonly n: number };
const deviateBlock = (n: number): Deviates => ({ alt: new Float64Array(n), z: new Float64Array(n), age: new Float64Array(n), mag: new Float64Array(n), beta: new Float64Array(n), mass: new Float64Array(n) });
const block = deviateBlock(DEVIATE_BLOCK);

/**
 * A galaxy's deviates, draw after draw, from its one random stream: only those the row needs are drawn,
 * always in the same order per draw (alternative, redshift, age, magnitude, β, mass), so the main run and
 * the fixed-redshift checks of one galaxy share their random numbers (common random numbers); the others
 * keep a constant (alternative 1, the rest 0). next(m, into) fills entries 0 … m − 1 of into with the next
 * m draws' deviates.
 */
function deviateStream(g: GalaxyInput, seed: number): (m: number, into: Deviates) => void {
  const rnd = makeRandom(seed);
  const sLo = g.zLo !== undefined ? g.z - g.zLo : 0;
  const sHi = g.zHi !== undefined ? g.zHi - g.z : 0;
  const needAlt = g.zAlt !== undefined && g.pAlt > 0;
  const slots: [boolean, number, keyof Deviates, number][] = [
    [needAlt, DEVIATE_UNIFORM, 'alt', 1],
    [sLo > 0 || sHi > 0 || needAlt, DEVIATE_NORMAL, 'z', 0],
    [true, DEVIATE_UNIFORM, 'age', 0],
    [g.log10Mstar === undefined && g.magErr > 0, DEVIATE_NORMAL, 'mag', 0],
    [g.log10Mstar === undefined && g.beta !== undefined && g.betaErr > 0, DEVIATE_NORMAL, 'beta', 0],
    [g.log10Mstar !== undefined && g.log10MstarErr > 0, DEVIATE_NORMAL, 'mass', 0],
  ];
  const drawn = slots.filter(([need]) => need);
  const unused = slots.filter(([need]) => !need);
  const kindCodes = Uint8Array.from(drawn, ([, kind]) => kind);
  return (m, into) => {
    rnd.fill(kindCodes, drawn.map(([, , key]) => into[key]), m);
    for (const [, , key, v] of unused) into[key].fill(v, 0, m);
  };
}

/**
 * The deviates of a galaxy's first n draws, made once and kept: draws at fixed redshifts (drawGalaxy with
 * a zOverride) read them instead of making them again, value for value the same (one stream, read in the
 * same order).
 */
export function galaxyDeviates(g: GalaxyInput, n: number, seed: number): KeptDeviates {
  const d = deviateBlock(n);
  deviateStream(g, seed)(n, d);
  return { ...d, n };
}

/**
 * @param scratch where the draws' arrays come from (reused between calls; valid until the next call
 *   with the same scratch); fresh arrays when absent.
 */
export function drawGalaxy(g: GalaxyInput, n: number, seed: number, bgFull: Background, zOverride?: { z: number; alt: boolean }, scratch?: Scratch, kept?: KeptDeviates): GalaxyDraws {
  const s = galaxyDrawStream(g, n, seed, bgFull, zOverride, scratch, kept);
  s.extend(n);
  return s.draws;
}

/**
 * The draws of drawGalaxy, made block by block: the first m draws are the same whatever the blocks
 * (one stream, the same deviates in the same order per draw), so a run that stops after m draws has
 * exactly the first m draws of a longer run.
 * @param capacity the most draws extend may reach.
 * @param kept the galaxy's deviates made before (galaxyDeviates with the same seed, for at least
 *   `capacity` draws): read instead of the stream, the same numbers.
 */
export function galaxyDrawStream(g: GalaxyInput, capacity: number, seed: number, bgFull: Background, zOverride?: { z: number; alt: boolean }, scratch?: Scratch, kept?: KeptDeviates): GalaxyDrawStream {
  if (kept && kept.n < capacity) throw new RangeError(`draws: ${capacity} asked for, ${kept.n} deviates kept`);
  const next = kept ? undefined : deviateStream(g, seed);
  const bg = fastBackground(bgFull);
  const vec = (name: string): Float64Array => (scratch ? scratch.f64(name, capacity) : new Float64Array(capacity));
  const z = vec('draws.z');
  const lnZ1 = vec('draws.x');
  const lnT = vec('draws.lnAge');
  const lL = vec('draws.lnu');
  const lM = vec('draws.mass');
  const lAge = vec('draws.age');
  const lLam = vec('draws.lambda');
  const sLo = g.zLo !== undefined ? g.z - g.zLo : 0;
  const sHi = g.zHi !== undefined ? g.zHi - g.z : 0;
  const fracWidth = (0.5 * (sLo + sHi)) / (1 + g.z);
  const lambdaObs = g.mAB !== undefined ? g.lambdaObsUm! : MUV_REST_UM * (1 + g.z);
  const mApp = g.mAB ?? (g.muv !== undefined ? apparentFromAbsolute(g.muv, bg.luminosityDistanceMpc(g.z), g.z) : Number.NaN);
  const dl0 = bg.luminosityDistanceMpc(g.z);
  // a reported mass moved from z to zk scales as D_L² (1+z)⁻¹: ln D_L and ln(1+z) at the row's own z, once
  const lnDl0 = Math.log(dl0);
  const x0 = Math.log1p(g.z);
  const lObs = Math.log10(lambdaObs);
  const l0 = Math.log10(ML_AGE_MIN_MYR);
  const { x0: tx0, h: th, lnAge: tAge, lnDl: tDl } = bg;
  const tn = tAge.length;
  const tx1 = bg.x1;
  const draws = { n: 0, z, lnOnePlusZ: lnZ1, lnAgeGyr: lnT, log10AgeMyr: lAge, log10LambdaRestUm: lLam, log10Lnu: lL, log10MassRef: lM, excluded: 0 };
  /** The deviates of draws k … k + m − 1 into the block buffers: from the stream, or copied from those kept. */
  const deviates = (k: number, m: number): void => {
    if (next) next(m, block);
    else for (const key of ['alt', 'z', 'age', 'mag', 'beta', 'mass'] as const) block[key].set(kept![key].subarray(k, k + m));
  };
  // at a fixed redshift, ln(1+z), ln t [Gyr] and ln D_L [Mpc] are the same for every draw: read once
  const xFixed = zOverride ? Math.log1p(zOverride.z) : 0;
  const ltFixed = zOverride ? bg.lnAgeAt(xFixed) : 0;
  const lnDlFixed = zOverride ? bg.lnDlAt(xFixed) : 0;
  const extend = (n: number): void => {
    if (n > capacity) throw new RangeError(`draws: ${n} asked for, room for ${capacity}`);
    let excluded = 0;
    for (let k = draws.n; k < n; k++) {
      const b = (k - draws.n) % DEVIATE_BLOCK;
      if (b === 0) deviates(k, Math.min(DEVIATE_BLOCK, n - k));
      const uAlt = block.alt[b];
      const gz = block.z[b];
      const uAge = block.age[b];
      const gMag = block.mag[b];
      const gBeta = block.beta[b];
      const gMass = block.mass[b];
      let zk: number;
      let isAlt: boolean;
      if (zOverride) {
        zk = zOverride.z;
        isAlt = zOverride.alt;
      } else {
        isAlt = g.zAlt !== undefined && uAlt < g.pAlt;
        if (isAlt) zk = g.zAlt! + gz * fracWidth * (1 + g.zAlt!);
        else zk = g.z + gz * (gz < 0 ? sLo : sHi);
        zk = Math.max(zk, 0.05);
      }
      z[k] = zk;
      let x = xFixed;
      let lt = ltFixed;
      let lnDl = lnDlFixed;
      if (!zOverride) {
        x = Math.log1p(zk);
        // ln t and ln D_L at x from the two tables with one cell and weight (bg.lnAgeAt and bg.lnDlAt, the same numbers)
        if (x >= tx0 && x <= tx1) {
          const t = (x - tx0) / th;
          const i = Math.min(Math.max(Math.floor(t), 0), tn - 2);
          const u = t - i;
          lt = tAge[i] + u * (tAge[i + 1] - tAge[i]);
          lnDl = tDl[i] + u * (tDl[i + 1] - tDl[i]);
        } else {
          lt = bg.lnAgeAt(x);
          lnDl = bg.lnDlAt(x);
        }
      }
      lnZ1[k] = x;
      lnT[k] = lt;
      const log10TMax = lt / Math.LN10 + 3; // Myr
      const la = l0 + uAge * (log10TMax - l0);
      lAge[k] = la;
      if (g.log10Mstar !== undefined) {
        let m = g.log10Mstar + gMass * g.log10MstarErr;
        if (isAlt && g.log10MstarAlt !== undefined) m = g.log10MstarAlt + gMass * g.log10MstarErr;
        else if (zk !== g.z) m += (2 * (lnDl - lnDl0) - (x - x0)) / Math.LN10;
        lM[k] = m;
        lL[k] = Number.NaN;
        lLam[k] = Number.NaN;
      } else {
        const rest = lambdaObs / (1 + zk);
        lM[k] = Number.NaN;
        if (rest < LYMAN_ALPHA_UM || rest > MODEL_LAMBDA_MAX_UM) {
          lL[k] = Number.NaN;
          lLam[k] = Number.NaN;
          excluded++;
          continue;
        }
        let l = log10LnuFromApparent(mApp + gMag * g.magErr, lnDl, x);
        if (g.beta !== undefined) l += 0.4 * attenuationFromBeta(g.beta + gBeta * g.betaErr, rest);
        lL[k] = l;
        lLam[k] = lObs - x / Math.LN10;
      }
    }
    draws.n = Math.max(draws.n, n);
    draws.excluded += excluded;
  };
  return { draws, capacity, extend };
}
