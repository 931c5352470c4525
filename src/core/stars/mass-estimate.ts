import type { Background } from '../cosmology/background.js';
import { attenuationMag, type DustSpec } from './dust.js';
import { ML_AGE_MIN_MYR } from './mass-to-light.js';
import { lnuFromAbsolute, lnuFromApparent, restWavelengthUm } from './photometry.js';
import type { PopulationCache } from './population-cache.js';
import type { Sfh } from './sfh.js';

/** How bright the galaxy is: an observed AB magnitude in a band, a rest-UV absolute magnitude (1500 Å), or L_ν. */
export type Brightness =
  | { readonly kind: 'apparent'; readonly mAB: number; readonly lambdaObsUm: number }
  | { readonly kind: 'absolute-uv'; readonly muv: number }
  | { readonly kind: 'luminosity'; readonly lnuErgSHz: number; readonly lambdaRestUm: number };

/** Rest wavelength of M_UV, μm (common practice, no source: M_UV is quoted at 1500 Å). */
export const MUV_REST_UM = 0.15;

/** Observed (attenuated) L_ν and its rest wavelength. */
export function observedLnu(b: Brightness, z: number, bg: Background): { lnu: number; lambdaRestUm: number } {
  switch (b.kind) {
    case 'apparent':
      return { lnu: lnuFromApparent(b.mAB, bg.luminosityDistanceMpc(z), z), lambdaRestUm: restWavelengthUm(b.lambdaObsUm, z) };
    case 'absolute-uv':
      return { lnu: lnuFromAbsolute(b.muv), lambdaRestUm: MUV_REST_UM };
    case 'luminosity':
      return { lnu: b.lnuErgSHz, lambdaRestUm: b.lambdaRestUm };
  }
}

/** Dust-corrected (intrinsic) L_ν: L_obs · 10^{0.4 A_λ}. */
export function intrinsicLnu(lnuObs: number, lambdaRestUm: number, dust: DustSpec): number {
  return lnuObs * 10 ** (0.4 * attenuationMag(dust, lambdaRestUm));
}

export interface MassEstimate {
  readonly imf: string;
  /** Median of log10 M* over a log-uniform age prior from 1 Myr to the cosmic age at z. */
  readonly log10MstarBest: number;
  readonly log10MstarMin: number;
  readonly log10MstarMax: number;
  readonly ageMinMyr: number;
  readonly ageMaxMyr: number;
}

/** Allowed population ages at z: log-uniform grid from 1 Myr to the age of the universe at z. */
export function allowedAgesMyr(z: number, bg: Background, n = 61): number[] {
  const tMax = bg.ageGyr(z) * 1e3;
  const l0 = Math.log10(ML_AGE_MIN_MYR);
  const l1 = Math.log10(tMax);
  return Array.from({ length: n }, (_, i) => 10 ** (l0 + ((l1 - l0) * i) / (n - 1)));
}

/**
 * Stellar mass (stars + remnants, Msun) under one IMF and SFH for every allowed age:
 * M* = L_ν,intrinsic × (M/L_ν)(IMF, SFH, age, λ_rest).
 */
export function estimateMass(
  cache: PopulationCache,
  imfName: string,
  sfh: Sfh,
  brightness: Brightness,
  dust: DustSpec,
  z: number,
  bg: Background,
): MassEstimate {
  const { lnu, lambdaRestUm } = observedLnu(brightness, z, bg);
  const lint = intrinsicLnu(lnu, lambdaRestUm, dust);
  const table = cache.table(imfName, z, sfh);
  const ages = allowedAgesMyr(z, bg);
  const logs = ages.map((a) => Math.log10(lint) + table.logMassToLight(a, lambdaRestUm));
  const sorted = [...logs].sort((a, b) => a - b);
  const iMin = logs.indexOf(sorted[0]);
  const iMax = logs.indexOf(sorted[sorted.length - 1]);
  return {
    imf: imfName,
    log10MstarBest: sorted[(sorted.length - 1) >> 1],
    log10MstarMin: sorted[0],
    log10MstarMax: sorted[sorted.length - 1],
    ageMinMyr: ages[iMin],
    ageMaxMyr: ages[iMax],
  };
}

/**
 * Rescales a mass reported under one IMF to another at the same light: M_to = M_from ×
 * (M/L)_to / (M/L)_from at the same SFH, age and rest wavelength.
 */
export function rescaleMass(cache: PopulationCache, log10Mass: number, fromImf: string, toImf: string, sfh: Sfh, ageMyr: number, lambdaRestUm: number, z: number): number {
  if (fromImf === toImf) return log10Mass;
  return log10Mass + cache.table(toImf, z, sfh).logMassToLight(ageMyr, lambdaRestUm) - cache.table(fromImf, z, sfh).logMassToLight(ageMyr, lambdaRestUm);
}
