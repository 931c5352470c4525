import { PRESETS } from '../cosmology/presets.js';
import type { AuditChoices } from './choices.js';
import { CITATIONS, citeInText, referencesFor } from './citations.js';
import { csvLine, escapeMarkdown as md } from './output-safety.js';
import type { AuditResult, GalaxyRow } from './run-audit.js';
import type { BinBudget } from './sample-budget.js';
import type { Reconciliation } from './reconcile.js';
import { verdictFor } from './verdict.js';
import { drawRuleText } from './draw-rule.js';

/** How the report names a method: our citation table's text as it is; anything user-given (a custom IMF) escaped. */
const citeSafe = (name: string): string => (CITATIONS[name] ? CITATIONS[name].inText : md(citeInText(name)));

const fmtE = (x: number): string => (x >= 999 ? '> 999' : x >= 10 ? x.toFixed(0) : x >= 0.1 ? x.toFixed(2) : x.toExponential(1));

/** The CSV's columns: the per-IMF blocks and the echoed input columns, fixed before the first row. */
export interface CsvLayout {
  readonly imfs: readonly string[];
  readonly inputColumns: readonly string[];
}

const CSV_FIXED = ['row', 'lines', 'line_end', 'id', 'status', 'errors', 'verdict', 'attribution', 'attribution_detail', 'headline_imf', 'halo_mass_at_quantile_msun', 'log_mass_cosmo_sd_dex', 'eddington_shift_dex', 'time_budget_ratio', 'time_budget_p_ratio_over_1', 'formed_mass_msun', 'accreted_baryons_msun', 'draws_made', 'draws_used', 'draws_stop', 'mc_error_log_mstar_median_dex', 'mc_error_log_eps_required_median_dex', 'p_verdict_change'];
/** What it would take, for ε = 1 and ε_ref (empty for galaxies within budget). */
const CSV_RECONCILE = ['z_max', 'imf_slope_max', 'sigma8_min', 'power_boost_min', 'area_min_arcmin2', 'expected_hosts', 'notes'] as const;
const RECONCILE_COLUMNS = ['eps1', 'eps_ref'].flatMap((t) => CSV_RECONCILE.map((k) => `reconcile_${t}_${k}`));
const CSV_PER_IMF = ['verdict', 'log_mstar_median', 'eps_required_median', 'eps_required_p05', 'p_over_budget', 'p_strained', 'p_over_budget_cosmo', 'eps_required_median_debiased', 'time_budget_ratio_median', 'p_time_budget_over'] as const;

/** The compared IMFs first, then any imf_ref that is not among them, in order of appearance. */
export function csvLayoutOf(comparedImfs: readonly string[], galaxyImfs: Iterable<string>, inputColumns: Iterable<string>): CsvLayout {
  return { imfs: [...new Set([...comparedImfs, ...galaxyImfs])], inputColumns: [...new Set(inputColumns)] };
}

export function auditCsvHeader(l: CsvLayout): string {
  return csvLine([...CSV_FIXED, ...RECONCILE_COLUMNS, ...l.imfs.flatMap((i) => CSV_PER_IMF.map((k) => `${i}_${k}`)), ...l.inputColumns.map((c) => `in_${c}`)]);
}

/** Problems with the file as a whole, as rows of their own (status "file error" / "file warning"), so a CSV reader sees them. */
export function auditCsvFileRows(l: CsvLayout, fileErrors: readonly string[], fileWarnings: readonly string[]): string[] {
  const width = CSV_FIXED.length + RECONCILE_COLUMNS.length + l.imfs.length * CSV_PER_IMF.length + l.inputColumns.length;
  const row = (status: string, msg: string): string => csvLine(['', '', '', '', status, msg, ...new Array<string>(width - 6).fill('')]);
  return [...fileErrors.map((m) => row('file error', m)), ...fileWarnings.map((m) => row('file warning', m))];
}

/** One galaxy as one CSV line: identity, verdicts, per-IMF numbers, then every input column echoed (in_<name>). */
export function auditCsvRow(g: GalaxyRow, l: CsvLayout): string {
  const cells: (string | number | undefined)[] = [
    g.row,
    g.lines ? `${g.lines[0]}-${g.lines[1]}` : '',
    g.line_end,
    g.id,
    g.status,
    g.errors.map((e) => `row ${e.row}, ${e.column}: ${e.reason}`).join(' | '),
    g.verdict ?? '',
    (g.attribution ?? []).join('; '),
    (g.attribution_detail ?? []).map((d) => `${d.cause} via ${d.via} → ${d.verdict_after}`).join('; '),
    g.headline_imf ?? '',
    g.ceiling?.halo_mass_at_quantile_msun,
    g.ceiling?.log_mass_cosmo_sd_dex,
    g.eddington?.shift_dex,
    g.time_budget?.ratio,
    g.time_budget?.p_ratio_over_1,
    g.time_budget?.formed_mass_msun,
    g.time_budget?.accreted_baryons_msun,
    g.monte_carlo?.draws_made,
    g.draws_used,
    g.monte_carlo?.stop ?? '',
    g.monte_carlo?.log_mstar_median_mc_error_dex,
    g.monte_carlo?.log_eps_required_median_mc_error_dex,
    g.monte_carlo?.p_verdict_change,
  ];
  for (const target of ['eps1', 'eps_ref']) {
    const rc = (g.reconcile ?? []).find((x) => (target === 'eps1' ? x.eps === 1 : x.eps !== 1)) ?? (target === 'eps_ref' ? (g.reconcile ?? [])[0] : undefined);
    cells.push(rc?.z_max ?? '', rc?.imf_slope_max ?? '', rc?.sigma8_min ?? '', rc?.power_boost_min ?? '', rc?.area_min_arcmin2 ?? '', rc?.expected_hosts, rc ? Object.entries(rc.reasons).map(([a, t]) => `${a}: ${t}`).join('; ') : '');
  }
  for (const i of l.imfs) {
    const x = g.imf?.[i];
    for (const k of CSV_PER_IMF) cells.push(x?.[k]);
  }
  for (const c of l.inputColumns) cells.push(g.input[c] ?? '');
  return csvLine(cells);
}

/** The whole CSV (the page's download; the CLI writes the same lines one by one). */
export function auditCsv(r: AuditResult): string {
  const l = csvLayoutOf(r.record.choices.imfs, r.galaxies.flatMap((g) => (g.imf ? Object.keys(g.imf) : [])), r.galaxies.flatMap((g) => Object.keys(g.input)));
  return [auditCsvHeader(l), ...auditCsvFileRows(l, r.sample.file_errors, r.sample.file_warnings ?? []), ...r.galaxies.map((g) => auditCsvRow(g, l))].join('\n');
}

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
  if (imf.length) clauses.push(`another IMF (${imf.map((x) => `${citeSafe(x.via)}: ${x.verdict_after}`).join('; ')})`);
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

function galaxyParagraph(g: GalaxyRow, c: AuditChoices): string {
  if (g.status === 'rejected') return `**${g.id ? md(g.id) : `row ${g.row}`}**: not audited. ${g.errors.map((e) => `${md(e.column)}: ${md(e.reason)}`).join('; ')}.`;
  const h = g.imf![g.headline_imf!];
  const others = Object.entries(g.imf!)
    .filter(([k]) => k !== g.headline_imf)
    .map(([k, v]) => `${citeSafe(k)} ε ≈ ${fmtE(v.eps_required_median)} (${v.verdict})`)
    .join(', ');
  const rz = g.redshift_checks!.map((x) => `at ${x.kind} = ${x.z} it needs ε ≈ ${fmtE(x.eps_required_median)} (${x.verdict})`).join('; ');
  return (
    `**${md(g.id)}** (z = ${md(g.input.z)}) is **${g.verdict}** under ${citeSafe(g.headline_imf!)}, the headline IMF. Its log M* = ${h.log_mstar_median.toFixed(2)} ` +
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
    (g.notes!.length ? ` Notes: ${g.notes!.map(md).join('; ')}.` : '')
  );
}

/** The sample line of one bin, judged like the galaxies: the k most massive at the run's quantile q. */
export function sampleSentence(b: BinBudget, c: AuditChoices): string {
  const head = `In ${b.z_min} < z < ${b.z_max} (${b.volume_mpc3.toExponential(3)} Mpc³, ${b.galaxies} ${b.galaxies === 1 ? 'galaxy' : 'galaxies'})`;
  if (!b.points.length) return `${head} no galaxy was audited.`;
  const worst = b.points.reduce((a, p) => (p.eps_required_q > a.eps_required_q ? p : a));
  const v = verdictFor(worst.eps_required_q, c.epsRef);
  const who = worst.count === 1 ? `its most massive galaxy (${md(worst.id)})` : `its ${worst.count} most massive galaxies (down to ${md(worst.id)})`;
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
  return [markdownHead(c, r.sample.file_errors, r.sample.file_warnings ?? []), ...r.galaxies.map((g) => markdownGalaxy(g, c)), markdownTail(r.sample, c, r.caution)].join('');
}

/** The summary's head: the title, the assumptions, the sample file's errors and warnings, and the galaxies' heading. */
export function markdownHead(c: AuditChoices, fileErrors: readonly string[], fileWarnings: readonly string[]): string {
  const lines: string[] = [];
  lines.push('# Baryon budget audit', '');
  const preset = presetName(c);
  lines.push(
    `Assumptions: the ${citeInText(c.massFunction)} halo mass function with the ${citeInText(c.transfer.kind)} linear power spectrum; ` +
      `${preset ? `the ${citeInText(preset)} cosmology, ` : ''}H0 = ${c.cosmology.h0}, Ωm = ${c.cosmology.omegaM}, ` +
      `Ωb = ${c.cosmology.omegaB.toFixed(5)} (f_b = ${(c.cosmology.omegaB / c.cosmology.omegaM).toFixed(4)}), σ8 = ${c.cosmology.sigma8}; ` +
      `survey ${md(c.survey.name)}: ${c.survey.areaArcmin2} arcmin², ${c.survey.zMin} < z < ${c.survey.zMax}; redshift slices of Δz = ${c.sliceDz}; ` +
      `rarest-halo quantile ${c.quantile} (extreme-value statistics, ${citeInText('evs')}); ε_ref = ${c.epsRef}; SFH ${md(c.sfh)}; ` +
      `IMFs ${c.imfs.map((i) => citeSafe(i)).join(', ')}; Monte Carlo draws, ${md(drawRuleText(c))}; seed ${c.seed}.`,
    '',
  );
  if (fileErrors.length || fileWarnings.length) {
    lines.push('## The sample file', '');
    for (const m of fileErrors) lines.push(`- **Error:** ${md(m)}`);
    for (const m of fileWarnings) lines.push(`- Warning: ${md(m)}`);
    lines.push('');
  }
  lines.push('## Galaxies', '');
  return `${lines.join('\n')}\n`;
}

/** One galaxy's paragraph of the summary, with the blank line after it. */
export function markdownGalaxy(g: GalaxyRow, c: AuditChoices): string {
  return `${galaxyParagraph(g, c)}\n\n`;
}

/** The summary's tail: the sample level, the counts, the caution and the references. */
export function markdownTail(sample: AuditResult['sample'], c: AuditChoices, caution: string): string {
  const lines: string[] = [];
  lines.push('## Sample', '');
  for (const b of sample.bins) lines.push(sampleSentence(b, c), '');
  lines.push(`${sample.accepted} ${sample.accepted === 1 ? 'row was' : 'rows were'} audited and ${sample.rejected} rejected.`, '', `*Caution:* ${caution}`, '');
  lines.push('## References', '');
  for (const ref of referencesFor(c, presetName(c))) lines.push(`- ${ref}`);
  lines.push('');
  return lines.join('\n');
}
