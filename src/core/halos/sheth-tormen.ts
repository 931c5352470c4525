import type { MultiplicityModel } from './multiplicity.js';

/** Sheth & Tormen 1999 (MNRAS 308, 119) coefficients: A = 0.3222, a = 0.707, p = 0.3. */
export const ST_A = 0.3222;
export const ST_SMALL_A = 0.707;
export const ST_P = 0.3;

/**
 * Sheth & Tormen 1999, MNRAS 308, 119 (their eq. 10 in ν form):
 * f(ν) = A √(2a/π) [1 + (aν²)^−p] ν exp(−aν²/2).
 */
export const shethTormen: MultiplicityModel = {
  name: 'sheth-tormen',
  label: 'Sheth–Tormen 1999',
  source: 'Sheth & Tormen 1999, MNRAS 308, 119 (A = 0.3222, a = 0.707, p = 0.3)',
  calibrated: { lnInvSigmaMin: -Infinity, lnInvSigmaMax: Infinity, zMax: Infinity },
  f: ({ sigma, deltaC }) => {
    const nu = deltaC / sigma;
    const anu2 = ST_SMALL_A * nu * nu;
    return ST_A * Math.sqrt((2 * ST_SMALL_A) / Math.PI) * (1 + anu2 ** -ST_P) * nu * Math.exp(-0.5 * anu2);
  },
};
