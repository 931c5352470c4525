import type { MultiplicityModel } from './multiplicity.js';

/**
 * Reed et al. 2007, MNRAS 374, 2: calibrated on simulations reaching very high redshift, with an
 * explicit dependence on the local spectral slope n_eff:
 * f = A √(2a/π) [1 + (aν²)^−p + 0.6 G1 + 0.4 G2] ν exp(−c a ν²/2 − 0.03 ν^0.6/(n_eff + 3)²),
 * G1 = exp[−(ln σ⁻¹ − 0.4)²/(2·0.6²)], G2 = exp[−(ln σ⁻¹ − 0.75)²/(2·0.2²)],
 * A = 0.3222, a = 0.707, p = 0.3, c = 1.08 (their eq. 12).
 */
export const reed07: MultiplicityModel = {
  name: 'reed07',
  label: 'Reed et al. 2007',
  source: 'Reed et al. 2007, MNRAS 374, 2, eq. 12',
  calibrated: { lnInvSigmaMin: -1.7, lnInvSigmaMax: 0.9, zMax: 30 },
  f: ({ sigma, deltaC, nEff }) => {
    const nu = deltaC / sigma;
    const lis = -Math.log(sigma);
    const g1 = Math.exp(-((lis - 0.4) ** 2) / (2 * 0.36));
    const g2 = Math.exp(-((lis - 0.75) ** 2) / (2 * 0.04));
    const a = 0.707;
    const anu2 = a * nu * nu;
    const ne3 = Math.max(nEff + 3, 1e-3);
    return (
      0.3222 * Math.sqrt((2 * a) / Math.PI) * (1 + anu2 ** -0.3 + 0.6 * g1 + 0.4 * g2) * nu *
      Math.exp((-1.08 * anu2) / 2 - (0.03 * nu ** 0.6) / (ne3 * ne3))
    );
  },
};
