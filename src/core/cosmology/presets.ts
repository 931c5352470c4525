import type { CosmologyParams } from './params.js';

/**
 * Planck 2018: Planck Collaboration 2020, A&A 641, A6, Table 2, column TT,TE,EE+lowE+lensing+BAO.
 * H0 = 67.66, Ω_m = 0.3111 (includes the 0.06 eV neutrino, here counted as matter),
 * Ω_b h² = 0.02242 → Ω_b = 0.02242/0.6766² = 0.048975, σ8 = 0.8102, n_s = 0.9665.
 * T_CMB = 2.7255 K and N_eff = 3.046 are the paper's baseline assumptions; all N_eff species are
 * treated as massless radiation here (the massive one's rest mass is inside Ω_m).
 */
export const PLANCK18: CosmologyParams = Object.freeze({
  h0: 67.66,
  omegaM: 0.3111,
  omegaB: 0.02242 / 0.6766 ** 2,
  omegaK: 0,
  tcmbK: 2.7255,
  nEff: 3.046,
  w0: -1,
  wa: 0,
  sigma8: 0.8102,
  ns: 0.9665,
});

/**
 * WMAP9: Hinshaw et al. 2013, ApJS 208, 19, Table 4, column WMAP+eCMB+BAO+H0.
 * H0 = 69.32, Ω_m = 0.2865, Ω_b = 0.04628, σ8 = 0.820, n_s = 0.9608; flat;
 * T_CMB = 2.725 K and N_eff = 3.04 massless species (the conventions of that analysis).
 */
export const WMAP9: CosmologyParams = Object.freeze({
  h0: 69.32,
  omegaM: 0.2865,
  omegaB: 0.04628,
  omegaK: 0,
  tcmbK: 2.725,
  nEff: 3.04,
  w0: -1,
  wa: 0,
  sigma8: 0.82,
  ns: 0.9608,
});

export const PRESETS: Readonly<Record<string, CosmologyParams>> = Object.freeze({
  planck18: PLANCK18,
  wmap9: WMAP9,
});

export type PresetName = keyof typeof PRESETS;
