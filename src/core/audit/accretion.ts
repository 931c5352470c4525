/**
 * Mean halo mass accretion rate, Fakhouri, Ma & Boylan-Kolchin 2010, MNRAS 406, 2267, eq. 2:
 * ⟨dM/dt⟩ = 46.1 Msun/yr (M/1e12 Msun)^1.1 (1 + 1.11 z) √(Ω_m(1+z)³ + Ω_Λ).
 * The abstract's 46 Msun/yr, M^1.1 and (1+z)^2.5 scaling are verified; the coefficients 46.1 and 1.11
 * are from memory. Fitted for 0 < z < 15 and 1e10–1e15 Msun. Msun/yr.
 */
export function meanAccretionRateMsunYr(massMsun: number, z: number, omegaM: number, omegaL: number): number {
  return 46.1 * (massMsun / 1e12) ** 1.1 * (1 + 1.11 * z) * Math.sqrt(omegaM * (1 + z) ** 3 + omegaL);
}
