import type { Population } from './population.js';
import type { Sfh } from './sfh.js';

/** The usual UV-slope window, μm (1300–2600 Å; common practice, no source). */
export const UV_SLOPE_LAMBDA_MIN_UM = 0.13;
export const UV_SLOPE_LAMBDA_MAX_UM = 0.26;
/** Wavelengths of the fit: log-spaced over the window, both ends included. */
const N_POINTS = 15;

/**
 * Intrinsic UV slope β of a population (dust-free, no nebular light): the least-squares slope of
 * log10 L_λ against log10 λ over 1300–2600 Å, with L_λ ∝ L_ν/λ², i.e. f_λ ∝ λ^β (Calzetti, Kinney &
 * Storchi-Bergmann 1994, ApJ 429, 582 define β this way, fitted in windows between 1268 and 2580 Å;
 * from memory). Fitted on 15 log-spaced wavelengths of the model spectrum. Dimensionless.
 * Throws a RangeError when the population has no UV light left (every star dead at that age).
 */
export function intrinsicUvSlope(pop: Population, sfh: Sfh, ageMyr: number): number {
  const phases = pop.phases(sfh, ageMyr);
  const l0 = Math.log10(UV_SLOPE_LAMBDA_MIN_UM);
  const l1 = Math.log10(UV_SLOPE_LAMBDA_MAX_UM);
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < N_POINTS; i++) {
    const x = l0 + ((l1 - l0) * i) / (N_POINTS - 1);
    const lnu = pop.lnuAt(phases, 10 ** x);
    if (!(lnu > 0)) throw new RangeError(`no UV light left at ${ageMyr} Myr: every star of this IMF has died, so the UV slope is undefined`);
    const y = Math.log10(lnu) - 2 * x;
    sx += x;
    sy += y;
    sxx += x * x;
    sxy += x * y;
  }
  return (N_POINTS * sxy - sx * sy) / (N_POINTS * sxx - sx * sx);
}
