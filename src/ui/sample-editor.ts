import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { repeat } from 'lit/directives/repeat.js';
import type { RowProblem } from '../core/audit/index.js';
import { decodeText } from '../core/audit/text-decoding.js';
import { FieldHelp, helpStyles } from './field-help.js';
import { fieldValue } from './field-value.js';
import { appendWithHeader, readPasteBlock } from './paste-block.js';
import { auditRowNumbers, csvFromGrid, gridFromCsv, isBlankRow, type SampleGrid } from './sample-table.js';

/** Samples up to this many rows are drawn whole; larger ones only the rows in view (plus a margin). */
const DRAW_ALL_ROWS = 100;
const OVERSCAN = 8;
/** Problems listed under the table (each one also sits on its cell). */
const LIST_PROBLEMS = 30;

/** Which cells of a table row a problem names ('(row)' names the row; 'a/b' names either column). */
function problemColumn(p: RowProblem, header: readonly string[]): number {
  const i = header.indexOf(p.column);
  if (i >= 0) return i;
  const alt = p.column.split('/').map((k) => header.indexOf(k)).find((j) => j >= 0);
  return alt ?? -1;
}

/**
 * <sample-editor>: the sample as a table. Import by file picker or drag-and-drop, paste a block from a
 * spreadsheet (appended; a block headed by other columns asks whether to replace or append), add, edit
 * and delete rows inline. Cells named in `problems` are marked and carry the reason (shown on focus too);
 * rejected rows stay visible. The text being typed into a cell stays until it is committed (Enter, leaving
 * the cell) or undone (Escape), whatever re-renders the table meanwhile (fieldValue). The grid is one tab
 * stop: arrow keys, Page Up/Down, Ctrl+Home/End and Enter move between cells. Large samples draw only the rows in view.
 * Fires `sample-change` (detail: { csv, what, fileName? }) on every user edit; `what` names the edit.
 */
@customElement('sample-editor')
export class SampleEditor extends LitElement {
  @property() csv = '';
  @property({ attribute: false }) problems: readonly RowProblem[] = [];
  @state() private pasting = false;
  @state() private ask?: { header: string[]; rows: string[][] };
  @state() private pasteError = '';
  @state() private dragging = false;
  @state() private importError = '';
  @state() private first = 0;
  @state() private active = { r: 0, c: 0 };
  @state() private said = '';
  private grid: SampleGrid = { header: ['id', 'z', 'muv'], rows: [] };
  private gridCsv: string | undefined;
  private rowH = 29;
  private headH = 30;
  private viewH = 0;
  /** Table row index → its problems; and the list of all, in table order. */
  private byRow = new Map<number, RowProblem[]>();
  private allProblems: { r: number; c: number; p: RowProblem }[] = [];
  private blank = 0;
  private readonly help = new FieldHelp(this);

  static styles = [
    helpStyles,
    css`
      :host { display: block; }
      .bar { display: flex; flex-wrap: wrap; gap: 0.5rem; align-items: center; margin-bottom: 0.5rem; }
      .scroll { position: relative; overflow: auto; max-height: 26rem; border: 1px solid #bbb; }
      .scroll.windowed { height: 26rem; }
      .scroll.drag { outline: 3px dashed #0072B2; }
      table { border-collapse: collapse; font-size: 0.85rem; }
      th, td { border: 1px solid #ddd; padding: 0; white-space: nowrap; }
      thead th { position: sticky; top: 0; z-index: 1; background: #f3f3f3; padding: 0.2rem 0.3rem; font-weight: 600; }
      td.num { padding: 0 0.3rem; color: #444; text-align: right; }
      tr.spacer td { border: 0; padding: 0; }
      input { width: 6.5em; border: 0; padding: 0.25rem; font: inherit; background: transparent; scroll-margin: 2.2rem 2rem 0.2rem 3rem; }
      input:focus { outline: 2px solid #0072B2; outline-offset: -2px; background: #fff; }
      td.bad input { background: #fde2d6; outline: 2px solid #D55E00; outline-offset: -2px; }
      tr.rejected td:first-child { border-left: 4px solid #D55E00; }
      .badge { font-size: 0.75rem; color: #fff; background: #D55E00; border-radius: 3px; padding: 0 0.3rem; }
      .blank { font-size: 0.75rem; color: #555; }
      .msgs { font-size: 0.8rem; color: #8a2b00; margin: 0.3rem 0; padding-left: 1.2rem; }
      .visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip-path: inset(50%); white-space: nowrap; }
      label.button, button { font: inherit; padding: 0.25rem 0.6rem; border: 1px solid #777; border-radius: 4px; background: #fafafa; cursor: pointer; }
      td button { padding: 0.1rem 0.4rem; border-color: #bbb; scroll-margin: 2.2rem 0.2rem 0.2rem 0.2rem; }
      button:focus-visible, td button:focus { outline: 2px solid #0072B2; }
      button.link { border: 0; background: none; padding: 0; text-decoration: underline; color: inherit; }
      label.button:focus-within { outline: 2px solid #0072B2; }
      .paste, .ask { border: 1px solid #bbb; padding: 0.4rem; margin: 0 0 0.5rem; }
      .ask { background: #fff8e6; }
      .paste label { display: block; }
      textarea { box-sizing: border-box; width: 100%; min-height: 6rem; font-family: monospace; }
      .row-buttons { display: flex; flex-wrap: wrap; gap: 0.4rem; margin-top: 0.3rem; }
      .said { font-size: 0.8rem; color: #333; margin: 0.2rem 0; min-height: 1em; }
    `,
  ];

  /** For tests and diagnostics: how many data rows are drawn now. */
  get drawnRows(): number {
    return this.renderRoot.querySelectorAll('tr[data-row]').length;
  }

  protected willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('csv') && this.csv !== this.gridCsv) {
      this.grid = gridFromCsv(this.csv);
      this.gridCsv = this.csv;
      this.active = { r: Math.min(this.active.r, Math.max(0, this.grid.rows.length - 1)), c: Math.min(this.active.c, this.grid.header.length) };
    }
    if (changed.has('csv') || changed.has('problems')) this.indexProblems();
  }

  private indexProblems(): void {
    const g = this.grid;
    const numbers = auditRowNumbers(g);
    const tableRow = new Map<number, number>();
    numbers.forEach((n, i) => n && tableRow.set(n, i));
    this.blank = numbers.reduce((a, n) => a + (n === 0 ? 1 : 0), 0);
    this.byRow = new Map();
    this.allProblems = [];
    for (const p of this.problems) {
      const r = tableRow.get(p.row);
      if (r === undefined) continue;
      this.byRow.set(r, [...(this.byRow.get(r) ?? []), p]);
      this.allProblems.push({ r, c: Math.max(0, problemColumn(p, g.header)), p });
    }
    this.allProblems.sort((a, b) => a.r - b.r || a.c - b.c);
  }

  private emit(g: SampleGrid, what: string, extra: Record<string, unknown> = {}): void {
    this.grid = g;
    this.gridCsv = csvFromGrid(g);
    this.csv = this.gridCsv;
    this.indexProblems();
    this.dispatchEvent(new CustomEvent('sample-change', { detail: { csv: this.gridCsv, what, ...extra }, bubbles: true, composed: true }));
  }

  private async importFile(file: File): Promise<void> {
    this.importError = '';
    try {
      // UTF-8 (BOM or not) and UTF-16 with a BOM, as the command line reads files; anything else is refused by name.
      const { text } = decodeText(new Uint8Array(await file.arrayBuffer()), file.name);
      if (!text.trim()) {
        this.importError = `${file.name} is empty`;
        return;
      }
      const grid = gridFromCsv(text);
      // A turn for the page between reading the file and handing the sample on (each a few tens of ms at 10⁴ rows).
      await new Promise((ok) => setTimeout(ok, 0));
      this.emit(grid, `import ${file.name}`, { fileName: file.name });
      this.said = `Imported ${file.name}: ${this.grid.rows.length} rows (Undo brings the previous sample back).`;
    } catch (e) {
      this.importError = `could not read ${file.name}: ${(e as Error).message}`;
    }
  }

  private onFile(e: Event): void {
    const input = e.target as HTMLInputElement;
    const f = input.files?.[0];
    if (f) void this.importFile(f);
    input.value = '';
  }

  private onDrop(e: DragEvent): void {
    e.preventDefault();
    this.dragging = false;
    const f = e.dataTransfer?.files?.[0];
    if (f) void this.importFile(f);
  }

  private applyPaste(): void {
    const ta = this.renderRoot.querySelector('textarea') as HTMLTextAreaElement;
    const g = this.grid;
    const block = readPasteBlock(ta.value, g.header);
    if (block.kind === 'empty') {
      this.pasteError = 'nothing to paste: the box is empty';
      return;
    }
    if (block.kind === 'error') {
      this.pasteError = block.message;
      return;
    }
    this.pasteError = '';
    if (block.kind === 'other-header') {
      if (!g.rows.length) this.replaceSample(block.header, block.rows);
      else this.ask = { header: block.header, rows: block.rows };
      return;
    }
    this.appendRows({ header: g.header, rows: [...g.rows, ...block.rows] }, block.rows.length);
  }

  private appendRows(next: SampleGrid, added: number): void {
    const from = this.grid.rows.length;
    this.pasting = false;
    this.ask = undefined;
    this.emit(next, `paste ${added} rows`);
    this.said = added ? `Added ${added} pasted rows as rows ${from + 1}–${from + added}.` : 'The pasted block held a header line only: no rows added.';
    if (added) void this.moveTo(from, 0);
  }

  private replaceSample(header: string[], rows: string[][]): void {
    this.pasting = false;
    this.ask = undefined;
    this.emit({ header, rows }, `replace the sample by ${rows.length} pasted rows`);
    this.said = `The sample is now the ${rows.length} pasted rows (Undo brings the previous sample back).`;
  }

  private edit(r: number, c: number, value: string): void {
    const g = this.grid;
    if (!g.rows[r] || g.rows[r][c] === value) return;
    const rows = g.rows.slice();
    const row = rows[r].slice();
    row[c] = value;
    rows[r] = row;
    this.emit({ header: g.header, rows }, `edit row ${r + 1}, ${g.header[c]}`);
  }

  private addRow(): void {
    const g = this.grid;
    this.emit({ header: g.header, rows: [...g.rows, g.header.map(() => '')] }, 'add a row');
    this.said = `Row ${g.rows.length + 1} added.`;
    void this.moveTo(g.rows.length, 0);
  }

  private deleteRow(r: number): void {
    const g = this.grid;
    const id = g.rows[r]?.[g.header.indexOf('id')] ?? '';
    this.emit({ header: g.header, rows: g.rows.filter((_, i) => i !== r) }, `delete row ${r + 1}`);
    this.said = `Row ${r + 1}${id ? ` (${id})` : ''} deleted.`;
    if (this.grid.rows.length) void this.moveTo(Math.min(r, this.grid.rows.length - 1), this.active.c);
  }

  // ---- windowing ----

  private get scroller(): HTMLElement | null {
    return this.renderRoot.querySelector('.scroll');
  }

  private get windowed(): boolean {
    return this.grid.rows.length > DRAW_ALL_ROWS;
  }

  private range(): [number, number] {
    const n = this.grid.rows.length;
    if (!this.windowed) return [0, n];
    const visible = Math.ceil((this.viewH || 420) / this.rowH);
    const start = Math.max(0, Math.min(this.first, n - visible) - OVERSCAN);
    return [start, Math.min(n, Math.max(this.first, 0) + visible + OVERSCAN)];
  }

  private firstFromScroll(el: HTMLElement): number {
    return Math.max(0, Math.floor(el.scrollTop / this.rowH));
  }

  private onScroll = (): void => {
    const el = this.scroller;
    if (!el || !this.windowed) return;
    const f = this.firstFromScroll(el);
    if (f !== this.first) {
      this.commitDraft();
      this.first = f;
    }
  };

  /** A cell being typed into that is about to be scrolled away keeps its text: commit it. */
  private commitDraft(): void {
    const a = (this.renderRoot as ShadowRoot).activeElement;
    if (a instanceof HTMLInputElement && a.dataset.r !== undefined) this.edit(Number(a.dataset.r), Number(a.dataset.c), a.value);
  }

  protected updated(): void {
    const el = this.scroller;
    if (!el) return;
    const rows = this.renderRoot.querySelectorAll<HTMLTableRowElement>('tr[data-row]');
    const head = this.renderRoot.querySelector('thead');
    if (head) this.headH = head.getBoundingClientRect().height;
    if (rows.length >= 2) {
      const h = rows[1].getBoundingClientRect().top - rows[0].getBoundingClientRect().top;
      if (h > 4 && Math.abs(h - this.rowH) > 0.25) {
        this.rowH = h;
        if (this.windowed) this.requestUpdate();
      }
    }
    if (this.viewH !== el.clientHeight) {
      this.viewH = el.clientHeight;
      if (this.windowed) this.requestUpdate();
    }
    const [start, end] = this.range();
    const top = this.renderRoot.querySelector<HTMLElement>('tr.spacer.top td');
    const bottom = this.renderRoot.querySelector<HTMLElement>('tr.spacer.bottom td');
    // Spacer heights through the CSSOM (the page's CSP forbids style attributes, not style properties).
    if (top) top.style.height = `${start * this.rowH}px`;
    if (bottom) bottom.style.height = `${(this.grid.rows.length - end) * this.rowH}px`;
  }

  // ---- keyboard: roving focus in the grid ----

  private cell(r: number, c: number): HTMLElement | null {
    return this.renderRoot.querySelector(`[data-r="${r}"][data-c="${c}"]`);
  }

  /** Moves the grid's focus to (r, c), scrolling the row into view (and drawing it) first. */
  async moveTo(r: number, c: number): Promise<void> {
    const n = this.grid.rows.length;
    if (!n) return;
    r = Math.max(0, Math.min(n - 1, r));
    c = Math.max(0, Math.min(this.grid.header.length, c));
    this.active = { r, c };
    const el = this.scroller;
    if (el && this.windowed) {
      const topY = r * this.rowH;
      const room = el.clientHeight - this.headH;
      if (topY < el.scrollTop) el.scrollTop = topY;
      else if (topY + this.rowH > el.scrollTop + room) el.scrollTop = topY + this.rowH - room;
      this.first = this.firstFromScroll(el);
    }
    await this.updateComplete;
    const target = this.cell(r, c);
    if (!target) return;
    target.focus({ preventScroll: true });
    target.scrollIntoView({ block: 'nearest', inline: 'nearest' });
    if (target instanceof HTMLInputElement) target.select();
  }

  private onGridFocus(e: FocusEvent): void {
    const t = e.composedPath()[0] as HTMLElement;
    if (t.dataset?.r === undefined) return;
    const r = Number(t.dataset.r);
    const c = Number(t.dataset.c);
    if (r !== this.active.r || c !== this.active.c) this.active = { r, c };
  }

  private onGridKey(e: KeyboardEvent): void {
    const t = e.composedPath()[0] as HTMLElement;
    if (t.dataset?.r === undefined || e.altKey) return;
    const r = Number(t.dataset.r);
    const c = Number(t.dataset.c);
    const input = t instanceof HTMLInputElement ? t : undefined;
    const len = input?.value.length ?? 0;
    const s = input?.selectionStart ?? 0;
    const eSel = input?.selectionEnd ?? 0;
    const whole = !input || (s === 0 && eSel === len);
    const atStart = whole || (s === 0 && eSel === 0);
    const atEnd = whole || (s === len && eSel === len);
    const page = Math.max(1, Math.floor(((this.scroller?.clientHeight ?? 400) - this.headH) / this.rowH) - 1);
    const mod = e.ctrlKey || e.metaKey;
    let to: [number, number] | undefined;
    switch (e.key) {
      case 'ArrowUp': to = [r - 1, c]; break;
      case 'ArrowDown': to = [r + 1, c]; break;
      case 'ArrowLeft': if (atStart) to = [r, c - 1]; break;
      case 'ArrowRight': if (atEnd) to = [r, c + 1]; break;
      case 'PageUp': to = [r - page, c]; break;
      case 'PageDown': to = [r + page, c]; break;
      case 'Home': if (mod) to = [0, c]; else if (!input) to = [r, 0]; break;
      case 'End': if (mod) to = [this.grid.rows.length - 1, c]; else if (!input) to = [r, this.grid.header.length]; break;
      case 'Enter':
        if (input) {
          this.edit(r, c, input.value);
          to = [r + (e.shiftKey ? -1 : 1), c];
        }
        break;
      case 'Escape':
        if (input) input.value = this.grid.rows[r]?.[c] ?? '';
        break;
    }
    if (to && (to[0] !== r || to[1] !== c)) {
      e.preventDefault();
      void this.moveTo(to[0], to[1]);
    } else if (to && (e.key === 'ArrowUp' || e.key === 'ArrowDown' || e.key.startsWith('Page'))) e.preventDefault();
  }

  // ---- rendering ----

  private renderRow(r: number) {
    const g = this.grid;
    const row = g.rows[r];
    const probs = this.byRow.get(r) ?? [];
    const bad = new Map<number, string>();
    for (const p of probs) {
      const c = problemColumn(p, g.header);
      if (c >= 0) bad.set(c, bad.has(c) ? `${bad.get(c)}; ${p.reason}` : p.reason);
    }
    const rowWide = probs.filter((p) => problemColumn(p, g.header) < 0);
    const tab = (c: number) => (r === this.active.r && c === this.active.c ? 0 : -1);
    return html`<tr class=${probs.length ? 'rejected' : ''} data-row=${r + 1} aria-rowindex=${r + 2}>
      <td class="num">${r + 1} ${probs.length ? html`<span class="badge" title=${probs.map((p) => `${p.column}: ${p.reason}`).join('\n')}>rejected</span>` : nothing}${isBlankRow(row) ? html`<span class="blank">blank, not audited</span>` : nothing}</td>
      ${row.map((cell, c) => {
        const col = g.header[c];
        const reason = bad.get(c) ?? (c === 0 && rowWide.length ? rowWide.map((p) => `${p.column}: ${p.reason}`).join('; ') : undefined);
        return html`<td class=${reason ? 'bad' : ''}><input
            data-r=${r}
            data-c=${c}
            tabindex=${tab(c)}
            .value=${fieldValue(cell)}
            data-v=${cell}
            aria-label=${`row ${r + 1}, ${col}`}
            aria-invalid=${reason ? 'true' : 'false'}
            title=${reason ?? ''}
            data-help=${reason ? `row ${r + 1}, ${col}: ${reason}` : ''}
            @change=${(e: Event) => this.edit(r, c, (e.target as HTMLInputElement).value)}
          /></td>`;
      })}
      <td><button type="button" data-r=${r} data-c=${g.header.length} tabindex=${tab(g.header.length)} aria-label=${`delete row ${r + 1}`} @click=${() => this.deleteRow(r)}>✕</button></td>
    </tr>`;
  }

  render() {
    const g = this.grid;
    const n = g.rows.length;
    const [start, end] = this.range();
    const idx = Array.from({ length: end - start }, (_, i) => start + i);
    const cols = g.header.length + 2;
    const shown = this.allProblems.slice(0, LIST_PROBLEMS);
    return html`
      <div class="bar">
        <label class="button">Import CSV…<input class="visually-hidden" type="file" accept=".csv,text/csv,text/plain" @change=${this.onFile} aria-label="Import a sample CSV file" /></label>
        <button type="button" @click=${() => { this.pasting = !this.pasting; this.ask = undefined; this.pasteError = ''; }} aria-expanded=${this.pasting}>Paste from spreadsheet</button>
        <button type="button" @click=${this.addRow}>Add row</button>
        <span>${n} rows${this.blank ? ` (${this.blank} blank)` : ''} · drop a CSV file on the table</span>
      </div>
      ${this.importError ? html`<p role="alert" class="msgs">${this.importError}</p>` : nothing}
      ${this.pasting
        ? html`<div class="paste">
            <label for="paste">Paste rows from a spreadsheet (tab- or comma-separated). They are added below the table; a first line of column names is recognised, and if it names other columns you choose whether to replace the sample or append.</label>
            <textarea id="paste" aria-label="Pasted rows" @input=${() => (this.pasteError = '')}></textarea>
            <div class="row-buttons"><button type="button" @click=${this.applyPaste}>Add pasted rows</button><button type="button" @click=${() => { this.pasting = false; this.ask = undefined; }}>Cancel</button></div>
            ${this.pasteError ? html`<p role="alert" class="msgs">${this.pasteError}</p>` : nothing}
          </div>`
        : nothing}
      ${this.ask
        ? html`<div class="ask" role="group" aria-labelledby="ask-text">
            <p id="ask-text">The pasted block names other columns (${this.ask.header.join(', ')}) than the table (${g.header.join(', ')}). Replace the sample with its ${this.ask.rows.length} rows, or append them (columns matched by name, new columns added)?</p>
            <div class="row-buttons">
              <button type="button" @click=${() => this.replaceSample(this.ask!.header, this.ask!.rows)}>Replace the sample</button>
              <button type="button" @click=${() => this.appendRows(appendWithHeader(g, this.ask!.header, this.ask!.rows), this.ask!.rows.length)}>Append the rows</button>
              <button type="button" @click=${() => (this.ask = undefined)}>Cancel</button>
            </div>
          </div>`
        : nothing}
      <p class="said" role="status">${this.said}</p>
      <div
        class="scroll ${this.dragging ? 'drag' : ''} ${this.windowed ? 'windowed' : ''}"
        @scroll=${this.onScroll}
        @dragover=${(e: DragEvent) => {
          e.preventDefault();
          this.dragging = true;
        }}
        @dragleave=${() => (this.dragging = false)}
        @drop=${this.onDrop}
      >
        <table role="grid" aria-label="sample" aria-rowcount=${n + 1} aria-colcount=${cols} @keydown=${this.onGridKey} @focusin=${this.onGridFocus}>
          <thead>
            <tr aria-rowindex="1"><th scope="col">row</th>${g.header.map((h) => html`<th scope="col">${h}</th>`)}<th scope="col"><span class="visually-hidden">delete</span></th></tr>
          </thead>
          <tbody>
            <tr class="spacer top" aria-hidden="true"><td colspan=${cols}></td></tr>
            ${repeat(idx, (r) => r, (r) => this.renderRow(r))}
            <tr class="spacer bottom" aria-hidden="true"><td colspan=${cols}></td></tr>
          </tbody>
        </table>
      </div>
      ${this.help.line()}
      ${shown.length
        ? html`<ul class="msgs" aria-label="problems in the sample">
            ${shown.map(({ r, c, p }) => html`<li><button type="button" class="link" @click=${() => this.moveTo(r, c)}>row ${r + 1}, ${p.column}</button>: ${p.reason}</li>`)}
            ${this.allProblems.length > shown.length ? html`<li>… and ${this.allProblems.length - shown.length} more (marked on their cells)</li>` : nothing}
          </ul>`
        : nothing}
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'sample-editor': SampleEditor;
  }
}
