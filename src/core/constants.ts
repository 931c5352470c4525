/** Physical constants and unit conversions used by the core (cgs unless a name says otherwise). */

/** Speed of light, km/s (SI definition, exact). */
export const C_KM_S = 299792.458;
/** Speed of light, cm/s (exact). */
export const C_CM_S = 2.99792458e10;
/** 1 Mpc in cm (IAU 2015: 1 pc = 648000/π au, au = 1.495978707e13 cm). */
export const MPC_CM = 3.0856775814913673e24;
/** 10 pc in cm. */
export const TEN_PC_CM = 3.0856775814913673e19;
/** Julian year, s. */
export const YEAR_S = 3.15576e7;
/** Hubble time 1/H0 in Gyr for H0 = 1 km/s/Mpc: Mpc_km / Gyr_s. */
export const HUBBLE_TIME_GYR_KMSMPC = 3.0856775814913673e19 / 3.15576e16;
/** Critical density today for h = 1: 3 H0² / (8πG) in Msun Mpc⁻³ (G = 6.67430e-11, Msun = 1.98841e30 kg). */
export const RHO_CRIT_H2_MSUN_MPC3 = 2.77536627e11;
/** Solar luminosity, erg/s (IAU 2015 nominal). */
export const LSUN_ERG_S = 3.828e33;
/** Solar effective temperature, K (IAU 2015 nominal). */
export const TSUN_K = 5772;
/** Planck constant, erg s (SI 2019, exact). */
export const H_PLANCK = 6.62607015e-27;
/** Boltzmann constant, erg/K (SI 2019, exact). */
export const K_BOLTZMANN = 1.380649e-16;
/** Stefan–Boltzmann constant, erg cm⁻² s⁻¹ K⁻⁴ (derived from h, k, c). */
export const SIGMA_SB = 5.670374419e-5;
/** Solar radius, cm (IAU 2015 nominal). */
export const RSUN_CM = 6.957e10;
/** 1 arcmin² in steradian: (π / 10800)². */
export const ARCMIN2_SR = (Math.PI / 10800) ** 2;
/** AB zero point: m_AB = −2.5 log10 f_ν[erg s⁻¹ cm⁻² Hz⁻¹] − 48.60 (Oke & Gunn 1983, ApJ 266, 713). */
export const AB_ZERO_POINT = 48.6;
/** Lyman-α rest wavelength, μm. */
export const LYMAN_ALPHA_UM = 0.121567;
