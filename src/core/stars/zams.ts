import { RSUN_CM, TSUN_K } from '../constants.js';

/**
 * Zero-age main-sequence luminosity and radius, Tout, Pols, Eggleton & Han 1996, MNRAS 281, 257,
 * eqs. 1–2 with Tables 1–2 (each coefficient c0 + c1ζ + … + c4ζ⁴, ζ = log10(Z/0.02)); valid
 * 0.1–100 Msun. Above 100 Msun we continue on the Eddington-limited branch L ∝ M (the linear
 * high-mass mass–luminosity relation) with R ∝ M^0.5, which keeps T_eff at its 100-Msun value.
 */
const L_ROWS = [
  [0.3970417, -0.32913574, 0.34776688, 0.37470851, 0.09011915],
  [8.527626, -24.41225973, 56.43597107, 37.06152575, 5.4562406],
  [0.00025546, -0.00123461, -0.00023246, 0.00045519, 0.00016176],
  [5.432889, -8.62157806, 13.44202049, 14.51584135, 3.39793084],
  [5.563579, -10.32345224, 19.4432298, 18.97361347, 4.16903097],
  [0.7886606, -2.90870942, 6.54713531, 4.05606657, 0.53287322],
  [0.00586685, -0.01704237, 0.03872348, 0.02570041, 0.00383376],
];
const R_ROWS = [
  [1.715359, 0.62246212, -0.92557761, -1.16996966, -0.30631491],
  [6.597788, -0.42450044, -12.13339427, -10.73509484, -2.51487077],
  [10.08855, -7.11727086, -31.67119479, -24.24848322, -5.33608972],
  [1.012495, 0.3269969, -0.00923418, -0.03876858, -0.0041275],
  [0.07490166, 0.02410413, 0.07233664, 0.03040467, 0.00197741],
  [0.01077422, 0, 0, 0, 0],
  [3.082234, 0.9447205, -2.15200882, -2.49219496, -0.63848738],
  [17.84778, -7.4534569, -48.96066856, -40.05386135, -9.09331816],
  [0.00022582, -0.00186899, 0.00388783, 0.00142402, -0.00007671],
];

const poly = (row: readonly number[], z: number): number => row[0] + z * (row[1] + z * (row[2] + z * (row[3] + z * row[4])));

function toutL(m: number, zeta: number): number {
  const [al, be, ga, de, ep, ze, et] = L_ROWS.map((r) => poly(r, zeta));
  return (al * m ** 5.5 + be * m ** 11) / (ga + m ** 3 + de * m ** 5 + ep * m ** 7 + ze * m ** 8 + et * m ** 9.5);
}

function toutR(m: number, zeta: number): number {
  const [th, io, ka, la, mu, nu, xi, om, pi] = R_ROWS.map((r) => poly(r, zeta));
  return (th * m ** 2.5 + io * m ** 6.5 + ka * m ** 11 + la * m ** 19 + mu * m ** 19.5) / (nu + xi * m ** 2 + om * m ** 8.5 + m ** 18.5 + pi * m ** 19.5);
}

/** ZAMS luminosity, Lsun. */
export function zamsLuminosityLsun(massMsun: number, metallicity = 0.02): number {
  const zeta = Math.log10(metallicity / 0.02);
  return massMsun <= 100 ? toutL(massMsun, zeta) : toutL(100, zeta) * (massMsun / 100);
}

/** ZAMS radius, Rsun. */
export function zamsRadiusRsun(massMsun: number, metallicity = 0.02): number {
  const zeta = Math.log10(metallicity / 0.02);
  return massMsun <= 100 ? toutR(massMsun, zeta) : toutR(100, zeta) * Math.sqrt(massMsun / 100);
}

/** T_eff = 5772 K (L/Lsun)^(1/4) (R/Rsun)^(−1/2) (Stefan–Boltzmann with the IAU 2015 nominal Sun), K. */
export function effectiveTemperatureK(lLsun: number, rRsun: number): number {
  return TSUN_K * lLsun ** 0.25 * rRsun ** -0.5;
}

/**
 * Surface gravity log10(GM/R²), cgs, for M in Msun and R in Rsun, with the IAU 2015 nominal GM_sun =
 * 1.3271244e26 cm³ s⁻² and R_sun = 6.957e10 cm (log g_sun = 4.438).
 */
export function surfaceLogG(massMsun: number, rRsun: number): number {
  return Math.log10((1.3271244e26 * massMsun) / (RSUN_CM * rRsun) ** 2);
}
