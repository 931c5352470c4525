import { PARAM_SPECS, type CosmologyParams } from './params.js';
import { radiationDensity } from './radiation.js';

/** A problem with one parameter: which field, and why (user-facing text). */
export interface ParamProblem {
  readonly field: keyof CosmologyParams | 'expansion';
  readonly flag: string;
  readonly message: string;
}

export class CosmologyError extends Error {
  readonly problems: readonly ParamProblem[];
  constructor(problems: readonly ParamProblem[]) {
    super(problems.map((p) => p.message).join('; '));
    this.name = 'CosmologyError';
    this.problems = problems;
  }
}

/** Ω_DE today implied by closure: 1 − Ω_m − Ω_r − Ω_k. */
export function darkEnergyDensity(p: CosmologyParams): number {
  return 1 - p.omegaM - radiationDensity(p) - p.omegaK;
}

/**
 * E(z)² of the CPL model (Chevallier & Polarski 2001; Linder 2003) with radiation
 * (Komatsu et al. 2011, ApJS 192, 18, eq. 26 for the neutrino term), dimensionless.
 */
export function e2OfA(p: CosmologyParams, omegaR: number, omegaDE: number, a: number): number {
  const de = p.w0 === -1 && p.wa === 0 ? 1 : a ** (-3 * (1 + p.w0 + p.wa)) * Math.exp(-3 * p.wa * (1 - a));
  return p.omegaM / (a * a * a) + omegaR / (a * a * a * a) + p.omegaK / (a * a) + omegaDE * de;
}

/**
 * Checks every field (finite, in range) and the physical conditions: Ω_b ≤ Ω_m, σ8 > 0 and
 * E(z)² > 0 for every redshift from 0 to 1e12 (no bounce, no recollapse in the past).
 */
export function validateCosmology(p: CosmologyParams): ParamProblem[] {
  const problems: ParamProblem[] = [];
  for (const spec of PARAM_SPECS) {
    const v = p[spec.key];
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      problems.push({ field: spec.key, flag: spec.flag, message: `${spec.flag}: ${spec.doc} must be a finite number (got ${String(v)})` });
    } else if (v < spec.min || v > spec.max) {
      problems.push({
        field: spec.key,
        flag: spec.flag,
        message: `${spec.flag}: ${spec.doc} must lie in [${spec.min}, ${spec.max}]${spec.unit ? ' ' + spec.unit : ''} (got ${v})`,
      });
    }
  }
  if (problems.length) return problems;
  if (p.omegaB > p.omegaM) {
    problems.push({ field: 'omegaB', flag: '--omega-b', message: `--omega-b: Ωb = ${p.omegaB} exceeds Ωm = ${p.omegaM}; baryons are part of the matter` });
  }
  if (p.tcmbK > 0 && p.tcmbK < 1) {
    problems.push({ field: 'tcmbK', flag: '--tcmb', message: `--tcmb: ${p.tcmbK} K is outside the transfer fits' domain; give a CMB temperature of 1–10 K, or 0 to switch radiation off` });
  }
  if (!(p.sigma8 > 0)) problems.push({ field: 'sigma8', flag: '--sigma8', message: `--sigma8 must be > 0 (got ${p.sigma8})` });
  const omegaR = radiationDensity(p);
  const omegaDE = darkEnergyDensity(p);
  for (let u = 0; u >= -27.7; u -= 0.05) {
    const a = Math.exp(u);
    const e2 = e2OfA(p, omegaR, omegaDE, a);
    if (!(e2 > 0)) {
      problems.push({
        field: 'expansion',
        flag: '--omega-k/--w0/--wa',
        message: `E(z)² = ${e2.toPrecision(3)} ≤ 0 at z = ${(1 / a - 1).toPrecision(3)}: these parameters have no hot big bang (check --omega-m, --omega-k, --w0, --wa)`,
      });
      break;
    }
  }
  return problems;
}

/** Throws a CosmologyError naming every bad field; returns the parameters unchanged otherwise. */
export function assertCosmology(p: CosmologyParams): CosmologyParams {
  const problems = validateCosmology(p);
  if (problems.length) throw new CosmologyError(problems);
  return p;
}
