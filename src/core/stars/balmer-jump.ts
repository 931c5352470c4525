/**
 * Balmer jump of main-sequence stars, D_B = log10[F_ν(3646 Å⁺)/F_ν(3646 Å⁻)] in dex, against T_eff (K),
 * as measured in the Barbier–Chalonge–Divan spectrophotometric system (Chalonge & Divan 1952; T_eff
 * calibration of Zorec et al. 2009, A&A 501, 297). The nodes are from memory, rounded: largest (≈ 0.5 dex)
 * near A0 (9500 K), ≈ 0.3 at B5 (15 000 K), ≈ 0.1 at B0.5 (25 000 K), vanishing for early O stars; linear
 * in T_eff between nodes, constant outside. Dwarf values are used for every star (supergiants have somewhat
 * smaller jumps at the same T_eff; not modelled).
 */
const NODES: readonly (readonly [number, number])[] = [
  [4000, 0.02],
  [5000, 0.05],
  [7000, 0.3],
  [9500, 0.5],
  [12000, 0.4],
  [15000, 0.3],
  [18000, 0.2],
  [25000, 0.1],
  [32000, 0.04],
  [40000, 0.02],
  [60000, 0],
];

export function balmerJumpDex(tEffK: number): number {
  if (tEffK <= NODES[0][0]) return NODES[0][1];
  for (let i = 1; i < NODES.length; i++) {
    const [t1, d1] = NODES[i];
    if (tEffK <= t1) {
      const [t0, d0] = NODES[i - 1];
      return d0 + ((d1 - d0) * (tEffK - t0)) / (t1 - t0);
    }
  }
  return NODES[NODES.length - 1][1];
}
