import type { MultiplicityModel } from './multiplicity.js';

/**
 * Tinker et al. 2008, ApJ 688, 709, eq. 3 with Table 2 (Δ = 200 with respect to the mean density)
 * and the redshift evolution of eqs. 5–8: f = A[(σ/b)^−a + 1] exp(−c/σ²),
 * A = 0.186(1+z)^−0.14, a = 1.47(1+z)^−0.06, b = 2.57(1+z)^−α, log10 α = −[0.75/log10(Δ/75)]^1.2, c = 1.19.
 * Calibrated for z ≤ 2.5 and −0.6 ≲ ln σ⁻¹ ≲ 0.4; beyond that it is an extrapolation.
 */
export const tinker08: MultiplicityModel = {
  name: 'tinker08',
  label: 'Tinker et al. 2008 (Δ=200m)',
  source: 'Tinker et al. 2008, ApJ 688, 709, eq. 3, Table 2 (Δ = 200m), eqs. 5–8',
  calibrated: { lnInvSigmaMin: -0.6, lnInvSigmaMax: 0.4, zMax: 2.5 },
  f: ({ sigma, z }) => {
    const delta = 200;
    const alpha = 10 ** -((0.75 / Math.log10(delta / 75)) ** 1.2);
    const A = 0.186 * (1 + z) ** -0.14;
    const a = 1.47 * (1 + z) ** -0.06;
    const b = 2.57 * (1 + z) ** -alpha;
    const c = 1.19;
    return A * ((sigma / b) ** -a + 1) * Math.exp(-c / (sigma * sigma));
  },
};
