import type { CosmologyParams } from './params.js';

/**
 * The base parameters the cosmological uncertainty is expressed in: ω_b = Ω_b h², ω_c = Ω_c h²,
 * H0, n_s, σ8. Ω_m is derived, Ω_m = ω_m/h², so that a covariance that is diagonal in these keeps
 * the Ω_m–H0 anti-correlation a CMB fit imposes (it fixes ω_m, not Ω_m; common practice, no source).
 * Curvature, T_CMB, N_eff, w0 and wa are held at their given values; dark energy closes the budget.
 */
export const BASE_PARAM_KEYS = ['omegaBh2', 'omegaCh2', 'h0', 'ns', 'sigma8'] as const;
export type BaseParamKey = (typeof BASE_PARAM_KEYS)[number];
export type BaseParams = Readonly<Record<BaseParamKey, number>>;

/** Name of each base parameter in covariance files and outputs, with its unit. */
export const BASE_PARAM_SPECS: Readonly<Record<BaseParamKey, { readonly name: string; readonly label: string; readonly unit: string }>> = Object.freeze({
  omegaBh2: { name: 'omega_b_h2', label: 'Ω_b h²', unit: '' },
  omegaCh2: { name: 'omega_c_h2', label: 'Ω_c h²', unit: '' },
  h0: { name: 'h0', label: 'H₀', unit: 'km/s/Mpc' },
  ns: { name: 'n_s', label: 'n_s', unit: '' },
  sigma8: { name: 'sigma8', label: 'σ₈', unit: '' },
});

/** The file/output names in BASE_PARAM_KEYS order: omega_b_h2, omega_c_h2, h0, n_s, sigma8. */
export const BASE_PARAM_NAMES: readonly string[] = BASE_PARAM_KEYS.map((k) => BASE_PARAM_SPECS[k].name);

/**
 * Base parameters of a cosmology. ω_c = Ω_m h² − ω_b − ω_ν: pass the density of massive neutrinos
 * counted inside Ω_m (omegaNuH2, e.g. 0.06 eV / 93.14 eV for the Planck 2018 baseline) to recover the
 * published ω_c; it cancels in every variation (see perturbCosmology).
 */
export function toBaseParams(p: CosmologyParams, omegaNuH2 = 0): BaseParams {
  const h2 = (p.h0 / 100) ** 2;
  return { omegaBh2: p.omegaB * h2, omegaCh2: p.omegaM * h2 - p.omegaB * h2 - omegaNuH2, h0: p.h0, ns: p.ns, sigma8: p.sigma8 };
}

/**
 * The cosmology moved by `delta` in the base parameters (same units):
 *   ω_b' = Ω_b h² + δω_b, ω_m' = Ω_m h² + δω_b + δω_c, h' = (H0 + δH0)/100,
 *   Ω_b' = ω_b'/h'², Ω_m' = ω_m'/h'², n_s' = n_s + δn_s, σ8' = σ8 + δσ8; the rest unchanged.
 * Any neutrino density inside Ω_m rides along unchanged. A zero delta returns the parameters as given.
 */
export function perturbCosmology(p: CosmologyParams, delta: Partial<BaseParams>): CosmologyParams {
  const d = (k: BaseParamKey): number => delta[k] ?? 0;
  if (BASE_PARAM_KEYS.every((k) => d(k) === 0)) return p;
  const h2 = (p.h0 / 100) ** 2;
  const wb = p.omegaB * h2 + d('omegaBh2');
  const wm = p.omegaM * h2 + d('omegaBh2') + d('omegaCh2');
  const h0 = p.h0 + d('h0');
  const h2n = (h0 / 100) ** 2;
  return { ...p, h0, omegaB: wb / h2n, omegaM: wm / h2n, ns: p.ns + d('ns'), sigma8: p.sigma8 + d('sigma8') };
}
