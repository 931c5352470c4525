import { BASE_PARAM_KEYS, perturbCosmology, type BaseParamKey } from '../cosmology/base-params.js';
import type { GrowthModel } from '../cosmology/growth.js';
import type { CosmologyParams } from '../cosmology/params.js';
import { assertCovariance, type ParamCovariance } from '../cosmology/parameter-covariance.js';
import type { DeltaCSpec } from '../halos/collapse-threshold.js';
import { makeHaloModel } from '../halos/halo-model.js';
import type { TransferSpec } from '../power/transfer.js';
import { makeCeilingTable } from './ceiling.js';

/** The physics a ceiling depends on (a subset of the audit's choices; AuditChoices fits as it is). */
export interface CeilingPhysics {
  readonly cosmology: CosmologyParams;
  readonly transfer: TransferSpec;
  readonly massFunction: string;
  readonly deltaC?: DeltaCSpec;
  readonly growth?: GrowthModel;
}

/** The spread of the ceiling from the cosmological parameters at one redshift. */
export interface CeilingSpread {
  readonly z: number;
  /** log10 of the ceiling halo mass at the central parameters, log10 Msun. */
  readonly log_mass_central: number;
  /** 1σ of log10 M_halo,q from the parameter covariance, by linear response √(J C Jᵀ), dex. */
  readonly log_mass_cosmo_sd_dex: number;
  /**
   * ∂log10 M_halo,q/∂p for every base parameter with non-zero variance, dex per unit of p (per
   * km/s/Mpc for h0). Parameters held fixed (zero variance) are absent: they add nothing and are not computed.
   */
  readonly jacobian: Readonly<Partial<Record<BaseParamKey, number>>>;
  /** With the convergence check: the same spread from central differences with half the step, dex. */
  readonly log_mass_cosmo_sd_dex_half_step?: number;
  /** With the convergence check: |sd(step) − sd(step/2)| / sd(step); 0 when the spread is 0. */
  readonly fd_relative_change?: number;
}

export interface CeilingSpreadOptions {
  /** Step of the central differences in units of each parameter's 1σ (default 1). */
  readonly stepSd?: number;
  /** Also difference with half the step and report the change (default true; doubles the cost). */
  readonly convergenceCheck?: boolean;
}

/** log10 of the ceiling mass at each z for one cosmology (the audit's own builders, unchanged). */
export function ceilingLog10Mass(physics: CeilingPhysics, areaArcmin2: number, quantile: number, sliceDz: number, zs: readonly number[]): number[] {
  const halo = makeHaloModel({ cosmology: physics.cosmology, transfer: physics.transfer, massFunction: physics.massFunction, deltaC: physics.deltaC, growth: physics.growth });
  const table = makeCeilingTable(halo, areaArcmin2, quantile, Math.min(...zs), Math.max(...zs), sliceDz);
  return zs.map((z) => table.log10HaloMassAtQuantile(z));
}

/**
 * Spread of the ceiling's log10 M_halo at quantile q in each redshift slice from the uncertainty of
 * the cosmological parameters, by linear response (first-order error propagation; common practice,
 * no source): σ² = J C Jᵀ with J_i = ∂log10 M_q/∂p_i over the base parameters (ω_b, ω_c, H0, n_s, σ8;
 * Ω_m = ω_m/h² derived, see perturbCosmology) and C their covariance.
 * J_i by central differences, J_i = [f(p_i + h_i) − f(p_i − h_i)]/(2h_i), with h_i = stepSd × σ_i
 * (σ_i = √C_ii): a 1σ step measures the response on the scale the parameters actually vary.
 * Convergence check (default on): the same with h_i/2; both spreads and their relative change are
 * returned. Cost: one halo model + ceiling table for the centre and 2 (4 with the check) per varied
 * parameter, ~50 ms each with EH98 (the σ table dominates): ~0.5 s (~1 s) for the five parameters.
 */
export function ceilingSpreadDex(
  physics: CeilingPhysics,
  areaArcmin2: number,
  quantile: number,
  sliceDz: number,
  zs: readonly number[],
  cov: ParamCovariance,
  options: CeilingSpreadOptions = {},
): CeilingSpread[] {
  if (!zs.length) return [];
  for (const z of zs) if (!(z > 0) || !Number.isFinite(z)) throw new RangeError(`ceiling spread: redshift must be a finite number > 0 (got ${z})`);
  const stepSd = options.stepSd ?? 1;
  const check = options.convergenceCheck ?? true;
  if (!(stepSd > 0 && stepSd <= 5)) throw new RangeError(`ceiling spread: the step must lie in (0, 5] standard deviations (got ${stepSd})`);
  const C = assertCovariance(cov).matrix;
  const at = (key: BaseParamKey, delta: number): number[] => ceilingLog10Mass({ ...physics, cosmology: perturbCosmology(physics.cosmology, { [key]: delta }) }, areaArcmin2, quantile, sliceDz, zs);
  const central = ceilingLog10Mass(physics, areaArcmin2, quantile, sliceDz, zs);
  // jac[s][i][k]: derivative for step s (0: full, 1: half), parameter i, redshift k (0 when held fixed).
  const varied = BASE_PARAM_KEYS.map((_, i) => C[i][i] > 0);
  const steps = check ? [1, 0.5] : [1];
  const jac: number[][][] = steps.map(() => BASE_PARAM_KEYS.map(() => zs.map(() => 0)));
  BASE_PARAM_KEYS.forEach((key, i) => {
    if (!varied[i]) return;
    steps.forEach((f, s) => {
      const h = f * stepSd * Math.sqrt(C[i][i]);
      const up = at(key, h);
      const dn = at(key, -h);
      jac[s][i] = zs.map((_, k) => (up[k] - dn[k]) / (2 * h));
    });
  });
  const spread = (s: number, k: number): number => {
    let v = 0;
    for (let i = 0; i < BASE_PARAM_KEYS.length; i++) for (let j = 0; j < BASE_PARAM_KEYS.length; j++) v += jac[s][i][k] * C[i][j] * jac[s][j][k];
    return Math.sqrt(Math.max(0, v));
  };
  return zs.map((z, k) => {
    const sd = spread(0, k);
    const jacobian: Partial<Record<BaseParamKey, number>> = {};
    BASE_PARAM_KEYS.forEach((key, i) => {
      if (varied[i]) jacobian[key] = jac[0][i][k];
    });
    const row: CeilingSpread = { z, log_mass_central: central[k], log_mass_cosmo_sd_dex: sd, jacobian };
    if (!check) return row;
    const sdHalf = spread(1, k);
    return { ...row, log_mass_cosmo_sd_dex_half_step: sdHalf, fd_relative_change: sd > 0 ? Math.abs(sd - sdHalf) / sd : 0 };
  });
}
