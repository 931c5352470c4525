/**
 * Remnant mass left by a star of initial mass m (Msun):
 *  m < 8: white dwarf, initial–final relation of Kalirai et al. 2008, ApJ 676, 594: 0.109 m + 0.394;
 *  8 ≤ m < 25: neutron star, 1.4 Msun (common practice, no source);
 *  25 ≤ m < 140 or m > 260: black hole of 0.4 m, about the helium-core mass (common practice, no source);
 *  140 ≤ m ≤ 260: pair-instability supernova, no remnant (common practice, no source).
 */
export function remnantMassMsun(m: number): number {
  if (m < 8) return Math.min(m, 0.109 * m + 0.394);
  if (m < 25) return 1.4;
  if (m >= 140 && m <= 260) return 0;
  return 0.4 * m;
}
