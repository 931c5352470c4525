import { C_CM_S, H_PLANCK, K_BOLTZMANN } from '../constants.js';
import { findRoot } from '../numeric/root-find.js';
import { blackbodyLnu } from './blackbody.js';
import { continuousOpacity, photosphericLayer, rosselandMean } from './continuous-opacity.js';
import { fluxKernel } from './formal-solution.js';
import { gasState, type GasState } from './gas-state.js';

/**
 * Emergent spectra of stellar photospheres from their LTE continuous opacity, in the classical non-grey
 * treatment on a grey temperature structure (e.g. Mihalas 1978, Stellar Atmospheres, ch. 3 and 7; Gray 2005,
 * The Observation and Analysis of Stellar Photospheres, ch. 8–9 — chapter numbers from memory):
 *  - temperature against the mean optical depth τ: the Eddington grey law T⁴(τ) = ¾ T_eff⁴ (τ + ⅔);
 *  - opacity: κ_ν of the photospheric layer (continuous-opacity.ts: hydrogen bound-free from every level
 *    and free-free, H⁻, Thomson scattering; Saha–Boltzmann populations at T_eff and the hydrostatic pressure
 *    for the star's gravity), held fixed with depth, so τ_ν = r(λ) τ with r = κ_ν/κ̄;
 *  - r = (κ_ν/κ_R)^w / s: κ_R the Rosseland mean, w the weight of the non-grey opacity (nonGreyWeight: 1 for
 *    hot photospheres, 0 for cool ones), and s the one number that conserves the total flux,
 *    ∫F_ν dν = σT_eff⁴ (the grey law with κ_R alone does not, for a non-grey κ_ν);
 *  - emergent flux from the formal solution F_ν = 2π∫B_ν(T(τ_ν/r))E_2(τ_ν)dτ_ν (formal-solution.ts).
 * The Lyman, Balmer, Paschen… jumps and the λ³ rise of each hydrogen continuum follow from the opacity; the
 * flux blocked where the gas is opaque comes out through the windows, so hot stars are brighter and bluer
 * between 912 and 3000 Å than a black body of their T_eff. Metal and helium continua, line blanketing,
 * scattering (treated as absorption), winds and departures from LTE are not modelled.
 * Wavelengths in μm, temperatures in K, gravities log10 of cm s⁻².
 */

/** hc/k in μm K (h, k, c exact, SI 2019). */
const HC_K_UM_K = ((H_PLANCK * C_CM_S) / K_BOLTZMANN) * 1e4;
/**
 * Wavelength grid for the flux integral, μm: midpoints of log-spaced cells in pieces that meet at the hydrogen
 * edges n²/R_H for n = 1…5 (Lyman, Balmer, Paschen, Brackett, Pfund), so no cell straddles a jump (the
 * midpoint rule stays second order); with each cell's Δln λ. Built on first use (no work at module load,
 * so bundles that never compute a spectrum drop it).
 */
const CELLS_PER_DEX = 30;
function buildFluxGrid(): { lams: number[]; dln: number[] } {
  const bounds = [0.005, ...[1, 2, 3, 4, 5].map((n) => (n * n) / 1.0967758e-3 / 1e4), 60];
  const lams: number[] = [];
  const dln: number[] = [];
  for (let p = 0; p + 1 < bounds.length; p++) {
    const lo = bounds[p];
    const hi = bounds[p + 1];
    const n = Math.max(4, Math.ceil(Math.log10(hi / lo) * CELLS_PER_DEX));
    for (let i = 0; i < n; i++) {
      lams.push(lo * (hi / lo) ** ((i + 0.5) / n));
      dln.push(Math.log(hi / lo) / n);
    }
  }
  return { lams, dln };
}
let fluxGridCache: { lams: number[]; dln: number[] } | undefined;
function fluxGrid(): { lams: number[]; dln: number[] } {
  fluxGridCache ??= buildFluxGrid();
  return fluxGridCache;
}

/** B_ν(T) up to the constant 2h/c² · c³ (λ in μm): 1/(λ³ (e^x − 1)), x = hc/(λkT). */
function planckShape(tK: number, lambdaUm: number): number {
  const x = HC_K_UM_K / (lambdaUm * tK);
  return x > 700 ? 0 : 1 / (lambdaUm ** 3 * Math.expm1(x));
}

/** F_ν/π in planckShape units for opacity ratio r = κ_ν/κ̄ (formal solution on the Eddington grey T(τ)). */
function emergentShape(tEffK: number, r: number, lambdaUm: number): number {
  const { t, w } = fluxKernel();
  let s = 0;
  for (let k = 0; k < t.length; k++) s += w[k] * planckShape(tEffK * Math.sqrt(Math.sqrt(0.75 * (t[k] / r + 2 / 3))), lambdaUm);
  return s;
}

/**
 * Weight of the computed non-grey opacity against a grey one, by T_eff: the opacity ratio used is
 * r = (κ_ν/κ_R)^w / s, w = 0 at ≤ 7000 K, 1 at ≥ 10 000 K, linear in log T_eff between. Below ~7000 K H⁻ gives most
 * of the continuous opacity and neutral metals (Mg, Si, Fe, Al, C: bound-free edges and lines, not in
 * continuous-opacity.ts) make the ultraviolet opaque; left out, they would open a false ultraviolet window
 * through which the grey structure would push flux taken from the optical. Above ~10 000 K hydrogen gives
 * most of the opacity and those metals are ionised. So cool photospheres stay grey, as the model's had been
 * (the two temperatures: our approximation, common practice, no source; not tuned to any check).
 */
export function nonGreyWeight(tEffK: number): number {
  const w = Math.log(tEffK / NON_GREY_FROM_K) / Math.log(NON_GREY_FULL_K / NON_GREY_FROM_K);
  return Math.min(Math.max(w, 0), 1);
}
export const NON_GREY_FROM_K = 7000;
export const NON_GREY_FULL_K = 10000;

/** Σ_i F_ν(λ_i) Δlnλ_i/λ_i (∝ ∫F_ν dν) for opacity ratios r_i/s, r_i = (κ_i/κ_R)^w. */
function totalFlux(tEffK: number, kappaOverRoss: Float64Array, s: number): number {
  const { lams: LAMS, dln: DLN } = fluxGrid();
  let f = 0;
  for (let i = 0; i < LAMS.length; i++) f += (DLN[i] / LAMS[i]) * emergentShape(tEffK, kappaOverRoss[i] / s, LAMS[i]);
  return f;
}

/**
 * The flux-conserving scale s: Σ F_ν = Σ πB_ν(T_eff) on the grid to 1e-9 in ln F, by secant steps in ln s
 * (a larger s makes every layer more transparent, hence hotter and brighter, so the flux rises
 * monotonically with s).
 */
function fluxScale(gas: GasState, kappaRoss: number): number {
  const tEffK = gas.tK;
  const { lams: LAMS, dln: DLN } = fluxGrid();
  const w = nonGreyWeight(tEffK);
  const ratio = Float64Array.from(LAMS, (l) => (continuousOpacity(gas, l * 1e4) / kappaRoss) ** w);
  let target = 0;
  for (let i = 0; i < LAMS.length; i++) target += (DLN[i] / LAMS[i]) * planckShape(tEffK, LAMS[i]);
  const f = (lnS: number): number => Math.log(totalFlux(tEffK, ratio, Math.exp(lnS)) / target);
  // secant steps from s = 1 (exact for a grey photosphere); a root search over [10⁻⁴, 10⁴] if they stall
  let x0 = 0;
  let f0 = f(x0);
  if (Math.abs(f0) < 1e-9) return 1;
  let x1 = -f0;
  for (let k = 0; k < 20; k++) {
    const f1 = f(x1);
    if (Math.abs(f1) < 1e-9) return Math.exp(x1);
    const slope = (f1 - f0) / (x1 - x0);
    if (!(slope > 0)) break;
    x0 = x1;
    f0 = f1;
    x1 -= Math.max(Math.min(f1 / slope, 2), -2);
  }
  const lo = Math.log(1e-4);
  const hi = Math.log(1e4);
  if (!(f(lo) < 0)) return 1e-4;
  if (!(f(hi) > 0)) return 1e4;
  return Math.exp(findRoot(f, lo, hi, 1e-8));
}

/** Node grids of the precomputed photospheres: log T_eff (K) and log g (cgs). */
const LOG_T_MIN = Math.log10(2500);
const LOG_T_MAX = Math.log10(200000);
const N_T = 80;
const LOG_G_MIN = -0.5;
const LOG_G_MAX = 6;
const N_G = 14;

interface Node {
  readonly lnP: number;
  readonly lnScale: number;
}

const tables = new Map<number, (Node | undefined)[]>();

function node(metallicity: number, i: number, j: number): Node {
  let t = tables.get(metallicity);
  if (!t) {
    t = new Array<Node | undefined>(N_T * N_G);
    tables.set(metallicity, t);
  }
  const hit = t[i * N_G + j];
  if (hit) return hit;
  const tEffK = 10 ** (LOG_T_MIN + ((LOG_T_MAX - LOG_T_MIN) * i) / (N_T - 1));
  const logG = LOG_G_MIN + ((LOG_G_MAX - LOG_G_MIN) * j) / (N_G - 1);
  const gas = photosphericLayer(tEffK, logG, metallicity);
  const n = { lnP: Math.log(gas.pGas), lnScale: Math.log(fluxScale(gas, rosselandMean(gas))) };
  t[i * N_G + j] = n;
  return n;
}

export interface Photosphere {
  readonly tEffK: number;
  readonly logG: number;
  readonly metallicity: number;
  /** The photospheric layer's gas (T = T_eff, hydrostatic P). */
  readonly gas: GasState;
  /** Rosseland mean of the layer, cm² g⁻¹. */
  readonly kappaRoss: number;
  /** nonGreyWeight(T_eff). */
  readonly weight: number;
  /** The flux-conserving scale s of r = (κ_ν/κ_R)^w / s. */
  readonly scale: number;
}

/**
 * The photosphere of (T_eff, log g, Z): ln P and ln s interpolated bilinearly in (log T_eff, log g) between
 * nodes solved on first use (40 × 14 over 2500–200 000 K and log g −0.5–6, clamped outside); κ_ν and κ_R
 * then computed at the star's own T_eff and P.
 */
export function photosphereAt(tEffK: number, logG: number, metallicity = 0.02): Photosphere {
  if (!(tEffK > 0) || !Number.isFinite(logG)) throw new RangeError(`photosphere needs T_eff > 0 K and a finite log g (got ${tEffK} K, ${logG})`);
  const x = Math.min(Math.max(((Math.log10(tEffK) - LOG_T_MIN) / (LOG_T_MAX - LOG_T_MIN)) * (N_T - 1), 0), N_T - 1);
  const y = Math.min(Math.max(((logG - LOG_G_MIN) / (LOG_G_MAX - LOG_G_MIN)) * (N_G - 1), 0), N_G - 1);
  const i = Math.min(Math.floor(x), N_T - 2);
  const j = Math.min(Math.floor(y), N_G - 2);
  const fx = x - i;
  const fy = y - j;
  const n00 = node(metallicity, i, j);
  const n01 = node(metallicity, i, j + 1);
  const n10 = node(metallicity, i + 1, j);
  const n11 = node(metallicity, i + 1, j + 1);
  const w00 = (1 - fx) * (1 - fy);
  const w01 = (1 - fx) * fy;
  const w10 = fx * (1 - fy);
  const w11 = fx * fy;
  const lnP = w00 * n00.lnP + w01 * n01.lnP + w10 * n10.lnP + w11 * n11.lnP;
  const lnS = w00 * n00.lnScale + w01 * n01.lnScale + w10 * n10.lnScale + w11 * n11.lnScale;
  const gas = gasState(tEffK, Math.exp(lnP), metallicity);
  return { tEffK, logG, metallicity, gas, kappaRoss: rosselandMean(gas), weight: nonGreyWeight(tEffK), scale: Math.exp(lnS) };
}

/** Opacity ratio r = (κ_ν/κ_R)^w / s of the photosphere at λ (μm): κ_ν against the mean opacity of the grey structure. */
export function opacityRatio(p: Photosphere, lambdaUm: number): number {
  const w = p.weight;
  return (w === 0 ? 1 : (continuousOpacity(p.gas, lambdaUm * 1e4) / p.kappaRoss) ** w) / p.scale;
}

/** Emergent F_ν over the black-body value πB_ν(T_eff) at λ (μm); 0 where B_ν(T_eff) underflows. */
export function photosphereFluxRatio(p: Photosphere, lambdaUm: number): number {
  const bb = planckShape(p.tEffK, lambdaUm);
  return bb > 0 ? emergentShape(p.tEffK, opacityRatio(p, lambdaUm), lambdaUm) / bb : 0;
}

/**
 * Specific luminosity of a star of radius R (Rsun) with this photosphere at λ (μm): 4πR² F_ν,
 * erg s⁻¹ Hz⁻¹.
 */
export function stellarLnu(rRsun: number, p: Photosphere, lambdaUm: number): number {
  return blackbodyLnu(rRsun, p.tEffK, lambdaUm) * photosphereFluxRatio(p, lambdaUm);
}
