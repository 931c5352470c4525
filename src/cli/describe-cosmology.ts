import { makeBackground, type CosmologyParams } from '../core/cosmology/index.js';

/** The cosmology block echoed in every output: inputs plus the derived densities (dimensionless). */
export function describeCosmology(p: CosmologyParams): Record<string, number> {
  const bg = makeBackground(p);
  return {
    h0_km_s_mpc: p.h0,
    omega_m: p.omegaM,
    omega_b: p.omegaB,
    omega_k: p.omegaK,
    omega_r: bg.omegaR,
    omega_de: bg.omegaDE,
    tcmb_k: p.tcmbK,
    neff: p.nEff,
    w0: p.w0,
    wa: p.wa,
    sigma8: p.sigma8,
    ns: p.ns,
    baryon_fraction: p.omegaB / p.omegaM,
    age_today_gyr: bg.ageGyr(0),
  };
}
