import type { MultiplicityModel } from './multiplicity.js';

/**
 * Press & Schechter 1974, ApJ 187, 425: f(ν) = √(2/π) ν exp(−ν²/2), ν = δc/σ.
 * ∫ f dlnν = 1 exactly; the mass fraction above M is erfc(ν/√2).
 */
export const pressSchechter: MultiplicityModel = {
  name: 'press-schechter',
  label: 'Press–Schechter 1974',
  source: 'Press & Schechter 1974, ApJ 187, 425',
  calibrated: { lnInvSigmaMin: -Infinity, lnInvSigmaMax: Infinity, zMax: Infinity },
  f: ({ sigma, deltaC }) => {
    const nu = deltaC / sigma;
    return Math.sqrt(2 / Math.PI) * nu * Math.exp(-0.5 * nu * nu);
  },
};
