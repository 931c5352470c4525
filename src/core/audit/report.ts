import Papa from 'papaparse';
import type { AuditResult, GalaxyRow } from './run-audit.js';

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
      halo_mass_at_quantile_msun: g.ceiling?.halo_mass_at_quantile_msun ?? '',
    };
    for (const i of imfs) {
      const x = g.imf?.[i];
      o[`${i}_verdict`] = x?.verdict ?? '';
      o[`${i}_log_mstar_median`] = x?.log_mstar_median ?? '';
      o[`${i}_eps_required_median`] = x?.eps_required_median ?? '';
      o[`${i}_eps_required_p05`] = x?.eps_required_p05 ?? '';
      o[`${i}_p_over_budget`] = x?.p_over_budget ?? '';
      o[`${i}_p_strained`] = x?.p_strained ?? '';
    }
    for (const c of inputCols) o[`in_${c}`] = g.input[c] ?? '';
    return o;
  });
  return Papa.unparse(rows, { newline: '\n' });
}

function galaxyParagraph(g: GalaxyRow, r: AuditResult): string {
  const c = r.record.choices;
  if (g.status === 'rejected') return `**${g.id || `row ${g.row}`}** — not audited: ${g.errors.map((e) => `${e.column}: ${e.reason}`).join('; ')}.`;
  const h = g.imf![g.headline_imf!];
  const others = Object.entries(g.imf!)
    .filter(([k]) => k !== g.headline_imf)
    .map(([k, v]) => `${k} ${fmtE(v.eps_required_median)} (${v.verdict})`)
    .join(', ');
  const attr = g.attribution!.length ? ` The tension is ${g.attribution!.join(', ')}.` : '';
  const rz = g.redshift_checks!.map((x) => `at ${x.kind} = ${x.z} it needs ε ≈ ${fmtE(x.eps_required_median)}`).join('; ');
  return (
    `**${g.id}** (z = ${g.input.z}) — **${g.verdict}** under ${g.headline_imf}: log M* = ${h.log_mstar_median.toFixed(2)} ` +
    `(16–84%: ${h.log_mstar_p16.toFixed(2)}–${h.log_mstar_p84.toFixed(2)}) needs a star-formation efficiency ε ≈ ${fmtE(h.eps_required_median)} ` +
    `(5th percentile ${fmtE(h.eps_required_p05)}) of the baryons in the most massive halo expected at the ${(c.quantile * 100).toFixed(1)}% level ` +
    `in its slice ${g.ceiling!.slice_z_min.toFixed(2)} < z < ${g.ceiling!.slice_z_max.toFixed(2)} (M_halo = ${g.ceiling!.halo_mass_at_quantile_msun.toExponential(2)} Msun); ` +
    `P(ε > 1) = ${h.p_over_budget.toFixed(2)}, P(ε > ${c.epsRef}) = ${h.p_strained.toFixed(2)}. ` +
    `Other IMFs: ${others || 'none'}. Corrected for Eddington bias ε ≈ ${fmtE(h.eps_required_median_debiased)}; with cosmic variance ε ≈ ${fmtE(h.eps_required_median_cv)}.` +
    (rz ? ` Redshift checks: ${rz}.` : '') +
    attr +
    (g.notes!.length ? ` Notes: ${g.notes!.join('; ')}.` : '')
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
      `survey ${c.survey.name}: ${c.survey.areaArcmin2} arcmin², ${c.survey.zMin} < z < ${c.survey.zMax}; redshift slices of Δz = ${c.sliceDz}; ` +
      `rarest-halo quantile ${c.quantile}; ε_ref = ${c.epsRef}; SFH ${c.sfh}; IMFs ${c.imfs.join(', ')}; ${c.draws} Monte Carlo draws, seed ${c.seed}.`,
    '',
  );
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
