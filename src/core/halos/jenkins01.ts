import type { MultiplicityModel } from './multiplicity.js';

/**
 * Jenkins et al. 2001, MNRAS 321, 372, eq. 9 (FOF b = 0.2): f = 0.315 exp(−|ln σ⁻¹ + 0.61|^3.8),
 * valid for −1.2 ≤ ln σ⁻¹ ≤ 1.05.
 */
export const jenkins01: MultiplicityModel = {
  name: 'jenkins01',
  label: 'Jenkins et al. 2001',
  source: 'Jenkins et al. 2001, MNRAS 321, 372, eq. 9',
  calibrated: { lnInvSigmaMin: -1.2, lnInvSigmaMax: 1.05, zMax: 5 },
  f: ({ sigma }) => 0.315 * Math.exp(-(Math.abs(-Math.log(sigma) + 0.61) ** 3.8)),
};
