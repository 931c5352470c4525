import { CHI_HMINUS_EV, C_CM_S, EV_ERG, H_PLANCK, K_BOLTZMANN } from './atomic-constants.js';

/**
 * Absorption by the negative hydrogen ion H⁻, the main opacity of photospheres cooler than ~7000 K.
 * Wavelengths in Å, temperatures in K, pressures in dyn cm⁻².
 */

/** H⁻ photo-detachment threshold, Å: hc/χ(H⁻). */
export const HMINUS_THRESHOLD_ANGSTROM = (H_PLANCK * C_CM_S * 1e8) / (CHI_HMINUS_EV * EV_ERG);

const BF = [1.99654, -1.18267e-5, 2.64243e-6, -4.40524e-10, 3.23992e-14, -1.39568e-18, 2.78701e-23];

/**
 * Bound-free cross-section of H⁻ at λ (Å), cm²: the polynomial fit of Wishart 1979 (MNRAS 187, 59P) to his
 * cross-sections, as given by Gray 2005, eq. 8.11 (coefficients from memory; they reproduce the known peak of
 * ≈ 4.0e-17 cm² near 8500 Å): σ = (a0 + a1 λ + … + a6 λ⁶) × 10⁻¹⁸, zero beyond the fit's root near 16 300 Å.
 */
export function hMinusBoundFreeCrossSection(lambdaAngstrom: number): number {
  if (lambdaAngstrom >= HMINUS_THRESHOLD_ANGSTROM) return 0;
  let s = 0;
  for (let i = BF.length - 1; i >= 0; i--) s = s * lambdaAngstrom + BF[i];
  return Math.max(s, 0) * 1e-18;
}

/**
 * Free-free absorption of H⁻ (a free electron in the field of H), cm⁴ dyn⁻¹ per neutral H atom per unit
 * electron pressure, already including stimulated emission: the fit of Bell & Berrington 1987 (J. Phys. B
 * 20, 801) as given by Gray 2005, eq. 8.13 (coefficients from memory), θ = 5040/T, valid 2600–113 900 Å and
 * 1400–10 080 K (clamped to its range): 10⁻²⁶ 10^(f0 + f1 log θ + f2 log² θ).
 */
export function hMinusFreeFreePerPe(lambdaAngstrom: number, tK: number): number {
  return hMinusFreeFreeAt(hMinusFreeFreeCoefficients(lambdaAngstrom), tK);
}

/** The λ-dependent coefficients (f0, f1, f2) of hMinusFreeFreePerPe, for reuse at many temperatures. */
export function hMinusFreeFreeCoefficients(lambdaAngstrom: number): readonly [number, number, number] {
  const lg = Math.log10(Math.min(Math.max(lambdaAngstrom, 2600), 113900));
  const f0 = -2.2763 - 1.685 * lg + 0.76661 * lg * lg - 0.053346 * lg ** 3;
  const f1 = 15.2827 - 9.2846 * lg + 1.99381 * lg * lg - 0.142631 * lg ** 3;
  const f2 = -197.789 + 190.266 * lg - 67.9775 * lg * lg + 10.6913 * lg ** 3 - 0.625151 * lg ** 4;
  return [f0, f1, f2];
}

/** log θ = log10(5040 K/T) of the fit, T clamped to its 1400–10 080 K. */
export function hMinusFreeFreeLogTheta(tK: number): number {
  return Math.log10(5040 / Math.min(Math.max(tK, 1400), 10080));
}

/** hMinusFreeFreePerPe from its coefficients at T (K). */
export function hMinusFreeFreeAt(c: readonly [number, number, number], tK: number): number {
  const lt = hMinusFreeFreeLogTheta(tK);
  return 1e-26 * 10 ** (c[0] + c[1] * lt + c[2] * lt * lt);
}

/**
 * H⁻ absorption coefficient, cm⁻¹, at λ (Å) and T (K) for neutral-hydrogen and H⁻ densities (cm⁻³) and
 * electron pressure P_e (dyn cm⁻²): bound-free with stimulated emission, plus free-free.
 */
export function hMinusAbsorption(lambdaAngstrom: number, tK: number, nNeutral: number, nHMinus: number, pElectron: number): number {
  const hnukt = (H_PLANCK * C_CM_S) / (lambdaAngstrom * 1e-8 * K_BOLTZMANN * tK);
  return nHMinus * hMinusBoundFreeCrossSection(lambdaAngstrom) * -Math.expm1(-hnukt) + nNeutral * pElectron * hMinusFreeFreePerPe(lambdaAngstrom, tK);
}
