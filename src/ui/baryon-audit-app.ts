import { LitElement, css, html, nothing } from 'lit';
import { customElement, state } from 'lit/decorators.js';
import type { AuditChoices } from '../core/audit/choices.js';
import type { RowProblem } from '../core/audit/sample.js';
import { DEMO_SAMPLE_CSV } from '../demo/demo-sample.js';
import { decodeShare, encodeShare, loadSaved, makeRecord, recordFromJson, save } from './app-state.js';
import { AuditController, type ControllerState } from './audit-controller.js';
import type { ChartModel } from './chart/chart-config.js';
import { densityFigure, explorerFigure, galaxyImfFigure, massRedshiftFigure } from './chart/figures.js';
import { DEFAULT_CHOICES } from './default-choices.js';
import { download } from './downloads.js';
import './audit-chart.js';
import './choice-panel.js';
import './results-table.js';
import './sample-editor.js';

/**
 * <baryon-audit-app>: the page. Holds the sample text and the choices, asks the controller for audits
 * (debounced; the latest edit wins), shows results, figures, the summary and exports; restores state
 * from a share link, an imported JSON record or the saved state, and says when it cannot.
 * Fires `audit-complete` (detail: { elapsedMs }) after the figures are drawn, `audit-failed` on errors.
 */
@customElement('baryon-audit-app')
export class BaryonAuditApp extends LitElement {
  @state() private csv = DEMO_SAMPLE_CSV;
  @state() private choices: AuditChoices = DEFAULT_CHOICES;
  @state() private ctl: ControllerState = { status: 'idle', done: 0, total: 0, restarts: 0 };
  @state() private notice = '';
  @state() private selected = '';
  @state() private explorerZ = 10;
  @state() private explorer?: ChartModel;
  private controller?: AuditController;
  private timer?: ReturnType<typeof setTimeout>;
  private lastShown = 0;
  /** Figure models of the response on show, rebuilt only when the response or the selection changes. */
  private figCache?: { id: number; selected: string; figs: ChartModel[] };
  /** The rows' problems of the response on show (one array per response, so the editor is not re-rendered by progress). */
  private problemCache: { result?: object; problems: RowProblem[] } = { problems: [] };

  static styles = css`
    :host { display: block; font-family: system-ui, sans-serif; color: #111; }
    header { padding: 0.6rem 1rem; border-bottom: 1px solid #ccc; }
    h1 { font-size: 1.35rem; margin: 0; }
    h2 { font-size: 1.1rem; margin: 0.8rem 0 0.3rem; }
    .caution { font-size: 0.85rem; color: #444; margin: 0.3rem 0 0; }
    main { display: grid; grid-template-columns: minmax(0, 1fr); gap: 1rem; padding: 0.8rem 1rem; }
    @media (min-width: 1100px) { main { grid-template-columns: minmax(0, 5fr) minmax(0, 7fr); } }
    .status { display: flex; gap: 0.6rem; align-items: center; min-height: 2rem; }
    .notice { background: #fff4d6; border: 1px solid #E69F00; padding: 0.4rem 0.6rem; }
    .error { background: #fde2d6; border: 1px solid #D55E00; padding: 0.4rem 0.6rem; }
    .figs { display: grid; grid-template-columns: minmax(0, 1fr); gap: 1rem; }
    @media (min-width: 1500px) { .figs { grid-template-columns: minmax(0, 1fr) minmax(0, 1fr); } }
    .exports { display: flex; flex-wrap: wrap; gap: 0.5rem; }
    button, label.button { font: inherit; padding: 0.25rem 0.6rem; border: 1px solid #777; border-radius: 4px; background: #fafafa; cursor: pointer; }
    label.button:focus-within { outline: 2px solid #0072B2; }
    .visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip: rect(0 0 0 0); }
    pre.summary { white-space: pre-wrap; font-size: 0.85rem; background: #f7f7f7; padding: 0.6rem; border: 1px solid #ddd; }
    progress { width: 12rem; }
    .rate { color: #444; font-variant-numeric: tabular-nums; }
    /* Own paint layers for the long tables: a progress update on the status line then repaints only the line. */
    sample-editor, results-table { contain: paint; }
  `;

  connectedCallback(): void {
    super.connectedCallback();
    this.restore();
    this.controller = new AuditController((s) => this.onController(s));
    // The halo-abundance explorer is cheap and independent of the sample: ask for it first so the first
    // figure appears while the audit runs.
    void this.loadExplorer();
    this.schedule(0);
    window.addEventListener('hashchange', this.onHash);
  }

  disconnectedCallback(): void {
    super.disconnectedCallback();
    window.removeEventListener('hashchange', this.onHash);
    this.controller?.dispose();
  }

  /** For tests and diagnostics: the controller that owns the worker. */
  get auditController(): AuditController | undefined {
    return this.controller;
  }

  private onHash = (): void => {
    if (location.hash.startsWith('#state=')) {
      this.restore();
      this.schedule(0);
    }
  };

  private restore(): void {
    if (location.hash.startsWith('#state=')) {
      try {
        const rec = decodeShare(location.hash);
        this.csv = rec.sample_csv;
        this.choices = rec.choices;
        this.notice = 'State restored from the link.';
        return;
      } catch (e) {
        this.notice = `This share link could not be used: ${(e as Error).message}. The saved or demo state was loaded instead.`;
      }
    }
    const saved = loadSaved(localStorage);
    if (saved.record) {
      this.csv = saved.record.sample_csv;
      this.choices = saved.record.choices;
    } else if (saved.problem) this.notice = `Note: ${saved.problem}.`;
  }

  /** Runs the audit after `delay` ms of quiet; with no delay at once, so the workers start before the page redraws. */
  private schedule(delay = 0): void {
    clearTimeout(this.timer);
    const go = (): void => {
      save(localStorage, makeRecord(this.csv, this.choices));
      void this.controller?.run(this.csv, this.choices);
    };
    if (delay > 0) this.timer = setTimeout(go, delay);
    else go();
  }

  private onController(s: ControllerState): void {
    this.ctl = s;
    if (s.status === 'error' && s.message) this.dispatchEvent(new CustomEvent('audit-failed', { detail: { message: s.message }, bubbles: true, composed: true }));
  }

  private async loadExplorer(): Promise<void> {
    if (!this.controller) return;
    const z = this.explorerZ;
    try {
      const r = await this.controller.explore({ cosmology: this.choices.cosmology, transfer: this.choices.transfer, z });
      const c = this.choices.cosmology;
      this.explorer = explorerFigure(r.log10M, r.series, z, `H0 = ${c.h0}, Ωm = ${c.omegaM}, σ8 = ${c.sigma8}, ${this.choices.transfer.kind}`);
    } catch (e) {
      this.notice = `halo-abundance explorer: ${(e as Error).message}`;
    }
  }

  protected updated(): void {
    const resp = this.ctl.response;
    if (resp && this.ctl.status === 'done' && resp.id !== this.lastShown) {
      this.lastShown = resp.id;
      const charts = [...this.renderRoot.querySelectorAll('audit-chart')];
      void Promise.all(charts.map((c) => c.updateComplete)).then(() =>
        this.dispatchEvent(new CustomEvent('audit-complete', { detail: { id: resp.id, elapsedMs: resp.elapsedMs }, bubbles: true, composed: true })),
      );
    }
  }

  private onSample(e: CustomEvent<{ csv: string }>): void {
    this.csv = e.detail.csv;
    this.schedule();
  }

  private onChoices(e: CustomEvent<{ choices: AuditChoices }>): void {
    const physicsChanged = JSON.stringify([e.detail.choices.cosmology, e.detail.choices.transfer]) !== JSON.stringify([this.choices.cosmology, this.choices.transfer]);
    this.choices = e.detail.choices;
    this.schedule();
    if (physicsChanged) void this.loadExplorer();
  }

  private async importRecord(e: Event): Promise<void> {
    const input = e.target as HTMLInputElement;
    const f = input.files?.[0];
    input.value = '';
    if (!f) return;
    try {
      const rec = recordFromJson(await f.text());
      this.csv = rec.sample_csv;
      this.choices = rec.choices;
      this.notice = `Restored ${f.name}.`;
      this.schedule(0);
    } catch (err) {
      this.notice = `${f.name} could not be imported: ${(err as Error).message}`;
    }
  }

  private shareLink(): string {
    return `${location.origin}${location.pathname}${encodeShare(makeRecord(this.csv, this.choices))}`;
  }

  private async copyShare(): Promise<void> {
    const link = this.shareLink();
    history.replaceState(null, '', link);
    try {
      await navigator.clipboard.writeText(link);
      this.notice = 'Share link copied to the clipboard (and put in the address bar).';
    } catch {
      this.notice = 'Share link put in the address bar (the clipboard was not available).';
    }
  }

  private exportText(name: string, text: string, type: string): void {
    download(name, new Blob([text], { type }));
  }

  render() {
    const resp = this.ctl.response;
    const result = resp?.result;
    if (this.problemCache.result !== result) {
      const problems = result ? result.galaxies.flatMap((g) => g.errors) : [];
      this.problemCache = { result, problems: problems.length || this.problemCache.problems.length ? problems : this.problemCache.problems };
    }
    const problems = this.problemCache.problems;
    let figs: ChartModel[] = [];
    if (result && resp?.curves && resp.points) {
      const c = this.figCache;
      if (c && c.id === resp.id && c.selected === this.selected) figs = c.figs;
      else {
        const old = c && c.id === resp.id ? c.figs : undefined;
        figs = [old?.[0] ?? massRedshiftFigure(result, resp.curves, resp.points), old?.[1] ?? densityFigure(result), galaxyImfFigure(result, this.selected)];
        this.figCache = { id: resp.id, selected: this.selected, figs };
      }
    }
    return html`
      <header>
        <h1>Baryon Audit</h1>
        <p class="caution">Can ΛCDM's haloes hold these stars? Results depend on the assumed stellar population (IMF, star-formation history, dust), the redshifts and the cosmology; this audit complements, not replaces, full spectral fitting and spectroscopic confirmation.</p>
      </header>
      <main>
        <section aria-label="inputs">
          <h2>Sample</h2>
          <sample-editor .csv=${this.csv} .problems=${problems} @sample-change=${this.onSample}></sample-editor>
          <h2>Choices</h2>
          <choice-panel .choices=${this.choices} @choices-change=${this.onChoices}></choice-panel>
        </section>
        <section aria-label="results">
          ${this.notice ? html`<p class="notice" role="status">${this.notice} <button type="button" @click=${() => (this.notice = '')}>dismiss</button></p>` : nothing}
          <div class="status" role="status" aria-live="polite">
            ${this.ctl.status === 'running'
              ? html`<span>Auditing… ${this.ctl.done}/${this.ctl.total || '?'} rows</span><progress max=${this.ctl.total || 1} value=${this.ctl.done}></progress>${this.ctl.rowsPerSecond
                    ? html`<span class="rate">${this.ctl.rowsPerSecond.toFixed(0)} rows/s, about ${Math.ceil(this.ctl.secondsLeft ?? 0)} s left</span>`
                    : nothing}<button type="button" @click=${() => this.controller?.cancel()}>Cancel</button>`
              : this.ctl.status === 'done' && resp
                ? html`<span>Audited ${result!.sample.accepted} galaxies (${result!.sample.rejected} rejected) in ${(resp.elapsedMs / 1000).toFixed(2)} s.</span>`
                : nothing}
          </div>
          ${this.ctl.message && this.ctl.status !== 'error' && !/restarted/.test(this.ctl.message) ? html`<p class="notice" role="status">${this.ctl.message}</p>` : nothing}
          ${this.ctl.message && (this.ctl.status === 'error' || /restarted/.test(this.ctl.message))
            ? html`<p class="error" role="alert">${this.ctl.message} Your sample and choices are kept as you left them.
                <button type="button" @click=${() => this.schedule(0)}>Run again with the current inputs</button></p>`
            : nothing}
          <h2>Per galaxy</h2>
          <results-table .result=${result} .selected=${this.selected} @galaxy-select=${(e: CustomEvent<{ id: string }>) => (this.selected = e.detail.id)}></results-table>
          <h2>Figures</h2>
          <div class="figs" @download=${(e: CustomEvent<{ name: string; blob: Blob }>) => download(e.detail.name, e.detail.blob)}>
            ${figs.map((m) => html`<audit-chart .model=${m}></audit-chart>`)}
            <div>
              <label>explorer redshift <input type="number" min="0" max="30" step="0.5" .value=${String(this.explorerZ)} @change=${(e: Event) => {
                const v = Number((e.target as HTMLInputElement).value);
                if (Number.isFinite(v) && v >= 0 && v <= 30) {
                  this.explorerZ = v;
                  void this.loadExplorer();
                } else this.notice = 'explorer redshift must be a number in [0, 30]';
              }} /></label>
              ${this.explorer ? html`<audit-chart .model=${this.explorer}></audit-chart>` : nothing}
            </div>
          </div>
          <h2>Export</h2>
          <div class="exports">
            <button type="button" ?disabled=${!resp?.csv} @click=${() => this.exportText('baryon-audit.csv', resp!.csv!, 'text/csv')}>Results CSV</button>
            <button type="button" ?disabled=${!result} @click=${() => this.exportText('baryon-audit.json', JSON.stringify(result, null, 1), 'application/json')}>Full JSON record</button>
            <button type="button" ?disabled=${!resp?.markdown} @click=${() => this.exportText('baryon-audit.md', resp!.markdown!, 'text/markdown')}>Markdown summary</button>
            <button type="button" @click=${() => this.copyShare()}>Share link</button>
            <label class="button">Import JSON record…<input class="visually-hidden" type="file" accept=".json,application/json" @change=${this.importRecord} aria-label="Import a JSON record" /></label>
          </div>
          <h2>Summary</h2>
          <pre class="summary">${resp?.markdown ?? ''}</pre>
        </section>
      </main>
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'baryon-audit-app': BaryonAuditApp;
  }
}
