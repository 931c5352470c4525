import { CHI_HMINUS_EV, CHI_HYDROGEN_EV, EV_ERG, H_PLANCK, K_BOLTZMANN, M_ELECTRON_G, M_HYDROGEN_G } from './atomic-constants.js';

/**
 * The gas of a photospheric layer in LTE: hydrogen (H, H⁺, H⁻), helium (He, He⁺, He²⁺) and the easily
 * ionised metals that supply the electrons of cool photospheres, at temperature T (K) and gas pressure P (dyn cm⁻²).
 * Ionisation by the Saha equation, n_{i+1} n_e/n_i = (2U_{i+1}/U_i)(2π m_e kT/h²)^{3/2} e^{−χ_i/kT}
 * (e.g. Gray 2005, eq. 1.20); charge balance and P = N kT fix n_e. Densities in cm⁻³.
 */
export interface GasState {
  readonly tK: number;
  readonly pGas: number;
  readonly nNeutral: number;
  readonly nProton: number;
  readonly nElectron: number;
  readonly nHMinus: number;
  readonly pElectron: number;
  /** Mass density, g cm⁻³. */
  readonly rho: number;
}

/**
 * Electron donors: ionisation energy (eV), 2U⁺/U⁰ from ground-term statistical weights (our approximation of
 * the partition functions), and solar number abundance log ε (H = 12; Asplund et al. 2009, ARA&A 47, 481,
 * from memory). Ionisation energies from memory (NIST): Na 5.139, Al 5.986, Ca 6.113, Mg 7.646, Fe 7.902,
 * Si 8.152 eV. Scaled with Z/0.02: the model takes Z = 0.02 as solar, as its lifetimes and ZAMS fits do.
 */
const DONORS: readonly (readonly [number, number, number])[] = [
  [5.139, 1, 6.24],
  [5.986, 1 / 3, 6.45],
  [6.113, 4, 6.34],
  [7.646, 4, 7.6],
  [7.902, 2.4, 7.5],
  [8.152, 4 / 3, 7.51],
];


/**
 * Helium: ionisation energies 24.587 and 54.418 eV (NIST, from memory) and 2U⁺/U⁰ = 4 (He I ¹S, He II ²S),
 * 2U²⁺/U⁺ = 1 (ground-level weights).
 */
const HE_I: readonly [number, number] = [24.587, 4];
const HE_II: readonly [number, number] = [54.418, 1];

/** Hydrogen and helium mass fractions X = 0.76 − 3Z, Y = 0.24 + 2Z (Tout et al. 1996 and Pols et al. 1998; from memory). */
export function hydrogenMassFraction(metallicity: number): number {
  return 0.76 - 3 * metallicity;
}

/** (2π m_e kT/h²)^{3/2}, cm⁻³. */
function thermalElectronDensity(tK: number): number {
  return ((2 * Math.PI * M_ELECTRON_G * K_BOLTZMANN * tK) / (H_PLANCK * H_PLANCK)) ** 1.5;
}

/**
 * Saha factor of hydrogen, n_p n_e/n_H0 (U_H0 = 2, U_p = 1), cm⁻³.
 */
export function hydrogenSahaFactor(tK: number): number {
  return thermalElectronDensity(tK) * Math.exp(-(CHI_HYDROGEN_EV * EV_ERG) / (K_BOLTZMANN * tK));
}

/** Saha factor of H⁻, n_H0 n_e/n_H⁻ = 4 (2π m_e kT/h²)^{3/2} e^{−0.754 eV/kT} (U_H⁻ = 1, U_H0 = 2), cm⁻³. */
export function hMinusSahaFactor(tK: number): number {
  return 4 * thermalElectronDensity(tK) * Math.exp(-(CHI_HMINUS_EV * EV_ERG) / (K_BOLTZMANN * tK));
}

/**
 * LTE state at T and P_gas for metallicity Z. Charge balance n_e = n_p + n_He⁺ + 2n_He²⁺ + Σ n_M⁺ − n_H⁻ is
 * solved by bisection in ln n_e to 1e-10. H⁻ is counted among the neutral atoms in the level populations
 * (n_H⁻/n_H0 = n_e/Φ_H⁻ stays below 1e-6 in the model's photospheres).
 */
export function gasState(tK: number, pGas: number, metallicity: number): GasState {
  if (!(tK > 0 && pGas > 0)) throw new RangeError(`gas state needs T > 0 and P > 0 (got T = ${tK} K, P = ${pGas} dyn/cm²)`);
  const x = hydrogenMassFraction(metallicity);
  const yHe = (1 - x - metallicity) / (4 * x);
  const zScale = metallicity / 0.02;
  const nTh = thermalElectronDensity(tK);
  const kt = K_BOLTZMANN * tK;
  const phiH = hydrogenSahaFactor(tK);
  const phiHm = hMinusSahaFactor(tK);
  const nD = DONORS.length;
  const yD = DONORS.map(([, , eps]) => 10 ** (eps - 12) * zScale);
  const phiD = DONORS.map(([chi, g]) => g * nTh * Math.exp(-(chi * EV_ERG) / kt));
  const phiHe1 = HE_I[1] * nTh * Math.exp(-(HE_I[0] * EV_ERG) / kt);
  const phiHe2 = HE_II[1] * nTh * Math.exp(-(HE_II[0] * EV_ERG) / kt);
  const yMetal = yD.reduce((a, y) => a + y, 0);
  const nTot = pGas / kt;
  const nuclei = (ne: number): number => (nTot - ne) / (1 + yHe + yMetal);
  const excess = (lnNe: number): number => {
    const ne = Math.exp(lnNe);
    let ions = phiH / (phiH + ne);
    const a = phiHe1 / ne;
    const ab = a * (phiHe2 / ne);
    ions += (yHe * (a + 2 * ab)) / (1 + a + ab);
    for (let k = 0; k < nD; k++) ions += (yD[k] * phiD[k]) / (phiD[k] + ne);
    ions -= (ne / (phiH + ne)) * (ne / phiHm); // H⁻ per H nucleus: (n_H0/n_H)(n_e/Φ_H⁻)
    return nuclei(ne) * ions - ne;
  };
  let lo = Math.log(nTot * 1e-30);
  let hi = Math.log(nTot); // n_e < N: every particle counted once
  for (let k = 0; k < 200 && hi - lo > 1e-10; k++) {
    const mid = 0.5 * (lo + hi);
    if (excess(mid) > 0) lo = mid;
    else hi = mid;
  }
  const ne = Math.exp(0.5 * (lo + hi));
  const nH = nuclei(ne);
  const nNeutral = (nH * ne) / (phiH + ne);
  return {
    tK,
    pGas,
    nNeutral,
    nProton: nH - nNeutral,
    nElectron: ne,
    nHMinus: (nNeutral * ne) / phiHm,
    pElectron: ne * kt,
    rho: (nH * M_HYDROGEN_G) / x,
  };
}
