/**
 * A halo mass function in the Jenkins et al. 2001 convention, dn/dlnM = f(σ) ρ̄_m/M |dlnσ/dlnM|
 * (reproduced as Tinker et al. 2008, ApJ 688, 709, eq. 2). Each model supplies f.
 */
export interface MultiplicityContext {
  /** Linear rms σ(M, z). */
  readonly sigma: number;
  /** Collapse threshold δc at z. */
  readonly deltaC: number;
  readonly z: number;
  /** Effective spectral slope n_eff = −6 dlnσ/dlnM − 3 at M. */
  readonly nEff: number;
}

export interface MultiplicityModel {
  readonly name: string;
  readonly label: string;
  /** Paper, journal and equation/table the coefficients come from. */
  readonly source: string;
  /** Range of ln σ⁻¹ (and redshifts) where the fit was calibrated, for warnings. */
  readonly calibrated: { readonly lnInvSigmaMin: number; readonly lnInvSigmaMax: number; readonly zMax: number };
  f(ctx: MultiplicityContext): number;
}
