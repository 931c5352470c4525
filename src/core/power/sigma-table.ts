import { cubicSpline, splineEval, type CubicSpline } from '../numeric/cubic-spline.js';
import type { LinearPower } from './linear-power.js';

/**
 * σ(M) at z = 0 and dlnσ/dlnM, tabulated on log10 M ∈ [2, 19] (Msun) every 0.05 dex and
 * interpolated with cubic splines. M = (4π/3) ρ̄_m R³ (Lagrangian radius, comoving Mpc), and
 * dlnσ/dlnM = (1/3) dlnσ/dlnR.
 */
export interface SigmaTable {
  readonly log10MMin: number;
  readonly log10MMax: number;
  readonly rhoMMsunMpc3: number;
  /** Table nodes (log10 M), for integration. */
  readonly log10M: Float64Array;
  readonly lnSigma: Float64Array;
  readonly slope: Float64Array;
  /** σ(M, z = 0). */
  sigma0(massMsun: number): number;
  /** dlnσ/dlnM (independent of z in linear theory). */
  dlnSigmaDlnM(massMsun: number): number;
  /** Lagrangian radius of a mass, comoving Mpc. */
  radiusMpc(massMsun: number): number;
}

export const LOG10M_MIN = 2;
export const LOG10M_MAX = 19;
export const LOG10M_STEP = 0.05;

export function makeSigmaTable(power: LinearPower, resolution = 1): SigmaTable {
  const rho = power.rhoMMsunMpc3;
  const n = Math.round((LOG10M_MAX - LOG10M_MIN) / LOG10M_STEP) + 1;
  const lm = new Float64Array(n);
  const ls = new Float64Array(n);
  const sl = new Float64Array(n);
  const radius = (m: number): number => Math.cbrt((3 * m) / (4 * Math.PI * rho));
  for (let i = 0; i < n; i++) {
    lm[i] = LOG10M_MIN + i * LOG10M_STEP;
    const r = radius(10 ** lm[i]);
    const { sigma, dlnSigmaDlnR } = power.sigmaAndSlopeR(r, resolution);
    ls[i] = Math.log(sigma);
    sl[i] = dlnSigmaDlnR / 3;
  }
  const sS: CubicSpline = cubicSpline(lm, ls);
  const sD: CubicSpline = cubicSpline(lm, sl);
  const check = (m: number): number => {
    if (!(m > 0) || !Number.isFinite(m)) throw new RangeError(`halo mass must be a finite number > 0 Msun (got ${m})`);
    const l = Math.log10(m);
    if (l < LOG10M_MIN - 1e-9 || l > LOG10M_MAX + 1e-9) {
      throw new RangeError(`halo mass ${m.toExponential(3)} Msun is outside the tabulated range 1e${LOG10M_MIN}–1e${LOG10M_MAX} Msun`);
    }
    return l;
  };
  return {
    log10MMin: LOG10M_MIN,
    log10MMax: LOG10M_MAX,
    rhoMMsunMpc3: rho,
    log10M: lm,
    lnSigma: ls,
    slope: sl,
    sigma0: (m) => Math.exp(splineEval(sS, check(m))),
    dlnSigmaDlnM: (m) => splineEval(sD, check(m)),
    radiusMpc: radius,
  };
}
