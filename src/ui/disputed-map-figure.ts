import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import type { AuditResult } from '../core/audit/index.js';
import type { DisputedMap } from '../core/audit/disputed-map.js';
import { mapCaption, mapTitle } from './chart/disputed-map-caption.js';
import { mapScene, mapSvg, SCREEN_FONTS, type Scene } from './chart/disputed-map-scene.js';
import { pixelsFor, withDpi } from './chart/png-dpi.js';
import { COLUMN_MM } from './chart/svg-export.js';

/**
 * <disputed-map-figure>: the fifth figure, the median ε_req of one galaxy over redshift × IMF slope as a
 * colour map (canvas on screen; uPlot has no heatmaps) with the ε = 1 and ε = ε_ref contours and the galaxy's
 * position. Exports PNG (print width and dpi, the dpi written in the file) and SVG, as the other figures.
 * Properties: `map` (from the worker), `result` (for the caption), `busy`, `message`.
 * Fires `map-drawn` (detail: { id, cells, contours: { eps, lines }[] }) after drawing, and
 * `download` (detail: { name, blob }) for an export.
 */
@customElement('disputed-map-figure')
export class DisputedMapFigure extends LitElement {
  @property({ attribute: false }) map?: DisputedMap;
  @property({ attribute: false }) result?: AuditResult;
  @property({ type: Boolean }) busy = false;
  @property() message = '';
  @state() widthMm: number = COLUMN_MM.double;
  @state() dpi = 300;
  private caption = '';
  private title_ = '';
  private resize?: ResizeObserver;
  private cssWidth = 0;

  static styles = css`
    :host { display: block; margin: 0.4rem 0 1rem; }
    .bar { display: flex; flex-wrap: wrap; gap: 0.4rem 0.8rem; align-items: center; font-size: 0.82rem; margin-bottom: 0.3rem; }
    canvas { display: block; width: 100%; }
    .note { font-size: 0.82rem; color: #333; }
    figcaption { font-size: 0.8rem; color: #222; margin-top: 0.2rem; }
  `;

  protected willUpdate(changed: PropertyValues): void {
    if ((changed.has('map') || changed.has('result')) && this.map && this.result) {
      this.caption = mapCaption(this.map, this.result);
      this.title_ = mapTitle(this.map);
    }
  }

  connectedCallback(): void {
    super.connectedCallback();
    if (typeof ResizeObserver !== 'undefined')
      this.resize = new ResizeObserver(() => {
        if (Math.abs(this.clientWidth - this.cssWidth) > 4) this.draw();
      });
    this.resize?.observe(this);
  }

  disconnectedCallback(): void {
    super.disconnectedCallback();
    this.resize?.disconnect();
  }

  render() {
    const m = this.map;
    return html`<figure>
      <div class="bar">
        <strong>${m ? this.title_ : 'ε_req over redshift and IMF slope'}</strong>
        ${this.busy ? html`<span class="note" role="status">computing the map…</span>` : nothing}
        <label>export width <select aria-label="export width of the map" @change=${(e: Event) => (this.widthMm = Number((e.target as HTMLSelectElement).value))}>
          <option value=${COLUMN_MM.double} ?selected=${this.widthMm === COLUMN_MM.double}>${COLUMN_MM.double} mm (two columns)</option>
          <option value=${COLUMN_MM.single} ?selected=${this.widthMm === COLUMN_MM.single}>${COLUMN_MM.single} mm (one column)</option>
        </select></label>
        <label>PNG <select aria-label="PNG resolution of the map" @change=${(e: Event) => (this.dpi = Number((e.target as HTMLSelectElement).value))}>
          <option value="300" ?selected=${this.dpi === 300}>300 dpi</option>
          <option value="600" ?selected=${this.dpi === 600}>600 dpi</option>
        </select></label>
        <button type="button" ?disabled=${!m} @click=${() => this.exportPng()}>PNG</button>
        <button type="button" ?disabled=${!m} @click=${() => this.exportSvg()}>SVG</button>
      </div>
      ${this.message ? html`<p class="note" role="alert">${this.message}</p>` : nothing}
      <canvas role="img" aria-label=${m ? `${this.title_}. ${this.caption}` : 'no map yet'}></canvas>
      ${m ? html`<figcaption>${this.caption}</figcaption>` : nothing}
    </figure>`;
  }

  protected updated(): void {
    this.draw();
  }

  /** Draws the map at the element's width (device pixels for a sharp screen). */
  private draw(): void {
    const canvas = this.renderRoot.querySelector('canvas');
    const m = this.map;
    if (!canvas) return;
    this.cssWidth = this.clientWidth;
    if (!m || this.cssWidth <= 0) {
      canvas.width = 0;
      canvas.height = 0;
      return;
    }
    const sc = mapScene(m, this.cssWidth, SCREEN_FONTS, '');
    const dpr = globalThis.devicePixelRatio || 1;
    canvas.width = Math.round(sc.width * dpr);
    canvas.height = Math.round(sc.height * dpr);
    const ctx = canvas.getContext('2d');
    if (!ctx) return;
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    paint(ctx, sc);
    const lines = (cls: string): number => sc.lines.filter((l) => l.cls === cls).length;
    this.dispatchEvent(
      new CustomEvent('map-drawn', { detail: { id: m.id, cells: m.z.length * m.slope.length, contours: m.contours.map((c) => ({ eps: c.eps, lines: lines(c.eps === 1 ? 'contour-eps1' : 'contour-ref') })) }, bubbles: true, composed: true }),
    );
  }

  /** The figure as a standalone SVG document at print size (width in mm, fonts in pt), with its caption. */
  svg(widthMm = this.widthMm): string {
    return this.map ? mapSvg(this.map, widthMm, this.title_, this.caption).svg : '';
  }

  /** The figure as a PNG at a print width and resolution (pixels across = width / 25.4 mm × dpi), dpi in the file. */
  async png(widthMm = this.widthMm, dpi = this.dpi): Promise<Blob> {
    if (!this.map) throw new Error('no map drawn yet');
    const w = pixelsFor(widthMm, dpi);
    const pt = (widthMm / 25.4) * 72;
    const { heightPt } = mapSvg(this.map, widthMm, this.title_, this.caption);
    const h = Math.round((heightPt * w) / pt);
    const out = document.createElement('canvas');
    out.width = w;
    out.height = h;
    const ctx = out.getContext('2d')!;
    ctx.setTransform(w / pt, 0, 0, w / pt, 0, 0);
    const sc = mapScene(this.map, pt, { tick: 7, label: 8, legend: 7, caption: 7, title: 8.5 }, this.title_, this.caption);
    paint(ctx, sc);
    const blob = await new Promise<Blob>((resolve, reject) => out.toBlob((b) => (b ? resolve(b) : reject(new Error('PNG encoding failed'))), 'image/png'));
    return new Blob([withDpi(new Uint8Array(await blob.arrayBuffer()), dpi) as Uint8Array<ArrayBuffer>], { type: 'image/png' });
  }

  private async exportPng(): Promise<void> {
    try {
      const blob = await this.png();
      this.dispatchEvent(new CustomEvent('download', { detail: { name: `map-${this.map!.id}-${this.widthMm}mm-${this.dpi}dpi.png`, blob }, bubbles: true, composed: true }));
    } catch (e) {
      this.message = `PNG export: ${(e as Error).message}`;
    }
  }

  private exportSvg(): void {
    const blob = new Blob([this.svg()], { type: 'image/svg+xml' });
    this.dispatchEvent(new CustomEvent('download', { detail: { name: `map-${this.map!.id}-${this.widthMm}mm.svg`, blob }, bubbles: true, composed: true }));
  }
}

/** Draws a scene on a 2D context (white background first). */
function paint(ctx: CanvasRenderingContext2D, sc: Scene): void {
  ctx.fillStyle = '#fff';
  ctx.fillRect(0, 0, sc.width, sc.height);
  for (const c of sc.cells) {
    ctx.fillStyle = c.fill;
    ctx.fillRect(c.x, c.y, c.w, c.h);
  }
  ctx.strokeStyle = '#000';
  ctx.lineWidth = 0.6;
  for (const f of sc.frames) ctx.strokeRect(f.x, f.y, f.w, f.h);
  ctx.lineJoin = 'round';
  for (const l of sc.lines) {
    ctx.beginPath();
    l.pts.forEach(([x, y], i) => (i ? ctx.lineTo(x, y) : ctx.moveTo(x, y)));
    ctx.strokeStyle = l.stroke;
    ctx.lineWidth = l.width;
    ctx.setLineDash(l.dash as number[]);
    ctx.stroke();
  }
  ctx.setLineDash([]);
  for (const m of sc.marks) {
    ctx.beginPath();
    ctx.arc(m.x, m.y, m.r, 0, 2 * Math.PI);
    ctx.fillStyle = '#fff';
    ctx.fill();
    ctx.lineWidth = 1.2;
    ctx.strokeStyle = '#000';
    ctx.stroke();
  }
  ctx.fillStyle = '#000';
  for (const t of sc.texts) {
    ctx.font = `${t.bold ? 'bold ' : ''}${t.size}px Helvetica, Arial, sans-serif`;
    ctx.textAlign = t.anchor === 'middle' ? 'center' : t.anchor === 'end' ? 'right' : 'left';
    if (t.rotate) {
      ctx.save();
      ctx.translate(t.x, t.y);
      ctx.rotate(-Math.PI / 2);
      ctx.fillText(t.text, 0, 0);
      ctx.restore();
    } else ctx.fillText(t.text, t.x, t.y);
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'disputed-map-figure': DisputedMapFigure;
  }
}
