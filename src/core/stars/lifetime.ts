/**
 * Main-sequence lifetime, Hurley, Pols & Tout 2000, MNRAS 315, 543, §5.1, eqs. 4–7, Appendix A
 * coefficients a1–a10 with their metallicity polynomials in ζ = log10(Z/0.02). Myr.
 * t_BGB = (a1 + a2 M⁴ + a3 M^5.5 + M⁷)/(a4 M² + a5 M⁷); t_hook = μ t_BGB,
 * μ = max(0.5, 1 − 0.01 max(a6/M^a7, a8 + a9/M^a10)); x = max(0.95, min(0.95 − 0.03(ζ + 0.30103), 0.99));
 * t_MS = max(t_hook, x t_BGB). Fitted over 0.1–100 Msun; above 100 Msun the formula tends to the
 * constant 1/a5 ≈ 3 Myr, which we keep (an extrapolation).
 */
const COEF: readonly (readonly number[])[] = [
  [1.59389e3, 2.053038e3, 1.231226e3, 2.327785e2],
  [2.706708e3, 1.483131e3, 5.772723e2, 7.41123e1],
  [1.466143e2, -1.048442e2, -6.795374e1, -1.391127e1],
  [4.14196e-2, 4.564888e-2, 2.958542e-2, 5.571483e-3],
  [3.426349e-1, 0, 0, 0],
  [1.949814e1, 1.758178, -6.008212, -4.470533],
  [4.90383, 0, 0, 0],
  [5.212154e-2, 3.166411e-2, -2.750074e-3, -2.271549e-3],
  [1.312179, -3.294936e-1, 9.23186e-2, 2.610989e-2],
  [8.073972e-1, 0, 0, 0],
];

export function mainSequenceLifetimeMyr(massMsun: number, metallicity = 0.02): number {
  const zeta = Math.log10(metallicity / 0.02);
  const a = COEF.map(([al, be, ga, et]) => al + zeta * (be + zeta * (ga + zeta * et)));
  const m = massMsun;
  const tBgb = (a[0] + a[1] * m ** 4 + a[2] * m ** 5.5 + m ** 7) / (a[3] * m * m + a[4] * m ** 7);
  const mu = Math.max(0.5, 1 - 0.01 * Math.max(a[5] / m ** a[6], a[7] + a[8] / m ** a[9]));
  const x = Math.max(0.95, Math.min(0.95 - 0.03 * (zeta + 0.30103), 0.99));
  return Math.max(mu * tBgb, x * tBgb);
}
