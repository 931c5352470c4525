import { AB_ZERO_POINT, LYMAN_ALPHA_UM, MPC_CM, TEN_PC_CM } from '../constants.js';

/** Rest wavelengths the population model covers, μm (Lyman-α to 1 μm). */
export const MODEL_LAMBDA_MIN_UM = LYMAN_ALPHA_UM;
export const MODEL_LAMBDA_MAX_UM = 1.0;

/** AB magnitude → f_ν: m_AB = −2.5 log10 f_ν − 48.60 (Oke & Gunn 1983, ApJ 266, 713), erg s⁻¹ cm⁻² Hz⁻¹. */
export function abToFnu(mAB: number): number {
  return 10 ** (-0.4 * (mAB + AB_ZERO_POINT));
}

const LOG10_4PI_MPC2 = Math.log10(4 * Math.PI * MPC_CM * MPC_CM);

/**
 * log10 of the rest-frame L_ν from an observed AB magnitude, L_ν = 4π D_L² f_ν / (1+z) (bandwidth term),
 * from ln D_L [Mpc] and ln(1+z): log10(4π D_L²) − 0.4 (m + 48.60) − log10(1+z). erg s⁻¹ Hz⁻¹.
 */
export function log10LnuFromApparent(mAB: number, lnDlMpc: number, ln1pz: number): number {
  return LOG10_4PI_MPC2 + (2 * lnDlMpc - ln1pz) / Math.LN10 - 0.4 * (mAB + AB_ZERO_POINT);
}

/** Rest-frame L_ν from an observed AB magnitude (log10LnuFromApparent), erg s⁻¹ Hz⁻¹. */
export function lnuFromApparent(mAB: number, luminosityDistanceMpc: number, z: number): number {
  return 10 ** log10LnuFromApparent(mAB, Math.log(luminosityDistanceMpc), Math.log1p(z));
}

/** L_ν from an absolute AB magnitude (flux at 10 pc): 4π(10 pc)² 10^{−0.4(M + 48.60)}, erg s⁻¹ Hz⁻¹. */
export function lnuFromAbsolute(mAbs: number): number {
  return 4 * Math.PI * TEN_PC_CM * TEN_PC_CM * abToFnu(mAbs);
}

/** Absolute magnitude from apparent: M = m − 5 log10(D_L/10 pc) + 2.5 log10(1+z) (common practice, no source). */
export function absoluteFromApparent(mAB: number, luminosityDistanceMpc: number, z: number): number {
  return mAB - 5 * Math.log10((luminosityDistanceMpc * MPC_CM) / TEN_PC_CM) + 2.5 * Math.log10(1 + z);
}

/** Apparent from absolute, the inverse of absoluteFromApparent. */
export function apparentFromAbsolute(mAbs: number, luminosityDistanceMpc: number, z: number): number {
  return mAbs + 5 * Math.log10((luminosityDistanceMpc * MPC_CM) / TEN_PC_CM) - 2.5 * Math.log10(1 + z);
}

/**
 * Rest wavelength of an observed band, μm; refuses bands blueward of Lyman-α (absorbed by the
 * intergalactic medium at these redshifts) or redward of the model's 1 μm.
 */
export function restWavelengthUm(lambdaObsUm: number, z: number): number {
  const rest = lambdaObsUm / (1 + z);
  if (rest < MODEL_LAMBDA_MIN_UM) {
    throw new RangeError(
      `observed ${lambdaObsUm} μm at z = ${z} is ${rest.toFixed(4)} μm in the rest frame, blueward of Lyman-α (0.1216 μm) where the IGM absorbs; use a redder band`,
    );
  }
  if (rest > MODEL_LAMBDA_MAX_UM) throw new RangeError(`observed ${lambdaObsUm} μm at z = ${z} is ${rest.toFixed(3)} μm in the rest frame, beyond the model's 1 μm`);
  return rest;
}
