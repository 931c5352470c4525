import { LitElement, css, html, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import type { RowProblem } from '../core/audit/index.js';
import { csvFromGrid, gridFromCsv, gridFromPaste, type SampleGrid } from './sample-table.js';

/**
 * <sample-editor>: the sample as a table. Import by file picker or drag-and-drop, paste from a
 * spreadsheet, add, edit and delete rows inline. Cells named in `problems` are marked and carry the
 * reason; rejected rows stay visible. Fires `sample-change` (detail: { csv }) on every user edit.
 */
@customElement('sample-editor')
export class SampleEditor extends LitElement {
  @property() csv = '';
  @property({ attribute: false }) problems: readonly RowProblem[] = [];
  @state() private pasting = false;
  @state() private dragging = false;
  @state() private importError = '';

  static styles = css`
    :host { display: block; }
    .bar { display: flex; flex-wrap: wrap; gap: 0.5rem; align-items: center; margin-bottom: 0.5rem; }
    .scroll { overflow-x: auto; border: 1px solid #bbb; }
    .scroll.drag { outline: 3px dashed #0072B2; }
    table { border-collapse: collapse; font-size: 0.85rem; }
    th, td { border: 1px solid #ddd; padding: 0; }
    th { background: #f3f3f3; padding: 0.2rem 0.3rem; font-weight: 600; }
    input { width: 6.5em; border: 0; padding: 0.25rem; font: inherit; background: transparent; }
    td.bad input { background: #fde2d6; outline: 2px solid #D55E00; }
    tr.rejected td:first-child { border-left: 4px solid #D55E00; }
    .badge { font-size: 0.75rem; color: #fff; background: #D55E00; border-radius: 3px; padding: 0 0.3rem; }
    .msgs { font-size: 0.8rem; color: #8a2b00; margin: 0.3rem 0; padding-left: 1.2rem; }
    .visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip: rect(0 0 0 0); white-space: nowrap; }
    label.button, button { font: inherit; padding: 0.25rem 0.6rem; border: 1px solid #777; border-radius: 4px; background: #fafafa; cursor: pointer; }
    label.button:focus-within { outline: 2px solid #0072B2; }
    textarea { width: 100%; min-height: 6rem; font-family: monospace; }
  `;

  private get grid(): SampleGrid {
    return gridFromCsv(this.csv);
  }

  private emit(g: SampleGrid): void {
    const csv = csvFromGrid(g);
    this.csv = csv;
    this.dispatchEvent(new CustomEvent('sample-change', { detail: { csv }, bubbles: true, composed: true }));
  }

  private async importFile(file: File): Promise<void> {
    this.importError = '';
    try {
      const text = await file.text();
      if (!text.trim()) {
        this.importError = `${file.name} is empty`;
        return;
      }
      this.csv = text;
      this.dispatchEvent(new CustomEvent('sample-change', { detail: { csv: text, fileName: file.name }, bubbles: true, composed: true }));
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
    const g = gridFromPaste(ta.value);
    if (!g.header.length) {
      this.importError = 'nothing to paste: the first line must be the header';
      return;
    }
    this.pasting = false;
    this.emit(g);
  }

  private edit(r: number, c: number, value: string): void {
    const g = this.grid;
    const rows = g.rows.map((row) => [...row]);
    rows[r][c] = value;
    this.emit({ header: g.header, rows });
  }

  private addRow(): void {
    const g = this.grid;
    this.emit({ header: g.header, rows: [...g.rows, g.header.map(() => '')] });
  }

  private deleteRow(r: number): void {
    const g = this.grid;
    this.emit({ header: g.header, rows: g.rows.filter((_, i) => i !== r) });
  }

  render() {
    const g = this.grid;
    const byRow = new Map<number, RowProblem[]>();
    for (const p of this.problems) byRow.set(p.row, [...(byRow.get(p.row) ?? []), p]);
    return html`
      <div class="bar">
        <label class="button">Import CSV…<input class="visually-hidden" type="file" accept=".csv,text/csv,text/plain" @change=${this.onFile} aria-label="Import a sample CSV file" /></label>
        <button type="button" @click=${() => (this.pasting = !this.pasting)} aria-expanded=${this.pasting}>Paste from spreadsheet</button>
        <button type="button" @click=${this.addRow}>Add row</button>
        <span>${g.rows.length} rows · drop a CSV file on the table</span>
      </div>
      ${this.importError ? html`<p role="alert" class="msgs">${this.importError}</p>` : nothing}
      ${this.pasting
        ? html`<div><label>Paste rows with a header line (tab- or comma-separated)<textarea aria-label="Pasted rows"></textarea></label><button type="button" @click=${this.applyPaste}>Use pasted rows</button></div>`
        : nothing}
      <div
        class="scroll ${this.dragging ? 'drag' : ''}"
        @dragover=${(e: DragEvent) => {
          e.preventDefault();
          this.dragging = true;
        }}
        @dragleave=${() => (this.dragging = false)}
        @drop=${this.onDrop}
      >
        <table>
          <thead>
            <tr><th scope="col">row</th>${g.header.map((h) => html`<th scope="col">${h}</th>`)}<th scope="col"><span class="visually-hidden">delete</span></th></tr>
          </thead>
          <tbody>
            ${g.rows.map((row, r) => {
              const probs = byRow.get(r + 1) ?? [];
              const bad = new Map(probs.map((p) => [p.column, p.reason]));
              return html`<tr class=${probs.length ? 'rejected' : ''} data-row=${r + 1}>
                  <td>${r + 1} ${probs.length ? html`<span class="badge" title=${probs.map((p) => `${p.column}: ${p.reason}`).join('\n')}>rejected</span>` : nothing}</td>
                  ${row.map((cell, c) => {
                    const col = g.header[c];
                    const reason = bad.get(col) ?? [...bad.entries()].find(([k]) => k.split('/').includes(col))?.[1];
                    return html`<td class=${reason ? 'bad' : ''}><input
                        .value=${cell}
                        aria-label=${`row ${r + 1}, ${col}`}
                        aria-invalid=${reason ? 'true' : 'false'}
                        title=${reason ?? ''}
                        @change=${(e: Event) => this.edit(r, c, (e.target as HTMLInputElement).value)}
                      /></td>`;
                  })}
                  <td><button type="button" aria-label=${`delete row ${r + 1}`} @click=${() => this.deleteRow(r)}>✕</button></td>
                </tr>
                ${probs.length ? html`<tr class="rejected"><td colspan=${g.header.length + 2}><ul class="msgs">${probs.map((p) => html`<li>row ${p.row}, ${p.column}: ${p.reason}</li>`)}</ul></td></tr>` : nothing}`;
            })}
          </tbody>
        </table>
      </div>
    `;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'sample-editor': SampleEditor;
  }
}
