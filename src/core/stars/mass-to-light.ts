import { MODEL_LAMBDA_MAX_UM, MODEL_LAMBDA_MIN_UM } from './photometry.js';
import type { Sfh } from './sfh.js';
import type { Population } from './population.js';

/**
 * Tables of log10 L_ν (erg s⁻¹ Hz⁻¹ per Msun formed) and log10 of the surviving fraction over
 * log-spaced population ages (1 Myr–14 Gyr, 80 points) and rest wavelengths (Lyman-α–1 μm,
 * 20 points), bilinear in (log age, log λ). Built once per (IMF, SFH); used by the Monte Carlo
 * so that one mass estimate costs a table lookup instead of a synthesis.
 */
export interface MassToLightTable {
  readonly nAge: number;
  readonly nLam: number;
  readonly log10AgeMin: number;
  readonly log10AgeMax: number;
  readonly log10LamMin: number;
  readonly log10LamMax: number;
  readonly logLnu: Float64Array;
  readonly logSurv: Float64Array;
  /** log10(surviving Msun per erg s⁻¹ Hz⁻¹) at (age Myr, λ μm). */
  logMassToLight(ageMyr: number, lambdaUm: number): number;
  /** Fractional grid position (x = age index, y = λ index) from log10 age (Myr) and log10 λ (μm), shared by every table on the same grid. */
  gridPositionLog(log10AgeMyr: number, log10LambdaUm: number): [number, number];
  /** logMassToLight at a grid position from gridPositionLog (the same number, fewer logarithms). */
  logMassToLightAt(x: number, y: number): number;
}

export const ML_AGE_MIN_MYR = 1;
export const ML_AGE_MAX_MYR = 14000;

export function makeMassToLightTable(pop: Population, sfh: Sfh, nAge = 80, nLam = 20): MassToLightTable {
  const la0 = Math.log10(ML_AGE_MIN_MYR);
  const la1 = Math.log10(ML_AGE_MAX_MYR);
  const ll0 = Math.log10(MODEL_LAMBDA_MIN_UM);
  const ll1 = Math.log10(MODEL_LAMBDA_MAX_UM);
  const lams = Array.from({ length: nLam }, (_, j) => 10 ** (ll0 + ((ll1 - ll0) * j) / (nLam - 1)));
  const logLnu = new Float64Array(nAge * nLam);
  const logSurv = new Float64Array(nAge);
  for (let i = 0; i < nAge; i++) {
    // the stellar phases depend on the age only: computed once, then lit at every wavelength
    const ph = pop.phases(sfh, 10 ** (la0 + ((la1 - la0) * i) / (nAge - 1)));
    logSurv[i] = Math.log10(pop.survivingAt(ph));
    for (let j = 0; j < nLam; j++) logLnu[i * nLam + j] = Math.log10(Math.max(pop.lnuAt(ph, lams[j]), 1e-300));
  }
  const fa = (nAge - 1) / (la1 - la0);
  const fl = (nLam - 1) / (ll1 - ll0);
  return {
    nAge,
    nLam,
    log10AgeMin: la0,
    log10AgeMax: la1,
    log10LamMin: ll0,
    log10LamMax: ll1,
    logLnu,
    logSurv,
    logMassToLight: (ageMyr, lambdaUm) => at(...pos(ageMyr, lambdaUm)),
    gridPositionLog: (la, ll) => posLog(la, ll),
    logMassToLightAt: (x, y) => at(x, y),
  };
  function pos(ageMyr: number, lambdaUm: number): [number, number] {
    return posLog(Math.log10(ageMyr), Math.log10(lambdaUm));
  }
  function posLog(la: number, ll: number): [number, number] {
    const x = (la - la0) * fa;
    const y = (ll - ll0) * fl;
    return [Math.min(Math.max(x, 0), nAge - 1), Math.min(Math.max(y, 0), nLam - 1)];
  }
  function at(x: number, y: number): number {
    {
      const i = Math.min(Math.floor(x), nAge - 2);
      const j = Math.min(Math.floor(y), nLam - 2);
      const tx = x - i;
      const ty = y - j;
      const l00 = logLnu[i * nLam + j];
      const l01 = logLnu[i * nLam + j + 1];
      const l10 = logLnu[(i + 1) * nLam + j];
      const l11 = logLnu[(i + 1) * nLam + j + 1];
      const lnu = (1 - tx) * ((1 - ty) * l00 + ty * l01) + tx * ((1 - ty) * l10 + ty * l11);
      const surv = (1 - tx) * logSurv[i] + tx * logSurv[i + 1];
      return surv - lnu;
    }
  }
}
