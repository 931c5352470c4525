import { imfMass, imfNumber, type Imf } from './imf.js';
import { mainSequenceLifetimeMyr } from './lifetime.js';
import { remnantMassMsun } from './remnant.js';
import { cumulativeYoungerThan, type Sfh } from './sfh.js';
import { POST_MS_DURATION, postTrack, starState, type Track } from './stellar-phases.js';
import { spectralLibrary } from './stellar-spectra.js';

/**
 * Our compact population synthesis. The IMF is cut into log-spaced mass bins; each bin is one
 * representative star (the bin's mean mass; its states in stellar-phases.ts) with
 *  - a main-sequence phase of length t_MS (Hurley, Pols & Tout 2000) at one mid-main-sequence state:
 *    1.3× the ZAMS luminosity and 2.0× the ZAMS radius (Tout et al. 1996), so T_eff is 0.76× its ZAMS value.
 *    Stars brighten and swell on the main sequence (roughly doubling L and tripling R between ZAMS and TAMS
 *    for massive stars); the two factors are our approximation, chosen on a grid while comparing the model
 *    with the Kennicutt 1998 UV calibration at 1500 Å, the UV-slope window and the band-to-band mass
 *    consistency, so those comparisons constrain them rather than test them (README, "The population model");
 *  - a post-main-sequence phase of 0.1 t_MS at twice the ZAMS luminosity, as a red giant or
 *    supergiant (T_eff = 4500 K) below 15 Msun and a blue supergiant (T_eff = 12 000 K) above
 *    (our approximation of core-helium burning; the 12 000 K was set with the same checks in view, so it is
 *    calibrated, not independent of them);
 *  - then a remnant (remnant.ts), the rest of its mass returned to the gas.
 * Each star radiates the spectrum of stellar-atmosphere.ts for its T_eff and surface gravity: a photosphere
 * with the LTE continuous opacity of hydrogen (every bound-free continuum, free-free), H⁻ and electron
 * scattering, not a black body; the spectra come from stellar-spectra.ts, exact on a fine mass grid and
 * interpolated to each bin's mass. Any SFH enters through C(a), the fraction of mass younger than a, so each
 * bin's contribution is exact for piecewise-constant stellar phases. Everything is per Msun ever formed.
 */
export interface PopulationOptions {
  /** Metallicity (mass fraction), default 0.02. */
  readonly metallicity?: number;
  /** Number of mass bins, default 600. */
  readonly bins?: number;
}

/** Per mass bin: fraction of the mass formed that is still on the main sequence (msEnd) or not yet a remnant (postEnd). */
export interface Phases {
  readonly msEnd: Float64Array;
  readonly postEnd: Float64Array;
}

export interface Population {
  readonly imf: Imf;
  readonly metallicity: number;
  /** Per bin: number, mass, representative mass, lifetimes, luminosities. */
  readonly number: Float64Array;
  readonly mass: Float64Array;
  readonly mStar: Float64Array;
  readonly tMsMyr: Float64Array;
  readonly remnant: Float64Array;
  /** C(a) at the end of each bin's main sequence and of its post-main sequence, for one SFH and age. */
  phases(sfh: Sfh, ageMyr: number): Phases;
  /** L_ν per Msun formed at λ (μm) for given phases, erg s⁻¹ Hz⁻¹. */
  lnuAt(phases: Phases, lambdaUm: number): number;
  /** Stars + remnants per Msun formed for given phases. */
  survivingAt(phases: Phases): number;
  /** L_ν per Msun formed at rest wavelength λ (μm), erg s⁻¹ Hz⁻¹. */
  lnu(sfh: Sfh, ageMyr: number, lambdaUm: number): number;
  /** Per-bin L_ν of one star in its main-sequence and post-main-sequence phases, erg s⁻¹ Hz⁻¹. */
  perStarLnu(lambdaUm: number): { readonly ms: Float64Array; readonly post: Float64Array };
  /** Bolometric luminosity per Msun formed, Lsun. */
  lbol(sfh: Sfh, ageMyr: number): number;
  /** Stars + remnants per Msun formed. */
  survivingFraction(sfh: Sfh, ageMyr: number): number;
}

export function makePopulation(imf: Imf, opts: PopulationOptions = {}): Population {
  const Z = opts.metallicity ?? 0.02;
  const nb = opts.bins ?? 600;
  // Bin edges: log-spaced, with every segment boundary inserted so no bin straddles a kink.
  const edges: number[] = [];
  const l0 = Math.log10(imf.mLow);
  const l1 = Math.log10(imf.mUp);
  for (let i = 0; i <= nb; i++) edges.push(10 ** (l0 + ((l1 - l0) * i) / nb));
  for (const s of imf.segments) edges.push(s.mLo, s.mHi);
  edges.sort((a, b) => a - b);
  const uniq = edges.filter((e, i) => i === 0 || e / edges[i - 1] - 1 > 1e-9);
  const n = uniq.length - 1;
  const number = new Float64Array(n);
  const mass = new Float64Array(n);
  const mStar = new Float64Array(n);
  const tMs = new Float64Array(n);
  const rem = new Float64Array(n);
  const lMs = new Float64Array(n);
  const lPost = new Float64Array(n);
  const post: Track[] = [];
  for (let i = 0; i < n; i++) {
    number[i] = imfNumber(imf, uniq[i], uniq[i + 1]);
    mass[i] = imfMass(imf, uniq[i], uniq[i + 1]);
    const m = mass[i] / number[i];
    mStar[i] = m;
    tMs[i] = mainSequenceLifetimeMyr(m, Z);
    rem[i] = remnantMassMsun(m);
    post.push(postTrack(m));
    lMs[i] = starState('ms', m, Z).lLsun;
    lPost[i] = starState(post[i], m, Z).lLsun;
  }
  // Spectra of one star per track, shared by every population of this metallicity (stellar-spectra.ts).
  const library = spectralLibrary(Z);
  const lnuCache = new Map<number, { ms: Float64Array; post: Float64Array }>();
  const perStarLnu = (lambdaUm: number): { ms: Float64Array; post: Float64Array } => {
    const hit = lnuCache.get(lambdaUm);
    if (hit) return hit;
    const ms = new Float64Array(n);
    const postLnu = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      ms[i] = library.lnu('ms', mStar[i], lambdaUm);
      postLnu[i] = library.lnu(post[i], mStar[i], lambdaUm);
    }
    const v = { ms, post: postLnu };
    if (lnuCache.size > 256) lnuCache.clear();
    lnuCache.set(lambdaUm, v);
    return v;
  };
  const phases = (sfh: Sfh, age: number): Phases => {
    const msEnd = new Float64Array(n);
    const postEnd = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      msEnd[i] = cumulativeYoungerThan(sfh, tMs[i], age);
      postEnd[i] = cumulativeYoungerThan(sfh, tMs[i] * (1 + POST_MS_DURATION), age);
    }
    return { msEnd, postEnd };
  };
  /** Σ_bins N [L_MS C(t_MS) + L_post (C(t_MS + t_post) − C(t_MS))]: each phase lit while it lasts. */
  const lightAt = (p: Phases, ms: Float64Array, post: Float64Array): number => {
    let s = 0;
    for (let i = 0; i < n; i++) s += number[i] * (ms[i] * p.msEnd[i] + post[i] * (p.postEnd[i] - p.msEnd[i]));
    return s;
  };
  /** Σ_bins [M C(t_life) + N m_rem (1 − C(t_life))]: living stars plus the remnants of the dead. */
  const survivingAt = (p: Phases): number => {
    let s = 0;
    for (let i = 0; i < n; i++) s += mass[i] * p.postEnd[i] + rem[i] * number[i] * (1 - p.postEnd[i]);
    return s;
  };
  const lbolMs = lMs;
  const lbolPost = lPost;
  return {
    imf,
    metallicity: Z,
    number,
    mass,
    mStar,
    tMsMyr: tMs,
    remnant: rem,
    perStarLnu,
    phases,
    lnuAt: (p, lambdaUm) => {
      const { ms, post } = perStarLnu(lambdaUm);
      return lightAt(p, ms, post);
    },
    survivingAt,
    lnu: (sfh, age, lambdaUm) => {
      const { ms, post } = perStarLnu(lambdaUm);
      return lightAt(phases(sfh, age), ms, post);
    },
    lbol: (sfh, age) => lightAt(phases(sfh, age), lbolMs, lbolPost),
    survivingFraction: (sfh, age) => survivingAt(phases(sfh, age)),
  };
}
