import { quantilesBySelection } from '../numeric/select.js';
import { bucketQuantiles, makeBuckets, type Buckets } from '../numeric/quantile-buckets.js';
import { makeScratch, type Scratch } from '../numeric/scratch.js';
import type { HaloModel } from '../halos/halo-model.js';
import type { PopulationCache } from '../stars/population-cache.js';
import type { MassToLightTable } from '../stars/mass-to-light.js';
import type { Sfh } from '../stars/sfh.js';
import { makeAccretionHistory } from './accretion.js';
import { attribute, type AttributionDetail } from './attribution.js';
import type { AuditChoices } from './choices.js';
import type { CeilingTable } from './ceiling.js';
import { drawGalaxy, galaxyDeviates, galaxyDrawStream, tabulatedBackground, type GalaxyDraws, type KeptDeviates } from './galaxy-draws.js';
import { DRAW_BLOCK, drawPrecisionOf, errorUpperLimit, FIRST_LOOK, looksFor, normalQuantile, P_CLASS_CHANGE_MAX } from './draw-rule.js';
import { fillGridCells, type GridCells } from './grid-cells.js';
import { imfStatistics, makeLookState, medianLook, type ImfResult, type ImfStatistics, type SharedDraws } from './imf-statistics.js';
import { rescaleBase, rescalePosition } from './imf-rescale.js';
import { DEVIATE_NORMAL, idSeed, makeRandom } from './random.js';
import type { GalaxyInput } from './sample.js';
import { reconcileGalaxy, type Reconciliation } from './reconcile.js';
import { logAccretedBaryonsOfDraws } from './time-budget.js';
import { verdictFor, type Attribution, type Verdict } from './verdict.js';

export type { ImfResult } from './imf-statistics.js';

export interface TimeBudget {
  readonly formation_z: number;
  /** Headline IMF: median over the draws of (stellar mass formed) / (f_b × halo mass accreted over the same interval). */
  readonly ratio: number;
  /** P(ratio > 1): the chance that the halo could not have supplied the gas in time, even at ε = 1. */
  readonly p_ratio_over_1: number;
  /** Median stellar mass formed, M⋆/(1 − R), Msun (headline IMF). */
  readonly formed_mass_msun: number;
  /** Median baryons f_b ΔM_h accreted by the ceiling halo during the population's age, Msun. */
  readonly accreted_baryons_msun: number;
  readonly method: string;
}

export interface GalaxyAudit {
  readonly headline_imf: string;
  readonly verdict: Verdict;
  readonly attribution: Attribution[];
  readonly attribution_detail: AttributionDetail[];
  readonly imf: Record<string, ImfResult>;
  readonly ceiling: {
    readonly slice_z_min: number;
    readonly slice_z_max: number;
    readonly halo_mass_at_quantile_msun: number;
    readonly halo_mass_at_quantile_cv_msun: number;
    readonly stellar_ceiling_msun: number;
    readonly sigma_dm: number;
    readonly bias_smt01: number;
    /** 1σ of log10 M_halo,q from the cosmological parameters (linear response), dex. */
    readonly log_mass_cosmo_sd_dex: number;
  };
  readonly eddington: {
    readonly sigma_dex: number;
    /** Exact posterior-median shift of log M⋆ under the mass-function prior (headline IMF), dex. */
    readonly shift_dex: number;
    /** The first-order α σ² ln10 shift and its local slope α, for comparison. */
    readonly shift_first_order_dex: number;
    readonly slope_alpha: number;
    readonly method: string;
  };
  readonly time_budget: TimeBudget | null;
  readonly redshift_checks: { readonly z: number; readonly kind: 'z_alt' | 'z_lo'; readonly eps_required_median: number; readonly verdict: Verdict }[];
  /** What it would take (strained or over budget only): one entry for ε = 1 and one for ε_ref. */
  readonly reconcile: Reconciliation[];
  readonly draws_used: number;
  readonly draws_excluded: number;
  /** How many draws were made and why they stopped, and the precision reached (the worst over the compared IMFs). */
  readonly monte_carlo: MonteCarloSummary;
  readonly notes: string[];
}

export interface MonteCarloSummary {
  /** Draws made (valid and excluded). */
  readonly draws_made: number;
  /** fixed: --fixed-draws; settled: the adaptive rule stopped; maximum: it reached --draws unsettled. */
  readonly stop: DrawStop;
  /** The largest Monte Carlo error over the compared IMFs of the median log10 M⋆ and log10 ε_req, dex. */
  readonly log_mstar_median_mc_error_dex: number;
  readonly log_eps_required_median_mc_error_dex: number;
  /** The largest chance over the compared IMFs that a verdict lies across its threshold (draw-rule.ts). */
  readonly p_verdict_change: number;
}

function monteCarloOf(choices: AuditChoices, n: number, stop: DrawStop, results: readonly ImfResult[]): MonteCarloSummary {
  const worst = (f: (r: ImfResult) => number): number => Math.max(...results.map(f));
  return {
    draws_made: n,
    stop,
    log_mstar_median_mc_error_dex: worst((r) => r.log_mstar_median_mc_error_dex),
    log_eps_required_median_mc_error_dex: worst((r) => r.log_eps_required_median_mc_error_dex),
    p_verdict_change: worst((r) => r.p_verdict_change),
  };
}

export interface AuditContext {
  readonly halo: HaloModel;
  readonly cache: PopulationCache;
  readonly sfh: Sfh;
  readonly choices: AuditChoices;
  ceilingFor(surveyName: string | undefined): CeilingTable;
  /** 1σ (dex) of the ceiling's log10 M_halo,q from the cosmological parameters, at z. */
  ceilingSdDexAt(surveyName: string | undefined, z: number): number;
  /** Area (arcmin²) of the named survey, or of the default one. */
  areaFor(surveyName: string | undefined): number;
  sigmaDmFor(surveyName: string | undefined, z: number): number;
}

/**
 * Where the draws at `valid` sit in the M/L grid (the same position for every IMF's table) and the
 * part of log10 M⋆ that does not depend on the IMF: log10 M⋆ = base + logMassToLightAt(x, y). For a
 * brightness row, base = the dust-corrected log10 L_ν at (age, rest λ); for a reported mass, the
 * mass rescaled at the same light (imf-rescale.ts).
 */
function drawGrid(g: GalaxyInput, d: GalaxyDraws, valid: ArrayLike<number>, grid: MassToLightTable, ref: MassToLightTable | undefined, scratch?: Scratch): { x: Float64Array; y: Float64Array; base: Float64Array } {
  const nv = valid.length;
  const vec = (name: string): Float64Array => (scratch ? scratch.f64(name, nv) : new Float64Array(nv));
  const out = { x: vec('grid.x'), y: vec('grid.y'), base: vec('grid.base') };
  fillGrid(g, d, valid, 0, nv, grid, ref, out);
  return out;
}

/** drawGrid for the valid draws from..to − 1, into the given arrays (the earlier entries are kept). */
function fillGrid(g: GalaxyInput, d: GalaxyDraws, valid: ArrayLike<number>, from: number, to: number, grid: MassToLightTable, ref: MassToLightTable | undefined, out: { x: Float64Array; y: Float64Array; base: Float64Array }): void {
  const { x, y, base } = out;
  // the table's gridPositionLog written out (the same expressions), without an array per draw
  const la0 = grid.log10AgeMin;
  const fa = (grid.nAge - 1) / (grid.log10AgeMax - la0);
  const ll0 = grid.log10LamMin;
  const fl = (grid.nLam - 1) / (grid.log10LamMax - ll0);
  const xTop = grid.nAge - 1;
  const yTop = grid.nLam - 1;
  // a reported mass is rescaled at one wavelength: its y is the same for every draw (rescalePosition's), x as below
  const yRescale = g.log10Mstar !== undefined ? rescalePosition(grid, la0)[1] : 0;
  for (let i = from; i < to; i++) {
    const k = valid[i];
    const a = Math.min(Math.max((d.log10AgeMyr[k] - la0) * fa, 0), xTop);
    x[i] = a;
    if (g.log10Mstar !== undefined) {
      y[i] = yRescale;
      base[i] = rescaleBase(d.log10MassRef[k], ref!, a, yRescale);
    } else {
      y[i] = Math.min(Math.max((d.log10LambdaRestUm[k] - ll0) * fl, 0), yTop);
      base[i] = d.log10Lnu[k];
    }
  }
}

/** The one kind of deviate of the ceiling offsets' stream. */
const OFFSET_KINDS = Uint8Array.of(DEVIATE_NORMAL);

/**
 * Each draw's offset of the ceiling's log10 mass from the cosmological parameters, N(0, sd²) dex, from
 * a stream of its own (seeded from the galaxy's stream seed with a fixed tag), so that the other draws
 * are the same with or without it.
 */
export function ceilingOffsets(seed: number, id: string, n: number, sdDex: number, scratch: Scratch): Float64Array {
  const rnd = makeRandom(idSeed(seed, id) ^ 0x6a09e667);
  const out = scratch.f64('ceiling.offset', n);
  rnd.fill(OFFSET_KINDS, [out], n);
  for (let i = 0; i < n; i++) out[i] *= sdDex;
  return out;
}

/**
 * The galaxy's draws placed at one redshift z (the same band and flux, or the reported mass scaled by
 * D_L²(1+z)), as IMF-free bases and grid positions in the M/L tables; undefined when the band leaves
 * the model's rest range there. The galaxy's own random stream, so the figure and the reconciliation
 * agree.
 */
export function fixedRedshiftCells(ctx: AuditContext, g: GalaxyInput, z: number, n: number, kept?: KeptDeviates): { base: Float64Array; gx: Float64Array; gy: Float64Array } | undefined {
  const { headline } = headlineAndCompared(g, ctx.choices);
  const tableOf = (imf: string): MassToLightTable => ctx.cache.table(imf, g.z, ctx.sfh);
  const df = drawGalaxy(g, n, idSeed(ctx.choices.seed, g.id), ctx.halo.background, { z, alt: false }, undefined, kept);
  const ok = validDraws(g, df);
  if (!ok.length) return undefined;
  const cell = drawGrid(g, df, ok, tableOf(headline), g.imfRef ? tableOf(g.imfRef) : undefined);
  return { base: cell.base, gx: cell.x, gy: cell.y };
}

/** Indices of the draws whose band fell inside the model's rest range (all, for a reported mass). */
function validDraws(g: GalaxyInput, d: GalaxyDraws, scratch?: Scratch): Int32Array {
  const all = scratch ? scratch.i32('valid', d.n) : new Int32Array(d.n);
  let nv = 0;
  for (let k = 0; k < d.n; k++) if (g.log10Mstar !== undefined || Number.isFinite(d.log10Lnu[k])) all[nv++] = k;
  return all.subarray(0, nv);
}

/**
 * The headline IMF and the IMFs compared. A reported mass's imf_ref is always its headline; other rows
 * take the run's headline IMF (default: the first of the list). The headline is always compared: it is
 * put first if the list lacks it. The choice never depends on the order of the rest of the list.
 */
export function headlineAndCompared(g: GalaxyInput, choices: AuditChoices): { headline: string; imfs: string[] } {
  const headline = g.imfRef ?? choices.headlineImf ?? choices.imfs[0];
  const imfs = choices.imfs.includes(headline) ? [...choices.imfs] : [headline, ...choices.imfs];
  return { headline, imfs };
}

/** The fixed-redshift checks (alternative solution, lower bound) of the headline IMF, for the attribution. */
function redshiftChecks(ctx: AuditContext, g: GalaxyInput, seed: number, headTab: MassToLightTable, refTab: MassToLightTable | undefined, notes: string[], kept: () => KeptDeviates): GalaxyAudit['redshift_checks'] {
  const { choices, halo } = ctx;
  const ceil = ctx.ceilingFor(g.survey);
  const lfb = Math.log10(halo.baryonFraction);
  const fixed: [number, 'z_alt' | 'z_lo', boolean][] = [];
  if (g.zAlt !== undefined) fixed.push([g.zAlt, 'z_alt', true]);
  if (g.zLo !== undefined && g.zLo < g.z) fixed.push([Math.max(g.zLo, 0.05), 'z_lo', false]);
  const out: GalaxyAudit['redshift_checks'] = [];
  for (const [zf, kind, isAlt] of fixed) {
    const df = drawGalaxy(g, Math.min(choices.draws, 2000), seed, halo.background, { z: zf, alt: isAlt }, undefined, kept());
    const ok = validDraws(g, df);
    if (!ok.length) {
      notes.push(`at ${kind} = ${zf} the band falls outside the model's rest range; that solution was not evaluated`);
      continue;
    }
    const lc = lfb + ceil.log10HaloMassAtQuantile(zf);
    const cell = drawGrid(g, df, ok, headTab, refTab);
    const leps = cell.base.map((b, i) => b + headTab.logMassToLightAt(cell.x[i], cell.y[i]) - lc);
    const med = 10 ** quantilesBySelection(leps, [0.5])[0];
    out.push({ z: zf, kind, eps_required_median: med, verdict: verdictFor(med, choices.epsRef) });
  }
  return out;
}

/** log10 f_b ΔM_h per valid draw over its star formation (undefined when z is not below the formation redshift). */
function drawAccretion(ctx: AuditContext, g: GalaxyInput, d: GalaxyDraws, valid: Int32Array, logCeil: Float64Array, scratch: Scratch): Float64Array | undefined {
  const { halo, choices } = ctx;
  if (!(g.z < choices.formationZ)) return undefined;
  const lfb = Math.log10(halo.baryonFraction);
  const nv = valid.length;
  const halos = scratch.f64('accretion.halo', nv);
  for (let i = 0; i < nv; i++) halos[i] = logCeil[i] - lfb;
  // ages and distances per draw from the draws' own tables (galaxy-draws.ts), not the direct integrals
  const bg = tabulatedBackground(halo.background);
  return logAccretedBaryonsOfDraws(bg, makeAccretionHistory(bg), halo.baryonFraction, choices.formationZ, nv, valid, d.lnOnePlusZ, d.lnAgeGyr, d.log10AgeMyr, halos, scratch.f64('accretion.out', nv));
}

function timeBudgetOf(ctx: AuditContext, g: GalaxyInput, head: ImfStatistics, acc: Float64Array | undefined, notes: string[]): TimeBudget | null {
  const fz = ctx.choices.formationZ;
  if (!acc) {
    notes.push(`z = ${g.z} is not below the formation redshift ${fz}: no time budget`);
    return null;
  }
  const r = head.result;
  if (r.time_budget_ratio_median === undefined || head.formedMassMedianMsun === undefined) {
    notes.push(`most draws leave no time for star formation after the formation redshift ${fz}: no time budget`);
    return null;
  }
  return {
    formation_z: fz,
    ratio: r.time_budget_ratio_median,
    p_ratio_over_1: r.p_time_budget_over!,
    formed_mass_msun: head.formedMassMedianMsun,
    accreted_baryons_msun: 10 ** bucketQuantiles(acc, acc.length, [0.5])[0],
    method:
      'per draw: stellar mass formed M*/(1 − R) (R of the population model at the drawn age) over f_b × the mass the ceiling halo accretes in ' +
      `[max(t(z) − age, t(z = ${fz})), t(z)] on its mean history (Fakhouri, Ma & Boylan-Kolchin 2010, integrated along M_h(z))`,
  };
}

/**
 * Work vectors of the main draws, reused from galaxy to galaxy (nothing in a GalaxyAudit refers to
 * them; the fixed-redshift checks and the what-it-would-take search draw into arrays of their own).
 */
const mainScratch = makeScratch();
/** The looks' buckets per compared IMF, reused from galaxy to galaxy like mainScratch. */
const lookBuckets: [Buckets, Buckets][] = [];

/**
 * The galaxy's main draws: all `draws` with fixedDraws, else block by block under the adaptive rule
 * (draw-rule.ts) until every compared IMF's verdict and medians are settled or `draws` is reached.
 * Fills the valid draws' indices, grid positions, bases and ceilings (reused vectors, capacity `draws`).
 */
function mainDraws(ctx: AuditContext, g: GalaxyInput, seed: number, imfTables: readonly MassToLightTable[], refTable: MassToLightTable | undefined, ceil: CeilingTable) {
  const { choices, halo } = ctx;
  const fixed = choices.fixedDraws === true;
  const nMax = choices.draws;
  const stream = galaxyDrawStream(g, nMax, seed, halo.background, undefined, mainScratch);
  const d = stream.draws;
  const validBuf = mainScratch.i32('valid', nMax);
  const grid = { x: mainScratch.f64('grid.x', nMax), y: mainScratch.f64('grid.y', nMax), base: mainScratch.f64('grid.base', nMax) };
  const logCeilBuf = mainScratch.f64('ceiling.log', nMax);
  // every IMF's table is on the first one's grid (the looks and imfStatistics check it)
  const cells: GridCells = {
    nAge: imfTables[0].nAge,
    nLam: imfTables[0].nLam,
    cell: mainScratch.i32('cells.cell', nMax),
    ageIndex: mainScratch.i32('cells.age', nMax),
    tx: mainScratch.f64('cells.tx', nMax),
    ty: mainScratch.f64('cells.ty', nMax),
  };
  const lfb = Math.log10(halo.baryonFraction);
  const zLook = fixed ? Infinity : normalQuantile(1 - P_CLASS_CHANGE_MAX / looksFor(nMax));
  while (lookBuckets.length < imfTables.length) lookBuckets.push([makeBuckets(), makeBuckets()]);
  const looks = imfTables.map((_, j) => makeLookState(mainScratch.f64(`look.lm.${j}`, nMax), mainScratch.f64(`look.le.${j}`, nMax), lookBuckets[j]));
  const precision = drawPrecisionOf(choices);
  let nv = 0;
  let stop: DrawStop = fixed ? 'fixed' : 'maximum';
  for (let n = fixed ? nMax : Math.min(FIRST_LOOK, nMax); ; n = Math.min(n + DRAW_BLOCK, nMax)) {
    const k0 = d.n;
    const nv0 = nv;
    stream.extend(n);
    for (let k = k0; k < n; k++) if (g.log10Mstar !== undefined || Number.isFinite(d.log10Lnu[k])) validBuf[nv++] = k;
    fillGrid(g, d, validBuf, nv0, nv, imfTables[0], refTable, grid);
    fillGridCells(grid.x, grid.y, nv0, nv, cells);
    ceil.log10HaloMassesAt(d.z, validBuf.subarray(nv0, nv), nv - nv0, undefined, lfb, logCeilBuf.subarray(nv0, nv));
    if (fixed || n >= nMax) break;
    // a look needs half the first look's draws valid; every IMF settled (z errors from both thresholds,
    // the error at its upper confidence limit), both errors within the precision
    if (nv >= FIRST_LOOK / 2) {
      let settled = true;
      for (let j = 0; j < imfTables.length && settled; j++) {
        const m = medianLook(imfTables[j], cells, grid.base, logCeilBuf, nv, looks[j]);
        const dist = Math.min(Math.abs(m.logEpsMedian - Math.log10(choices.epsRef)), Math.abs(m.logEpsMedian));
        settled = m.logMstarErrDex <= precision && m.logEpsErrDex <= precision && dist >= zLook * errorUpperLimit(m.logEpsErrDex, nv);
      }
      if (settled) {
        stop = 'settled';
        break;
      }
    }
  }
  return {
    d,
    stop,
    // the looks' vectors of each IMF (imfStatistics takes log10 M⋆ and ε_req from them); none with fixedDraws
    looks: fixed ? undefined : looks,
    valid: validBuf.subarray(0, nv),
    gx: grid.x.subarray(0, nv),
    gy: grid.y.subarray(0, nv),
    base: grid.base.subarray(0, nv),
    logCeil: logCeilBuf.subarray(0, nv),
    cells,
  };
}

export type DrawStop = 'fixed' | 'settled' | 'maximum';

export interface GalaxyAuditOptions {
  /**
   * Whether to search what it would take to reconcile a galaxy in tension (default true). The page's first
   * look leaves it out and asks for it next (the rest of the audit is the same, draw for draw); its
   * `reconcile` is then empty whatever the verdict.
   */
  readonly reconcile?: boolean;
}

export function auditGalaxy(ctx: AuditContext, g: GalaxyInput, index: number, options: GalaxyAuditOptions = {}): GalaxyAudit {
  const { choices, halo } = ctx;
  const fb = halo.baryonFraction;
  const seed = idSeed(choices.seed, g.id);
  const ceil = ctx.ceilingFor(g.survey);
  const sigmaDm = ctx.sigmaDmFor(g.survey, g.z);
  const notes: string[] = [];
  const { headline, imfs } = headlineAndCompared(g, choices);
  const tableOf = (imf: string): MassToLightTable => ctx.cache.table(imf, g.z, ctx.sfh);
  const refTable = g.imfRef ? tableOf(g.imfRef) : undefined;
  const { d, stop, looks, valid, gx, gy, base, logCeil, cells } = mainDraws(ctx, g, seed, imfs.map(tableOf), refTable, ceil);
  const n = d.n;
  if (d.excluded) notes.push(`${d.excluded} of ${n} draws put the observed band outside the model's rest range (Lyman-α–1 μm) and were left out`);
  if (valid.length < Math.max(20, 0.01 * n)) throw new RangeError(`row ${g.row} (${g.id}): almost every redshift draw puts the band outside the model's rest range (Lyman-α–1 μm)`);
  if (g.log10Mstar !== undefined && g.zAlt !== undefined && g.log10MstarAlt === undefined) {
    notes.push('no log_mstar_alt: the mass at z_alt was rescaled by the luminosity-distance ratio, D_L(z_alt)²/D_L(z)² · (1+z)/(1+z_alt)');
  }
  // σ_dm is evaluated once, at the galaxy's nominal z (it changes slowly with z across the slice).
  const logCeilCv = ceil.log10HaloMassesAt(d.z, valid, valid.length, sigmaDm, Math.log10(fb), mainScratch.f64('ceiling.logCv', valid.length));
  const acc = drawAccretion(ctx, g, d, valid, logCeil, mainScratch);
  const cosmoSd = ctx.ceilingSdDexAt(g.survey, g.z);
  const shared: SharedDraws = { n: valid.length, base, gx, gy, logCeil, logCeilCv, logAccretedBaryons: acc, cosmoOffset: ceilingOffsets(choices.seed, g.id, valid.length, cosmoSd, mainScratch), cells };
  const sigmaDex = g.log10Mstar !== undefined ? g.log10MstarErr : 0.4 * g.magErr;
  const ed = { halo, z: g.z, sigmaDex, epsRef: choices.epsRef };
  const stats: Record<string, ImfStatistics> = {};
  imfs.forEach((imf, j) => (stats[imf] = imfStatistics(tableOf(imf), shared, ed, imf === headline, looks?.[j])));
  const imfResults: Record<string, ImfResult> = Object.fromEntries(imfs.map((i) => [i, stats[i].result]));
  const h = imfResults[headline];
  // the draws at fixed redshifts (checks, what it would take) share the galaxy's first deviates: made once
  let kept: KeptDeviates | undefined;
  const keptDeviates = (): KeptDeviates => (kept ??= galaxyDeviates(g, Math.min(choices.draws, 2000), seed));
  const checks = h.verdict !== 'within budget' ? redshiftChecks(ctx, g, seed, tableOf(headline), refTable, notes, keptDeviates) : [];
  const { attribution, attribution_detail } = attribute({
    headlineImf: headline,
    headlineVerdict: h.verdict,
    imfVerdicts: Object.fromEntries(imfs.map((i) => [i, imfResults[i].verdict])),
    redshiftChecks: checks,
    verdictCosmicVariance: h.verdict_cv,
    verdictEddington: h.verdict_debiased,
    eddingtonShiftDex: h.eddington_shift_dex,
  });
  const reconcile =
    h.verdict === 'within budget' || options.reconcile === false
      ? []
      : reconcileGalaxy(
          {
            g,
            halo,
            ceiling: ceil,
            quantile: choices.quantile,
            areaArcmin2: ctx.areaFor(g.survey),
            sliceDz: choices.sliceDz,
            z: Float64Array.from(valid, (k) => d.z[k]),
            base,
            gx,
            gy,
            headTable: tableOf(headline),
            tableOf,
            drawsAtRedshift: (zf) => fixedRedshiftCells(ctx, g, zf, Math.min(choices.draws, 2000), keptDeviates()),
          },
          [...new Set([1, choices.epsRef])],
        );
  const mCeil = ceil.haloMassAtQuantile(g.z);
  const [s0, s1] = ceil.sliceLimits(g.z);
  return {
    headline_imf: headline,
    verdict: h.verdict,
    attribution,
    attribution_detail,
    imf: imfResults,
    ceiling: {
      slice_z_min: s0,
      slice_z_max: s1,
      halo_mass_at_quantile_msun: mCeil,
      halo_mass_at_quantile_cv_msun: ceil.haloMassAtQuantileCv(g.z, sigmaDm),
      stellar_ceiling_msun: fb * mCeil,
      sigma_dm: sigmaDm,
      bias_smt01: halo.bias(mCeil, g.z, 'smt01'),
      log_mass_cosmo_sd_dex: cosmoSd,
    },
    eddington: {
      sigma_dex: sigmaDex,
      shift_dex: h.eddington_shift_dex,
      shift_first_order_dex: stats[headline].eddingtonFirstOrderDex,
      slope_alpha: stats[headline].eddingtonSlopeAlpha,
      method:
        `exact posterior median of log M* for a Gaussian error of σ dex and the prior dn/dlog M_h (${halo.model.label}, z = ${g.z}) at the host mass ` +
        'M*/(f_b ε), ε = the median ε_req clamped to [ε_ref, 1]; the first-order α σ² ln10 is given for comparison',
    },
    time_budget: timeBudgetOf(ctx, g, stats[headline], acc, notes),
    redshift_checks: checks,
    reconcile,
    draws_used: valid.length,
    draws_excluded: d.excluded,
    monte_carlo: monteCarloOf(choices, n, stop, imfs.map((i) => imfResults[i])),
    notes,
  };
}
