import { quantilesBySelection } from '../numeric/select.js';
import type { HaloModel } from '../halos/halo-model.js';
import type { PopulationCache } from '../stars/population-cache.js';
import type { MassToLightTable } from '../stars/mass-to-light.js';
import { isTopHeavy } from '../stars/imf-presets.js';
import type { Sfh } from '../stars/sfh.js';
import { meanAccretionRateMsunYr } from './accretion.js';
import type { AuditChoices } from './choices.js';
import { RESCALE_REST_UM } from './choices.js';
import type { CeilingTable } from './ceiling.js';
import { drawGalaxy, type GalaxyDraws } from './galaxy-draws.js';
import { idSeed } from './random.js';
import type { GalaxyInput } from './sample.js';
import { verdictFor, type Attribution, type Verdict } from './verdict.js';

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
  /** Median ε_req after the Eddington-bias correction of the measured mass. */
  readonly eps_required_median_debiased: number;
  /** Median ε_req against the ceiling widened by cosmic variance. */
  readonly eps_required_median_cv: number;
  readonly verdict_cv: Verdict;
}

export interface GalaxyAudit {
  readonly headline_imf: string;
  readonly verdict: Verdict;
  readonly attribution: Attribution[];
  readonly imf: Record<string, ImfResult>;
  readonly ceiling: {
    readonly slice_z_min: number;
    readonly slice_z_max: number;
    readonly halo_mass_at_quantile_msun: number;
    readonly halo_mass_at_quantile_cv_msun: number;
    readonly stellar_ceiling_msun: number;
    readonly sigma_dm: number;
    readonly bias_smt01: number;
  };
  readonly eddington: { readonly slope_alpha: number; readonly sigma_dex: number; readonly shift_dex: number; readonly method: string };
  readonly time_budget: { readonly formation_z: number; readonly sfr_needed_msun_yr: number; readonly inflow_max_msun_yr: number; readonly ratio: number } | null;
  readonly redshift_checks: { readonly z: number; readonly kind: 'z_alt' | 'z_lo'; readonly eps_required_median: number; readonly verdict: Verdict }[];
  readonly draws_used: number;
  readonly draws_excluded: number;
  readonly notes: string[];
}

export interface AuditContext {
  readonly halo: HaloModel;
  readonly cache: PopulationCache;
  readonly sfh: Sfh;
  readonly choices: AuditChoices;
  ceilingFor(surveyName: string | undefined): CeilingTable;
  sigmaDmFor(surveyName: string | undefined, z: number): number;
}

const LOG_RESCALE = Math.log10(RESCALE_REST_UM);

/**
 * Where the draws at `valid` sit in the M/L grid (the same position for every IMF's table) and the
 * part of log10 M⋆ that does not depend on the IMF: log10 M⋆ = base + logMassToLightAt(x, y). For a
 * brightness row, base = the dust-corrected log10 L_ν at (age, rest λ); for a reported mass, the mass
 * divided by imf_ref's M/L at rest RESCALE_REST_UM (rescaling at the same light).
 */
function drawGrid(g: GalaxyInput, d: GalaxyDraws, valid: readonly number[], grid: MassToLightTable, ref: MassToLightTable | undefined): { x: Float64Array; y: Float64Array; base: Float64Array } {
  const nv = valid.length;
  const x = new Float64Array(nv);
  const y = new Float64Array(nv);
  const base = new Float64Array(nv);
  for (let i = 0; i < nv; i++) {
    const k = valid[i];
    const [a, b] = grid.gridPositionLog(d.log10AgeMyr[k], g.log10Mstar !== undefined ? LOG_RESCALE : d.log10LambdaRestUm[k]);
    x[i] = a;
    y[i] = b;
    base[i] = g.log10Mstar !== undefined ? d.log10MassRef[k] - ref!.logMassToLightAt(a, b) : d.log10Lnu[k];
  }
  return { x, y, base };
}

/** Indices of the draws whose band fell inside the model's rest range (all, for a reported mass). */
function validDraws(g: GalaxyInput, d: GalaxyDraws): number[] {
  const valid: number[] = [];
  for (let k = 0; k < d.n; k++) if (g.log10Mstar !== undefined || Number.isFinite(d.log10Lnu[k])) valid.push(k);
  return valid;
}

export function auditGalaxy(ctx: AuditContext, g: GalaxyInput, index: number): GalaxyAudit {
  const { choices, halo } = ctx;
  const fb = halo.baryonFraction;
  const n = choices.draws;
  const seed = idSeed(choices.seed, g.id);
  const d = drawGalaxy(g, n, seed, halo.background);
  const ceil = ctx.ceilingFor(g.survey);
  const sigmaDm = ctx.sigmaDmFor(g.survey, g.z);
  const notes: string[] = [];
  const valid = validDraws(g, d);
  if (d.excluded) notes.push(`${d.excluded} of ${n} draws put the observed band outside the model's rest range (Lyman-α–1 μm) and were left out`);
  if (valid.length < Math.max(20, 0.01 * n)) throw new RangeError(`row ${g.row} (${g.id}): almost every redshift draw puts the band outside the model's rest range (Lyman-α–1 μm)`);
  if (g.log10Mstar !== undefined && g.zAlt !== undefined && g.log10MstarAlt === undefined) {
    notes.push('no log_mstar_alt: the mass at z_alt was rescaled by the luminosity-distance ratio, D_L(z_alt)²/D_L(z)² · (1+z)/(1+z_alt)');
  }
  const nv = valid.length;
  const logCeil = new Float64Array(nv);
  const logCeilCv = new Float64Array(nv);
  const lfb = Math.log10(fb);
  for (let i = 0; i < nv; i++) {
    const zk = d.z[valid[i]];
    logCeil[i] = lfb + ceil.log10HaloMassAtQuantile(zk);
    // σ_dm is evaluated once, at the galaxy's nominal z (it changes slowly with z across the slice).
    logCeilCv[i] = lfb + ceil.log10HaloMassAtQuantileCv(zk, sigmaDm);
  }
  const headline = g.imfRef && choices.imfs.includes(g.imfRef) ? g.imfRef : choices.imfs[0];
  const imfs = g.imfRef && !choices.imfs.includes(g.imfRef) ? [g.imfRef, ...choices.imfs] : [...choices.imfs];
  const imfResults: Record<string, ImfResult> = {};
  let eddington = { slope_alpha: 0, sigma_dex: 0, shift_dex: 0, method: '' };
  let headlineLogM = Number.NaN;
  const tableOf = (imf: string): MassToLightTable => ctx.cache.table(imf, g.z, ctx.sfh);
  const refTable = g.imfRef ? tableOf(g.imfRef) : undefined;
  const { x: gx, y: gy, base } = drawGrid(g, d, valid, tableOf(imfs[0]), refTable);
  for (const imf of imfs) {
    const tab = tableOf(imf);
    // Everything in log10: quantiles commute with the monotonic map, so no power of ten per draw.
    const lm = new Float64Array(nv);
    const leps = new Float64Array(nv);
    const lepsCv = new Float64Array(nv);
    let over = 0;
    let strained = 0;
    const lRef = Math.log10(choices.epsRef);
    for (let i = 0; i < nv; i++) {
      const v = base[i] + tab.logMassToLightAt(gx[i], gy[i]);
      lm[i] = v;
      const e = v - logCeil[i];
      leps[i] = e;
      lepsCv[i] = v - logCeilCv[i];
      if (e > 0) over++;
      if (e > lRef) strained++;
    }
    const [lm16, lmMed, lm84] = quantilesBySelection(lm, [0.16, 0.5, 0.84]);
    const [le05, leMed, le95] = quantilesBySelection(leps, [0.05, 0.5, 0.95]);
    const med = 10 ** leMed;
    const medCv = 10 ** quantilesBySelection(lepsCv, [0.5])[0];
    // Eddington bias: with dn/dlog M ∝ M^−α near the host mass and Gaussian log-mass errors σ, the
    // true mass is lower on average by α σ² ln10 dex (Eddington 1913, MNRAS 73, 359; the posterior mean
    // of a Gaussian error on a power-law prior). Host mass: M⋆/(f_b ε) with ε = median ε_req in [ε_ref, 1].
    const sigmaDex = g.log10Mstar !== undefined ? g.log10MstarErr : 0.4 * g.magErr;
    const epsHost = Math.min(1, Math.max(med, choices.epsRef));
    const mHost = Math.min(Math.max(10 ** lmMed / (fb * epsHost), 1e3), 1e18);
    const alpha = -Math.log(halo.dndlnM(mHost * 1.1, g.z) / halo.dndlnM(mHost / 1.1, g.z)) / Math.log(1.21);
    const shift = alpha * sigmaDex * sigmaDex * Math.LN10;
    if (imf === headline) {
      eddington = {
        slope_alpha: alpha,
        sigma_dex: sigmaDex,
        shift_dex: shift,
        method: `dn/dlnM ∝ M^−α at the host mass M⋆/(f_b ε), ε = the median ε_req clamped to [ε_ref, 1], α from the ${halo.model.label} mass function at z = ${g.z}; measured log M* lowered by α σ² ln10`,
      };
      headlineLogM = lmMed;
    }
    imfResults[imf] = {
      verdict: verdictFor(med, choices.epsRef),
      log_mstar_median: lmMed,
      log_mstar_p16: lm16,
      log_mstar_p84: lm84,
      eps_required_median: med,
      eps_required_p05: 10 ** le05,
      eps_required_p95: 10 ** le95,
      p_over_budget: over / nv,
      p_strained: strained / nv,
      eps_required_median_debiased: med * 10 ** -shift,
      eps_required_median_cv: medCv,
      verdict_cv: verdictFor(medCv, choices.epsRef),
    };
  }
  // Redshift checks, for the attribution of a strained or over-budget headline verdict: the same
  // draws with z fixed at the alternative solution and at the lower bound of the interval.
  const redshiftChecks: GalaxyAudit['redshift_checks'] = [];
  const fixedChecks: [number, 'z_alt' | 'z_lo', boolean][] = [];
  const needsAttribution = imfResults[headline].verdict !== 'within budget';
  if (needsAttribution && g.zAlt !== undefined) fixedChecks.push([g.zAlt, 'z_alt', true]);
  if (needsAttribution && g.zLo !== undefined && g.zLo < g.z) fixedChecks.push([Math.max(g.zLo, 0.05), 'z_lo', false]);
  for (const [zf, kind, isAlt] of fixedChecks) {
    const df = drawGalaxy(g, Math.min(n, 2000), seed, halo.background, { z: zf, alt: isAlt });
    const okDraws = validDraws(g, df);
    if (!okDraws.length) {
      notes.push(`at ${kind} = ${zf} the band falls outside the model's rest range; that solution was not evaluated`);
      continue;
    }
    const lc = lfb + ceil.log10HaloMassAtQuantile(zf);
    const head = tableOf(headline);
    const cell = drawGrid(g, df, okDraws, head, refTable);
    const eps = cell.base.map((b, i) => 10 ** (b + head.logMassToLightAt(cell.x[i], cell.y[i]) - lc));
    const med = quantilesBySelection(eps, [0.5])[0];
    redshiftChecks.push({ z: zf, kind, eps_required_median: med, verdict: verdictFor(med, choices.epsRef) });
  }
  const h = imfResults[headline];
  const attribution: Attribution[] = [];
  if (needsAttribution) {
    const cleared = imfs.filter((i) => imfResults[i].verdict === 'within budget');
    if (!cleared.length) attribution.push('holds under every IMF');
    if (cleared.some((i) => isTopHeavy(i))) attribution.push('IMF-driven');
    if (redshiftChecks.some((r) => r.verdict === 'within budget')) attribution.push('redshift-driven');
    if (h.verdict_cv === 'within budget') attribution.push('volume-driven');
  }
  const mCeil = ceil.haloMassAtQuantile(g.z);
  const bg = halo.background;
  let timeBudget: GalaxyAudit['time_budget'] = null;
  if (g.z < choices.formationZ) {
    const dtYr = (bg.ageGyr(g.z) - bg.ageGyr(choices.formationZ)) * 1e9;
    const sfr = 10 ** headlineLogM / dtYr;
    const inflow = fb * meanAccretionRateMsunYr(mCeil, g.z, halo.options.cosmology.omegaM, bg.omegaDE);
    timeBudget = { formation_z: choices.formationZ, sfr_needed_msun_yr: sfr, inflow_max_msun_yr: inflow, ratio: sfr / inflow };
  } else notes.push(`z = ${g.z} is not below the formation redshift ${choices.formationZ}: no time budget`);
  const [s0, s1] = ceil.sliceLimits(g.z);
  return {
    headline_imf: headline,
    verdict: h.verdict,
    attribution,
    imf: imfResults,
    ceiling: {
      slice_z_min: s0,
      slice_z_max: s1,
      halo_mass_at_quantile_msun: mCeil,
      halo_mass_at_quantile_cv_msun: ceil.haloMassAtQuantileCv(g.z, sigmaDm),
      stellar_ceiling_msun: fb * mCeil,
      sigma_dm: sigmaDm,
      bias_smt01: halo.bias(mCeil, g.z, 'smt01'),
    },
    eddington,
    time_budget: timeBudget,
    redshift_checks: redshiftChecks,
    draws_used: valid.length,
    draws_excluded: d.excluded,
    notes,
  };
}
