import { C_CM_S, H_PLANCK, K_BOLTZMANN } from '../constants.js';
import { balmerJumpDex } from './balmer-jump.js';
import { blackbodyLnu } from './blackbody.js';

/**
 * Emergent spectra of stellar photospheres with the hydrogen Lyman and Balmer continua, in the classical
 * grey-structure approximation (e.g. Mihalas 1978, Stellar Atmospheres, 2nd ed., ch. 3 and 7; Gray 2005,
 * The Observation and Analysis of Stellar Photospheres, ch. 9 — chapter numbers from memory):
 *  - temperature against the mean optical depth τ: the Eddington grey law T⁴(τ) = ¾ T_eff⁴ (τ + ⅔);
 *  - emergent flux by the Eddington–Barbier relation, F_ν ≈ π B_ν(T at τ_ν = ⅔). With κ_ν/κ̄ = r(λ), τ_ν = ⅔
 *    lies at τ = ⅔/r, where T⁴ = T_eff⁴ (1 + 1/r)/2: transparent wavelengths (r < 1) show deeper, hotter
 *    layers, opaque ones (r > 1) cooler layers, down to the boundary temperature 2^(−1/4) T_eff;
 *  - opacity relative to the mean: r_P (grey) longward of the Balmer edge (3646 Å); r_P + j (λ/3646 Å)³ in the
 *    Balmer continuum (the hydrogenic bound-free cross-section falls as ν⁻³, Kramers 1923); opaque (r → ∞)
 *    in the Lyman continuum below 912 Å;
 *  - two conditions fix r_P and j at each T_eff: the measured Balmer jump of main-sequence stars
 *    (balmer-jump.ts), and conservation of the total flux, ∫F_ν dν = σT_eff⁴.
 * The flux blocked in the Lyman and Balmer continua comes out where the gas is transparent, so hot stars are
 * brighter and bluer between 912 and 3000 Å than a black body of their T_eff. Metal-line blanketing is not
 * modelled. Total flux is conserved to ≤ 0.6% for 3000–60 000 K (r_P, j interpolated in log T_eff; the test
 * integrates on a fine grid); it degrades above (−2% at 150 000 K, beyond any star of the model).
 * Wavelengths in μm, temperatures in K.
 */

const LAMBDA_BALMER_UM = 0.3646;
const LAMBDA_LYMAN_UM = 0.0912;
/** hc/k in μm K (h, k, c exact, SI 2019). */
const HC_K_UM_K = ((H_PLANCK * C_CM_S) / K_BOLTZMANN) * 1e4;
/** Largest Balmer opacity ratio j; a jump the grey structure cannot reach is capped there. */
const J_MAX = 1e4;
/** T_eff grid of the precomputed (r_P, j) table: log-spaced, K. */
const T_MIN_K = 2500;
const T_MAX_K = 200000;
const N_T = 40;
/**
 * Wavelength grid for the flux integral, μm: midpoints of log-spaced cells in three pieces that meet at the
 * Lyman and Balmer edges, so no cell straddles a jump (the midpoint rule stays second order).
 */
const LAM_PIECES: readonly (readonly [number, number, number])[] = [
  [0.005, 0.0912, 30],
  [0.0912, 0.3646, 50],
  [0.3646, 60, 100],
];

/** B_ν(T) up to the constant 2h/c² · c³ (λ in μm): 1/(λ³ (e^x − 1)), x = hc/(λkT). */
function planckShape(tK: number, lambdaUm: number): number {
  const x = HC_K_UM_K / (lambdaUm * tK);
  return x > 700 ? 0 : 1 / (lambdaUm ** 3 * Math.expm1(x));
}

/** Temperature where τ_ν = ⅔ for opacity ratio r, Eddington grey law: T_eff ((1 + 1/r)/2)^¼. */
function formationTemperatureK(tEffK: number, r: number): number {
  return tEffK * Math.sqrt(Math.sqrt((1 + 1 / r) / 2));
}

/** Brightness temperature of planckShape value b at λ (inverse Planck law), K. */
function brightnessTemperatureK(b: number, lambdaUm: number): number {
  return HC_K_UM_K / (lambdaUm * Math.log1p(1 / (lambdaUm ** 3 * b)));
}

/** Opacity ratio r(λ) for grey ratio r_P and Balmer ratio j. */
function opacityRatio(lambdaUm: number, rP: number, j: number): number {
  if (lambdaUm < LAMBDA_LYMAN_UM) return Infinity;
  if (lambdaUm < LAMBDA_BALMER_UM) return rP + j * (lambdaUm / LAMBDA_BALMER_UM) ** 3;
  return rP;
}

/** j that gives the Balmer jump D (dex) at grey ratio r_P: closed form through the brightness temperature at 3646 Å⁻. */
function balmerRatioFor(tEffK: number, rP: number, dDex: number): number {
  const bMinus = planckShape(formationTemperatureK(tEffK, rP), LAMBDA_BALMER_UM) * 10 ** -dDex;
  const q = 2 * (brightnessTemperatureK(bMinus, LAMBDA_BALMER_UM) / tEffK) ** 4 - 1;
  if (!(q > 0)) return J_MAX;
  return Math.min(Math.max(1 / q - rP, 0), J_MAX);
}

const LAMS: number[] = [];
const DLN: number[] = [];
for (const [lo, hi, n] of LAM_PIECES) {
  for (let i = 0; i < n; i++) {
    LAMS.push(lo * (hi / lo) ** ((i + 0.5) / n));
    DLN.push(Math.log(hi / lo) / n);
  }
}
const N_LAM = LAMS.length;
/** Per grid point: hc/(λk) in μm K over μm; the weight Δlnλ/λ⁴ of F_ν dν (planckShape's 1/λ³ times |dν| ∝ dlnλ/λ); (λ/3646 Å)³. */
const X_T = LAMS.map((l) => HC_K_UM_K / l);
const W = LAMS.map((l, i) => DLN[i] / l ** 4);
const BALMER_CUBE = LAMS.map((l) => (l / LAMBDA_BALMER_UM) ** 3);
const I_LYMAN = LAMS.findIndex((l) => l >= LAMBDA_LYMAN_UM);
const I_BALMER = LAMS.findIndex((l) => l >= LAMBDA_BALMER_UM);

/** Σ over grid points i0 ≤ i < i1 of planckShape(T, λ_i) Δlnλ_i/λ_i (∝ ∫F_ν dν over that range). */
function planckSum(tK: number, i0: number, i1: number): number {
  let s = 0;
  for (let i = i0; i < i1; i++) {
    const x = X_T[i] / tK;
    if (x < 700) s += W[i] / Math.expm1(x);
  }
  return s;
}

/** ∫ F_ν dν on the log-λ grid in planckShape units, for grey ratio r_P and Balmer ratio j (the Lyman part passed in). */
function totalFlux(tEffK: number, rP: number, j: number, lymanPart: number): number {
  let s = lymanPart + planckSum(formationTemperatureK(tEffK, rP), I_BALMER, N_LAM);
  for (let i = I_LYMAN; i < I_BALMER; i++) {
    const x = X_T[i] / formationTemperatureK(tEffK, rP + j * BALMER_CUBE[i]);
    if (x < 700) s += W[i] / Math.expm1(x);
  }
  return s;
}

/**
 * Solves flux conservation for r_P at one T_eff (r_P ≤ 1, since the continua only block), with j from the
 * Balmer jump: bisection in ln r_P over [ln 10⁻⁶, 0] to 2⁻²⁸ of the bracket (the hottest stars, whose flux lies mostly
 * in the opaque Lyman continuum, need r_P far below 1).
 */
function solveAtmosphere(tEffK: number): { rP: number; j: number } {
  const target = planckSum(tEffK, 0, N_LAM);
  const lymanPart = planckSum(tEffK * 2 ** -0.25, 0, I_LYMAN);
  const d = balmerJumpDex(tEffK);
  let lo = Math.log(1e-6);
  let hi = 0;
  for (let k = 0; k < 28; k++) {
    const mid = 0.5 * (lo + hi);
    const rP = Math.exp(mid);
    if (totalFlux(tEffK, rP, balmerRatioFor(tEffK, rP, d), lymanPart) > target) lo = mid;
    else hi = mid;
  }
  const rP = Math.exp(0.5 * (lo + hi));
  return { rP, j: balmerRatioFor(tEffK, rP, d) };
}

let table: { logT: Float64Array; rP: Float64Array; j: Float64Array } | undefined;

function atmosphereTable(): { logT: Float64Array; rP: Float64Array; j: Float64Array } {
  if (table) return table;
  const logT = new Float64Array(N_T);
  const rP = new Float64Array(N_T);
  const j = new Float64Array(N_T);
  for (let i = 0; i < N_T; i++) {
    logT[i] = Math.log(T_MIN_K) + (Math.log(T_MAX_K / T_MIN_K) * i) / (N_T - 1);
    const s = solveAtmosphere(Math.exp(logT[i]));
    rP[i] = s.rP;
    j[i] = s.j;
  }
  table = { logT, rP, j };
  return table;
}

/** r_P and j at T_eff: solved on a log-T grid, linear in log T between nodes (clamped outside 2500–200 000 K). */
export function atmosphereOpacityRatios(tEffK: number): { rP: number; j: number } {
  const t = atmosphereTable();
  const x = ((Math.log(tEffK) - t.logT[0]) / (t.logT[N_T - 1] - t.logT[0])) * (N_T - 1);
  const i = Math.min(Math.max(Math.floor(x), 0), N_T - 2);
  const f = Math.min(Math.max(x - i, 0), 1);
  return { rP: t.rP[i] + f * (t.rP[i + 1] - t.rP[i]), j: t.j[i] + f * (t.j[i + 1] - t.j[i]) };
}

export interface AtmosphereRatios {
  readonly tEffK: number;
  readonly rP: number;
  readonly j: number;
}

/** The photosphere of one T_eff (its opacity ratios), for repeated use at many wavelengths. */
export function atmosphereAt(tEffK: number): AtmosphereRatios {
  return { tEffK, ...atmosphereOpacityRatios(tEffK) };
}

/** Temperature of the layer that emits λ (μm), where τ_ν = ⅔ (Eddington grey law; 2^(−1/4) T_eff in the Lyman continuum), K. */
export function emittingTemperatureK(a: AtmosphereRatios, lambdaUm: number): number {
  const r = opacityRatio(lambdaUm, a.rP, a.j);
  return r === Infinity ? a.tEffK * 2 ** -0.25 : formationTemperatureK(a.tEffK, r);
}

/** Emergent F_ν over the black-body value πB_ν(T_eff) at λ (μm): B_ν(T(τ_ν = ⅔))/B_ν(T_eff). */
export function atmosphereFluxRatio(tEffK: number, lambdaUm: number): number {
  const bb = planckShape(tEffK, lambdaUm);
  return bb > 0 ? planckShape(emittingTemperatureK(atmosphereAt(tEffK), lambdaUm), lambdaUm) / bb : 0;
}

/**
 * Specific luminosity of a star of radius R (Rsun) with this photosphere at λ (μm): 4πR² πB_ν(T(τ_ν = ⅔)),
 * erg s⁻¹ Hz⁻¹. Pass atmosphereAt(T_eff) to reuse one photosphere across wavelengths.
 */
export function stellarLnu(rRsun: number, atmosphere: AtmosphereRatios | number, lambdaUm: number): number {
  const a = typeof atmosphere === 'number' ? atmosphereAt(atmosphere) : atmosphere;
  return blackbodyLnu(rRsun, emittingTemperatureK(a, lambdaUm), lambdaUm);
}
