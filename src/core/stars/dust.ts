/**
 * Calzetti et al. 2000, ApJ 533, 682, eq. 4: starburst attenuation curve k'(λ), λ in μm, R'_V = 4.05.
 * k' = 2.659(−2.156 + 1.509/λ − 0.198/λ² + 0.011/λ³) + R'_V for 0.12 ≤ λ < 0.63;
 * k' = 2.659(−1.857 + 1.040/λ) + R'_V for 0.63 ≤ λ ≤ 2.20. Below 0.12 μm the first branch is extended.
 */
export function calzettiK(lambdaUm: number): number {
  const rv = 4.05;
  const l = lambdaUm;
  if (l < 0.63) return 2.659 * (-2.156 + 1.509 / l - 0.198 / (l * l) + 0.011 / (l * l * l)) + rv;
  return 2.659 * (-1.857 + 1.04 / l) + rv;
}

/** Meurer, Heckman & Calzetti 1999, ApJ 521, 64, eq. 11: A_1600 = 4.43 + 1.99 β, floored at 0 (mag). */
export function meurerA1600(beta: number): number {
  return Math.max(0, 4.43 + 1.99 * beta);
}

const K_1600 = calzettiK(0.16);
const K_V = calzettiK(0.55);

/** A_λ from the UV slope: A_1600(β) (Meurer et al. 1999) carried to λ with the Calzetti curve, mag. */
export function attenuationFromBeta(beta: number, lambdaUm: number): number {
  return (meurerA1600(beta) * calzettiK(lambdaUm)) / K_1600;
}

export type DustSpec = { readonly kind: 'none' } | { readonly kind: 'beta'; readonly beta: number } | { readonly kind: 'av'; readonly av: number };

/**
 * Attenuation in magnitudes at rest wavelength λ: from β through A_1600 (Meurer et al. 1999) carried to λ
 * with the Calzetti curve, A_λ = A_1600 k'(λ)/k'(0.16); or from A_V, A_λ = A_V k'(λ)/k'(0.55).
 */
export function attenuationMag(dust: DustSpec, lambdaUm: number): number {
  if (dust.kind === 'none') return 0;
  if (dust.kind === 'beta') return attenuationFromBeta(dust.beta, lambdaUm);
  return (dust.av * calzettiK(lambdaUm)) / K_V;
}
