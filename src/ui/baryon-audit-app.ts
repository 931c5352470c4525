import { LitElement, css, html, nothing } from 'lit';
import { customElement, state } from 'lit/decorators.js';
import { normalizeChoices, type AuditChoices } from '../core/audit/choices.js';
import type { RowProblem } from '../core/audit/sample.js';
import { DEMO_SAMPLE_CSV, DEMO_SURVEY } from '../demo/demo-sample.js';
import { decodeShare, encodeShare, loadSaved, makeRecord, notExactNote, recordFromJson, save } from './app-state.js';
import { AuditController, type ControllerState } from './audit-controller.js';
import type { ChartModel } from './chart/chart-config.js';
import { densityFigure, explorerFigure, galaxyImfFigure, massRedshiftFigure } from './chart/figures.js';
import { headlineOf, type PanelChoices, type UvSlopeView } from './choice-panel.js';
import { DEFAULT_CHOICES } from './default-choices.js';
import { download } from './downloads.js';
import { canRedo, canUndo, record, redo, startHistory, undo, type EditHistory, type HistoryLimits } from './edit-history.js';
import { keepSameProblems } from './row-problems.js';
import type { SurveyChoices } from './survey-editor.js';
import './audit-summary.js';
import type { DisputedMap } from '../core/audit/disputed-map.js';
import './choice-panel.js';
import './results-table.js';
import './sample-editor.js';
import './survey-editor.js';

/**
 * The figure elements (uPlot, the canvas map, the exports) are a chunk of their own, fetched as soon as the
 * page starts, while the first audit runs: the figures exist only once a result is there.
 */
let figuresLoading: Promise<unknown> | undefined;
const figureElements = (): Promise<unknown> => (figuresLoading ??= Promise.all([import('./audit-chart.js'), import('./disputed-map-figure.js')]));
void figureElements();

/** One state of the bench: the sample text, every choice, and the edit that led to it (for Undo's label). */
interface Bench {
  readonly csv: string;
  readonly choices: PanelChoices;
  readonly what: string;
}

/** Undo reaches 200 edits back, within about 40 MB of sample text. */
const HISTORY_LIMITS: HistoryLimits<Bench> = { maxEntries: 200, maxSize: 2e7, sizeOf: (b) => b.csv.length + 2000 };
const sameBench = (a: Bench, b: Bench): boolean => a.csv === b.csv && a.choices === b.choices;
/**
 * The choices as the record keeps them: the headline IMF made explicit (the core's normalizeChoices), keys in
 * one order, so the panel's choices and a result's record compare equal when they mean the same audit.
 */
const choicesKey = (c: AuditChoices): string =>
  JSON.stringify(normalizeChoices(c), (_, v: unknown) => (v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) : v));

interface Invalid {
  readonly field: string;
  readonly message: string;
}

/**
 * <baryon-audit-app>: the page, a bench. Holds the sample text and the choices with their undo history
 * (every edit of the sample, the survey or a choice; Undo/Redo buttons and Ctrl/Cmd-Z, Shift-Ctrl/Cmd-Z;
 * "Demo sample" brings the invented demo back), asks the controller for audits (the latest edit wins),
 * shows results, figures, the summary and exports, and marks them out of date while they no longer
 * match the inputs (an invalid choice, or a run on its way). Restores state from a share link, an
 * imported JSON record or the saved state, and says when it cannot.
 * Fires `audit-complete` (detail: { elapsedMs }) after the figures are drawn, `audit-failed` on errors.
 */
@customElement('baryon-audit-app')
export class BaryonAuditApp extends LitElement {
  @state() private hist: EditHistory<Bench> = startHistory({ csv: DEMO_SAMPLE_CSV, choices: DEFAULT_CHOICES, what: 'open the demo' });
  /** Invalid fields per element (choice panel, survey editor): results stay marked out of date meanwhile. */
  @state() private invalid: Record<string, readonly Invalid[]> = {};
  @state() private said = '';
  @state() private ctl: ControllerState = { status: 'idle', done: 0, total: 0, restarts: 0 };
  @state() private notice = '';
  @state() private selected = '';
  @state() private explorerZ = 10;
  @state() private explorer?: ChartModel;
  private controller?: AuditController;
  /** The fifth figure: the map of the chosen galaxy, for the response on show (`key` = response id | galaxy id). */
  @state() private mapView: { key: string; map?: DisputedMap; busy: boolean; message: string } = { key: '', busy: false, message: '' };
  private timer?: ReturnType<typeof setTimeout>;
  private lastShown = 0;
  /** Figure models of the response on show, rebuilt only when the response or the selection changes. */
  private figCache?: { id: number; selected: string; figs: ChartModel[] };
  /** The last summary shown: it stays (dimmed after a moment) while a first look's reports are on their way. */
  private summaryShown = '';
  /** Inputs that have been typed into (fields without a `data-v` committed value): Ctrl-Z there is theirs. */
  private typing = new WeakSet<EventTarget>();

  private get csv(): string {
    return this.hist.present.csv;
  }

  private get choices(): PanelChoices {
    return this.hist.present.choices;
  }
  /** The rows' problems of the response on show (the same array while they say the same, so neither progress nor a run that finds the same problems re-renders the editor). */
  private problemCache: { result?: object; problems: readonly RowProblem[] } = { problems: [] };

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
    .visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip-path: inset(50%); white-space: nowrap; }
    section { position: relative; }
    progress { width: min(12rem, 40vw); }
    section { min-width: 0; }
    .status, .bench { flex-wrap: wrap; }
    .bench { display: flex; gap: 0.5rem; align-items: center; margin: 0 0 0.4rem; }
    .bench .last { font-size: 0.8rem; color: #444; }
    button:disabled { cursor: default; color: #888; border-color: #ccc; }
    button:focus-visible { outline: 2px solid #0072B2; outline-offset: 1px; }
    label.button { position: relative; }
    .skip:not(:focus) { position: absolute; width: 1px; height: 1px; overflow: hidden; clip-path: inset(50%); white-space: nowrap; }
    .skip:focus { display: inline-block; margin: 0.2rem 0; padding: 0.2rem 0.5rem; background: #0072B2; color: #fff; }
    h2:focus { outline: 2px solid #0072B2; }
    .out { position: relative; }
    /* The results' containing block clips sideways: nothing inside (hidden labels included) widens the page. */
    .out > .body { position: relative; overflow-x: clip; transition: opacity 0.2s ease 0.4s; }
    .out.pending > .body, .summary.settling { opacity: 0.7; }
    .summary { transition: opacity 0.2s ease 0.4s; }
    .out.stale > .body { opacity: 0.35; filter: grayscale(0.7); transition: none; }
    .stale-badge { position: sticky; top: 0; z-index: 2; margin: 0.4rem 0; padding: 0.35rem 0.6rem; background: #fde2d6; border: 2px solid #D55E00; font-weight: 600; }
    .stale-badge button { margin-left: 0.5rem; font-weight: normal; }
    .explorer-z input { width: 5rem; }
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
    this.addEventListener('keydown', this.onKey);
    this.addEventListener('input', this.onInput);
  }

  disconnectedCallback(): void {
    super.disconnectedCallback();
    window.removeEventListener('hashchange', this.onHash);
    this.removeEventListener('keydown', this.onKey);
    this.removeEventListener('input', this.onInput);
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
        this.open(rec.sample_csv, rec.choices, 'open the link');
        this.notice = `State restored from the link.${notExactNote(rec)}`;
        return;
      } catch (e) {
        this.notice = `This share link could not be used: ${(e as Error).message}. The saved or demo state was loaded instead.`;
      }
    }
    const saved = loadSaved(localStorage);
    if (saved.record) {
      this.open(saved.record.sample_csv, saved.record.choices, 'open the saved state');
      const note = notExactNote(saved.record);
      if (note) this.notice = `Saved state restored.${note}`;
    } else if (saved.problem) this.notice = `Note: ${saved.problem}.`;
  }

  /** A state opened from a link or the saved state starts a fresh history. */
  private open(csv: string, choices: AuditChoices, what: string): void {
    this.hist = startHistory({ csv, choices, what });
    this.invalid = {};
  }

  /** A new state of the bench (undoable); runs the audit, and the explorer if the physics changed. */
  private commit(csv: string, choices: PanelChoices, what: string): void {
    const before = this.hist.present;
    this.hist = record(this.hist, { csv, choices, what }, HISTORY_LIMITS, sameBench);
    this.changed(before);
  }

  private changed(before: Bench): void {
    const now = this.hist.present;
    if (now === before) return;
    this.schedule();
    const physics = (c: AuditChoices) => JSON.stringify([c.cosmology, c.transfer]);
    if (physics(now.choices) !== physics(before.choices)) void this.loadExplorer();
  }

  /** Undoes the last edit of the sample, survey or choices. */
  undo(): void {
    if (!canUndo(this.hist)) return;
    const before = this.hist.present;
    this.hist = undo(this.hist);
    this.said = `Undone: ${before.what}.`;
    this.changed(before);
  }

  redo(): void {
    if (!canRedo(this.hist)) return;
    const before = this.hist.present;
    this.hist = redo(this.hist);
    this.said = `Redone: ${this.hist.present.what}.`;
    this.changed(before);
  }

  /** Brings back the invented demo sample and its field (undoable). */
  private restoreDemo(): void {
    if (this.csv === DEMO_SAMPLE_CSV && this.choices.survey.name === DEMO_SURVEY.name) {
      this.said = 'The demo sample is already on the bench.';
      return;
    }
    this.commit(DEMO_SAMPLE_CSV, { ...this.choices, survey: DEMO_SURVEY, surveys: [], zBins: [] }, 'restore the demo sample');
    this.said = 'The demo sample and its field are back; Undo returns to your sample.';
  }

  private onInput = (e: Event): void => {
    this.typing.add(e.composedPath()[0]);
  };

  /**
   * Ctrl/Cmd-Z undoes, Shift-Ctrl/Cmd-Z (or Ctrl-Y) redoes, except inside a field whose text differs from
   * the value it shows (`data-v`, set by the elements), or a text box typed into: there the field's own
   * undo applies.
   */
  private onKey = (e: KeyboardEvent): void => {
    if (!(e.ctrlKey || e.metaKey) || e.altKey) return;
    const k = e.key.toLowerCase();
    const isUndo = k === 'z' && !e.shiftKey;
    const isRedo = (k === 'z' && e.shiftKey) || (k === 'y' && !e.shiftKey);
    if (!isUndo && !isRedo) return;
    const t = e.composedPath()[0];
    const typing = t instanceof HTMLInputElement && (t.dataset.v !== undefined ? t.value !== t.dataset.v : this.typing.has(t));
    if (t instanceof HTMLTextAreaElement || typing) return;
    e.preventDefault();
    if (isUndo) this.undo();
    else this.redo();
  };

  /** Runs the audit after `delay` ms of quiet; with no delay at once, so the workers start before the page redraws. */
  private schedule(delay = 0): void {
    clearTimeout(this.timer);
    const go = (): void => {
      void this.controller?.run(this.csv, this.choices); // the request goes out first; the saved state after it
      save(localStorage, makeRecord(this.csv, this.choices));
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
      this.explorer = explorerFigure(r.log10M, r.series, z, `H0 = ${c.h0}, Ωm = ${c.omegaM}, σ8 = ${c.sigma8}`, this.choices.transfer.kind);
    } catch (e) {
      this.notice = `halo-abundance explorer: ${(e as Error).message}`;
    }
  }

  /** The headline IMF's intrinsic UV slope for the chosen SFH at 100 Myr, computed in the worker. */
  @state() private uv?: UvSlopeView;
  private uvKey = '';
  private readonly covParser = (text: string, name: string) => this.controller!.parseCovariance(text, name);

  private loadUvSlope(): void {
    const c = this.choices;
    const imf = headlineOf(c);
    const z = Math.round(((c.survey.zMin + c.survey.zMax) / 2) * 2) / 2;
    const key = JSON.stringify([imf, c.sfh, c.metallicity, z]);
    if (!this.controller || key === this.uvKey) return;
    this.uvKey = key;
    const base = { imf, sfh: c.sfh, ageMyr: 100, z };
    this.controller.uvSlope(imf, c.sfh, c.metallicity, 100, z).then(
      (beta) => {
        if (this.uvKey === key) this.uv = { ...base, beta };
      },
      (e: unknown) => {
        if (this.uvKey === key) this.uv = { ...base, message: (e as Error).message };
      },
    );
  }

  /** The galaxy of the IMF figure and the map: the selected one, else the first audited. */
  private chosenIndex(): number {
    const gs = this.ctl.response?.result?.galaxies ?? [];
    const i = gs.findIndex((g) => g.id === this.selected && g.status === 'ok');
    return i >= 0 ? i : gs.findIndex((g) => g.status === 'ok');
  }

  /** Asks the worker for the map of the chosen galaxy when the response or the choice of galaxy changed. */
  private loadMap(): void {
    const resp = this.ctl.response;
    const r = resp?.result;
    if (!resp || !r || this.ctl.status !== 'done' || !this.controller) return;
    const i = this.chosenIndex();
    const key = i < 0 ? `${resp.id}|` : `${resp.id}|${r.galaxies[i].id}`;
    if (key === this.mapView.key) return;
    if (i < 0) {
      this.mapView = { key, busy: false, message: 'no audited galaxy to map' };
      return;
    }
    this.mapView = { ...this.mapView, key, busy: true, message: '' };
    this.controller.map(r.record.sample_csv, r.record.choices, i).then(
      (map) => {
        if (this.mapView.key === key) this.mapView = { key, map, busy: false, message: '' };
      },
      (e: unknown) => {
        if (this.mapView.key === key) this.mapView = { key, busy: false, message: `map of ${r.galaxies[i].id}: ${(e as Error).message}` };
      },
    );
  }

  /** Derived state of the response on show: the last summary, the rows' problems, the figure models. */
  protected willUpdate(): void {
    const resp = this.ctl.response;
    const result = resp?.result;
    if (resp?.markdown !== undefined) this.summaryShown = resp.markdown;
    if (this.problemCache.result !== result) {
      const problems = result ? result.galaxies.flatMap((g) => g.errors) : [];
      this.problemCache = { result, problems: keepSameProblems(this.problemCache.problems, problems) };
    }
    if (!result || !resp?.curves || !resp.points) this.figCache = undefined;
    else {
      const c = this.figCache;
      if (!c || c.id !== resp.id || c.selected !== this.selected) {
        // a first look and the whole audit that follows share an id: their figures are the same
        const old = c && c.id === resp.id ? c.figs : undefined;
        const figs = [old?.[0] ?? massRedshiftFigure(result, resp.curves, resp.points), old?.[1] ?? densityFigure(result), galaxyImfFigure(result, this.selected)];
        this.figCache = { id: resp.id, selected: this.selected, figs };
      }
    }
  }

  /** Resolves once every figure on show has drawn what this update gave it. */
  private figuresDrawn(): Promise<unknown> {
    return figureElements().then(() => Promise.all([...this.renderRoot.querySelectorAll('audit-chart')].map((c) => c.updateComplete)));
  }

  protected updated(): void {
    // Under a first look the map is asked for once its figures are drawn: the page's drawing then shares
    // the cores with the worker of the whole audit only, not with the map's too.
    if (this.ctl.settling) void this.figuresDrawn().then(() => this.loadMap());
    else this.loadMap();
    this.loadUvSlope();
    const resp = this.ctl.response;
    if (resp && this.ctl.status === 'done' && !this.ctl.settling && resp.id !== this.lastShown) {
      this.lastShown = resp.id;
      void this.figuresDrawn()
        .then(() =>
        this.dispatchEvent(new CustomEvent('audit-complete', { detail: { id: resp.id, elapsedMs: resp.elapsedMs }, bubbles: true, composed: true })),
      );
    }
  }

  private onSample(e: CustomEvent<{ csv: string; what?: string; fileName?: string }>): void {
    this.commit(e.detail.csv, this.choices, e.detail.what ?? 'edit the sample');
    if (e.detail.fileName && this.choices.survey.name === DEMO_SURVEY.name) {
      const s = this.choices.survey;
      this.notice = `${e.detail.fileName} is audited in the demo field "${s.name}" (${s.areaArcmin2} arcmin², ${s.zMin} < z < ${s.zMax}); set your own survey under Survey.`;
    }
  }

  private onChoices(e: CustomEvent<{ choices: PanelChoices }>): void {
    this.commit(this.csv, e.detail.choices, 'change a choice');
  }

  private onSurvey(e: CustomEvent<SurveyChoices>): void {
    this.commit(this.csv, { ...this.choices, ...e.detail }, 'edit the survey');
  }

  private onValidity(e: CustomEvent<{ source: string; problems: readonly Invalid[] }>): void {
    this.invalid = { ...this.invalid, [e.detail.source]: e.detail.problems };
  }

  private focusById(id: string): void {
    const el = this.renderRoot.querySelector<HTMLElement>(`#${id}`);
    el?.focus();
    el?.scrollIntoView({ block: 'start' });
  }

  private async importRecord(e: Event): Promise<void> {
    const input = e.target as HTMLInputElement;
    const f = input.files?.[0];
    input.value = '';
    if (!f) return;
    try {
      const rec = recordFromJson(await f.text());
      this.commit(rec.sample_csv, rec.choices, `import ${f.name}`);
      this.notice = `Restored ${f.name} (Undo returns to the previous state).${notExactNote(rec)}`;
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

  /** Whether the results on show were computed from the inputs on the bench now. */
  private upToDate(): boolean {
    const rec = this.ctl.response?.result?.record;
    return !!rec && rec.sample_csv === this.csv && choicesKey(rec.choices) === choicesKey(this.choices);
  }

  render() {
    const resp = this.ctl.response;
    const result = resp?.result;
    const problems = this.problemCache.problems;
    const figs = this.figCache?.figs ?? [];
    const invalid = Object.values(this.invalid).flat();
    const stale = !!result && invalid.length > 0;
    const pending = !!result && !stale && !this.upToDate();
    // Behind: the results are for earlier inputs and no run is on its way (it was cancelled, or it failed).
    const behind = pending && this.ctl.status !== 'running';
    const outClass = stale ? 'stale' : pending ? 'pending' : '';
    const staleText = stale
      ? `The results, figures and summary below are out of date: ${invalid.map((p) => p.message).join('; ')}. Fix the highlighted choice to update them.`
      : behind
        ? 'The results below are for earlier inputs: the run for your latest edit did not finish. Run again to update them.'
        : pending
          ? 'The results below are being updated for your latest edit.'
        : '';
    const h = this.hist;
    // A first look: the galaxies in tension lack what it would take, and the reports are on their way.
    const firstLook = resp?.reconcileLeftOut ?? 0;
    return html`
      <header>
        <h1>Baryon Audit</h1>
        <p class="caution">Can ΛCDM's haloes hold these stars? Results depend on the assumed stellar population (IMF, star-formation history, dust), the redshifts and the cosmology; this audit complements, not replaces, full spectral fitting and spectroscopic confirmation.</p>
      </header>
      <main>
        <section aria-label="inputs">
          <h2 id="sample-heading" tabindex="-1">Sample</h2>
          <a class="skip" href="#survey-heading" @click=${(e: Event) => {
            e.preventDefault();
            this.focusById('survey-heading');
          }}>Skip the sample table</a>
          <div class="bench" role="toolbar" aria-label="edit history">
            <button type="button" aria-label="Undo" title=${canUndo(h) ? `Undo: ${h.present.what} (Ctrl+Z)` : 'nothing to undo'} ?disabled=${!canUndo(h)} @click=${() => this.undo()}>↶ Undo</button>
            <button type="button" aria-label="Redo" title=${canRedo(h) ? `Redo: ${h.future[0].what} (Shift+Ctrl+Z)` : 'nothing to redo'} ?disabled=${!canRedo(h)} @click=${() => this.redo()}>↷ Redo</button>
            <button type="button" @click=${() => this.restoreDemo()}>Demo sample</button>
            <span class="last">${canUndo(h) ? `last edit: ${h.present.what}` : 'no edits yet'} · Ctrl/⌘+Z undoes, Shift+Ctrl/⌘+Z redoes</span>
          </div>
          <p class="visually-hidden" role="status">${this.said}</p>
          <sample-editor .csv=${this.csv} .problems=${problems} @sample-change=${this.onSample}></sample-editor>
          <h2 id="survey-heading" tabindex="-1">Survey</h2>
          <survey-editor .value=${{ survey: this.choices.survey, surveys: this.choices.surveys, zBins: this.choices.zBins }} @survey-change=${this.onSurvey} @choices-validity=${this.onValidity}></survey-editor>
          <h2 id="choices-heading" tabindex="-1">Choices</h2>
          <choice-panel .choices=${this.choices} .uvSlope=${this.uv} .covarianceParser=${this.covParser} @choices-change=${this.onChoices} @choices-validity=${this.onValidity}></choice-panel>
        </section>
        <section aria-label="results">
          ${this.notice ? html`<p class="notice" role="status">${this.notice} <button type="button" @click=${() => (this.notice = '')}>dismiss</button></p>` : nothing}
          <div class="status" role="status" aria-live="polite">
            ${this.ctl.status === 'running'
              ? html`<span>Auditing… ${this.ctl.done}/${this.ctl.total || '?'} rows</span><progress max=${this.ctl.total || 1} value=${this.ctl.done}></progress>${this.ctl.rowsPerSecond
                    ? html`<span class="rate">${this.ctl.rowsPerSecond.toFixed(0)} rows/s, about ${Math.ceil(this.ctl.secondsLeft ?? 0)} s left</span>`
                    : nothing}<button type="button" @click=${() => this.controller?.cancel()}>Cancel</button>`
              : this.ctl.status === 'done' && resp
                ? html`<span>Audited ${result!.sample.accepted} galaxies (${result!.sample.rejected} rejected) in ${(resp.elapsedMs / 1000).toFixed(2)} s.</span>${firstLook
                    ? html`<span class="rate">${this.ctl.settling ? `Working out what it would take for ${firstLook} in tension…` : `What it would take for ${firstLook} in tension was not worked out: the run stopped first.`}</span>`
                    : nothing}`
                : nothing}
          </div>
          ${this.ctl.message && this.ctl.status !== 'error' && !/restarted/.test(this.ctl.message)
            ? html`<p class="notice" role="status">${this.ctl.message}${behind
                  ? html`; the results below are for earlier inputs. <button type="button" @click=${() => this.schedule(0)}>Run again with the current inputs</button>`
                  : nothing}</p>`
            : nothing}
          ${this.ctl.message && (this.ctl.status === 'error' || /restarted/.test(this.ctl.message))
            ? html`<p class="error" role="alert">${this.ctl.message} Your sample and choices are kept as you left them.
                <button type="button" @click=${() => this.schedule(0)}>Run again with the current inputs</button></p>`
            : nothing}
          <p class="visually-hidden" aria-live="polite" id="stale-text">${staleText}</p>
          <div class="out ${outClass}" data-state=${stale ? 'out-of-date' : behind ? 'behind' : pending ? 'updating' : 'current'}>
            ${stale
              ? html`<p class="stale-badge" aria-hidden="true">out of date — fix the highlighted choice
                  <button type="button" @click=${() => this.focusFirstInvalid()}>go to it</button></p>`
              : nothing}
            <div class="body" aria-describedby="stale-text">
              <h2>Per galaxy</h2>
              <results-table .result=${result} .selected=${this.selected} .reconcileLeftOut=${firstLook ? (this.ctl.settling ? 'coming' : 'stopped') : 'no'} @galaxy-select=${(e: CustomEvent<{ id: string }>) => (this.selected = e.detail.id)}></results-table>
              <h2>Figures</h2>
              <div class="figs" @download=${(e: CustomEvent<{ name: string; blob: Blob }>) => download(e.detail.name, e.detail.blob)}>
                ${figs.map((m) => html`<audit-chart .model=${m} .highlight=${this.selected}></audit-chart>`)}
                ${result ? html`<disputed-map-figure .map=${this.mapView.map} .result=${result} ?busy=${this.mapView.busy} .message=${this.mapView.message}></disputed-map-figure>` : nothing}
                <div>
                  <label class="explorer-z">explorer redshift <input type="number" min="0" max="30" step="0.5" .value=${String(this.explorerZ)} @change=${(e: Event) => {
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
                <button type="button" ?disabled=${!result || firstLook > 0} @click=${() => this.exportText('baryon-audit.json', JSON.stringify(result, null, 1), 'application/json')}>Full JSON record</button>
                <button type="button" ?disabled=${!resp?.markdown} @click=${() => this.exportText('baryon-audit.md', resp!.markdown!, 'text/markdown')}>Markdown summary</button>
                <button type="button" @click=${() => this.copyShare()}>Share link</button>
                <label class="button">Import JSON record…<input class="visually-hidden" type="file" accept=".json,application/json" @change=${this.importRecord} aria-label="Import a JSON record" /></label>
              </div>
              <h2>Summary</h2>
              <div class=${firstLook ? 'summary settling' : 'summary'}><audit-summary .markdown=${resp?.markdown ?? this.summaryShown}></audit-summary></div>
            </div>
          </div>
        </section>
      </main>
    `;
  }

  /** Focus on the first field marked invalid in the survey editor or the choice panel. */
  private focusFirstInvalid(): void {
    for (const tag of ['survey-editor', 'choice-panel']) {
      const el = this.renderRoot.querySelector(tag)?.shadowRoot?.querySelector<HTMLElement>('[aria-invalid="true"]');
      if (el) {
        el.focus();
        el.scrollIntoView({ block: 'center' });
        return;
      }
    }
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'baryon-audit-app': BaryonAuditApp;
  }
}
