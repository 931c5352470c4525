import { C_CM_S, CHI_HYDROGEN_EV, EV_ERG, H_PLANCK, K_BOLTZMANN, RYDBERG_H_PER_ANGSTROM, SIGMA_THOMSON_CM2 } from './atomic-constants.js';
import { findRoot } from '../numeric/root-find.js';
import { gasState, type GasState } from './gas-state.js';
import { hydrogenBoundFreeCrossSection, hydrogenEdgeAngstrom, KRAMERS_FF_CGS, N_LEVELS_MAX } from './hydrogen-opacity.js';
import { HMINUS_THRESHOLD_ANGSTROM, hMinusBoundFreeCrossSection, hMinusFreeFreeCoefficients, hMinusFreeFreeLogTheta } from './negative-hydrogen-opacity.js';

/**
 * Continuous opacity of a photospheric layer, cm² g⁻¹ at λ (Å): hydrogen bound-free from levels 1–30 and
 * free-free (hydrogen-opacity.ts), H⁻ bound-free and free-free (negative-hydrogen-opacity.ts), and Thomson
 * scattering by free electrons (counted as absorption, as the LTE model of stellar-atmosphere.ts needs).
 * Metal and helium continua and all lines are left out. The same sum as hydrogenAbsorption +
 * hMinusAbsorption + σ_T n_e, with the wavelength-only factors kept per λ and the level populations per layer.
 */
interface Row {
  readonly hnuk: number;
  /** n² σ_n(λ) per level, cm². */
  readonly sigmaN2: Float64Array;
  readonly ffNu3: number;
  readonly gffA: number;
  readonly gffB: number;
  readonly hmBf: number;
  readonly hmFf: readonly [number, number, number];
  /** Index n − 1 of the lowest level that absorbs at λ (σ_n > 0); the levels below it are skipped. */
  readonly firstLevel: number;
}

const rows = new Map<number, Row>();

function rowFor(lambdaAngstrom: number): Row {
  const hit = rows.get(lambdaAngstrom);
  if (hit) return hit;
  const r = makeRow(lambdaAngstrom);
  if (rows.size > 4096) rows.clear();
  rows.set(lambdaAngstrom, r);
  return r;
}

function makeRow(lambdaAngstrom: number): Row {
  const nu = C_CM_S / (lambdaAngstrom * 1e-8);
  const sigmaN2 = new Float64Array(N_LEVELS_MAX);
  for (let n = 1; n <= N_LEVELS_MAX; n++) sigmaN2[n - 1] = n * n * hydrogenBoundFreeCrossSection(lambdaAngstrom, n);
  const lr = lambdaAngstrom * RYDBERG_H_PER_ANGSTROM;
  const r: Row = {
    hnuk: (H_PLANCK * nu) / K_BOLTZMANN,
    sigmaN2,
    ffNu3: KRAMERS_FF_CGS / nu ** 3,
    gffA: 0.3456 / Math.cbrt(lr),
    gffB: (lambdaAngstrom * 1e-8 * K_BOLTZMANN) / (H_PLANCK * C_CM_S),
    hmBf: hMinusBoundFreeCrossSection(lambdaAngstrom),
    hmFf: hMinusFreeFreeCoefficients(lambdaAngstrom),
    firstLevel: Math.max(sigmaN2.findIndex((v) => v > 0), 0),
  };
  return r;
}

/** Per-layer factors: Boltzmann factors of the hydrogen levels, log θ of the H⁻ free-free fit, √T. */
interface Layer {
  readonly b: Float64Array;
  readonly lt: number;
  readonly sqrtT: number;
}

const layerCache = new WeakMap<GasState, Layer>();

function layerOf(gas: GasState): Layer {
  let l = layerCache.get(gas);
  if (!l) {
    const chiKt = (CHI_HYDROGEN_EV * EV_ERG) / (K_BOLTZMANN * gas.tK);
    const b = new Float64Array(N_LEVELS_MAX);
    for (let i = 0; i < N_LEVELS_MAX; i++) b[i] = Math.exp(-chiKt * (1 - 1 / ((i + 1) * (i + 1))));
    l = { b, lt: hMinusFreeFreeLogTheta(gas.tK), sqrtT: Math.sqrt(gas.tK) };
    layerCache.set(gas, l);
  }
  return l;
}

export function continuousOpacity(gas: GasState, lambdaAngstrom: number): number {
  const r = rowFor(lambdaAngstrom);
  return opacityFromRow(gas, r, layerOf(gas), -Math.expm1(-r.hnuk / gas.tK));
}

/** continuousOpacity from a wavelength's row, the layer's factors and the stimulated-emission factor 1 − e^(−hν/kT). */
function opacityFromRow(gas: GasState, r: Row, layer: Layer, stim: number): number {
  const b = layer.b;
  let bf = 0;
  for (let i = r.firstLevel; i < N_LEVELS_MAX; i++) bf += r.sigmaN2[i] * b[i];
  const gff = 1 + r.gffA * (r.gffB * gas.tK + 0.5);
  const ff = (r.ffNu3 * gff * gas.nElectron * gas.nProton) / layer.sqrtT;
  const lt = layer.lt;
  const hmFf = 1e-26 * 10 ** (r.hmFf[0] + lt * (r.hmFf[1] + lt * r.hmFf[2]));
  const hm = gas.nHMinus * r.hmBf * stim + gas.nNeutral * gas.pElectron * hmFf;
  return ((bf * gas.nNeutral + ff) * stim + hm + SIGMA_THOMSON_CM2 * gas.nElectron) / gas.rho;
}

/**
 * Wavelengths of the Rosseland mean, Å: midpoints of log-spaced cells from 500 Å to 100 μm in pieces that meet
 * at the hydrogen edges n = 1…5 and the H⁻ threshold, so no cell straddles a jump; with their Δln λ and
 * opacity rows, built on first use.
 */
const ROSS_PER_DEX = 30;
function buildRosselandGrid(): { lams: number[]; dln: number[]; rows: Row[] } {
  const bounds = [500, ...[1, 2, 3, 4].map(hydrogenEdgeAngstrom), HMINUS_THRESHOLD_ANGSTROM, hydrogenEdgeAngstrom(5), 1e6];
  const lams: number[] = [];
  const dln: number[] = [];
  for (let p = 0; p + 1 < bounds.length; p++) {
    const n = Math.max(2, Math.ceil(Math.log10(bounds[p + 1] / bounds[p]) * ROSS_PER_DEX));
    for (let i = 0; i < n; i++) {
      lams.push(bounds[p] * (bounds[p + 1] / bounds[p]) ** ((i + 0.5) / n));
      dln.push(Math.log(bounds[p + 1] / bounds[p]) / n);
    }
  }
  return { lams, dln, rows: lams.map(makeRow) };
}
let rossGridCache: { lams: number[]; dln: number[]; rows: Row[] } | undefined;
function rosselandGrid(): { lams: number[]; dln: number[]; rows: Row[] } {
  rossGridCache ??= buildRosselandGrid();
  return rossGridCache;
}
/** hc/k in Å K. */
const HC_K_ANGSTROM_K = ((H_PLANCK * C_CM_S) / K_BOLTZMANN) * 1e8;

/**
 * Rosseland mean κ_R of the layer, cm² g⁻¹: 1/κ_R = ∫ κ_ν⁻¹ ∂B_ν/∂T dν / ∫ ∂B_ν/∂T dν (Rosseland 1924;
 * e.g. Mihalas 1978, ch. 2), by the midpoint rule in ln λ on the grid above with weight x⁴eˣ/(eˣ − 1)² Δlnλ,
 * x = hc/λkT (∝ ∂B_ν/∂T |dν|, since ∂B_ν/∂T ∝ ν⁴ eˣ/(eˣ − 1)²/T and |dν| = ν dlnλ).
 */
export function rosselandMean(gas: GasState): number {
  let num = 0;
  let den = 0;
  const layer = layerOf(gas);
  const { lams: ROSS_LAMBDA, dln: ROSS_DLN, rows: ROSS_ROWS } = rosselandGrid();
  for (let i = 0; i < ROSS_LAMBDA.length; i++) {
    const x = HC_K_ANGSTROM_K / (ROSS_LAMBDA[i] * gas.tK);
    if (x > 300) continue;
    const em = -Math.expm1(-x);
    const w = ((x ** 4 * (1 - em)) / (em * em)) * ROSS_DLN[i];
    num += w / opacityFromRow(gas, ROSS_ROWS[i], layer, em);
    den += w;
  }
  return den / num;
}

/**
 * The photospheric layer of a star of T_eff (K) and surface gravity log g (cgs): the gas at T = T_eff and
 * at the pressure of hydrostatic equilibrium at Rosseland optical depth ⅔ with the opacity held at its
 * value there, P = ⅔ g/κ_R(T, P) (dP/dτ = g/κ, radiation pressure neglected; e.g. Gray 2005, ch. 9).
 * Solved in ln P by secant steps to a residual below 1e-7.
 */
export function photosphericLayer(tEffK: number, logG: number, metallicity: number): GasState {
  const g = 10 ** logG;
  const f = (lnP: number): number => lnP - Math.log(((2 / 3) * g) / rosselandMean(gasState(tEffK, Math.exp(lnP), metallicity)));
  // Secant iteration from the Thomson-scattering estimate (κ = 0.34 cm²/g); f rises with ln P, with slope
  // 1 + dlnκ_R/dlnP between 1 and 3, so it converges in a few steps; a root search over 10⁻⁸–10¹⁴ if it does not.
  let x0 = Math.log(((2 / 3) * g) / 0.34);
  let f0 = f(x0);
  let x1 = x0 - f0 / 2;
  for (let k = 0; k < 30; k++) {
    const f1 = f(x1);
    if (Math.abs(f1) < 1e-7) return gasState(tEffK, Math.exp(x1), metallicity);
    const slope = (f1 - f0) / (x1 - x0);
    const step = Math.max(Math.min(-f1 / (slope > 0.5 ? slope : 2), 3), -3);
    x0 = x1;
    f0 = f1;
    x1 += step;
  }
  const lnP = findRoot(f, Math.log(1e-8), Math.log(1e14), 1e-9);
  return gasState(tEffK, Math.exp(lnP), metallicity);
}
