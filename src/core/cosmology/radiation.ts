import { C_CM_S, MPC_CM, SIGMA_SB } from '../constants.js';
import type { CosmologyParams } from './params.js';

/** G in cgs (CODATA 2018). */
const G_CGS = 6.6743e-8;
/** Critical density for h = 1 in g cm⁻³: 3 (100 km/s/Mpc)² / (8πG). */
const RHO_CRIT_H1_G_CM3 = (3 * (1e7 / MPC_CM) ** 2) / (8 * Math.PI * G_CGS);

/**
 * Photon density today: Ω_γ = (4 σ_SB T⁴ / c³) / ρ_crit (standard black-body energy density;
 * ≈ 2.473e-5 h⁻² for T = 2.7255 K). Dimensionless.
 */
export function photonDensity(p: CosmologyParams): number {
  const h = p.h0 / 100;
  return (4 * SIGMA_SB * p.tcmbK ** 4) / C_CM_S ** 3 / RHO_CRIT_H1_G_CM3 / (h * h);
}

/**
 * Photons plus massless neutrinos: Ω_r = Ω_γ [1 + (7/8)(4/11)^(4/3) N_eff]
 * (Komatsu et al. 2011, ApJS 192, 18, eq. 26 in the massless limit). Dimensionless.
 */
export function radiationDensity(p: CosmologyParams): number {
  return photonDensity(p) * (1 + 0.22710731766 * p.nEff);
}
