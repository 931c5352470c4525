import { quantilesBySelection } from '../numeric/select.js';
import type { HaloModel } from '../halos/halo-model.js';
import type { MassToLightTable } from '../stars/mass-to-light.js';
import { eddingtonFirstOrderShiftDex, eddingtonPosterior } from './eddington.js';
import { logSurvivingAt } from './time-budget.js';
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
function hostPrior(e: EddingtonInputs, eps: number): (x: number) => number {
  const fb = e.halo.baryonFraction;
  const lm = e.halo.table.log10M;
  const lo = lm[0];
  const hi = lm[lm.length - 1];
  return (x) => {
    const lh = x - Math.log10(fb * eps);
    if (!(lh > lo && lh < hi)) return Number.NEGATIVE_INFINITY;
    return Math.log(e.halo.dndlnM(10 ** lh, e.z));
  };
}

/** Local slope α of dn/dlnM ∝ M^−α at M (centred difference over ±0.041 dex). */
function localSlope(halo: HaloModel, m: number, z: number): number {
  const a = -Math.log(halo.dndlnM(m * 1.1, z) / halo.dndlnM(m / 1.1, z)) / Math.log(1.21);
  if (!Number.isFinite(a)) {
    throw new RangeError(`the host halo M*/(f_b ε) ≈ ${m.toExponential(1)} Msun lies where the ${halo.model.label} mass function vanishes at z = ${z}: ΛCDM has no such haloes, so the mass cannot be audited or debiased`);
  }
  return a;
}

/** The statistics of one IMF over the shared draws (everything in log10: quantiles commute with 10^x). */
export function imfStatistics(tab: MassToLightTable, d: SharedDraws, ed: EddingtonInputs, wantFormedMedian: boolean): ImfStatistics {
  const nv = d.n;
  const lm = new Float64Array(nv);
  const leps = new Float64Array(nv);
  const lepsCv = new Float64Array(nv);
  const acc = d.logAccretedBaryons;
  const lratio = acc ? new Float64Array(nv) : undefined;
  const lformed = acc && wantFormedMedian ? new Float64Array(nv) : undefined;
  let over = 0;
  let overCosmo = 0;
  let strained = 0;
  let tbOver = 0;
  const lRef = Math.log10(ed.epsRef);
  for (let i = 0; i < nv; i++) {
    const v = d.base[i] + tab.logMassToLightAt(d.gx[i], d.gy[i]);
    lm[i] = v;
    const e = v - d.logCeil[i];
    leps[i] = e;
    lepsCv[i] = v - d.logCeilCv[i];
    if (e > 0) over++;
    if (e > d.cosmoOffset[i]) overCosmo++;
    if (e > lRef) strained++;
    if (acc) {
      const f = v - logSurvivingAt(tab, d.gx[i]);
      const r = f - acc[i];
      lratio![i] = r;
      if (lformed) lformed[i] = f;
      if (r > 0) tbOver++;
    }
  }
  const [lm16, lmMed, lm84] = quantilesBySelection(lm, [0.16, 0.5, 0.84]);
  const [le05, leMed, le95] = quantilesBySelection(leps, [0.05, 0.5, 0.95]);
  const med = 10 ** leMed;
  const medCv = 10 ** quantilesBySelection(lepsCv, [0.5])[0];
  const epsHost = Math.min(1, Math.max(med, ed.epsRef));
  const shift = eddingtonPosterior(hostPrior(ed, epsHost), lmMed, ed.sigmaDex).shiftMedianDex;
  const mHost = Math.min(Math.max(10 ** lmMed / (ed.halo.baryonFraction * epsHost), 1e3), 1e18);
  const alpha = localSlope(ed.halo, mHost, ed.z);
  const debiased = med * 10 ** -shift;
  const ratioMed = lratio ? 10 ** quantilesBySelection(lratio, [0.5])[0] : undefined;
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
  };
  return {
    result,
    eddingtonSlopeAlpha: alpha,
    eddingtonFirstOrderDex: eddingtonFirstOrderShiftDex(alpha, ed.sigmaDex),
    formedMassMedianMsun: lformed ? 10 ** quantilesBySelection(lformed, [0.5])[0] : undefined,
  };
}
