import { LitElement, css, html, nothing, unsafeCSS, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import type { AuditResult, GalaxyRow } from '../core/audit/index.js';
import { reconcileSentence, sampleSentence } from '../core/audit/report.js';
import { citeImf } from './citations.js';
import { plainFromMarkdown } from './markdown-plain.js';
import { imfStyle, VERDICT_COLORS } from './palette.js';
import { orderRows, verdictCounts, VERDICT_KEYS, type SortKey, type VerdictKey } from './results-order.js';
import { mark, VERDICT_FILL } from './verdict-marks.js';
import { rowOffsets, rowWindow, scrollToShow, type RowWindow } from './window-rows.js';

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
  'Eddington-driven': 'within budget once the Eddington bias of the mass (scatter into a steep mass function) is corrected',
};
const ATTR_SHORT: Record<string, string> = { 'holds under every IMF': 'every IMF', 'IMF-driven': 'IMF', 'redshift-driven': 'redshift', 'volume-driven': 'volume', 'Eddington-driven': 'Eddington' };
const COLUMN_EXPLAIN: Record<string, string> = {
  id: 'galaxy id; Enter or a click shows it in the figures',
  z: 'redshift as given',
  verdict: 'headline verdict, under the headline IMF (the row’s imf_ref, else the first IMF compared), whose mark follows it',
  attribution: 'what drives the tension: every IMF, IMF, redshift, volume or Eddington bias',
  draws: 'Monte Carlo draws made for this galaxy (the adaptive rule stops once its medians and verdicts are settled; fixed draws: all of them)',
};

const STOP_TEXT: Record<string, string> = { fixed: 'fixed number of draws', settled: 'stopped: medians and verdicts settled', maximum: 'reached the most draws allowed' };

/** The Monte Carlo line of a galaxy: draws, why they stopped, the medians' errors and the chance of a verdict change. */
function monteCarloText(g: GalaxyRow): string {
  const m = g.monte_carlo;
  if (!m) return 'Monte Carlo: not reported.';
  return `Monte Carlo: ${m.draws_made} draws (${STOP_TEXT[m.stop] ?? m.stop}); MC error of the medians ${m.log_mstar_median_mc_error_dex.toFixed(3)} dex in log M*, ${m.log_eps_required_median_mc_error_dex.toFixed(3)} dex in log ε_req; chance a verdict lies across its threshold ${m.p_verdict_change < 1e-4 ? '< 1e-4' : m.p_verdict_change.toFixed(4)}.`;
}

const f2 = (x: number): string => (x >= 999 ? '>999' : x >= 10 ? x.toFixed(0) : x >= 0.01 ? x.toFixed(2) : x.toExponential(1));
const idOf = (g: GalaxyRow): string => g.id || `row ${g.row}`;

/** Height of a compact row and of one line of the details, px (fixed in the stylesheet below). */
const ROW_H = 27;
const LINE_H = 22;
/** Lines of an expanded row under its IMF table, before the reconciliation: ceiling, Eddington and time budget, attribution, Monte Carlo. */
const DETAIL_LINES = 4;

/**
 * <results-table>: the audit per galaxy for samples of any size. One compact row per galaxy: the headline
 * verdict with the headline IMF's mark, the attribution, and under every IMF a mark in its palette colour and
 * shape (hollow within budget, half filled strained, filled over budget; the verdict also in text for screen
 * readers) with its median ε_req. A row expands to the full numbers. Only the rows in view are rendered;
 * columns sort, rows filter by verdict and id. Keyboard: Tab to the table, ↑/↓/PgUp/PgDn/Home/End move,
 * → or Space expands, ← collapses, Enter shows the galaxy in the figures. The explanation of the active row or
 * of a focused column heading shows under the table.
 * Properties: `result`, `selected`. Fires `galaxy-select` (detail: { id }).
 */
@customElement('results-table')
export class ResultsTable extends LitElement {
  @property({ attribute: false }) result?: AuditResult;
  @property() selected = '';
  /**
   * The result is a first look, without what it would take for the galaxies in tension: 'coming' while the
   * whole audit is on its way, 'stopped' if it will not come (the run was replaced or cancelled).
   */
  @property() reconcileLeftOut: 'no' | 'coming' | 'stopped' = 'no';

  @state() private sortKey: SortKey = 'row';
  @state() private sortDir: 1 | -1 = 1;
  @state() private show: ReadonlySet<VerdictKey> = new Set(VERDICT_KEYS);
  @state() private find = '';
  @state() private expanded: ReadonlySet<string> = new Set();
  @state() private active = 0;
  @state() private scrollPos = 0;
  @state() private viewH = 600;
  @state() private explain = '';
  @state() private rowH = ROW_H;

  private view: GalaxyRow[] = [];
  private offsets: Float64Array = new Float64Array(1);
  private win: RowWindow = { start: 0, end: 0, padTop: 0, padBottom: 0 };
  private imfs: string[] = [];
  /** Lines of reconciliation sentences in every expanded row (the most any galaxy has; rows are of one height). */
  private reconcileLines = 1;
  private resize?: ResizeObserver;
  private frame = 0;

  static styles = css`
    :host { display: block; --pad-top: 0px; --pad-bottom: 0px; --detail-h: 60px; }
    .bar { display: flex; flex-wrap: wrap; gap: 0.3rem 0.9rem; align-items: center; font-size: 0.82rem; margin-bottom: 0.3rem; }
    .bar fieldset { border: 0; padding: 0; margin: 0; display: flex; gap: 0.6rem; flex-wrap: wrap; }
    .bar legend { float: left; margin-right: 0.4rem; font-weight: 600; }
    .bar input[type='search'] { width: 8rem; font: inherit; }
    .key { display: inline-flex; gap: 0.5rem; align-items: center; color: #333; }
    .key span { display: inline-flex; gap: 0.15rem; align-items: center; }
    .scroll { overflow: auto; max-height: min(70vh, 34rem); border: 1px solid #ccc; }
    table { border-collapse: separate; border-spacing: 0; font-size: 0.8rem; width: max-content; min-width: 100%; }
    table:focus { outline: none; }
    .scroll:focus-within { outline: 2px solid #0072B2; outline-offset: 1px; }
    th { position: sticky; top: 0; z-index: 1; background: #f3f3f3; border-bottom: 1px solid #bbb; padding: 0.15rem 0.3rem; font-weight: 600; text-align: left; vertical-align: bottom; }
    th button.sort { font: inherit; border: 0; background: none; padding: 0; cursor: pointer; display: inline-flex; align-items: center; gap: 0.2rem; text-align: left; }
    th button.sort:focus-visible { outline: 2px solid #0072B2; }
    th.imf button.sort { flex-direction: column; align-items: flex-end; text-align: right; }
    th .name { max-width: 4.4rem; overflow-wrap: anywhere; white-space: normal; display: inline-block; line-height: 1.1; }
    td { padding: 0 0.25rem; border-bottom: 1px solid #e6e6e6; white-space: nowrap; }
    .c { height: ${ROW_H - 1}px; display: flex; align-items: center; gap: 0.25rem; overflow: hidden; }
    td.num .c, td.imf .c { justify-content: flex-end; font-variant-numeric: tabular-nums; }
    td.imf.head { background: #f4f8fb; font-weight: 600; }
    tr.pad td { padding: 0; border: 0; }
    tr.pad.top td { height: var(--pad-top); }
    tr.pad.bottom td { height: var(--pad-bottom); }
    tr.sel td { background: #e6f1fa; }
    tr.active td { box-shadow: inset 0 1px 0 #0072B2, inset 0 -1px 0 #0072B2; }
    tr.rejected td { color: #555; }
    td.why .c { max-width: 30rem; text-overflow: ellipsis; }
    .verdict { font-weight: 600; padding: 0 0.25rem; border-radius: 3px; color: #fff; line-height: 1.3; }
    .verdict.within { background: ${unsafeCSS(VERDICT_COLORS['within budget'])}; color: #000; }
    .verdict.strained { background: ${unsafeCSS(VERDICT_COLORS.strained)}; color: #000; }
    .verdict.over { background: ${unsafeCSS(VERDICT_COLORS['over budget'])}; }
    .t-within { color: #00704f; } .t-strained { color: #8a5a00; } .t-over { color: #a33a00; font-weight: 600; }
    .term { cursor: help; }
    .term:focus { outline: 2px solid #0072B2; }
    button.pick, button.tog { font: inherit; border: 0; background: none; cursor: pointer; padding: 0; }
    button.pick { text-decoration: underline; }
    button.tog { width: 1rem; color: #444; }
    tr.detail td { padding: 0 0.35rem 0 1.4rem; background: #fafafa; }
    .d { height: var(--detail-h); width: 0; min-width: 100%; overflow: auto; box-sizing: border-box; padding: 4px 0; }
    .d table { font-size: 0.78rem; min-width: 0; }
    .d th, .d td { position: static; height: ${LINE_H}px; padding: 0 0.4rem; border: 0; background: none; text-align: right; white-space: nowrap; }
    .d th:first-child, .d td:first-child { text-align: left; }
    .d p { height: ${LINE_H}px; line-height: ${LINE_H}px; margin: 0; white-space: nowrap; }
    .explain { font-size: 0.82rem; min-height: 1.2rem; margin: 0.3rem 0; color: #222; }
    .vh { position: absolute; width: 1px; height: 1px; overflow: hidden; clip: rect(0 0 0 0); white-space: nowrap; }
  `;

  connectedCallback(): void {
    super.connectedCallback();
    if (typeof ResizeObserver !== 'undefined')
      this.resize = new ResizeObserver(() => {
        const el = this.scroller;
        if (el && el.clientHeight > 0 && Math.abs(el.clientHeight - this.viewH) > 1) this.viewH = el.clientHeight;
      });
  }

  disconnectedCallback(): void {
    super.disconnectedCallback();
    this.resize?.disconnect();
    cancelAnimationFrame(this.frame);
  }

  private get scroller(): HTMLElement | null {
    return this.renderRoot.querySelector('.scroll');
  }

  /** The rows shown, in order (for tests and for the page). */
  get shownIds(): string[] {
    return this.view.map(idOf);
  }

  /** Scrolls so that the row with this index in the shown order is in view, and makes it the active row. */
  scrollToRow(index: number): void {
    this.active = Math.max(0, Math.min(this.view.length - 1, index));
    const el = this.scroller;
    const top = scrollToShow(this.offsets, this.active, this.scrollPos, this.viewH);
    this.scrollPos = top;
    if (el) el.scrollTop = top;
  }

  protected willUpdate(changed: PropertyValues): void {
    const r = this.result;
    if (changed.has('result')) {
      this.imfs = r ? [...new Set(r.galaxies.flatMap((g) => (g.imf ? Object.keys(g.imf) : [])))] : [];
      this.reconcileLines = r ? Math.max(1, ...r.galaxies.map((g) => g.reconcile?.length ?? 0)) : 1;
    }
    if (['result', 'sortKey', 'sortDir', 'show', 'find'].some((k) => changed.has(k))) {
      this.view = r ? orderRows(r.galaxies, this.sortKey, this.sortDir, this.show, this.find) : [];
      if (this.active >= this.view.length) this.active = Math.max(0, this.view.length - 1);
    }
    const detailH = LINE_H * (this.imfs.length + 1 + DETAIL_LINES + this.reconcileLines) + 9;
    this.offsets = rowOffsets(this.view.map((g) => this.rowH + (this.expanded.has(idOf(g)) ? detailH : 0)));
    this.style.setProperty('--detail-h', `${detailH - 1}px`);
    this.win = rowWindow(this.offsets, this.scrollPos, this.viewH);
    // Keep the active row among the rendered ones (aria-activedescendant must name an element in the page).
    if (this.win.end > this.win.start && (this.active < this.win.start || this.active >= this.win.end)) this.active = Math.min(this.win.end - 1, Math.max(this.win.start, this.active));
    // Spacer heights through the CSSOM (the page's CSP forbids style attributes in markup).
    this.style.setProperty('--pad-top', `${this.win.padTop}px`);
    this.style.setProperty('--pad-bottom', `${this.win.padBottom}px`);
  }

  protected updated(): void {
    const el = this.scroller;
    if (el && this.resize) this.resize.observe(el);
    const first = this.renderRoot.querySelector('tr.row');
    if (first) {
      const h = first.getBoundingClientRect().height;
      if (h > 0 && Math.abs(h - this.rowH) > 0.01) this.rowH = h;
    }
  }

  private onScroll(e: Event): void {
    const el = e.target as HTMLElement;
    cancelAnimationFrame(this.frame);
    this.frame = requestAnimationFrame(() => {
      this.scrollPos = el.scrollTop;
      if (el.clientHeight > 0) this.viewH = el.clientHeight;
    });
  }

  private sortBy(key: SortKey): void {
    if (this.sortKey === key) this.sortDir = this.sortDir === 1 ? -1 : 1;
    else {
      this.sortKey = key;
      this.sortDir = key === 'verdict' || key.startsWith('imf:') ? -1 : 1;
    }
    this.scrollToRow(0);
  }

  private toggleShow(k: VerdictKey, on: boolean): void {
    const s = new Set(this.show);
    if (on) s.add(k);
    else s.delete(k);
    this.show = s;
    this.scrollToRow(0);
  }

  private setExpanded(g: GalaxyRow, open: boolean): void {
    const s = new Set(this.expanded);
    if (open) s.add(idOf(g));
    else s.delete(idOf(g));
    this.expanded = s;
  }

  private pick(g: GalaxyRow): void {
    if (g.status !== 'ok') return;
    this.dispatchEvent(new CustomEvent('galaxy-select', { detail: { id: g.id }, bubbles: true, composed: true }));
  }

  /** The plain-language explanation of one row (shown for the active row). */
  private explainRow(g: GalaxyRow): string {
    if (g.status !== 'ok') return `${idOf(g)}: rejected: ${g.errors.map((e) => `${e.column}: ${e.reason}`).join('; ')}`;
    const attr = g.attribution!.length ? ` Attribution: ${g.attribution!.map((a) => `${a} (${EXPLAIN[a]})`).join('; ')}.` : '';
    const per = this.imfs
      .filter((i) => g.imf![i])
      .map((i) => `${i} ${g.imf![i].verdict}, ε_req ${f2(g.imf![i].eps_required_median)}`)
      .join('; ');
    return `${g.id}: ${g.verdict} under ${g.headline_imf} (${EXPLAIN[g.verdict!]}).${attr} Per IMF: ${per}.`;
  }

  private onKey(e: KeyboardEvent): void {
    const n = this.view.length;
    if (!n) return;
    const g = this.view[this.active];
    const page = Math.max(1, Math.floor(this.viewH / this.rowH) - 1);
    const moves: Record<string, number> = { ArrowDown: 1, ArrowUp: -1, PageDown: page, PageUp: -page, Home: -n, End: n };
    if (e.key in moves) this.scrollToRow(this.active + moves[e.key]);
    else if (e.key === 'ArrowRight' || e.key === ' ') this.setExpanded(g, true);
    else if (e.key === 'ArrowLeft') this.setExpanded(g, false);
    else if (e.key === 'Enter') this.pick(g);
    else return;
    e.preventDefault();
    this.explain = this.explainRow(this.view[this.active]);
  }

  private onFocusIn(e: FocusEvent): void {
    const t = (e.composedPath()[0] as HTMLElement | undefined)?.closest?.('[data-tip]');
    if (t) this.explain = t.getAttribute('data-tip') ?? '';
    else if ((e.composedPath()[0] as HTMLElement)?.tagName === 'TABLE' && this.view.length) this.explain = this.explainRow(this.view[this.active]);
  }

  private header(key: SortKey, label: unknown, tip: string, cls = '') {
    const sorted = this.sortKey === key;
    return html`<th class=${cls} scope="col" aria-sort=${sorted ? (this.sortDir === 1 ? 'ascending' : 'descending') : 'none'}>
      <button class="sort" type="button" data-tip=${tip} title=${tip} @click=${() => this.sortBy(key)}>${label}${sorted ? (this.sortDir === 1 ? ' ▲' : ' ▼') : ''}</button>
    </th>`;
  }

  private row(g: GalaxyRow, i: number) {
    const id = idOf(g);
    const open = this.expanded.has(id);
    const cls = `row${g.status === 'rejected' ? ' rejected' : ''}${g.id === this.selected && g.status === 'ok' ? ' sel' : ''}${i === this.active ? ' active' : ''}`;
    const cols = 5 + this.imfs.length;
    const tog = html`<button class="tog" type="button" tabindex="-1" aria-expanded=${open ? 'true' : 'false'} aria-label=${`${open ? 'hide' : 'show'} the numbers of ${id}`} @click=${() => this.setExpanded(g, !open)}>${open ? '▾' : '▸'}</button>`;
    if (g.status === 'rejected') {
      const why = `rejected: ${g.errors.map((e) => `${e.column}: ${e.reason}`).join('; ')}`;
      return html`<tr id=${`row-${i}`} class=${cls} data-id=${g.id} aria-rowindex=${i + 2}>
          <td class="id"><div class="c">${tog}${id}</div></td><td class="num"><div class="c">${g.input.z ?? ''}</div></td>
          <td colspan=${cols - 2} class="why"><div class="c" title=${why}>${why}</div></td>
        </tr>
        ${open ? html`<tr class="detail"><td colspan=${cols}><div class="d">${g.errors.map((e) => html`<p>row ${e.row}, ${e.column}: ${e.reason}</p>`)}</div></td></tr>` : nothing}`;
    }
    const hs = imfStyle(g.headline_imf!);
    return html`<tr id=${`row-${i}`} class=${cls} data-id=${g.id} aria-rowindex=${i + 2} aria-selected=${g.id === this.selected ? 'true' : 'false'}>
        <td class="id"><div class="c">${tog}<button class="pick" type="button" tabindex="-1" @click=${() => {
          this.active = i;
          this.pick(g);
        }}>${g.id}</button></div></td>
        <td class="num"><div class="c">${g.input.z}</div></td>
        <td><div class="c"><span class=${`verdict ${vClass(g.verdict!)} term`} tabindex="-1" data-tip=${`${g.verdict}: ${EXPLAIN[g.verdict!]} (headline IMF ${g.headline_imf})`} title=${EXPLAIN[g.verdict!]}>${g.verdict}</span><span class="term" tabindex="-1" data-tip=${`headline IMF: ${g.headline_imf}`} title=${`headline IMF: ${g.headline_imf}`}>${mark(hs.shape, hs.color)}<span class="vh">under ${g.headline_imf}</span></span></div></td>
        <td class="attr"><div class="c"><span>${g.attribution!.length ? g.attribution!.map((a, k) => html`${k ? ', ' : ''}<span class="term" tabindex="-1" data-tip=${`${a}: ${EXPLAIN[a]}`} title=${`${a}: ${EXPLAIN[a]}`}>${ATTR_SHORT[a] ?? a}</span>`) : '—'}</span></div></td>
        ${this.imfs.map((imf) => {
          const v = g.imf![imf];
          if (!v) return html`<td class="imf"><div class="c">—</div></td>`;
          const st = imfStyle(imf);
          const tip = `${imf}: ${v.verdict}, ε_req ${f2(v.eps_required_median)} (5–95%: ${f2(v.eps_required_p05)}–${f2(v.eps_required_p95)}), P(ε_req > 1) = ${v.p_over_budget.toFixed(2)}`;
          return html`<td class=${`imf${imf === g.headline_imf ? ' head' : ''}`}><div class="c" title=${tip}>${mark(st.shape, st.color, VERDICT_FILL[v.verdict])}<span class="vh">${imf}: ${v.verdict}, ε_req</span><span class=${`eps t-${vClass(v.verdict)}`}>${f2(v.eps_required_median)}</span></div></td>`;
        })}
        <td class="num"><div class="c" title=${monteCarloText(g)}>${g.monte_carlo?.draws_made ?? '—'}</div></td>
      </tr>
      ${open ? this.details(g, cols) : nothing}`;
  }

  private details(g: GalaxyRow, cols: number) {
    const epsRef = this.result!.record.choices.epsRef;
    const c = g.ceiling!;
    const e = g.eddington;
    const t = g.time_budget;
    const head = g.imf![g.headline_imf!];
    const rec = g.reconcile ?? [];
    const attr = g.attribution_detail ?? [];
    return html`<tr class="detail"><td colspan=${cols}><div class="d" role="group" aria-label=${`numbers of ${g.id}`}>
      <table>
        <tr><th scope="col">IMF</th><th scope="col">verdict</th><th scope="col" title="median log10 M* [Msun] (16–84%)">log M* [Msun] (16–84%)</th><th scope="col" title="median ε_req (5–95%) against the rarest halo">ε_req (5–95%)</th>
          <th scope="col" title="median ε_req after the Eddington-bias correction, and the verdict it gives">Eddington-corrected</th><th scope="col" title="median ε_req against the ceiling widened by cosmic variance">with cosmic variance</th><th scope="col">P(ε_req &gt; 1)</th>
          <th scope="col" title="P(ε_req > 1) with each draw's ceiling also drawn from the cosmological parameters' covariance">P(ε_req &gt; 1), cosmology drawn</th><th scope="col">${`P(ε_req > ε_ref = ${epsRef})`}</th>
          <th scope="col" title="stars formed over the baryons the ceiling halo accreted in the same time: median ratio, and P(ratio > 1)">time budget (P &gt; 1)</th></tr>
        ${this.imfs.map((imf) => {
          const v = g.imf![imf];
          if (!v) return html`<tr><td>${imf}</td><td colspan="9">not compared</td></tr>`;
          const st = imfStyle(imf);
          return html`<tr><td title=${citeImf(imf)}>${mark(st.shape, st.color, VERDICT_FILL[v.verdict], 12)} ${imf}${imf === g.headline_imf ? ' (headline)' : ''}</td><td class=${`t-${vClass(v.verdict)}`}>${v.verdict}</td>
            <td>${v.log_mstar_median.toFixed(2)} (${v.log_mstar_p16.toFixed(2)}–${v.log_mstar_p84.toFixed(2)})</td><td>${f2(v.eps_required_median)} (${f2(v.eps_required_p05)}–${f2(v.eps_required_p95)})</td>
            <td>${f2(v.eps_required_median_debiased)}${v.verdict_debiased ? html` <span class=${`t-${vClass(v.verdict_debiased)}`}>(${v.verdict_debiased})</span>` : nothing}</td><td>${f2(v.eps_required_median_cv)}</td><td>${v.p_over_budget.toFixed(2)}</td>
            <td>${v.p_over_budget_cosmo !== undefined ? v.p_over_budget_cosmo.toFixed(2) : '—'}</td><td>${v.p_strained.toFixed(2)}</td>
            <td>${v.time_budget_ratio_median !== undefined ? html`${f2(v.time_budget_ratio_median)} (${v.p_time_budget_over!.toFixed(2)})` : '—'}</td></tr>`;
        })}
      </table>
      <p>Ceiling: M_halo = ${c.halo_mass_at_quantile_msun.toExponential(2)} Msun at the rarest-halo quantile in ${c.slice_z_min.toFixed(2)} < z < ${c.slice_z_max.toFixed(2)}${c.log_mass_cosmo_sd_dex !== undefined ? `, spread ${c.log_mass_cosmo_sd_dex.toFixed(3)} dex (1σ) from the cosmological parameters' uncertainty` : ''}.</p>
      <p>${e ? `Eddington bias: log M* lowered by ${e.shift_dex.toFixed(2)} dex (first order α σ² ln 10: ${e.shift_first_order_dex.toFixed(2)} dex; σ = ${e.sigma_dex} dex).` : 'Eddington bias: no mass error given.'}
        ${t ? ` Time budget: ${t.formed_mass_msun.toExponential(2)} Msun of stars formed while the ceiling halo accreted ${t.accreted_baryons_msun.toExponential(2)} Msun of baryons (ratio ${f2(t.ratio)}, P(ratio > 1) = ${t.p_ratio_over_1.toFixed(2)}).` : ''}</p>
      <p>${monteCarloText(g)}</p>
      <p>Attribution: ${attr.length ? attr.map((a, k) => html`${k ? '; ' : ''}<span class="term" tabindex="-1" data-tip=${`${a.cause}: ${EXPLAIN[a.cause] ?? ''}`} title=${EXPLAIN[a.cause] ?? ''}>${a.cause}</span> (via ${a.via}: ${a.verdict_after} after)`) : g.attribution!.length ? g.attribution!.join(', ') : 'none'}.</p>
      ${rec.length
        ? rec.map((rc) => html`<p class="rc">${reconcileSentence(rc, epsRef, head.eps_required_median).trim()}</p>`)
        : g.verdict === 'within budget'
          ? html`<p class="rc">Within budget: nothing to reconcile.</p>`
          : html`<p class="rc pending">${this.reconcileLeftOut === 'stopped' ? 'What it would take was not worked out: the run stopped first. Run again to see it.' : 'What it would take: being worked out…'}</p>`}
    </div></td></tr>`;
  }

  render() {
    const r = this.result;
    if (!r) return html`<p>No audit yet.</p>`;
    const counts = verdictCounts(r.galaxies);
    const w = this.win;
    const cols = 5 + this.imfs.length;
    const rows = [];
    for (let i = w.start; i < w.end; i++) rows.push(this.row(this.view[i], i));
    return html`
      <div class="bar">
        <fieldset><legend>show</legend>
          ${VERDICT_KEYS.map((k) => html`<label><input type="checkbox" .checked=${this.show.has(k)} @change=${(e: Event) => this.toggleShow(k, (e.target as HTMLInputElement).checked)} /> ${k} (${counts[k]})</label>`)}
        </fieldset>
        <label>find <input type="search" placeholder="galaxy id" .value=${this.find} @input=${(e: Event) => {
          this.find = (e.target as HTMLInputElement).value;
          this.scrollToRow(0);
        }} /></label>
        <span class="key" aria-hidden="true"><span>${mark('circle', '#444', 'none', 12)} within</span><span>${mark('circle', '#444', 'half', 12)} strained</span><span>${mark('circle', '#444', 'full', 12)} over budget</span></span>
        <span role="status">${this.view.length} of ${r.galaxies.length} rows</span>
      </div>
      <div class="scroll" @scroll=${this.onScroll}>
        <table role="grid" tabindex="0" aria-label="audit per galaxy" aria-rowcount=${this.view.length + 1} aria-activedescendant=${this.view.length ? `row-${this.active}` : nothing} @keydown=${this.onKey} @focusin=${this.onFocusIn}>
          <thead><tr aria-rowindex="1">
            ${this.header('id', 'galaxy', COLUMN_EXPLAIN.id, 'id')}
            ${this.header('z', 'z', COLUMN_EXPLAIN.z)}
            ${this.header('verdict', 'verdict', COLUMN_EXPLAIN.verdict)}
            ${this.header('attribution', 'attribution', COLUMN_EXPLAIN.attribution)}
            ${this.imfs.map((imf) => {
              const st = imfStyle(imf);
              return this.header(`imf:${imf}`, html`${mark(st.shape, st.color)}<span class="name">${imf}</span>`, `${citeImf(imf)}: median ε_req under ${imf}; the mark is hollow within budget, half filled strained, filled over budget`, 'imf');
            })}
            ${this.header('draws', 'draws', COLUMN_EXPLAIN.draws)}
          </tr></thead>
          <tbody>
            <tr class="pad top" aria-hidden="true"><td colspan=${cols}></td></tr>
            ${rows}
            <tr class="pad bottom" aria-hidden="true"><td colspan=${cols}></td></tr>
          </tbody>
        </table>
      </div>
      <p class="explain" aria-live="polite">${this.explain || 'Tab to the table, then ↑/↓ to move, → to expand, Enter to show a galaxy in the figures; each column heading sorts.'}</p>
      ${r.sample.bins.map((b) => html`<p class="sample">Sample: ${plainFromMarkdown(sampleSentence(b, r.record.choices))}</p>`)}
      ${r.sample.file_errors.length ? html`<p class="file-errors" role="alert">File errors: ${r.sample.file_errors.join('; ')}</p>` : nothing}
      ${r.sample.file_warnings?.length ? html`<p class="file-warnings" role="status">File warnings: ${r.sample.file_warnings.join('; ')}</p>` : nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'results-table': ResultsTable;
  }
}
