/**
 * Atomic constants for the photosphere's opacities, cgs (CODATA 2018: Tiesinga et al. 2021, Rev. Mod. Phys.
 * 93, 025010; h, k, c, e exact in SI 2019).
 */
export { C_CM_S, H_PLANCK, K_BOLTZMANN } from '../constants.js';
/** Electron mass, g. */
export const M_ELECTRON_G = 9.1093837015e-28;
/** Elementary charge, esu (1.602176634e-19 C × c/10). */
export const E_CHARGE_ESU = 4.803204712570263e-10;
/** 1 eV in erg (exact). */
export const EV_ERG = 1.602176634e-12;
/** Mass of the hydrogen atom, g (1.00782503 u, u = 1.66053906660e-24 g). */
export const M_HYDROGEN_G = 1.6735575e-24;
/** Thomson cross-section, cm². */
export const SIGMA_THOMSON_CM2 = 6.6524587321e-25;
/** Ionisation energy of hydrogen from n = 1, eV (reduced-mass Rydberg energy). */
export const CHI_HYDROGEN_EV = 13.598434;
/** Rydberg constant for hydrogen (reduced mass), Å⁻¹. */
export const RYDBERG_H_PER_ANGSTROM = 1.0967758e-3;
/** Binding energy of the H⁻ ion, eV. */
export const CHI_HMINUS_EV = 0.7542;
