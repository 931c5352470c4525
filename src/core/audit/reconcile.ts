import { ARCMIN2_SR } from '../constants.js';
import type { HaloModel } from '../halos/halo-model.js';
import { gaussLegendre } from '../numeric/gauss-legendre.js';
import { findRoot } from '../numeric/root-find.js';
import { bucketQuantiles } from '../numeric/quantile-buckets.js';
import type { MassToLightTable } from '../stars/mass-to-light.js';
import type { CeilingTable } from './ceiling.js';
import { FULL_SKY_ARCMIN2 } from './choice-specs.js';
import { LYMAN_ALPHA_UM } from '../constants.js';
import { MUV_REST_UM } from '../stars/mass-estimate.js';
import { MODEL_LAMBDA_MAX_UM } from '../stars/photometry.js';
import type { GalaxyInput } from './sample.js';

/**
 * What it would take: for one galaxy and a target efficiency ε, the single change on each axis that
 * brings the median ε_req (headline IMF, rarest halo at quantile q) to ε, all else fixed. Our own
 * construction from the audit's definitions:
 *   z_max            the highest redshift at which the same observation fits, the galaxy placed at one
 *                    redshift (the same band and flux for light rows; D_L²(1+z) for reported masses);
 *   imf_slope_max    the high-mass slope α of custom:0.1:1.3:0.5:α:100 (Kroupa below 0.5 Msun) that fits,
 *                    over 0.5 ≤ α ≤ 2.35, with log M/L interpolated linearly in α between tables every 0.05;
 *   sigma8_min       the σ8 that fits (σ(M) scales exactly with σ8, so only the ceiling changes), and
 *   power_boost_min  = (σ8_min/σ8)², the factor on P(k) at the host's scale;
 *   area_min_arcmin2 the field whose rarest halo at quantile q would host it: N(>M) grows linearly with the
 *                    area, so the ceiling at area A' is the one at quantile q^(A/A') of the actual field;
 *   expected_hosts   the expected number of haloes above M⋆/(ε f_b) in the actual field (ΛCDM, the slice).
 * A value is null when no change within the searched range fits; `reasons` says why.
 */
export interface Reconciliation {
  readonly eps: number;
  readonly z_max: number | null;
  readonly imf_slope_max: number | null;
  readonly sigma8_min: number | null;
  readonly power_boost_min: number | null;
  readonly area_min_arcmin2: number | null;
  readonly expected_hosts: number;
  /** Why an axis is null, or where it hit the edge of its searched range. */
  readonly reasons: Readonly<Record<string, string>>;
}

/** The slope family of the IMF axis: Kroupa's 1.3 below 0.5 Msun, α above, 0.1–100 Msun. */
export const slopeImfName = (alpha: number): string => `custom:0.1:1.3:0.5:${alpha}:100`;
export const SLOPE_MIN = 0.5;
export const SLOPE_MAX = 2.35;
const SLOPE_STEP = 0.05;
const SLOPE_NODES = Math.round((SLOPE_MAX - SLOPE_MIN) / SLOPE_STEP) + 1;

/** What reconcileGalaxy needs from the audit of one galaxy (valid draws only; logs are log10). */
export interface ReconcileInputs {
  readonly g: GalaxyInput;
  readonly halo: HaloModel;
  readonly ceiling: CeilingTable;
  readonly quantile: number;
  readonly areaArcmin2: number;
  readonly sliceDz: number;
  /** Redshift of each valid draw, and the IMF-free part of log M⋆ and grid positions. */
  readonly z: Float64Array;
  readonly base: Float64Array;
  readonly gx: Float64Array;
  readonly gy: Float64Array;
  readonly headTable: MassToLightTable;
  tableOf(imf: string): MassToLightTable;
  /** The same galaxy's draws placed at one redshift (base, positions), or undefined when the band leaves the model there. */
  drawsAtRedshift(z: number): { base: Float64Array; gx: Float64Array; gy: Float64Array } | undefined;
}

/** The type-7 median of a (not reordered; bucketQuantiles: bit for bit quantilesBySelection). */
const median = (a: Float64Array): number => bucketQuantiles(a, a.length, [0.5])[0];

/** log10 of the median ε_req for masses lm against log10 ceilings (f_b M_q) given per draw. */
function medianLogEps(lm: Float64Array, logCeil: (i: number) => number): number {
  const e = new Float64Array(lm.length);
  for (let i = 0; i < lm.length; i++) e[i] = lm[i] - logCeil(i);
  return median(e);
}

function logMasses(base: Float64Array, gx: Float64Array, gy: Float64Array, tab: MassToLightTable): Float64Array {
  const lm = new Float64Array(base.length);
  for (let i = 0; i < lm.length; i++) lm[i] = base[i] + tab.logMassToLightAt(gx[i], gy[i]);
  return lm;
}

type Solved = { value: number | null; reason?: string };

/**
 * The crossing f = 0 of a monotone f over [a, b] (f > 0: does not fit). Increasing f: the largest x that
 * fits; decreasing: the smallest. If nothing in the range fits, null with `none`; if all of it fits, the
 * range's edge with `edge`.
 */
function solveMonotone(f: (x: number) => number, a: number, b: number, increasing: boolean, tol: number, none: string, edge: string): Solved {
  const fa = f(a);
  const fb = f(b);
  if (increasing ? fa > 0 : fb > 0) return { value: null, reason: none };
  if (increasing ? fb <= 0 : fa <= 0) return { value: increasing ? b : a, reason: edge };
  return { value: findRoot(f, a, b, tol) };
}

function zAxis(x: ReconcileInputs, lEps: number, lfb: number): Solved {
  const { g, ceiling } = x;
  const lambdaObs = g.mAB !== undefined ? g.lambdaObsUm! : g.muv !== undefined ? MUV_REST_UM * (1 + g.z) : undefined;
  // the band must stay within the model's rest range (Lyman-α–1 μm), the audit's domain (z ≥ 0.25) and the ceiling table
  const zLow = Math.max(0.25, lambdaObs !== undefined ? lambdaObs / MODEL_LAMBDA_MAX_UM - 1 + 1e-3 : 0.25);
  const zHigh = Math.min(ceiling.zMaxTable, lambdaObs !== undefined ? lambdaObs / LYMAN_ALPHA_UM - 1 - 1e-3 : Infinity);
  if (!(zHigh > zLow)) return { value: null, reason: 'no redshift keeps the band inside the model’s rest range (Lyman-α–1 μm)' };
  const at = (z: number): number => {
    const d = x.drawsAtRedshift(z);
    if (!d) throw new RangeError(`reconciliation: the band leaves the model's rest range at z = ${z}`);
    const lc = lfb + ceiling.log10HaloMassAtQuantile(z);
    return medianLogEps(logMasses(d.base, d.gx, d.gy, x.headTable), () => lc) - lEps;
  };
  return solveMonotone(at, zLow, zHigh, true, 2e-3 / Math.max(1, zHigh), `it needs more than this ε even at z = ${zLow.toFixed(2)}, the lowest redshift searched`, `it fits up to z = ${zHigh.toFixed(2)}, the highest redshift searched`);
}

function slopeAxis(x: ReconcileInputs, lEps: number, logCeil: Float64Array): Solved {
  const node = (k: number): MassToLightTable => x.tableOf(slopeImfName(Number((SLOPE_MIN + k * SLOPE_STEP).toFixed(2))));
  const atNode = (k: number): number => medianLogEps(logMasses(x.base, x.gx, x.gy, node(k)), (i) => logCeil[i]) - lEps;
  // ε_req rises with α (fewer massive stars per unit mass): bracket over the grid nodes by bisection
  const f0 = atNode(0);
  const f1 = atNode(SLOPE_NODES - 1);
  if (f0 > 0) return { value: null, reason: `even a slope of ${SLOPE_MIN} above 0.5 Msun leaves the median ε_req above the target` };
  if (f1 <= 0) return { value: SLOPE_MAX, reason: `it fits at every slope searched (up to ${SLOPE_MAX}, Salpeter's)` };
  let lo = 0;
  let hi = SLOPE_NODES - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (atNode(mid) <= 0) lo = mid;
    else hi = mid;
  }
  const ta = node(lo);
  const tb = node(hi);
  const at = (w: number): number => {
    const lm = new Float64Array(x.base.length);
    for (let i = 0; i < lm.length; i++) lm[i] = x.base[i] + (1 - w) * ta.logMassToLightAt(x.gx[i], x.gy[i]) + w * tb.logMassToLightAt(x.gx[i], x.gy[i]);
    return medianLogEps(lm, (i) => logCeil[i]) - lEps;
  };
  const w = findRoot(at, 0, 1, 1e-6);
  return { value: Number((SLOPE_MIN + (lo + w) * SLOPE_STEP).toFixed(3)) };
}

/**
 * dn/dlnM (Mpc⁻³) with σ(M, z) scaled by s = σ8'/σ8: the halo model's own formula (Jenkins et al. 2001
 * convention, f(σ) ρ̄/M |dlnσ/dlnM|) with σ → s σ; σ(M) is exactly proportional to σ8. Given σ(M, 0)
 * (sigma0), dlnσ/dlnM (slope), the growth factor d and δ_c at z, read by the caller.
 */
function dndlnMScaled(h: HaloModel, m: number, sigma0: number, slope: number, d: number, dc: number, z: number, s: number): number {
  const sigma = s * sigma0 * d;
  return h.model.f({ sigma, deltaC: dc, z, nEff: -6 * slope - 3 }) * (h.table.rhoMMsunMpc3 / m) * Math.abs(slope);
}

const GL_Z = gaussLegendre(8);
const GL_M = gaussLegendre(32);

/**
 * Expected haloes above M in the slice around z with σ scaled by s: Ω ∫ dz dV/dz ∫_M dn/dlnM dlnM,
 * 8-point Gauss–Legendre in z over the slice and 32-point in ln M over [ln M, ln M + 12] (the
 * multiplicity falls as e^(−ν²/2) far faster than that for the rare haloes of a ceiling). The mass
 * nodes and σ(M) there are the same at every redshift node, and the growth factor and δ_c the same
 * at every mass node: each is read once.
 */
function sliceCount(x: ReconcileInputs, z: number, m: number, s: number): number {
  const [z0, z1] = x.ceiling.sliceLimits(z);
  const omega = x.areaArcmin2 * ARCMIN2_SR;
  const h = x.halo;
  const lnTop = Math.min(Math.log(m) + 12, h.table.log10MMax * Math.LN10 - 1e-9);
  const lnM = Math.log(m);
  const ms = Array.from(GL_M.x, (t) => Math.exp(0.5 * (lnM + lnTop) + 0.5 * (lnTop - lnM) * t));
  const sigma0 = ms.map((mk) => h.table.sigma0(mk));
  const slope = ms.map((mk) => h.table.dlnSigmaDlnM(mk));
  let total = 0;
  for (let i = 0; i < GL_Z.x.length; i++) {
    const zi = 0.5 * (z0 + z1) + 0.5 * (z1 - z0) * GL_Z.x[i];
    const d = h.growth.d(zi);
    const dc = h.deltaC(zi);
    let n = 0;
    for (let k = 0; k < ms.length; k++) n += GL_M.w[k] * dndlnMScaled(h, ms[k], sigma0[k], slope[k], d, dc, zi, s);
    total += GL_Z.w[i] * h.background.dVdzdOmegaMpc3(zi) * n * 0.5 * (lnTop - lnM);
  }
  return omega * total * 0.5 * (z1 - z0);
}

/**
 * σ8 axis. Only the ceiling depends on σ8; its response is taken at the galaxy's redshift and applied to
 * every draw (it changes by ≲ 1e-3 dex across a slice): find the shift Δ that brings the median to ε,
 * then the s at which the slice holds −ln q haloes above 10^Δ times its ceiling mass, both with
 * sliceCount so that the two sides use one quadrature.
 */
function sigma8Axis(x: ReconcileInputs, lEps: number, lfb: number, lm: Float64Array, logCeil: Float64Array): Solved {
  const s8 = x.halo.options.cosmology.sigma8;
  const need = medianLogEps(lm, (i) => logCeil[i]) - lEps; // dex the ceiling must rise
  const t = -Math.log(x.quantile);
  const z = x.g.z;
  const lm1 = findRoot((l) => Math.log(sliceCount(x, z, 10 ** l, 1) / t), x.halo.table.log10M[0] + 0.1, x.halo.table.log10MMax - 0.5, 1e-7);
  const mTarget = 10 ** (lm1 + need);
  if (!(mTarget < 10 ** (x.halo.table.log10MMax - 0.5))) return { value: null, reason: 'the ceiling would have to exceed the mass table (1e19 Msun)' };
  const at = (ls: number): number => Math.log(t / sliceCount(x, z, mTarget, Math.exp(ls))); // > 0: too few haloes, does not fit
  // σ8 within the parameter table's range [0.1, 2]
  const s = solveMonotone(at, Math.log(0.1 / s8), Math.log(2 / s8), false, 1e-6, 'even σ8 = 2 leaves the median ε_req above the target', 'it fits at every σ8 down to 0.1, the lowest searched');
  return s.value === null ? s : { value: s8 * Math.exp(s.value), reason: s.reason };
}

function areaAxis(x: ReconcileInputs, lEps: number, lfb: number, lm: Float64Array): Solved {
  const a0 = x.areaArcmin2;
  const at = (la: number): number => {
    // N_A'(>M) = (A'/A) N_A(>M) = −ln q  ⇔  N_A(>M) = −ln q · A/A'
    const ceil = x.ceiling.log10HaloMassAtCountFn((-Math.log(x.quantile) * a0) / Math.exp(la));
    return medianLogEps(lm, (i) => lfb + ceil(x.z[i])) - lEps;
  };
  const s = solveMonotone(at, Math.log(1e-4), Math.log(FULL_SKY_ARCMIN2), false, 1e-5, 'not even the whole sky holds a halo that large at this quantile', 'it fits in any field of 1e-4 arcmin² or more, the smallest searched');
  return s.value === null ? s : { value: Math.exp(s.value) };
}

/** One reconciliation per target ε (each in (0, 1]). */
export function reconcileGalaxy(x: ReconcileInputs, targets: readonly number[]): Reconciliation[] {
  const lfb = Math.log10(x.halo.baryonFraction);
  const lm = logMasses(x.base, x.gx, x.gy, x.headTable);
  const logCeil = Float64Array.from(x.z, (z) => lfb + x.ceiling.log10HaloMassAtQuantile(z));
  const lmMed = median(lm);
  return targets.map((eps) => {
    const lEps = Math.log10(eps);
    const reasons: Record<string, string> = {};
    const keep = (axis: string, s: Solved): number | null => {
      if (s.reason) reasons[axis] = s.reason;
      return s.value;
    };
    const zMax = keep('z_max', zAxis(x, lEps, lfb));
    const slope = keep('imf_slope_max', slopeAxis(x, lEps, logCeil));
    const s8 = keep('sigma8_min', sigma8Axis(x, lEps, lfb, lm, logCeil));
    const area = keep('area_min_arcmin2', areaAxis(x, lEps, lfb, lm));
    const sigma8 = x.halo.options.cosmology.sigma8;
    if (s8 === null) reasons.power_boost_min = reasons.sigma8_min;
    return {
      eps,
      z_max: zMax,
      imf_slope_max: slope,
      sigma8_min: s8,
      power_boost_min: s8 === null ? null : (s8 / sigma8) ** 2,
      area_min_arcmin2: area,
      expected_hosts: x.ceiling.expectedAbove(10 ** lmMed / (eps * x.halo.baryonFraction), x.g.z),
      reasons,
    };
  });
}

