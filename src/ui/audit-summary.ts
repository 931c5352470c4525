import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { summaryParts, type SummaryParts } from './summary-parts.js';

/** Paragraphs per block once all are shown: each block is laid out on its own, and only when near the view. */
const PER_BLOCK = 100;

/**
 * <audit-summary>: the Markdown summary as text. Long summaries (a large sample has one paragraph per
 * galaxy: megabytes of text) show the assumptions, the first galaxies, the sample verdict, the caution
 * and the references, with a button that shows the other galaxies' paragraphs. Those are added a block
 * at a time, one task each, and a block far from the view is not laid out (`content-visibility: auto`),
 * so neither step holds the page up.
 * Properties: `markdown`. Fires nothing.
 */
@customElement('audit-summary')
export class AuditSummary extends LitElement {
  @property() markdown = '';
  /** Blocks of hidden paragraphs on show (0: collapsed). */
  @state() private blocks = 0;
  private parts: SummaryParts = { head: '', hidden: [], tail: '' };
  /** The text of each block of hidden paragraphs, made when first shown. */
  private blockText: string[] = [];
  private timer?: ReturnType<typeof setTimeout>;

  static styles = css`
    :host { display: block; }
    .box { font-size: 0.85rem; background: #f7f7f7; padding: 0.6rem; border: 1px solid #ddd; }
    pre { white-space: pre-wrap; overflow-wrap: anywhere; margin: 0; font: inherit; font-family: monospace; }
    pre.block { content-visibility: auto; contain-intrinsic-size: auto 40rem; }
    .more { margin: 0.6rem 0; font-family: system-ui, sans-serif; }
    button { font: inherit; padding: 0.2rem 0.5rem; }
  `;

  protected willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('markdown')) {
      this.parts = summaryParts(this.markdown);
      this.blockText = [];
      this.blocks = 0;
      clearTimeout(this.timer);
    }
  }

  disconnectedCallback(): void {
    super.disconnectedCallback();
    clearTimeout(this.timer);
  }

  /** Shows the hidden paragraphs, one block per task. */
  private showAll(): void {
    const total = Math.ceil(this.parts.hidden.length / PER_BLOCK);
    const step = (): void => {
      this.blocks++;
      if (this.blocks < total) this.timer = setTimeout(step, 0);
    };
    step();
  }

  render() {
    const { head, hidden, tail } = this.parts;
    const total = Math.ceil(hidden.length / PER_BLOCK);
    for (let b = this.blockText.length; b < this.blocks; b++) this.blockText.push(hidden.slice(b * PER_BLOCK, (b + 1) * PER_BLOCK).join('\n\n') + '\n\n');
    const shown = this.blockText.slice(0, this.blocks);
    return html`<div class="box">
      <pre class="summary">${head}</pre>
      ${hidden.length && this.blocks === 0
        ? html`<p class="more">… ${hidden.length} more galaxy paragraphs (the whole text is in "Markdown summary" above).
            <button type="button" @click=${() => this.showAll()}>Show all ${hidden.length}</button></p>`
        : nothing}
      ${shown.map((t) => html`<pre class="block">${t}</pre>`)}
      ${hidden.length && this.blocks > 0 && this.blocks < total ? html`<p class="more" role="status">Showing ${Math.min(hidden.length, this.blocks * PER_BLOCK)} of ${hidden.length}…</p>` : nothing}
      ${tail ? html`<pre>${tail}</pre>` : nothing}
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'audit-summary': AuditSummary;
  }
}
