import { hydrogenEdgeAngstrom } from './hydrogen-opacity.js';
import { photosphereAt, photosphereFluxRatio } from './stellar-atmosphere.js';

/** The Balmer edge (n = 2 → continuum), μm: 4/R_H = 3647.0 Å (vacuum). */
export const BALMER_EDGE_UM = hydrogenEdgeAngstrom(2) / 1e4;

/**
 * Balmer jump of the model photosphere, D_B = log10[F_ν(3647 Å⁺)/F_ν(3647 Å⁻)], dex, at T_eff (K), log g
 * (cgs) and metallicity Z. Computed, not fitted: it follows from the hydrogen n = 2 bound-free opacity
 * (Saha–Boltzmann populations) against the rest of the opacity, through the emergent-flux model of
 * stellar-atmosphere.ts. Dimensionless.
 */
export function balmerJumpDex(tEffK: number, logG = 4, metallicity = 0.02): number {
  const p = photosphereAt(tEffK, logG, metallicity);
  return Math.log10(photosphereFluxRatio(p, BALMER_EDGE_UM * (1 + 1e-6)) / photosphereFluxRatio(p, BALMER_EDGE_UM * (1 - 1e-6)));
}
