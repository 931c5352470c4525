import { C_CM_S, E_CHARGE_ESU, H_PLANCK, K_BOLTZMANN, M_ELECTRON_G, RYDBERG_H_PER_ANGSTROM } from './atomic-constants.js';

/**
 * Continuous absorption by atomic hydrogen: bound-free from every level n and free-free (Kramers 1923 with
 * quantum gaunt factors). Cross-sections in cm², frequencies in Hz, wavelengths in Å, temperatures in K.
 */

/**
 * Kramers' bound-free constant: σ_n(ν) = K_BF g_bf/(n⁵ ν³) with K_BF = 64π⁴ m_e e¹⁰/(3√3 c h⁶), cm² Hz³
 * (Kramers 1923; e.g. Rybicki & Lightman 1979, eq. 10.56, and Gray 2005, eq. 8.4). ≈ 2.815e29.
 */
export const KRAMERS_BF_CM2_HZ3 = (64 * Math.PI ** 4 * M_ELECTRON_G * E_CHARGE_ESU ** 10) / (3 * Math.sqrt(3) * C_CM_S * H_PLANCK ** 6);

/**
 * Free-free constant: κ_ff = K_FF g_ff T^(−½) ν⁻³ n_e n_p (1 − e^(−hν/kT)) cm⁻¹, K_FF = (4e⁶/(3 m_e h c))
 * (2π/(3 k m_e))^½ (Rybicki & Lightman 1979, eq. 5.18b, ≈ 3.69e8 cgs).
 */
export const KRAMERS_FF_CGS = ((4 * E_CHARGE_ESU ** 6) / (3 * M_ELECTRON_G * H_PLANCK * C_CM_S)) * Math.sqrt((2 * Math.PI) / (3 * K_BOLTZMANN * M_ELECTRON_G));

/**
 * Bound-free gaunt factor of level n at λ (Å), the first-order Menzel & Pekeris (1935) expansion as given
 * by Gray 2005, eq. 8.5 (from memory): g_bf = 1 − 0.3456 (λR)^(−⅓) (λR/n² − ½), R the Rydberg constant.
 */
export function gauntBoundFree(lambdaAngstrom: number, n: number): number {
  const lr = lambdaAngstrom * RYDBERG_H_PER_ANGSTROM;
  return 1 - (0.3456 / Math.cbrt(lr)) * (lr / (n * n) - 0.5);
}

/**
 * Free-free gaunt factor at λ (Å) and T (K), the same expansion (Gray 2005, eq. 8.6, from memory):
 * g_ff = 1 + 0.3456 (λR)^(−⅓) (λkT/(hc) + ½).
 */
export function gauntFreeFree(lambdaAngstrom: number, tK: number): number {
  const lr = lambdaAngstrom * RYDBERG_H_PER_ANGSTROM;
  const lkt = (lambdaAngstrom * 1e-8 * K_BOLTZMANN * tK) / (H_PLANCK * C_CM_S);
  return 1 + (0.3456 / Math.cbrt(lr)) * (lkt + 0.5);
}

/** Photo-ionisation edge of level n, Å: n²/R. */
export function hydrogenEdgeAngstrom(n: number): number {
  return (n * n) / RYDBERG_H_PER_ANGSTROM;
}

/** Bound-free cross-section of one hydrogen atom in level n at λ (Å), cm²: zero longward of the edge. */
export function hydrogenBoundFreeCrossSection(lambdaAngstrom: number, n: number): number {
  if (lambdaAngstrom > hydrogenEdgeAngstrom(n)) return 0;
  const nu = C_CM_S / (lambdaAngstrom * 1e-8);
  return (KRAMERS_BF_CM2_HZ3 * Math.max(gauntBoundFree(lambdaAngstrom, n), 0)) / (n ** 5 * nu ** 3);
}

/** Highest level summed; the terms fall as n⁻³ and the level populations stay near LTE (common practice, no source). */
export const N_LEVELS_MAX = 30;

/**
 * Hydrogen absorption coefficient, cm⁻¹, at λ (Å), temperature T (K), neutral density n_H0 and electron and
 * proton densities (cm⁻³), corrected for stimulated emission. Level populations from the Boltzmann law with
 * the neutral partition function U = 2 (ground level; excited levels add < 1e-3 below 20 000 K):
 * n_n = n_H0 n² exp(−χ(1 − 1/n²)/kT).
 */
export function hydrogenAbsorption(lambdaAngstrom: number, tK: number, nNeutral: number, nElectron: number, nProton: number): number {
  const nu = C_CM_S / (lambdaAngstrom * 1e-8);
  const hnukt = (H_PLANCK * nu) / (K_BOLTZMANN * tK);
  const chiKt = (13.598434 * 1.602176634e-12) / (K_BOLTZMANN * tK);
  let bf = 0;
  for (let n = 1; n <= N_LEVELS_MAX; n++) {
    const sigma = hydrogenBoundFreeCrossSection(lambdaAngstrom, n);
    if (sigma > 0) bf += n * n * Math.exp(-chiKt * (1 - 1 / (n * n))) * sigma;
  }
  const ff = (KRAMERS_FF_CGS * gauntFreeFree(lambdaAngstrom, tK) * nElectron * nProton) / (Math.sqrt(tK) * nu ** 3);
  return (bf * nNeutral + ff) * -Math.expm1(-hnukt);
}
