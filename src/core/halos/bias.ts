/**
 * Linear halo bias b(ν), ν = δc/σ(M, z).
 */
export type BiasName = 'mo-white' | 'sheth-tormen' | 'smt01' | 'tinker10';
export const BIAS_NAMES: readonly BiasName[] = ['smt01', 'tinker10', 'sheth-tormen', 'mo-white'];

/** Mo & White 1996, MNRAS 282, 347: b = 1 + (ν² − 1)/δc. */
export function biasMoWhite(nu: number, deltaC: number): number {
  return 1 + (nu * nu - 1) / deltaC;
}

/** Sheth & Tormen 1999, MNRAS 308, 119 (peak-background split): b = 1 + (aν² − 1)/δc + 2p/(δc[1 + (aν²)^p]). */
export function biasShethTormen(nu: number, deltaC: number): number {
  const a = 0.707;
  const p = 0.3;
  const anu2 = a * nu * nu;
  return 1 + (anu2 - 1) / deltaC + (2 * p) / (deltaC * (1 + anu2 ** p));
}

/**
 * Sheth, Mo & Tormen 2001, MNRAS 323, 1, eq. 8 (ellipsoidal collapse), a = 0.707, b = 0.5, c = 0.6:
 * b = 1 + [√a (aν²) + √a b (aν²)^(1−c) − (aν²)^c / ((aν²)^c + b(1−c)(1−c/2))] / (√a δc).
 */
export function biasSmt01(nu: number, deltaC: number): number {
  const a = 0.707;
  const b = 0.5;
  const c = 0.6;
  const sa = Math.sqrt(a);
  const x = a * nu * nu;
  return 1 + (sa * x + sa * b * x ** (1 - c) - x ** c / (x ** c + b * (1 - c) * (1 - c / 2))) / (sa * deltaC);
}

/**
 * Tinker et al. 2010, ApJ 724, 878, eq. 6 with Table 2, y = log10 Δ (Δ = 200 w.r.t. the mean):
 * b = 1 − A ν^a/(ν^a + δc^a) + B ν^b + C ν^c.
 */
export function biasTinker10(nu: number, deltaC: number, delta = 200): number {
  const y = Math.log10(delta);
  const ex = Math.exp(-((4 / y) ** 4));
  const A = 1 + 0.24 * y * ex;
  const a = 0.44 * y - 0.88;
  const B = 0.183;
  const b = 1.5;
  const C = 0.019 + 0.107 * y + 0.19 * ex;
  const c = 2.4;
  return 1 - (A * nu ** a) / (nu ** a + deltaC ** a) + B * nu ** b + C * nu ** c;
}

export function biasByName(name: BiasName, nu: number, deltaC: number): number {
  switch (name) {
    case 'mo-white':
      return biasMoWhite(nu, deltaC);
    case 'sheth-tormen':
      return biasShethTormen(nu, deltaC);
    case 'smt01':
      return biasSmt01(nu, deltaC);
    case 'tinker10':
      return biasTinker10(nu, deltaC);
  }
}
