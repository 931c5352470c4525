import { LitElement, css, html, nothing, unsafeCSS } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { AuditResult } from '../core/audit/index.js';
import { VERDICT_COLORS } from './palette.js';

/** CSS class for a verdict (colours come from the stylesheet: no inline styles under the page's CSP). */
const vClass = (v: string): string => (v === 'within budget' ? 'within' : v === 'strained' ? 'strained' : 'over');

const EXPLAIN: Record<string, string> = {
  'within budget': 'median ε_req ≤ ε_ref: ordinary efficiency suffices',
  strained: 'ε_ref < median ε_req ≤ 1: needs an unusually efficient conversion of baryons into stars',
  'over budget': 'median ε_req > 1: more stars than all the baryons of the rarest halo at the chosen quantile',
  'holds under every IMF': 'no IMF compared brings it within budget',
  'IMF-driven': 'a top-heavy IMF brings it within budget',
  'redshift-driven': 'at the alternative or lower redshift it is within budget',
  'volume-driven': 'within budget once cosmic variance is included',
};

const f2 = (x: number): string => (x >= 999 ? '>999' : x >= 10 ? x.toFixed(0) : x >= 0.01 ? x.toFixed(2) : x.toExponential(1));

/**
 * <results-table>: one row per galaxy with its verdict and attribution (explained on hover and focus),
 * and per IMF: log M*, ε_req with its 5–95% interval, P(ε > 1) and P(ε > ε_ref).
 * Fires `galaxy-select` (detail: { id }) when a row is chosen.
 */
@customElement('results-table')
export class ResultsTable extends LitElement {
  @property({ attribute: false }) result?: AuditResult;
  @property() selected = '';

  static styles = css`
    :host { display: block; overflow-x: auto; }
    table { border-collapse: collapse; font-size: 0.82rem; }
    th, td { border: 1px solid #ddd; padding: 0.2rem 0.35rem; text-align: right; white-space: nowrap; }
    th { background: #f3f3f3; }
    td.id, th.id { text-align: left; }
    tr.sel { background: #e6f1fa; }
    tr.rejected { color: #666; }
    .verdict { font-weight: 600; padding: 0 0.3rem; border-radius: 3px; color: #fff; }
    abbr { text-decoration: underline dotted; cursor: help; }
    abbr:focus { outline: 2px solid #0072B2; }
    .verdict.within { background: ${unsafeCSS(VERDICT_COLORS['within budget'])}; }
    .verdict.strained { background: ${unsafeCSS(VERDICT_COLORS.strained)}; color: #000; }
    .verdict.over { background: ${unsafeCSS(VERDICT_COLORS['over budget'])}; }
    .t-within { color: #00704f; } .t-strained { color: #8a5a00; } .t-over { color: #a33a00; font-weight: 600; }
    td.why { text-align: left; white-space: normal; }
    button.pick { font: inherit; border: 0; background: none; text-decoration: underline; cursor: pointer; padding: 0; }
  `;

  render() {
    const r = this.result;
    if (!r) return html`<p>No audit yet.</p>`;
    const imfs = [...new Set(r.galaxies.flatMap((g) => (g.imf ? Object.keys(g.imf) : [])))];
    const epsRef = r.record.choices.epsRef;
    return html`<table>
      <caption class="visually-hidden">Audit per galaxy</caption>
      <thead>
        <tr><th class="id" rowspan="2">galaxy</th><th rowspan="2">z</th><th rowspan="2">verdict</th><th rowspan="2">attribution</th>
          ${imfs.map((i) => html`<th colspan="4">${i}</th>`)}</tr>
        <tr>${imfs.map(() => html`<th><abbr tabindex="0" title="median log10 M* [Msun] (16–84%)">log M*</abbr></th><th><abbr tabindex="0" title="median ε_req (5–95%) against the rarest halo">ε_req</abbr></th><th><abbr tabindex="0" title="P(ε_req > 1)">P>1</abbr></th><th><abbr tabindex="0" title=${`P(ε_req > ε_ref = ${epsRef})`}>P>ε_ref</abbr></th>`)}</tr>
      </thead>
      <tbody>
        ${r.galaxies.map((g) => g.status === 'rejected'
          ? html`<tr class="rejected" data-id=${g.id}><td class="id">${g.id || `row ${g.row}`}</td><td>${g.input.z ?? ''}</td><td colspan=${2 + imfs.length * 4} class="why">rejected: ${g.errors.map((e) => `${e.column}: ${e.reason}`).join('; ')}</td></tr>`
          : html`<tr class=${g.id === this.selected ? 'sel' : ''} data-id=${g.id}>
              <td class="id"><button class="pick" type="button" @click=${() => this.dispatchEvent(new CustomEvent('galaxy-select', { detail: { id: g.id }, bubbles: true, composed: true }))}>${g.id}</button></td>
              <td>${g.input.z}</td>
              <td><abbr tabindex="0" class=${`verdict ${vClass(g.verdict!)}`} title=${`${EXPLAIN[g.verdict!]} (headline IMF ${g.headline_imf})`}>${g.verdict}</abbr></td>
              <td>${g.attribution!.length ? g.attribution!.map((a, i) => html`${i ? ', ' : ''}<abbr tabindex="0" title=${EXPLAIN[a]}>${a}</abbr>`) : '—'}</td>
              ${imfs.map((i) => {
                const v = g.imf![i];
                if (!v) return html`<td></td><td></td><td></td><td></td>`;
                return html`<td title=${`${v.log_mstar_p16.toFixed(2)}–${v.log_mstar_p84.toFixed(2)}`}>${v.log_mstar_median.toFixed(2)}</td>
                  <td title=${`5–95%: ${f2(v.eps_required_p05)}–${f2(v.eps_required_p95)}; Eddington-corrected ${f2(v.eps_required_median_debiased)}; with cosmic variance ${f2(v.eps_required_median_cv)}`}><span class=${`t-${vClass(v.verdict)}`}>${f2(v.eps_required_median)}</span> <small>[${f2(v.eps_required_p05)}–${f2(v.eps_required_p95)}]</small></td>
                  <td>${v.p_over_budget.toFixed(2)}</td><td>${v.p_strained.toFixed(2)}</td>`;
              })}
            </tr>`)}
      </tbody>
    </table>
    ${r.sample.bins.map((b) => html`<p>Sample, ${b.z_min} < z < ${b.z_max}: needs ε ≥ <strong>${f2(b.eps_required_rho)}</strong> (mass density) and ≥ <strong>${f2(b.eps_required_n)}</strong> (number density), ${b.galaxies} galaxies in ${b.volume_mpc3.toExponential(2)} Mpc³.</p>`)}
    ${r.sample.file_errors.length ? html`<p role="alert">${r.sample.file_errors.join('; ')}</p>` : nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'results-table': ResultsTable;
  }
}
