import { C_CM_S, H_PLANCK, K_BOLTZMANN, RSUN_CM } from '../constants.js';

/**
 * Specific luminosity of a spherical black body of radius R and temperature T at wavelength λ:
 * L_ν = 4πR² · πB_ν(T), B_ν = (2hν³/c²)/(exp(hν/kT) − 1) (Planck's law). erg s⁻¹ Hz⁻¹.
 */
export function blackbodyLnu(rRsun: number, tK: number, lambdaUm: number): number {
  const nu = C_CM_S / (lambdaUm * 1e-4);
  const x = (H_PLANCK * nu) / (K_BOLTZMANN * tK);
  if (x > 700) return 0;
  const bnu = (2 * H_PLANCK * nu ** 3) / (C_CM_S * C_CM_S) / Math.expm1(x);
  const r = rRsun * RSUN_CM;
  return 4 * Math.PI * r * r * Math.PI * bnu;
}
