import { bucketQuantiles, fillBuckets, layoutBuckets, makeBuckets, quantilesFromBuckets, type Buckets } from '../numeric/quantile-buckets.js';
import { WINDOW_MEDIAN_MIN_VALUES, windowMedian } from '../numeric/window-median.js';
import type { HaloModel } from '../halos/halo-model.js';
import { GRID_DLOG10M, lnMassFunctionGrid } from '../halos/mass-function-grid.js';
import type { MassToLightTable } from '../stars/mass-to-light.js';
import { eddingtonFirstOrderShiftDex, eddingtonPosterior, type LnPrior } from './eddington.js';
import { medianErrorQuantiles, pClassChange } from './draw-rule.js';
import { fillGridCells, logLnuInCell, logMassToLightInCell, logSurvivingInCell, type GridCells } from './grid-cells.js';
import { verdictFor, type Verdict } from './verdict.js';

export interface ImfResult {
  readonly verdict: Verdict;
  readonly log_mstar_median: number;
  readonly log_mstar_p16: number;
  readonly log_mstar_p84: number;
  readonly eps_required_median: number;
  readonly eps_required_p05: number;
  readonly eps_required_p95: number;
  readonly p_over_budget: number;
  readonly p_strained: number;
  /** P(ε_req > 1) with each draw's ceiling offset by the spread from the cosmological parameters. */
  readonly p_over_budget_cosmo: number;
  /** Median ε_req after the exact Eddington-bias correction of the measured mass. */
  readonly eps_required_median_debiased: number;
  readonly verdict_debiased: Verdict;
  /** Eddington shift of log M⋆ (posterior median), dex. */
  readonly eddington_shift_dex: number;
  /** Median ε_req against the ceiling widened by cosmic variance. */
  readonly eps_required_median_cv: number;
  readonly verdict_cv: Verdict;
  /** Time budget (absent when star formation has no time before z): median of mass formed / baryons accreted, and P(ratio > 1). */
  readonly time_budget_ratio_median?: number;
  readonly p_time_budget_over?: number;
  /** Monte Carlo errors of the medians of log10 M⋆ and log10 ε_req, dex (draw-rule.ts). */
  readonly log_mstar_median_mc_error_dex: number;
  readonly log_eps_required_median_mc_error_dex: number;
  /** The chance that the median ε_req's verdict lies across its nearest threshold, from that error (draw-rule.ts). */
  readonly p_verdict_change: number;
}

/** Per-draw inputs shared by every IMF (valid draws only; logs are log10). */
export interface SharedDraws {
  readonly n: number;
  /** IMF-free part of log10 M⋆ and the grid position of each draw in the M/L tables. */
  readonly base: Float64Array;
  readonly gx: Float64Array;
  readonly gy: Float64Array;
  /** log10 f_b M_halo,q at each draw's z, without and with cosmic variance. */
  readonly logCeil: Float64Array;
  readonly logCeilCv: Float64Array;
  /** log10 f_b ΔM_h accreted during each draw's star formation; undefined = no time budget. */
  readonly logAccretedBaryons?: Float64Array;
  /** Each draw's offset of log10 M_halo,q from the cosmological parameters, dex. */
  readonly cosmoOffset: Float64Array;
  /** The draws' cells at gx, gy, when they were made with the draws (grid-cells.ts); found here otherwise. */
  readonly cells?: GridCells;
}

export interface EddingtonInputs {
  readonly halo: HaloModel;
  readonly z: number;
  readonly sigmaDex: number;
  readonly epsRef: number;
}

/** Everything one IMF's statistics produce, with the headline's extra medians. */
export interface ImfStatistics {
  readonly result: ImfResult;
  readonly eddingtonSlopeAlpha: number;
  readonly eddingtonFirstOrderDex: number;
  readonly formedMassMedianMsun?: number;
}

/**
 * The ln prior of the exact Eddington correction: dn/dlog M_h (∝ dn/dlnM) at the host mass
 * M_h = 10^x/(f_b ε), −∞ outside the σ table. ε = the median ε_req clamped to [ε_ref, 1].
 */
function hostPrior(e: EddingtonInputs, eps: number): LnPrior {
  const lnDn = lnMassFunctionAt(e);
  const lfe = Math.log10(e.halo.baryonFraction * eps);
  const f = (x: number): number => lnDn(x - lfe);
  return Object.assign(f, { onGrid: (x0: number, h: number, n: number, out: Float64Array) => lnDn.onGrid(x0, h, n, out, lfe) });
}

/** Node spacing of the per-galaxy table of ln dn/dlnM, dex: the mass nodes of the shared (z, log10 M) grid. */
const PRIOR_STEP_DEX = GRID_DLOG10M;

type LnMassFunction = ((lh: number) => number) & {
  /** out[i] = f(x0 + i h − shift), the same values as f, the nodes filled first. */
  readonly onGrid: (x0: number, h: number, n: number, out: Float64Array, shift: number) => void;
};

/**
 * ln dn/dlnM(10^lh, z) at the galaxy's redshift, −∞ outside the σ table, on nodes 0.0025 dex apart
 * (filled on first use, so a galaxy reads a few hundred masses instead of every point of every posterior
 * grid), read with 4-point Lagrange interpolation (error ≈ (3/128) h⁴ |f⁗|, below 1e-12 in the posterior
 * median here; common practice, no source). Linear in the first and last node interval. Each node is the
 * run's shared (z, log10 M) table of the mass function read at the galaxy's z (halos/mass-function-grid.ts:
 * 4-point Lagrange in z on 0.05 steps, ≤ 2.5e-6 from the direct ln dn/dlnM), so the mass function itself
 * is evaluated once per table node for the whole sample, not per galaxy. One node table per
 * EddingtonInputs object, i.e. per galaxy: the last one is kept, in buffers reused from galaxy to galaxy
 * (a galaxy's IMFs are done one after another).
 */
let priorFor: { e: EddingtonInputs; f: LnMassFunction } | undefined;
/** Node values and the generation that filled each (a node is set when its stamp is the current generation), reused from galaxy to galaxy. */
let nodeBuf = new Float64Array(0);
let nodeStamp = new Int32Array(0);
let generation = 0;
function lnMassFunctionAt(e: EddingtonInputs): LnMassFunction {
  if (priorFor && priorFor.e === e) return priorFor.f;
  const lm = e.halo.table.log10M;
  const lo = lm[0];
  const hi = lm[lm.length - 1];
  const nNodes = Math.floor((hi - lo) / PRIOR_STEP_DEX) + 1;
  if (nodeBuf.length < nNodes) {
    nodeBuf = new Float64Array(nNodes);
    nodeStamp = new Int32Array(nNodes);
  }
  const nodes = nodeBuf;
  const stamp = nodeStamp;
  const gen = ++generation;
  const shared = lnMassFunctionGrid(e.halo);
  const node = (i: number): number => {
    if (stamp[i] !== gen) {
      nodes[i] = shared.nodeAt(e.z, i);
      stamp[i] = gen;
    }
    return nodes[i];
  };
  /** The Lagrange read at lh, with the nodes it uses already filled (nodes[] read directly). */
  const read = (lh: number): number => {
    if (!(lh > lo && lh < hi)) return Number.NEGATIVE_INFINITY;
    const t = (lh - lo) / PRIOR_STEP_DEX;
    const i = Math.min(Math.floor(t), nNodes - 2);
    const u = t - i;
    if (i < 1 || i > nNodes - 3) return (1 - u) * nodes[i] + u * nodes[i + 1];
    const a = nodes[i - 1];
    const b = nodes[i];
    const c = nodes[i + 1];
    const d = nodes[i + 2];
    // Lagrange weights on the nodes −1, 0, 1, 2 at u ∈ [0, 1)
    return (-u * (u - 1) * (u - 2) * a) / 6 + ((u + 1) * (u - 1) * (u - 2) * b) / 2 - ((u + 1) * u * (u - 2) * c) / 2 + ((u + 1) * u * (u - 1) * d) / 6;
  };
  /** Fills the nodes that read(lh) uses for lh in [a, b]. */
  const fill = (a: number, b: number): void => {
    const ia = Math.max(Math.floor((Math.max(a, lo) - lo) / PRIOR_STEP_DEX) - 1, 0);
    const ib = Math.min(Math.floor((Math.min(b, hi) - lo) / PRIOR_STEP_DEX) + 2, nNodes - 1);
    for (let i = ia; i <= ib; i++) node(i);
  };
  const one = (lh: number): number => {
    if (lh > lo && lh < hi) fill(lh, lh);
    return read(lh);
  };
  const f = Object.assign(one, {
    onGrid: (x0: number, h: number, n: number, out: Float64Array, shift: number) => {
      fill(x0 - shift, x0 + (n - 1) * h - shift);
      for (let i = 0; i < n; i++) out[i] = read(x0 + i * h - shift);
    },
  });
  priorFor = { e, f };
  return f;
}

/** Scratch vectors reused from call to call (the statistics keep only scalars). */
let scratch = new Float64Array(0);
function scratchVectors(n: number): Float64Array[] {
  if (scratch.length < 5 * n) scratch = new Float64Array(5 * Math.max(n, 1024));
  return [0, 1, 2, 3, 4].map((k) => scratch.subarray(k * n, (k + 1) * n));
}

/**
 * Each draw's cell in the M/L grid and its weights (grid-cells.ts: the draws' own, or found here once per
 * set of shared draws), used by every IMF's table, with the ranges the statistics' bucket bounds need
 * (cells, base, ceilings, accreted baryons). Buffers are reused from galaxy to galaxy; the cache holds
 * only the last set of draws.
 */
interface CellWeights {
  readonly cells: GridCells;
  /**
   * Smallest and largest age and wavelength cell index, and the ranges of the shared vectors (those of
   * the ceiling with cosmic variance and of the accreted baryons only below WINDOW_MEDIAN_MIN_VALUES
   * draws, where the single medians are bucketed: ±Infinity otherwise).
   */
  readonly ranges: {
    aLo: number; aHi: number; jLo: number; jHi: number;
    baseLo: number; baseHi: number; ceilLo: number; ceilHi: number;
    cvLo: number; cvHi: number; accLo: number; accHi: number;
  };
}
let ownCells: GridCells = { nAge: 0, nLam: 0, cell: new Int32Array(0), ageIndex: new Int32Array(0), tx: new Float64Array(0), ty: new Float64Array(0) };
const cellBuf: { cells: GridCells; ranges: CellWeights['ranges'] } = {
  cells: ownCells,
  ranges: { aLo: 0, aHi: 0, jLo: 0, jHi: 0, baseLo: 0, baseHi: 0, ceilLo: 0, ceilHi: 0, cvLo: 0, cvHi: 0, accLo: 0, accHi: 0 },
};
let cellFor: { d: SharedDraws; nAge: number; nLam: number } | undefined;
function cellWeights(d: SharedDraws, tab: MassToLightTable): CellWeights {
  const n = d.n;
  const { nAge, nLam } = tab;
  if (cellFor && cellFor.d === d && cellFor.nAge === nAge && cellFor.nLam === nLam) return cellBuf;
  let cells = d.cells;
  if (!cells || cells.nAge !== nAge || cells.nLam !== nLam) {
    if (ownCells.cell.length < n || ownCells.nAge !== nAge || ownCells.nLam !== nLam) {
      const m = Math.max(n, 1024);
      ownCells = { nAge, nLam, cell: new Int32Array(m), ageIndex: new Int32Array(m), tx: new Float64Array(m), ty: new Float64Array(m) };
    }
    fillGridCells(d.gx, d.gy, 0, n, ownCells);
    cells = ownCells;
  }
  const { cell, ageIndex } = cells;
  let aLo = nAge;
  let aHi = 0;
  let jLo = nLam;
  let jHi = 0;
  let baseLo = Infinity;
  let baseHi = -Infinity;
  for (let k = 0; k < n; k++) {
    const i = ageIndex[k];
    const j = cell[k] - i * nLam;
    if (i < aLo) aLo = i;
    if (i > aHi) aHi = i;
    if (j < jLo) jLo = j;
    if (j > jHi) jHi = j;
    const b = d.base[k];
    if (b < baseLo) baseLo = b;
    if (b > baseHi) baseHi = b;
  }
  const [ceilLo, ceilHi] = rangeOf(d.logCeil, n);
  const small = n < WINDOW_MEDIAN_MIN_VALUES;
  const [cvLo, cvHi] = small ? rangeOf(d.logCeilCv, n) : [-Infinity, Infinity];
  const [accLo, accHi] = small && d.logAccretedBaryons ? rangeOf(d.logAccretedBaryons, n) : [-Infinity, Infinity];
  Object.assign(cellBuf.ranges, { aLo, aHi, jLo, jHi, baseLo, baseHi, ceilLo, ceilHi, cvLo, cvHi, accLo, accHi });
  cellBuf.cells = cells;
  cellFor = { d, nAge, nLam };
  return cellBuf;
}

function rangeOf(a: Float64Array, n: number): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = a[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return [lo, hi];
}

/**
 * Bounds of the M/L table's term over the cells the draws use: log10 M⋆ − base = surv − lnu is a
 * convex combination of the four corners of each draw's cell (the bilinear rule), so it lies within
 * the corners' range over those cells; likewise log10 (1 − R) = surv within its nodes' range.
 */
function tableBounds(tab: MassToLightTable, r: CellWeights['ranges']): { dLo: number; dHi: number; sLo: number; sHi: number } {
  let dLo = Infinity;
  let dHi = -Infinity;
  let sLo = Infinity;
  let sHi = -Infinity;
  for (let i = r.aLo; i <= r.aHi + 1; i++) {
    const sv = tab.logSurv[i];
    if (sv < sLo) sLo = sv;
    if (sv > sHi) sHi = sv;
    for (let j = r.jLo; j <= r.jHi + 1; j++) {
      const l = tab.logLnu[i * tab.nLam + j];
      const dv = sv - l;
      if (dv < dLo) dLo = dv;
      if (dv > dHi) dHi = dv;
    }
  }
  return { dLo, dHi, sLo, sHi };
}

/** Puts value v (index i) into its bucket (quantile-buckets.ts: monotone in v, NaN in bucket 0). */
function bucket(bk: Buckets, i: number, v: number): void {
  let b = ((v - bk.min) * bk.scale) | 0;
  if (b > bk.top) b = bk.top;
  else if (b < 0 || v !== v) b = 0;
  bk.of[i] = b;
  bk.counts[b]++;
}

/**
 * The buckets of imfStatistics, reused from call to call: log10 M⋆ and log10 ε_req, and below
 * WINDOW_MEDIAN_MIN_VALUES draws those of the single medians (log10 ε_req against the ceiling with
 * cosmic variance, the time budget's ratio and formed mass); from there up windowMedian takes them.
 */
const bkM = makeBuckets();
const bkE = makeBuckets();
const bkCv = makeBuckets();
const bkR = makeBuckets();
const bkF = makeBuckets();

/** The quantiles reported of log10 M⋆ and of log10 ε_req (p16/p50/p84 and p05/p50/p95). */
const LM_QS = [0.16, 0.5, 0.84] as const;
const LE_QS = [0.05, 0.5, 0.95] as const;
/** The quantiles of one of the two vectors taken in one pass: its reported ones, then the ranks of its median's error (draw-rule.ts). */
function statQuantiles(reported: readonly number[], n: number): number[] {
  const [qa, , qb] = medianErrorQuantiles(n);
  return [...reported, qa, qb];
}

/** Local slope α of dn/dlnM ∝ M^−α at M (centred difference over ±0.041 dex). */
function localSlope(halo: HaloModel, m: number, z: number): number {
  const a = -Math.log(halo.dndlnM(m * 1.1, z) / halo.dndlnM(m / 1.1, z)) / Math.log(1.21);
  if (!Number.isFinite(a)) {
    throw new RangeError(`the host halo M*/(f_b ε) ≈ ${m.toExponential(1)} Msun lies where the ${halo.model.label} mass function vanishes at z = ${z}: ΛCDM has no such haloes, so the mass cannot be audited or debiased`);
  }
  return a;
}

/**
 * The statistics of one IMF over the shared draws (everything in log10: quantiles commute with 10^x).
 * @param look the adaptive rule's vectors of this IMF over the same draws (medianLook with this table):
 *   log10 M⋆ and log10 ε_req are then taken from it (extended to all d.n draws first) instead of being
 *   computed again; the same numbers, so the statistics are bit for bit those without it.
 */
export function imfStatistics(tab: MassToLightTable, d: SharedDraws, ed: EddingtonInputs, wantFormedMedian: boolean, look?: LookState): ImfStatistics {
  const nv = d.n;
  const [lmOwn, lepsOwn, lepsCv, lr, lf] = scratchVectors(nv);
  const w = cellWeights(d, tab);
  if (look) extendLook(tab, w.cells, d.base, d.logCeil, nv, look);
  const lm = look ? look.lm : lmOwn;
  const leps = look ? look.le : lepsOwn;
  const acc = d.logAccretedBaryons;
  const lratio = acc ? lr : undefined;
  const lformed = acc && wantFormedMedian ? lf : undefined;
  let over = 0;
  let overCosmo = 0;
  let strained = 0;
  let tbOver = 0;
  const lRef = Math.log10(ed.epsRef);
  const L = tab.logLnu;
  const S = tab.logSurv;
  const nLam = tab.nLam;
  const { cell, ageIndex, tx: txs, ty: tys } = w.cells;
  // log10 M⋆'s and log10 ε_req's bucket counts are made in this loop (quantile-buckets.ts), over bounds known before it:
  // the look's own ranges, or the M/L table's corners over the draws' cells plus the shared vectors' ranges.
  const r = w.ranges;
  const t = tableBounds(tab, r);
  // The look's last quantiles, when it was taken over all these draws, are these draws' own.
  const kept = look !== undefined && look.quantilesOf === nv;
  const vLo = look ? look.range.lmMin : r.baseLo + t.dLo;
  const vHi = look ? look.range.lmMax : r.baseHi + t.dHi;
  const useM = !kept && layoutBuckets(bkM, nv, vLo, vHi);
  const useE = !kept && layoutBuckets(bkE, nv, look ? look.range.leMin : vLo - r.ceilHi, look ? look.range.leMax : vHi - r.ceilLo);
  // the single medians' vectors, bucketed here where windowMedian would bucket them on its own (bounds
  // from those above; not laid out where the accreted baryons reach −Infinity: the ratio is then +Infinity)
  const small = nv < WINDOW_MEDIAN_MIN_VALUES;
  const useCv = small && layoutBuckets(bkCv, nv, vLo - r.cvHi, vHi - r.cvLo);
  const useR = small && lratio !== undefined && layoutBuckets(bkR, nv, vLo - t.sHi - r.accHi, vHi - t.sLo - r.accLo);
  const useF = small && lformed !== undefined && layoutBuckets(bkF, nv, vLo - t.sHi, vHi - t.sLo);
  const base = d.base;
  const logCeil = d.logCeil;
  const logCeilCv = d.logCeilCv;
  const cosmo = d.cosmoOffset;
  const own = !look;
  for (let i = 0; i < nv; i++) {
    const a = ageIndex[i];
    const tx = txs[i];
    const surv = logSurvivingInCell(S, a, tx);
    let v: number;
    let e: number;
    if (own) {
      // logMassToLightInCell in its two parts (surv is wanted on its own below)
      v = base[i] + (surv - logLnuInCell(L, nLam, cell[i], tx, tys[i]));
      lm[i] = v;
      e = v - logCeil[i];
      leps[i] = e;
    } else {
      v = lm[i];
      e = leps[i];
    }
    if (useM) bucket(bkM, i, v);
    if (useE) bucket(bkE, i, e);
    const ecv = v - logCeilCv[i];
    lepsCv[i] = ecv;
    if (useCv) bucket(bkCv, i, ecv);
    // counted without branches: near a threshold which side a draw falls cannot be predicted
    over += +(e > 0);
    overCosmo += +(e > cosmo[i]);
    strained += +(e > lRef);
    if (acc) {
      // log10 (1 − R) at the draw's age: the same interpolation as logSurvivingAt
      const f = v - surv;
      const rr = f - acc[i];
      lratio![i] = rr;
      if (useR) bucket(bkR, i, rr);
      if (lformed) lformed[i] = f;
      if (useF) bucket(bkF, i, f);
      tbOver += +(rr > 0);
    }
  }
  /** The quantiles of a vector from the counts of this loop, or bucketed on its own where they could not be laid out. */
  const quantiles = (x: Float64Array, qs: readonly number[], bk: Buckets, made: boolean): number[] => (made ? quantilesFromBuckets(x, nv, qs, bk) : bucketQuantiles(x, nv, qs));
  /** A single median from this loop's buckets, or by windowMedian. */
  const median = (x: Float64Array, bk: Buckets, made: boolean): number => (made ? quantilesFromBuckets(x, nv, [0.5], bk)[0] : windowMedian(x, nv));
  const [lm16, lmMed, lm84, lmA, lmB] = kept ? look.lmQuantiles : quantiles(lm, statQuantiles(LM_QS, nv), bkM, useM);
  const [le05, leMed, le95, leA, leB] = kept ? look.leQuantiles : quantiles(leps, statQuantiles(LE_QS, nv), bkE, useE);
  const leErr = 0.5 * (leB - leA);
  const med = 10 ** leMed;
  const medCv = 10 ** median(lepsCv, bkCv, useCv);
  const epsHost = Math.min(1, Math.max(med, ed.epsRef));
  const shift = eddingtonPosterior(hostPrior(ed, epsHost), lmMed, ed.sigmaDex).shiftMedianDex;
  const mHost = Math.min(Math.max(10 ** lmMed / (ed.halo.baryonFraction * epsHost), 1e3), 1e18);
  const alpha = localSlope(ed.halo, mHost, ed.z);
  const debiased = med * 10 ** -shift;
  const ratioMed = lratio ? 10 ** median(lratio, bkR, useR) : undefined;
  const result: ImfResult = {
    verdict: verdictFor(med, ed.epsRef),
    log_mstar_median: lmMed,
    log_mstar_p16: lm16,
    log_mstar_p84: lm84,
    eps_required_median: med,
    eps_required_p05: 10 ** le05,
    eps_required_p95: 10 ** le95,
    p_over_budget: over / nv,
    p_strained: strained / nv,
    p_over_budget_cosmo: overCosmo / nv,
    eps_required_median_debiased: debiased,
    verdict_debiased: verdictFor(debiased, ed.epsRef),
    eddington_shift_dex: shift,
    eps_required_median_cv: medCv,
    verdict_cv: verdictFor(medCv, ed.epsRef),
    ...(ratioMed !== undefined && Number.isFinite(ratioMed) ? { time_budget_ratio_median: ratioMed, p_time_budget_over: tbOver / nv } : {}),
    log_mstar_median_mc_error_dex: 0.5 * (lmB - lmA),
    log_eps_required_median_mc_error_dex: leErr,
    p_verdict_change: pClassChange(leMed, leErr, ed.epsRef),
  };
  return {
    result,
    eddingtonSlopeAlpha: alpha,
    eddingtonFirstOrderDex: eddingtonFirstOrderShiftDex(alpha, ed.sigmaDex),
    formedMassMedianMsun: lformed ? 10 ** median(lformed, bkF, useF) : undefined,
  };
}

/** One IMF's vectors of the adaptive rule's looks: log10 M⋆ and log10 ε_req of the first n valid draws, with their ranges. */
export interface LookState {
  n: number;
  readonly lm: Float64Array;
  readonly le: Float64Array;
  /** The buckets of lm and le (reused from look to look). */
  readonly bkLm: Buckets;
  readonly bkLe: Buckets;
  /**
   * The last look's quantiles of lm and le, in imfStatistics' order (statQuantiles), and the number of
   * draws they are of (−1: none): imfStatistics takes them as they are when the draws stop there.
   */
  lmQuantiles: number[];
  leQuantiles: number[];
  quantilesOf: number;
  range: { lmMin: number; lmMax: number; leMin: number; leMax: number };
}

/** @param buckets two Buckets (makeBuckets) for lm and le, reusable from galaxy to galaxy; fresh ones when absent. */
export function makeLookState(lm: Float64Array, le: Float64Array, buckets?: readonly [Buckets, Buckets]): LookState {
  const [bkLm, bkLe] = buckets ?? [makeBuckets(), makeBuckets()];
  return { n: 0, lm, le, bkLm, bkLe, lmQuantiles: [], leQuantiles: [], quantilesOf: -1, range: { lmMin: Infinity, lmMax: -Infinity, leMin: Infinity, leMax: -Infinity } };
}

/**
 * The adaptive rule's look at one IMF (draw-rule.ts): log10 M⋆ and log10 ε_req of the valid draws,
 * extended from look.n to n (the earlier draws are already there), then the two medians and their
 * Monte Carlo errors over all n. The reported quantiles are taken in the same pass (a few more order
 * statistics from the same gathered buckets) and kept, for imfStatistics when the draws stop here.
 */
export function medianLook(tab: MassToLightTable, cells: GridCells, base: Float64Array, logCeil: Float64Array, n: number, look: LookState): { logMstarErrDex: number; logEpsMedian: number; logEpsErrDex: number } {
  extendLook(tab, cells, base, logCeil, n, look);
  const { lm, le, range: r } = look;
  const okM = layoutBuckets(look.bkLm, n, r.lmMin, r.lmMax);
  const okE = layoutBuckets(look.bkLe, n, r.leMin, r.leMax);
  if (okM) fillBuckets(lm, n, look.bkLm);
  if (okE) fillBuckets(le, n, look.bkLe);
  const qm = statQuantiles(LM_QS, n);
  const qe = statQuantiles(LE_QS, n);
  const mq = okM ? quantilesFromBuckets(lm, n, qm, look.bkLm) : bucketQuantiles(lm, n, qm, { min: r.lmMin, max: r.lmMax });
  const eq = okE ? quantilesFromBuckets(le, n, qe, look.bkLe) : bucketQuantiles(le, n, qe, { min: r.leMin, max: r.leMax });
  look.lmQuantiles = mq;
  look.leQuantiles = eq;
  look.quantilesOf = n;
  // statQuantiles' order: the reported three (the median second), then the median error's two ranks
  return { logMstarErrDex: 0.5 * (mq[4] - mq[3]), logEpsMedian: eq[1], logEpsErrDex: 0.5 * (eq[4] - eq[3]) };
}

/** A look's vectors extended from look.n to n valid draws (logMassToLightInCell: the same numbers as imfStatistics' own rule), with their ranges. */
function extendLook(tab: MassToLightTable, cells: GridCells, base: Float64Array, logCeil: Float64Array, n: number, look: LookState): void {
  if (cells.nAge !== tab.nAge || cells.nLam !== tab.nLam) throw new RangeError(`M/L table of ${tab.nAge} × ${tab.nLam} nodes read on cells of a ${cells.nAge} × ${cells.nLam} grid`);
  const { lm, le, range: r } = look;
  const { cell, ageIndex, tx, ty } = cells;
  const L = tab.logLnu;
  const S = tab.logSurv;
  const nLam = tab.nLam;
  for (let i = look.n; i < n; i++) {
    const v = base[i] + logMassToLightInCell(L, S, nLam, ageIndex[i], cell[i], tx[i], ty[i]);
    const e = v - logCeil[i];
    lm[i] = v;
    le[i] = e;
    if (v < r.lmMin) r.lmMin = v;
    if (v > r.lmMax) r.lmMax = v;
    if (e < r.leMin) r.leMin = e;
    if (e > r.leMax) r.leMax = e;
  }
  look.n = Math.max(look.n, n);
}
