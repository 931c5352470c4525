import Papa from 'papaparse';
import { PRESETS } from '../cosmology/presets.js';
import type { AuditChoices } from './choices.js';
import { citeInText, referencesFor } from './citations.js';
import type { AuditResult, GalaxyRow } from './run-audit.js';
import type { BinBudget } from './sample-budget.js';
import type { Reconciliation } from './reconcile.js';
import { verdictFor } from './verdict.js';

const fmtE = (x: number): string => (x >= 999 ? '> 999' : x >= 10 ? x.toFixed(0) : x >= 0.1 ? x.toFixed(2) : x.toExponential(1));

/** One CSV row per galaxy: identity, verdicts, per-IMF numbers, then every input column echoed (prefixed in_). */
export function auditCsv(r: AuditResult): string {
  const imfs = [...new Set(r.galaxies.flatMap((g) => (g.imf ? Object.keys(g.imf) : [])))];
  const inputCols = [...new Set(r.galaxies.flatMap((g) => Object.keys(g.input)))];
  const rows = r.galaxies.map((g) => {
    const o: Record<string, string | number> = {
      row: g.row,
      id: g.id,
      status: g.status,
      errors: g.errors.map((e) => `row ${e.row}, ${e.column}: ${e.reason}`).join(' | '),
      verdict: g.verdict ?? '',
      attribution: (g.attribution ?? []).join('; '),
      headline_imf: g.headline_imf ?? '',
      attribution_detail: (g.attribution_detail ?? []).map((d) => `${d.cause} via ${d.via} → ${d.verdict_after}`).join('; '),
      halo_mass_at_quantile_msun: g.ceiling?.halo_mass_at_quantile_msun ?? '',
      eddington_shift_dex: g.eddington?.shift_dex ?? '',
      time_budget_ratio: g.time_budget?.ratio ?? '',
      time_budget_p_ratio_over_1: g.time_budget?.p_ratio_over_1 ?? '',
      formed_mass_msun: g.time_budget?.formed_mass_msun ?? '',
      accreted_baryons_msun: g.time_budget?.accreted_baryons_msun ?? '',
    };
    for (const rc of g.reconcile ?? []) {
      const k = rc.eps === 1 ? 'eps1' : 'eps_ref';
      o[`reconcile_${k}_z_max`] = rc.z_max ?? '';
      o[`reconcile_${k}_imf_slope_max`] = rc.imf_slope_max ?? '';
      o[`reconcile_${k}_sigma8_min`] = rc.sigma8_min ?? '';
      o[`reconcile_${k}_power_boost_min`] = rc.power_boost_min ?? '';
      o[`reconcile_${k}_area_min_arcmin2`] = rc.area_min_arcmin2 ?? '';
      o[`reconcile_${k}_expected_hosts`] = rc.expected_hosts;
      o[`reconcile_${k}_notes`] = Object.entries(rc.reasons).map(([a, t]) => `${a}: ${t}`).join('; ');
    }
    for (const i of imfs) {
      const x = g.imf?.[i];
      o[`${i}_verdict`] = x?.verdict ?? '';
      o[`${i}_log_mstar_median`] = x?.log_mstar_median ?? '';
      o[`${i}_eps_required_median`] = x?.eps_required_median ?? '';
      o[`${i}_eps_required_p05`] = x?.eps_required_p05 ?? '';
      o[`${i}_p_over_budget`] = x?.p_over_budget ?? '';
      o[`${i}_p_strained`] = x?.p_strained ?? '';
      o[`${i}_eps_required_median_debiased`] = x?.eps_required_median_debiased ?? '';
      o[`${i}_time_budget_ratio_median`] = x?.time_budget_ratio_median ?? '';
      o[`${i}_p_time_budget_over`] = x?.p_time_budget_over ?? '';
    }
    for (const c of inputCols) o[`in_${c}`] = g.input[c] ?? '';
    return o;
  });
  return Papa.unparse(rows, { newline: '\n' });
}

const capitalise = (t: string): string => t.charAt(0).toUpperCase() + t.slice(1);

/** Which published preset the cosmology is, if any (for the reference list). */
function presetName(c: AuditChoices): string | undefined {
  return Object.entries(PRESETS).find(([, p]) => JSON.stringify(p) === JSON.stringify(c.cosmology))?.[0];
}

/** "What would lower its verdict": one clause per cause, from the attribution details. */
export function attributionSentence(g: GalaxyRow): string {
  const d = g.attribution_detail ?? [];
  if (!d.length) return '';
  if (d.length === 1 && d[0].cause === 'holds under every IMF') return ' No compared IMF lowers its verdict, nor does any other check.';
  const clauses: string[] = [];
  const imf = d.filter((x) => x.cause === 'IMF-driven');
  if (imf.length) clauses.push(`another IMF (${imf.map((x) => `${citeInText(x.via)}: ${x.verdict_after}`).join('; ')})`);
  for (const x of d.filter((y) => y.cause === 'redshift-driven')) clauses.push(`the other redshift (${x.via}: ${x.verdict_after})`);
  for (const x of d.filter((y) => y.cause === 'volume-driven')) clauses.push(`cosmic variance (${x.verdict_after})`);
  for (const x of d.filter((y) => y.cause === 'Eddington-driven')) clauses.push(`the Eddington correction, ${x.via} (${x.verdict_after})`);
  const holds = d.some((x) => x.cause === 'holds under every IMF') ? ' No compared IMF lowers it.' : '';
  return ` Its verdict would be lower with ${clauses.join('; with ')}.${holds}`;
}

function timeBudgetSentence(g: GalaxyRow): string {
  const t = g.time_budget;
  if (!t) return '';
  return (
    ` Time budget: it formed ${t.formed_mass_msun.toExponential(2)} Msun of stars while the ceiling halo accreted ${t.accreted_baryons_msun.toExponential(2)} Msun of baryons ` +
    `over the same time (ratio ${fmtE(t.ratio)}, P(ratio > 1) = ${t.p_ratio_over_1.toFixed(2)}).`
  );
}

const sig = (x: number, d = 2): string => Number(x.toPrecision(d)).toString();

/**
 * "It would fit … if any one of these held: …" for one reconciliation entry (our wording); for a
 * galaxy that already meets that ε, the limits within which it keeps meeting it.
 */
export function reconcileSentence(rc: Reconciliation, epsRef: number, epsMedian: number): string {
  const fits = epsMedian <= rc.eps;
  const goal = rc.eps === 1 ? 'within ΛCDM’s baryons (ε ≤ 1)' : `within the reference efficiency (ε ≤ ${epsRef})`;
  const hosts = `${sig(rc.expected_hosts)} such ${rc.expected_hosts === 1 ? 'host is' : 'hosts are'} expected in this field`;
  const parts: string[] = [];
  if (fits) {
    if (rc.z_max !== null && !rc.reasons.z_max) parts.push(`above z = ${rc.z_max.toFixed(2)}`);
    if (rc.sigma8_min !== null && !rc.reasons.sigma8_min) parts.push(`below σ8 = ${rc.sigma8_min.toFixed(3)}`);
    if (rc.area_min_arcmin2 !== null && !rc.reasons.area_min_arcmin2) parts.push(`in a field smaller than ${sig(rc.area_min_arcmin2, 3)} arcmin²`);
    return ` It fits ${goal} as it is${parts.length ? `, and would stop fitting ${parts.join(', ')}` : ''} (${hosts}).`;
  }
  if (rc.z_max !== null) parts.push(`z ≤ ${rc.z_max.toFixed(2)}`);
  if (rc.imf_slope_max !== null && !rc.reasons.imf_slope_max) parts.push(`an IMF slope above 0.5 Msun of ${rc.imf_slope_max.toFixed(2)} or flatter`);
  if (rc.sigma8_min !== null && rc.power_boost_min !== null) parts.push(`σ8 ≥ ${rc.sigma8_min.toFixed(3)}, i.e. ${rc.power_boost_min.toFixed(2)}× the power at its host's scale`);
  if (rc.area_min_arcmin2 !== null) parts.push(`a field of ≥ ${sig(rc.area_min_arcmin2, 3)} arcmin²`);
  if (!parts.length) return ` No single change searched would bring it ${goal}; ${hosts}.`;
  return ` It would fit ${goal} if any one of these held: ${parts.join('; ')} — ${hosts}.`;
}

function galaxyParagraph(g: GalaxyRow, r: AuditResult): string {
  const c = r.record.choices;
  if (g.status === 'rejected') return `**${g.id || `row ${g.row}`}**: not audited. ${g.errors.map((e) => `${e.column}: ${e.reason}`).join('; ')}.`;
  const h = g.imf![g.headline_imf!];
  const others = Object.entries(g.imf!)
    .filter(([k]) => k !== g.headline_imf)
    .map(([k, v]) => `${citeInText(k)} ε ≈ ${fmtE(v.eps_required_median)} (${v.verdict})`)
    .join(', ');
  const rz = g.redshift_checks!.map((x) => `at ${x.kind} = ${x.z} it needs ε ≈ ${fmtE(x.eps_required_median)} (${x.verdict})`).join('; ');
  return (
    `**${g.id}** (z = ${g.input.z}) is **${g.verdict}** under ${citeInText(g.headline_imf!)}, the headline IMF. Its log M* = ${h.log_mstar_median.toFixed(2)} ` +
    `(16–84%: ${h.log_mstar_p16.toFixed(2)}–${h.log_mstar_p84.toFixed(2)}) needs a star-formation efficiency ε ≈ ${fmtE(h.eps_required_median)} ` +
    `(5th percentile ${fmtE(h.eps_required_p05)}) of the baryons in the most massive halo expected at the ${(c.quantile * 100).toFixed(1)}% level ` +
    `in its slice ${g.ceiling!.slice_z_min.toFixed(2)} < z < ${g.ceiling!.slice_z_max.toFixed(2)} (M_halo = ${g.ceiling!.halo_mass_at_quantile_msun.toExponential(2)} Msun); ` +
    `P(ε > 1) = ${h.p_over_budget.toFixed(2)} and P(ε > ${c.epsRef}) = ${h.p_strained.toFixed(2)}.` +
    (others ? ` Under the other IMFs: ${others}.` : '') +
    ` Corrected for Eddington bias (log M* lowered by ${g.eddington!.shift_dex.toFixed(2)} dex) it needs ε ≈ ${fmtE(h.eps_required_median_debiased)}; with cosmic variance, ε ≈ ${fmtE(h.eps_required_median_cv)}.` +
    timeBudgetSentence(g) +
    (rz ? ` Redshift checks: ${rz}.` : '') +
    attributionSentence(g) +
    (g.reconcile ?? []).map((rc) => reconcileSentence(rc, c.epsRef, h.eps_required_median)).join('') +
    (g.notes!.length ? ` Notes: ${g.notes!.join('; ')}.` : '')
  );
}

/** The sample line of one bin, judged like the galaxies: the k most massive at the run's quantile q. */
export function sampleSentence(b: BinBudget, c: AuditChoices): string {
  const head = `In ${b.z_min} < z < ${b.z_max} (${b.volume_mpc3.toExponential(3)} Mpc³, ${b.galaxies} ${b.galaxies === 1 ? 'galaxy' : 'galaxies'})`;
  if (!b.points.length) return `${head} no galaxy was audited.`;
  const worst = b.points.reduce((a, p) => (p.eps_required_q > a.eps_required_q ? p : a));
  const v = verdictFor(worst.eps_required_q, c.epsRef);
  const who = worst.count === 1 ? `its most massive galaxy (${worst.id})` : `its ${worst.count} most massive galaxies (down to ${worst.id})`;
  const verdictWords =
    v === 'over budget' ? 'more than all the baryons of the haloes ΛCDM predicts there: over budget' : v === 'strained' ? `above the reference ε = ${c.epsRef}: strained` : 'within budget';
  return (
    `${head}, judged like the galaxies at the ${(c.quantile * 100).toFixed(1)}% level, ${who} need${worst.count === 1 ? 's' : ''} ε ≥ ${fmtE(worst.eps_required_q)}, ${verdictWords}. ` +
    `At ε = 1, ΛCDM expects ${worst.expected_hosts_eps1.toPrecision(2)} haloes there able to host ${worst.count === 1 ? 'it' : `the ${ordinal(worst.count)}`}, ` +
    `and P(N ≥ ${worst.count}) = ${worst.p_chance_eps1.toPrecision(2)}. ` +
    `(The point estimates of the cumulative mass and number densities would need ε ≥ ${fmtE(b.eps_required_rho)} and ${fmtE(b.eps_required_n)}; they compare densities with mean expectations, not with the rarest haloes, and are not the verdict.)`
  );
}

function ordinal(k: number): string {
  const s = k % 100 >= 11 && k % 100 <= 13 ? 'th' : ({ 1: 'st', 2: 'nd', 3: 'rd' } as Record<number, string>)[k % 10] ?? 'th';
  return `${k}${s}`;
}

/** A plain-language summary for a referee report: assumptions, one paragraph per galaxy, the sample, the caution, the references. */
export function auditMarkdown(r: AuditResult): string {
  const c = r.record.choices;
  const lines: string[] = [];
  lines.push('# Baryon budget audit', '');
  const preset = presetName(c);
  lines.push(
    `Assumptions: the ${citeInText(c.massFunction)} halo mass function with the ${citeInText(c.transfer.kind)} linear power spectrum; ` +
      `${preset ? `the ${citeInText(preset)} cosmology, ` : ''}H0 = ${c.cosmology.h0}, Ωm = ${c.cosmology.omegaM}, ` +
      `Ωb = ${c.cosmology.omegaB.toFixed(5)} (f_b = ${(c.cosmology.omegaB / c.cosmology.omegaM).toFixed(4)}), σ8 = ${c.cosmology.sigma8}; ` +
      `survey ${c.survey.name}: ${c.survey.areaArcmin2} arcmin², ${c.survey.zMin} < z < ${c.survey.zMax}; redshift slices of Δz = ${c.sliceDz}; ` +
      `rarest-halo quantile ${c.quantile} (extreme-value statistics, ${citeInText('evs')}); ε_ref = ${c.epsRef}; SFH ${c.sfh}; ` +
      `IMFs ${c.imfs.map(citeInText).join(', ')}; ${c.draws} Monte Carlo draws, seed ${c.seed}.`,
    '',
  );
  lines.push('## Galaxies', '');
  for (const g of r.galaxies) lines.push(galaxyParagraph(g, r), '');
  lines.push('## Sample', '');
  for (const b of r.sample.bins) lines.push(sampleSentence(b, c), '');
  lines.push(`${r.sample.accepted} ${r.sample.accepted === 1 ? 'row was' : 'rows were'} audited and ${r.sample.rejected} rejected.`, '', `*Caution:* ${r.caution}`, '');
  lines.push('## References', '');
  for (const ref of referencesFor(c, preset)) lines.push(`- ${ref}`);
  lines.push('');
  return lines.join('\n');
}
