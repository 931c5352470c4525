/** δc for spherical collapse in Einstein–de Sitter: (3/20)(12π)^(2/3) = 1.6864702 (Gunn & Gott 1972 model). */
export const DELTA_C_EDS = 0.15 * (12 * Math.PI) ** (2 / 3);

/** The collapse-threshold choices: a constant (1.686 by default) or the weak Ω_m(z) dependence. */
export type DeltaCSpec = { readonly kind: 'constant'; readonly value: number } | { readonly kind: 'omega-m' };

export const DEFAULT_DELTA_C: DeltaCSpec = Object.freeze({ kind: 'constant', value: 1.686 });

/**
 * δc(z) = 1.686 [1 + 0.0123 log10 Ω_m(z)] for flat ΛCDM (Kitayama & Suto 1996, ApJ 469, 480;
 * Nakamura & Suto 1997, Prog. Theor. Phys. 97, 49).
 */
export function deltaCOmegaM(omegaMz: number): number {
  return 1.686 * (1 + 0.0123 * Math.log10(omegaMz));
}
