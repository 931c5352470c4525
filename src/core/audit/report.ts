import { csvLine, escapeMarkdown as md } from './output-safety.js';
import type { AuditResult, GalaxyRow } from './run-audit.js';

const fmtE = (x: number): string => (x >= 999 ? '> 999' : x >= 10 ? x.toFixed(0) : x >= 0.1 ? x.toFixed(2) : x.toExponential(1));

/** The CSV's columns: the per-IMF blocks and the echoed input columns, fixed before the first row. */
export interface CsvLayout {
  readonly imfs: readonly string[];
  readonly inputColumns: readonly string[];
}

const CSV_FIXED = ['row', 'lines', 'line_end', 'id', 'status', 'errors', 'verdict', 'attribution', 'headline_imf', 'halo_mass_at_quantile_msun'];
const CSV_PER_IMF = ['verdict', 'log_mstar_median', 'eps_required_median', 'eps_required_p05', 'p_over_budget', 'p_strained'] as const;

/** The compared IMFs first, then any imf_ref that is not among them, in order of appearance. */
export function csvLayoutOf(comparedImfs: readonly string[], galaxyImfs: Iterable<string>, inputColumns: Iterable<string>): CsvLayout {
  return { imfs: [...new Set([...comparedImfs, ...galaxyImfs])], inputColumns: [...new Set(inputColumns)] };
}

export function auditCsvHeader(l: CsvLayout): string {
  return csvLine([...CSV_FIXED, ...l.imfs.flatMap((i) => CSV_PER_IMF.map((k) => `${i}_${k}`)), ...l.inputColumns.map((c) => `in_${c}`)]);
}

/** Problems with the file as a whole, as rows of their own (status "file error" / "file warning"), so a CSV reader sees them. */
export function auditCsvFileRows(l: CsvLayout, fileErrors: readonly string[], fileWarnings: readonly string[]): string[] {
  const width = CSV_FIXED.length + l.imfs.length * CSV_PER_IMF.length + l.inputColumns.length;
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
    g.headline_imf ?? '',
    g.ceiling?.halo_mass_at_quantile_msun,
  ];
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

function galaxyParagraph(g: GalaxyRow, r: AuditResult): string {
  const c = r.record.choices;
  if (g.status === 'rejected') return `**${g.id ? md(g.id) : `row ${g.row}`}** — not audited: ${g.errors.map((e) => `${md(e.column)}: ${md(e.reason)}`).join('; ')}.`;
  const h = g.imf![g.headline_imf!];
  const others = Object.entries(g.imf!)
    .filter(([k]) => k !== g.headline_imf)
    .map(([k, v]) => `${md(k)} ${fmtE(v.eps_required_median)} (${v.verdict})`)
    .join(', ');
  const attr = g.attribution!.length ? ` The tension is ${g.attribution!.join(', ')}.` : '';
  const rz = g.redshift_checks!.map((x) => `at ${x.kind} = ${x.z} it needs ε ≈ ${fmtE(x.eps_required_median)}`).join('; ');
  return (
    `**${md(g.id)}** (z = ${md(g.input.z)}) — **${g.verdict}** under ${md(g.headline_imf!)}: log M* = ${h.log_mstar_median.toFixed(2)} ` +
    `(16–84%: ${h.log_mstar_p16.toFixed(2)}–${h.log_mstar_p84.toFixed(2)}) needs a star-formation efficiency ε ≈ ${fmtE(h.eps_required_median)} ` +
    `(5th percentile ${fmtE(h.eps_required_p05)}) of the baryons in the most massive halo expected at the ${(c.quantile * 100).toFixed(1)}% level ` +
    `in its slice ${g.ceiling!.slice_z_min.toFixed(2)} < z < ${g.ceiling!.slice_z_max.toFixed(2)} (M_halo = ${g.ceiling!.halo_mass_at_quantile_msun.toExponential(2)} Msun); ` +
    `P(ε > 1) = ${h.p_over_budget.toFixed(2)}, P(ε > ${c.epsRef}) = ${h.p_strained.toFixed(2)}. ` +
    `Other IMFs: ${others || 'none'}. Corrected for Eddington bias ε ≈ ${fmtE(h.eps_required_median_debiased)}; with cosmic variance ε ≈ ${fmtE(h.eps_required_median_cv)}.` +
    (rz ? ` Redshift checks: ${rz}.` : '') +
    attr +
    (g.notes!.length ? ` Notes: ${g.notes!.map(md).join('; ')}.` : '')
  );
}

/** A plain-language summary for a referee report: assumptions, one paragraph per galaxy, the sample, the caution. */
export function auditMarkdown(r: AuditResult): string {
  const c = r.record.choices;
  const lines: string[] = [];
  lines.push('# Baryon budget audit', '');
  lines.push(
    `Assumptions: ${c.massFunction} halo mass function, ${c.transfer.kind} linear power, H0 = ${c.cosmology.h0}, Ωm = ${c.cosmology.omegaM}, ` +
      `Ωb = ${c.cosmology.omegaB.toFixed(5)} (f_b = ${(c.cosmology.omegaB / c.cosmology.omegaM).toFixed(4)}), σ8 = ${c.cosmology.sigma8}; ` +
      `survey ${md(c.survey.name)}: ${c.survey.areaArcmin2} arcmin², ${c.survey.zMin} < z < ${c.survey.zMax}; redshift slices of Δz = ${c.sliceDz}; ` +
      `rarest-halo quantile ${c.quantile}; ε_ref = ${c.epsRef}; SFH ${md(c.sfh)}; IMFs ${c.imfs.map(md).join(', ')}; ${c.draws} Monte Carlo draws, seed ${c.seed}.`,
    '',
  );
  const fe = r.sample.file_errors;
  const fw = r.sample.file_warnings ?? [];
  if (fe.length || fw.length) {
    lines.push('## The sample file', '');
    for (const m of fe) lines.push(`- **Error:** ${md(m)}`);
    for (const m of fw) lines.push(`- Warning: ${md(m)}`);
    lines.push('');
  }
  lines.push('## Galaxies', '');
  for (const g of r.galaxies) lines.push(galaxyParagraph(g, r), '');
  lines.push('## Sample', '');
  for (const b of r.sample.bins) {
    lines.push(
      `In ${b.z_min} < z < ${b.z_max} (${b.volume_mpc3.toExponential(3)} Mpc³, ${b.galaxies} galaxies) the cumulative stellar mass density requires ε ≥ ${fmtE(b.eps_required_rho)} ` +
        `and the number density ε ≥ ${fmtE(b.eps_required_n)}${b.eps_required_rho > 1 ? ' — more than all the baryons in the haloes ΛCDM predicts there' : b.eps_required_rho > c.epsRef ? ` — above the reference ε = ${c.epsRef}` : ''}.`,
      '',
    );
  }
  lines.push(`${r.sample.accepted} rows audited, ${r.sample.rejected} rejected.`, '', `*Caution:* ${r.caution}`, '');
  return lines.join('\n');
}
