import type { BaseParams } from './base-params.js';
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

/** 1σ errors of a preset's source on the base parameters (ω_b, ω_c, H0 in km/s/Mpc, n_s, σ8). */
export interface PresetUncertainty {
  readonly sd: BaseParams;
  /** Density of massive neutrinos inside the preset's Ω_m (ω_ν = Σm_ν / 93.14 eV), to recover its ω_c. */
  readonly omegaNuH2: number;
  /** Paper, table and column the errors come from, with how they were checked. */
  readonly source: string;
}

/**
 * Planck Collaboration 2020, A&A 641, A6, Table 2, column TT,TE,EE+lowE+lensing+BAO (the preset's
 * column): Ω_b h² = 0.02242 ± 0.00014, Ω_c h² = 0.11933 ± 0.00091, H0 = 67.66 ± 0.42,
 * n_s = 0.9665 ± 0.0038, σ8 = 0.8102 ± 0.0060 (68%). Transcribed from the project's physics reference
 * sheet, §1.4 (tagged there as verified against a tabulated transcription of Table 2; its §13 quotes the
 * same numbers marked "from memory"). ω_ν = 0.06 eV / 93.14 eV (the baseline's one massive neutrino;
 * 93.14 eV is the usual conversion, common practice, no source).
 */
export const PLANCK18_UNCERTAINTY: PresetUncertainty = Object.freeze({
  sd: Object.freeze({ omegaBh2: 0.00014, omegaCh2: 0.00091, h0: 0.42, ns: 0.0038, sigma8: 0.006 }),
  omegaNuH2: 0.06 / 93.14,
  source: 'Planck Collaboration 2020, A&A 641, A6, Table 2, TT,TE,EE+lowE+lensing+BAO (1σ)',
});

/**
 * Hinshaw et al. 2013, ApJS 208, 19, Table 4, column WMAP+eCMB+BAO+H0 (the preset's column), from
 * memory (not checked against the paper here): Ω_b h² = 0.02223 ± 0.00033, Ω_c h² = 0.1153 ± 0.0019,
 * H0 = 69.32 ± 0.80, n_s = 0.9608 ± 0.0080, σ8 = 0.820 +0.013/−0.014 (symmetrised to ± 0.0135).
 * Massless neutrinos, so ω_ν = 0.
 */
export const WMAP9_UNCERTAINTY: PresetUncertainty = Object.freeze({
  sd: Object.freeze({ omegaBh2: 0.00033, omegaCh2: 0.0019, h0: 0.8, ns: 0.008, sigma8: 0.0135 }),
  omegaNuH2: 0,
  source: 'Hinshaw et al. 2013, ApJS 208, 19, Table 4, WMAP+eCMB+BAO+H0 (1σ; from memory)',
});

export const PRESET_UNCERTAINTIES: Readonly<Record<string, PresetUncertainty>> = Object.freeze({
  planck18: PLANCK18_UNCERTAINTY,
  wmap9: WMAP9_UNCERTAINTY,
});
