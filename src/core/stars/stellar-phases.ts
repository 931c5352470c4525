import { effectiveTemperatureK, surfaceLogG, zamsLuminosityLsun, zamsRadiusRsun } from './zams.js';

/**
 * The two luminous phases of one star of the population model (population.ts), as functions of its
 * initial mass m (Msun) and metallicity Z:
 *  - main sequence: one mid-main-sequence state, 1.3× the ZAMS luminosity and 2.0× the ZAMS radius of
 *    Tout et al. 1996 (our approximation, calibrated: README, "The population model");
 *  - post-main sequence: 2× the ZAMS luminosity at T_eff = 4500 K (red giant or supergiant) below 15 Msun
 *    and 12 000 K (blue supergiant, calibrated) above, for 0.1 t_MS (our approximation of core-helium burning).
 * Luminosities in Lsun, radii in Rsun, temperatures in K, gravities log10 of cm s⁻².
 */
export const MS_LUMINOSITY_FACTOR = 1.3;
export const MS_RADIUS_FACTOR = 2.0;
export const POST_MS_DURATION = 0.1;
export const POST_MS_LUMINOSITY_FACTOR = 2;
export const POST_MS_TEFF_K = 4500;
export const POST_MS_TEFF_MASSIVE_K = 12000;
export const POST_MS_MASSIVE_MSUN = 15;

export interface StarState {
  readonly lLsun: number;
  readonly rRsun: number;
  readonly tEffK: number;
  readonly logG: number;
}

/** The three tracks a star's light is drawn from: main sequence, red and blue post-main sequence. */
export type Track = 'ms' | 'post-red' | 'post-blue';

/** Which post-main-sequence track a star of mass m (Msun) follows. */
export function postTrack(massMsun: number): Track {
  return massMsun >= POST_MS_MASSIVE_MSUN ? 'post-blue' : 'post-red';
}

/**
 * State of a star of mass m on a track. The post-main-sequence radius follows from L = 4πR²σT_eff⁴ in solar
 * units, R = √L (5772 K/T_eff)² (IAU 2015 nominal solar T_eff).
 */
export function starState(track: Track, massMsun: number, metallicity: number): StarState {
  const lMs = MS_LUMINOSITY_FACTOR * zamsLuminosityLsun(massMsun, metallicity);
  if (track === 'ms') {
    const rRsun = MS_RADIUS_FACTOR * zamsRadiusRsun(massMsun, metallicity);
    return { lLsun: lMs, rRsun, tEffK: effectiveTemperatureK(lMs, rRsun), logG: surfaceLogG(massMsun, rRsun) };
  }
  const tEffK = track === 'post-blue' ? POST_MS_TEFF_MASSIVE_K : POST_MS_TEFF_K;
  const lLsun = (POST_MS_LUMINOSITY_FACTOR / MS_LUMINOSITY_FACTOR) * lMs;
  const rRsun = Math.sqrt(lLsun) * (5772 / tEffK) ** 2;
  return { lLsun, rRsun, tEffK, logG: surfaceLogG(massMsun, rRsun) };
}
