/**
 * Cosmological parameters. Plain frozen data: safe to send through structured clone.
 * Conventions: omegaM includes baryons (and any non-relativistic neutrinos) at z = 0; radiation
 * (photons + massless neutrinos from tcmbK and nEff) is extra; omegaK is given; dark energy
 * fills the rest: Ω_DE = 1 − Ω_m − Ω_r − Ω_k.
 */
export interface CosmologyParams {
  /** Hubble constant, km s⁻¹ Mpc⁻¹. */
  readonly h0: number;
  /** Matter density today (CDM + baryons), dimensionless. */
  readonly omegaM: number;
  /** Baryon density today, dimensionless. */
  readonly omegaB: number;
  /** Curvature density today, dimensionless (Ω_k > 0 open). */
  readonly omegaK: number;
  /** CMB temperature today, K (0 switches radiation off). */
  readonly tcmbK: number;
  /** Effective number of neutrino species, treated as massless (radiation). */
  readonly nEff: number;
  /** Dark-energy equation of state today (CPL w0). */
  readonly w0: number;
  /** CPL slope: w(a) = w0 + wa (1 − a). */
  readonly wa: number;
  /** rms linear density contrast in spheres of 8 h⁻¹ Mpc at z = 0. */
  readonly sigma8: number;
  /** Primordial spectral index. */
  readonly ns: number;
}

/** One entry of the parameter table: drives validation, CLI flags and form labels. */
export interface ParamSpec {
  readonly key: keyof CosmologyParams;
  readonly flag: string;
  readonly label: string;
  readonly unit: string;
  readonly min: number;
  readonly max: number;
  readonly doc: string;
}

export const PARAM_SPECS: readonly ParamSpec[] = [
  { key: 'h0', flag: '--h0', label: 'H₀', unit: 'km/s/Mpc', min: 20, max: 150, doc: 'Hubble constant' },
  { key: 'omegaM', flag: '--omega-m', label: 'Ωm', unit: '', min: 0.01, max: 1.5, doc: 'matter density today (incl. baryons)' },
  { key: 'omegaB', flag: '--omega-b', label: 'Ωb', unit: '', min: 1e-4, max: 0.5, doc: 'baryon density today (> 0: f_b sets the baryon budget)' },
  { key: 'omegaK', flag: '--omega-k', label: 'Ωk', unit: '', min: -0.5, max: 1, doc: 'curvature density today' },
  { key: 'tcmbK', flag: '--tcmb', label: 'T_CMB', unit: 'K', min: 0, max: 10, doc: 'CMB temperature today' },
  { key: 'nEff', flag: '--neff', label: 'N_eff', unit: '', min: 0, max: 10, doc: 'massless neutrino species' },
  { key: 'w0', flag: '--w0', label: 'w₀', unit: '', min: -3, max: 0, doc: 'dark-energy equation of state today' },
  { key: 'wa', flag: '--wa', label: 'w_a', unit: '', min: -3, max: 3, doc: 'CPL evolution of w' },
  { key: 'sigma8', flag: '--sigma8', label: 'σ₈', unit: '', min: 0.1, max: 2, doc: 'rms fluctuation in 8 h⁻¹ Mpc spheres' },
  { key: 'ns', flag: '--ns', label: 'n_s', unit: '', min: 0.5, max: 1.5, doc: 'primordial spectral index' },
];
