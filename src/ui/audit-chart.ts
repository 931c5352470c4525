import { LitElement, css, html, type PropertyValues } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import uPlot from 'uplot';
import type { ChartModel, MarkerSet } from './chart/chart-config.js';
import { FULL_POINTS, labelPoints } from './chart/legibility.js';
import { barPaths, markerPaths, type PixelPoints } from './chart/marker-batch.js';
import { pixelsFor, withDpi } from './chart/png-dpi.js';
import { COLUMN_MM, layoutSvg, legendEntries, type SvgOptions } from './chart/svg-export.js';
import { lineSample, mark } from './verdict-marks.js';

/** Longest slice of overlay drawing in one task, ms (then the page gets a turn). */
const SLICE_MS = 40;

/** Figures with at most this many markers draw in the page's update, not in a task of their own. */
const SMALL_FIGURE = 500;

/** Markers of a model, over its sets. */
const markerCount = (m: ChartModel | undefined): number => (m ? m.markers.reduce((a, s) => a + s.x.length, 0) : 0);

/** The markers' extents on each axis (error bars included on y), computed once per model. */
const extents = new WeakMap<ChartModel, { x: [number, number]; y: [number, number] }>();
function markerExtents(m: ChartModel): { x: [number, number]; y: [number, number] } {
  let e = extents.get(m);
  if (!e) {
    const scan = (arrs: ArrayLike<number>[]): [number, number] => {
      let lo = Infinity;
      let hi = -Infinity;
      for (const a of arrs)
        for (let i = 0; i < a.length; i++) {
          const v = a[i];
          if (!Number.isFinite(v)) continue;
          if (v < lo) lo = v;
          if (v > hi) hi = v;
        }
      return [lo, hi];
    };
    e = { x: scan(m.markers.map((s) => s.x)), y: scan(m.markers.flatMap((s) => [s.y, s.yLo ?? [], s.yHi ?? []])) };
    extents.set(m, e);
  }
  return e;
}

/**
 * <audit-chart>: draws one ChartModel with uPlot (lines on a shared x axis; density layer, markers with error
 * bars, galaxies in tension on top, the highlighted galaxy ringed and labelled, in a draw hook). Re-draws with
 * setData when the series layout is unchanged. Exports PNG (at a print width and resolution, with the dpi
 * written into the file) and SVG at print size, both from the same SVG drawing.
 * Properties: `model`, `highlight` (a galaxy id to ring and label; the page passes its selected galaxy).
 * Fires `chart-drawn` after every draw (detail: { id, markers, labels }), `chart-error` if drawing fails and
 * `download` (detail: { name, blob }) for an export.
 */
@customElement('audit-chart')
export class AuditChart extends LitElement {
  @property({ attribute: false }) model?: ChartModel;
  @property() highlight = '';
  /** Print width of the exports, mm. */
  @state() widthMm: number = COLUMN_MM.single;
  /** Resolution of the PNG export, dots per inch. */
  @state() dpi = 300;
  @state() private withCaption = true;
  @state() private labelTension = false;

  private plot?: uPlot;
  private layoutKey = '';
  private layerCanvas?: HTMLCanvasElement;
  /** The draw waiting for its own task (see scheduleDraw), and what it will do. */
  private drawing?: Promise<void>;
  private drawKind: 'draw' | 'redraw' | undefined;
  /** The overlay being drawn in slices (see drawOverlay), and a counter that tells a stale one to stop. */
  private overlayDone?: Promise<void>;
  private overlayJob = 0;
  private resizeObserver?: ResizeObserver;

  static styles = css`
    :host { display: block; }
    figure { margin: 0; }
    figcaption { font-size: 0.85rem; color: #333; margin-top: 0.3rem; }
    .plot { width: 100%; min-height: 320px; }
    .tools { display: flex; flex-wrap: wrap; gap: 0.4rem 0.7rem; justify-content: flex-end; align-items: center; font-size: 0.82rem; }
    button, select { font: inherit; padding: 0.15rem 0.5rem; }
    h3 { font-size: 1rem; margin: 0.2rem 0; }
    .legend { list-style: none; display: flex; flex-wrap: wrap; gap: 0.2rem 0.9rem; padding: 0; margin: 0.2rem 0; font-size: 0.82rem; }
    .legend li { display: inline-flex; align-items: center; gap: 0.3rem; }
    svg.mark { flex: none; }
  `;

  render() {
    const m = this.model;
    const entries = m ? legendEntries(m) : [];
    return html`<link rel="stylesheet" href=${new URL('uPlot.min.css', import.meta.url).href} />
      <figure role="group" aria-label=${m?.title ?? 'figure'}>
        <h3>${m?.title ?? ''}</h3>
        <div class="plot" part="plot"></div>
        ${entries.length
          ? html`<ul class="legend" aria-label="legend">
              ${entries.map((e) => html`<li>${e.kind === 'line' ? lineSample(e.color, e.dash, e.width ?? 1.5) : mark(e.set.shape, e.set.color)}<span>${e.label}</span></li>`)}
            </ul>`
          : ''}
        <figcaption>${m?.caption ?? ''}${this.highlight && m?.markers.some((s) => s.ids?.includes(this.highlight)) ? ` Ringed and labelled: ${this.highlight}.` : ''}</figcaption>
        <div class="tools">
          ${m?.markers.some((s) => s.tension?.some((t) => t === 1))
            ? html`<label><input type="checkbox" .checked=${this.labelTension} @change=${(e: Event) => (this.labelTension = (e.target as HTMLInputElement).checked)} /> label galaxies in tension</label>`
            : ''}
          <label>export width <select aria-label="export width" @change=${(e: Event) => (this.widthMm = Number((e.target as HTMLSelectElement).value))}>
            <option value=${COLUMN_MM.single} ?selected=${this.widthMm === COLUMN_MM.single}>single column, 88 mm</option>
            <option value=${COLUMN_MM.double} ?selected=${this.widthMm === COLUMN_MM.double}>double column, 180 mm</option>
          </select></label>
          <label>PNG <select aria-label="PNG resolution" @change=${(e: Event) => (this.dpi = Number((e.target as HTMLSelectElement).value))}>
            <option value="300" ?selected=${this.dpi === 300}>300 dpi</option>
            <option value="600" ?selected=${this.dpi === 600}>600 dpi</option>
          </select></label>
          <label><input type="checkbox" .checked=${this.withCaption} @change=${(e: Event) => (this.withCaption = (e.target as HTMLInputElement).checked)} /> title and caption in the file</label>
          <button type="button" @click=${() => this.exportPng()} ?disabled=${!m}>PNG</button>
          <button type="button" @click=${() => this.exportSvg()} ?disabled=${!m}>SVG</button>
        </div>
      </figure>`;
  }

  disconnectedCallback(): void {
    super.disconnectedCallback();
    this.resizeObserver?.disconnect();
    this.plot?.destroy();
    this.plot = undefined;
  }

  protected updated(changed: PropertyValues): void {
    if (changed.has('model') || !this.plot) this.scheduleDraw('draw');
    else if (changed.has('highlight') || changed.has('labelTension')) this.scheduleDraw('redraw');
  }

  /**
   * Draws in a task of its own, after the page's update: the figures of a large result then come one task
   * each, not all in the task that renders the page. Several requests before it runs make one draw.
   * `updateComplete` waits for it. A small figure (at most SMALL_FIGURE markers) draws at once, in the
   * page's update: it takes a few milliseconds, and a task of its own would wait for the page's frame.
   */
  private scheduleDraw(kind: 'draw' | 'redraw'): void {
    if (this.drawKind !== 'draw') this.drawKind = kind;
    if (!this.drawing && markerCount(this.model) <= SMALL_FIGURE) {
      this.drawNow();
      return;
    }
    this.drawing ??= new Promise<void>((done) =>
      setTimeout(() => {
        this.drawNow();
        done();
      }, 0),
    );
  }

  /** The draw (or redraw) asked for since the last one; a failure is reported as `chart-error`. */
  private drawNow(): void {
    const k = this.drawKind;
    this.drawing = undefined;
    this.drawKind = undefined;
    try {
      if (k === 'draw' || !this.plot) this.draw();
      else this.plot.redraw(false, false);
    } catch (e) {
      this.dispatchEvent(new CustomEvent('chart-error', { detail: { id: this.model?.id, message: (e as Error).message }, bubbles: true, composed: true }));
    }
  }

  protected override async getUpdateComplete(): Promise<boolean> {
    const result = await super.getUpdateComplete();
    while (this.drawing || this.overlayDone) await (this.drawing ?? this.overlayDone);
    return result;
  }

  /** Pixel positions of the set's finite markers that are (top) or are not in tension, with error-bar ends if drawn. */
  private pixels(s: MarkerSet, top: boolean, bars: boolean, X: (v: number) => number, Y: (v: number) => number): PixelPoints {
    const len = s.x.length;
    const x = new Float64Array(len);
    const y = new Float64Array(len);
    const lo = new Float64Array(bars && s.yLo && s.yHi ? len : 0);
    const hi = new Float64Array(lo.length);
    let n = 0;
    for (let i = 0; i < len; i++) {
      if ((s.tension?.[i] === 1) !== top) continue;
      const px = X(s.x[i]);
      const py = Y(s.y[i]);
      if (!Number.isFinite(px) || !Number.isFinite(py)) continue;
      x[n] = px;
      y[n] = py;
      if (lo.length) {
        lo[n] = Y(s.yLo![i]);
        hi[n] = Y(s.yHi![i]);
      }
      n++;
    }
    return { n, x, y, lo: lo.length ? lo : new Float64Array(n).fill(NaN), hi: hi.length ? hi : new Float64Array(n).fill(NaN) };
  }

  /** A 2D context off screen the size of the plot's canvas (kept between draws), for translucent layers. */
  private offscreen(w: number, h: number): CanvasRenderingContext2D {
    let c = this.layerCanvas;
    if (!c) c = this.layerCanvas = document.createElement('canvas');
    if (c.width !== w || c.height !== h) {
      c.width = w;
      c.height = h;
    }
    return c.getContext('2d')!;
  }

  /**
   * uPlot's draw hook: starts drawing the overlay (see overlaySteps) and goes on in slices of at most
   * SLICE_MS, each in a task of its own, so that 10⁴ galaxies under five IMFs never hold the page up. A
   * redraw before the last slice starts over. `updateComplete` waits for the last slice.
   */
  private drawOverlay(u: uPlot): void {
    if (!this.model) return;
    const job = ++this.overlayJob;
    const steps = this.overlaySteps(u, this.model);
    let done!: () => void;
    const finished = new Promise<void>((ok) => (done = ok));
    const fail = (e: unknown): void => {
      this.overlayDone = undefined;
      done();
      this.dispatchEvent(new CustomEvent('chart-error', { detail: { id: this.model?.id, message: (e as Error).message }, bubbles: true, composed: true }));
    };
    const slice = (): void => {
      if (job !== this.overlayJob) return done();
      const ctx = u.ctx;
      const t0 = performance.now();
      let last = false;
      ctx.save();
      try {
        ctx.setLineDash([]);
        ctx.beginPath();
        ctx.rect(u.bbox.left, u.bbox.top, u.bbox.width, u.bbox.height);
        ctx.clip();
        do last = !!steps.next().done;
        while (!last && performance.now() - t0 < SLICE_MS);
      } catch (e) {
        return fail(e);
      } finally {
        ctx.restore();
      }
      if (!last) {
        setTimeout(slice, 0);
        return;
      }
      if (this.overlayDone === finished) this.overlayDone = undefined;
      done();
    };
    this.overlayDone = finished;
    slice();
  }

  /**
   * The overlay, step by step (each `yield` is a point where drawing may pause for the page): density
   * layer, markers (ordinary ones, then galaxies in tension) batch by batch, highlight ring and labels,
   * then `chart-drawn`. Every step sets the canvas state it uses. Positions are taken from the scales as
   * they are when drawing starts.
   */
  private *overlaySteps(u: uPlot, m: ChartModel): Generator<void, void> {
    const dpr = devicePixelRatio;
    const line = (scale: uPlot.Scale, off: number, dim: number, flip: boolean): ((v: number) => number) => {
      const lo = scale.min ?? 0;
      const k = dim / ((scale.max ?? 1) - lo);
      return flip ? (v) => off + dim - (v - lo) * k : (v) => off + (v - lo) * k;
    };
    // uPlot's linear scales in canvas pixels (what valToPos(v, scale, true) gives), without a call per point.
    const X = line(u.scales.x, u.bbox.left, u.bbox.width, false);
    const Y = line(u.scales.y, u.bbox.top, u.bbox.height, true);
    const ctx = u.ctx;
    const d = m.density;
    if (d && d.max > 0) {
      const cw = (d.x1 - d.x0) / d.nx;
      const ch = (d.y1 - d.y0) / d.ny;
      for (let j = 0; j < d.ny; j++)
        for (let i = 0; i < d.nx; i++) {
          const c = d.counts[j * d.nx + i];
          if (!c) continue;
          ctx.fillStyle = `rgba(85,85,85,${(0.12 + (0.55 * Math.log1p(c)) / Math.log1p(d.max)).toFixed(3)})`;
          const x0 = X(d.x0 + i * cw);
          const y0 = Y(d.y0 + (j + 1) * ch);
          ctx.fillRect(x0, y0, X(d.x0 + (i + 1) * cw) - x0, Y(d.y0 + j * ch) - y0);
        }
      yield;
    }
    let count = 0;
    /** Strokes or fills each batch on `c` (yielding between batches), styled by `style` every time. */
    function* paint(c: CanvasRenderingContext2D, paths: Path2D[], style: (c: CanvasRenderingContext2D) => void, fill: boolean): Generator<void, void> {
      for (const path of paths) {
        style(c);
        if (fill) c.fill(path);
        else c.stroke(path);
        yield;
      }
    }
    const self = this;
    /**
     * One layer of a set (its bars, or its markers with their outlines). Opaque: batch after batch is the same
     * as one path. Translucent: drawn opaque off screen and laid on at the set's opacity, as one translucent
     * path would be.
     */
    function* layer(alpha: number, draw: (c: CanvasRenderingContext2D) => Generator<void, void>, batches: number): Generator<void, void> {
      if (alpha >= 1 || batches === 1) return yield* draw(ctx);
      const off = self.offscreen(ctx.canvas.width, ctx.canvas.height);
      off.clearRect(0, 0, off.canvas.width, off.canvas.height);
      yield* draw(off);
      ctx.globalAlpha = alpha;
      ctx.drawImage(off.canvas, 0, 0);
      ctx.globalAlpha = 1;
      yield;
    }
    for (const top of [false, true])
      for (const s of m.markers) {
        const st = top ? FULL_POINTS : (m.points ?? FULL_POINTS);
        const p = this.pixels(s, top, st.errorWidth > 0, X, Y);
        count += p.n;
        if (!p.n) continue;
        const r = st.radius * dpr;
        const bars = st.errorWidth > 0 && s.yLo && s.yHi ? barPaths(p) : [];
        const marks = markerPaths(s.shape, p, r);
        const a = st.alpha;
        yield;
        if (bars.length)
          yield* layer(a, (c) => paint(c, bars, (k) => ((k.globalAlpha = c === ctx ? a : 1), (k.strokeStyle = s.color), (k.lineWidth = st.errorWidth * dpr)), false), bars.length);
        yield* layer(
          a,
          function* (c) {
            const alpha = c === ctx ? a : 1;
            yield* paint(c, marks, (k) => ((k.globalAlpha = alpha), (k.fillStyle = s.color)), true);
            if (st.outline) yield* paint(c, marks, (k) => ((k.globalAlpha = alpha), (k.strokeStyle = '#000'), (k.lineWidth = 0.6 * dpr)), false);
          },
          marks.length,
        );
      }
    const { labels } = labelPoints(m, this.highlight, this.labelTension);
    const rr = FULL_POINTS.radius * dpr;
    ctx.lineJoin = 'round';
    for (const l of labels) {
      const x = X(l.x);
      const y = Y(l.y);
      if (l.highlight) {
        ctx.beginPath();
        ctx.arc(x, y, rr * 2, 0, 2 * Math.PI);
        ctx.strokeStyle = '#000';
        ctx.lineWidth = 1.5 * dpr;
        ctx.stroke();
      }
      ctx.font = `${l.highlight ? 'bold ' : ''}${11 * dpr}px sans-serif`;
      ctx.strokeStyle = '#fff';
      ctx.lineWidth = 3 * dpr;
      ctx.strokeText(l.id, x + rr * 2.2, y - rr * 1.6);
      ctx.fillStyle = '#000';
      ctx.fillText(l.id, x + rr * 2.2, y - rr * 1.6);
    }
    this.dispatchEvent(new CustomEvent('chart-drawn', { detail: { id: m.id, markers: count, labels: labels.map((l) => l.id) }, bubbles: true, composed: true }));
  }

  private draw(): void {
    const m = this.model;
    const host = this.renderRoot.querySelector('.plot') as HTMLElement | null;
    if (!m || !host) return;
    const data = [Array.from(m.x), ...m.lineData.map((d) => [...d])] as uPlot.AlignedData;
    const key = `${m.id}|${m.lines.map((l) => l.label).join('|')}|${m.x.length}|${(m.xCategories ?? []).join(',')}`;
    const width = Math.max(280, host.clientWidth || 640);
    if (this.plot && key === this.layoutKey) {
      this.plot.setData(data);
      return;
    }
    this.plot?.destroy();
    this.layoutKey = key;
    const cats = m.xCategories;
    const opts: uPlot.Options = {
      width,
      height: 340,
      scales: {
        x: {
          time: false,
          range: (_u, lo, hi) => {
            const [a, b] = markerExtents(this.model!).x;
            const l = Math.min(lo, a);
            const h = Math.max(hi, b);
            const pad = cats ? 0.5 : 0.02 * (h - l || 1);
            return [l - pad, h + pad];
          },
        },
        y: {
          range: (_u, lo, hi) => {
            const [a, b] = markerExtents(this.model!).y;
            const l = Math.min(Number.isFinite(lo) ? lo : a, a);
            const h = Math.max(Number.isFinite(hi) ? hi : b, b);
            const pad = 0.06 * (h - l || 1);
            return [l - pad, h + pad];
          },
        },
      },
      axes: [
        { label: m.xLabel, values: cats ? (_u, ticks) => ticks.map((t) => (Number.isInteger(t) ? cats[t - 1] ?? '' : '')) : undefined, splits: cats ? () => cats.map((_, i) => i + 1) : undefined },
        { label: m.yLabel },
      ],
      series: [{ label: m.xLabel }, ...m.lines.map((l) => ({ label: l.label, stroke: l.color, width: l.width ?? 1.5, dash: l.dash ? [...l.dash] : undefined, cap: 'round' as CanvasLineCap, spanGaps: true, points: { show: false } }))],
      bands: m.bands?.map(([a, b]) => ({ series: [b + 1, a + 1] as [number, number], fill: 'rgba(120,120,120,0.18)' })),
      legend: { show: false },
      hooks: { draw: [(u) => this.drawOverlay(u)] },
    };
    this.plot = new uPlot(opts, data, host);
    if (!this.resizeObserver && typeof ResizeObserver !== 'undefined') {
      this.resizeObserver = new ResizeObserver(() => {
        const w = host.clientWidth;
        if (this.plot && w > 0 && Math.abs(w - this.plot.width) > 4) this.plot.setSize({ width: w, height: 340 });
      });
      this.resizeObserver.observe(host);
    }
  }

  /** Export options: the ranges on screen, the chosen width, the highlight and the labels. */
  private svgOptions(widthMm: number): SvgOptions {
    const x = this.plot?.scales.x;
    const y = this.plot?.scales.y;
    return {
      xRange: x && x.min !== undefined && x.max !== undefined ? [x.min, x.max] : undefined,
      yRange: y && y.min !== undefined && y.max !== undefined ? [y.min, y.max] : undefined,
      widthMm,
      caption: this.withCaption,
      highlight: this.highlight,
      labelTension: this.labelTension,
    };
  }

  /** The figure as a standalone SVG document at print size (width in mm, fonts in pt). */
  svg(widthMm = this.widthMm): string {
    return this.model ? layoutSvg(this.model, this.svgOptions(widthMm)).svg : '';
  }

  /** The figure as a PNG at a print width and resolution (pixels across = width / 25.4 mm × dpi), dpi in the file. */
  async png(widthMm = this.widthMm, dpi = this.dpi): Promise<Blob> {
    if (!this.model) throw new Error('no figure drawn yet');
    const { svg, size } = layoutSvg(this.model, this.svgOptions(widthMm));
    const w = pixelsFor(widthMm, dpi);
    const h = Math.round((size.heightPt * w) / size.widthPt);
    const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
    try {
      const img = new Image(w, h);
      img.src = url;
      await img.decode();
      const out = document.createElement('canvas');
      out.width = w;
      out.height = h;
      const ctx = out.getContext('2d')!;
      ctx.fillStyle = '#fff';
      ctx.fillRect(0, 0, w, h);
      ctx.drawImage(img, 0, 0, w, h);
      const blob = await new Promise<Blob>((resolve, reject) => out.toBlob((b) => (b ? resolve(b) : reject(new Error('PNG encoding failed'))), 'image/png'));
      return new Blob([withDpi(new Uint8Array(await blob.arrayBuffer()), dpi) as Uint8Array<ArrayBuffer>], { type: 'image/png' });
    } finally {
      URL.revokeObjectURL(url);
    }
  }

  private async exportPng(): Promise<void> {
    try {
      const blob = await this.png();
      this.dispatchEvent(new CustomEvent('download', { detail: { name: `${this.model!.id}-${this.widthMm}mm-${this.dpi}dpi.png`, blob }, bubbles: true, composed: true }));
    } catch (e) {
      this.dispatchEvent(new CustomEvent('chart-error', { detail: { id: this.model?.id, message: `PNG export: ${(e as Error).message}` }, bubbles: true, composed: true }));
    }
  }

  private exportSvg(): void {
    const blob = new Blob([this.svg()], { type: 'image/svg+xml' });
    this.dispatchEvent(new CustomEvent('download', { detail: { name: `${this.model!.id}-${this.widthMm}mm.svg`, blob }, bubbles: true, composed: true }));
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'audit-chart': AuditChart;
  }
}
