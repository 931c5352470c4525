import type { CosmologyParams } from '../cosmology/params.js';

/**
 * Bardeen, Bond, Kaiser & Szalay 1986, ApJ 304, 15, eq. G3, with the baryon-corrected shape
 * parameter Γ = Ω_m h exp(−Ω_b − √(2h) Ω_b/Ω_m) (Sugiyama 1995, ApJS 100, 281). k in Mpc⁻¹,
 * q = k / (Γ h).
 */
export function makeBbks(p: CosmologyParams): (kMpc: number) => number {
  const h = p.h0 / 100;
  const gamma = p.omegaM * h * Math.exp(-p.omegaB - (Math.sqrt(2 * h) * p.omegaB) / p.omegaM);
  return (k: number): number => {
    const q = k / (gamma * h);
    if (q < 1e-9) return 1;
    return (Math.log(1 + 2.34 * q) / (2.34 * q)) * (1 + 3.89 * q + (16.1 * q) ** 2 + (5.46 * q) ** 3 + (6.71 * q) ** 4) ** -0.25;
  };
}
