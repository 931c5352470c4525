import { LitElement, css, html, unsafeCSS } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import uPlot from 'uplot';
import type { ChartModel } from './chart/chart-config.js';
import { drawMarker } from './chart/marker-path.js';
import { COLORS } from './palette.js';
import { chartToSvg } from './chart/svg-export.js';

/**
 * <audit-chart>: draws one ChartModel with uPlot (lines on a shared x axis; markers with error bars in a
 * draw hook). Re-draws with setData when the series layout is unchanged. Fires `chart-drawn` after every
 * draw (detail: { id, markers }) and `chart-error` if drawing fails. Exports PNG and SVG with the caption.
 */
@customElement('audit-chart')
export class AuditChart extends LitElement {
  @property({ attribute: false }) model?: ChartModel;

  private plot?: uPlot;
  private layoutKey = '';
  private resizeObserver?: ResizeObserver;

  static styles = css`
    :host { display: block; }
    figure { margin: 0; }
    figcaption { font-size: 0.85rem; color: #333; margin-top: 0.3rem; }
    .plot { width: 100%; min-height: 320px; }
    .tools { display: flex; gap: 0.5rem; justify-content: flex-end; }
    button { font: inherit; padding: 0.2rem 0.6rem; }
    h3 { font-size: 1rem; margin: 0.2rem 0; }
    .mlegend { list-style: none; display: flex; flex-wrap: wrap; gap: 0.8rem; padding: 0; margin: 0.2rem 0; font-size: 0.85rem; }
    ${unsafeCSS(COLORS.map((c, i) => `.c${i} { color: ${c}; }`).join('\n'))}
  `;

  render() {
    const m = this.model;
    return html`<link rel="stylesheet" href=${new URL('uPlot.min.css', import.meta.url).href} />
      <figure role="group" aria-label=${m?.title ?? 'figure'}>
        <h3>${m?.title ?? ''}</h3>
        <div class="plot" part="plot"></div>
        ${m?.markers.length
          ? html`<ul class="mlegend" aria-label="markers">
              ${m.markers.map((s) => html`<li class=${`c${Math.max(0, COLORS.indexOf(s.color as (typeof COLORS)[number]))}`}>${s.label}</li>`)}
            </ul>`
          : ''}
        <figcaption>${m?.caption ?? ''}</figcaption>
        <div class="tools">
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

  protected updated(): void {
    try {
      this.draw();
    } catch (e) {
      this.dispatchEvent(new CustomEvent('chart-error', { detail: { id: this.model?.id, message: (e as Error).message }, bubbles: true, composed: true }));
    }
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
    const markerRange = (axis: 'x' | 'y'): [number, number] => {
      let lo = Infinity;
      let hi = -Infinity;
      for (const s of this.model!.markers) {
        const arrs = axis === 'x' ? [s.x] : [s.y, s.yLo ?? [], s.yHi ?? []];
        for (const a of arrs) for (let i = 0; i < a.length; i++) if (Number.isFinite(a[i])) (lo = Math.min(lo, a[i])), (hi = Math.max(hi, a[i]));
      }
      return [lo, hi];
    };
    const opts: uPlot.Options = {
      width,
      height: 340,
      scales: {
        x: {
          time: false,
          range: (_u, lo, hi) => {
            const [a, b] = markerRange('x');
            const l = Math.min(lo, a);
            const h = Math.max(hi, b);
            const pad = m.xCategories ? 0.5 : 0.02 * (h - l || 1);
            return [l - pad, h + pad];
          },
        },
        y: {
          range: (_u, lo, hi) => {
            const [a, b] = markerRange('y');
            const l = Math.min(Number.isFinite(lo) ? lo : a, a);
            const h = Math.max(Number.isFinite(hi) ? hi : b, b);
            const pad = 0.06 * (h - l || 1);
            return [l - pad, h + pad];
          },
        },
      },
      axes: [
        { label: m.xLabel, values: m.xCategories ? (_u, ticks) => ticks.map((t) => (Number.isInteger(t) ? m.xCategories![t - 1] ?? '' : '')) : undefined, splits: m.xCategories ? () => m.xCategories!.map((_, i) => i + 1) : undefined },
        { label: m.yLabel },
      ],
      series: [{ label: m.xLabel }, ...m.lines.map((l) => ({ label: l.label, stroke: l.color, width: l.width ?? 1.5, dash: l.dash, spanGaps: true, points: { show: false } }))],
      bands: m.bands?.map(([a, b]) => ({ series: [b + 1, a + 1] as [number, number], fill: 'rgba(120,120,120,0.12)' })),
      legend: { show: true, live: false },
      hooks: {
        draw: [
          (u) => {
            const ctx = u.ctx;
            const r = 5 * devicePixelRatio;
            ctx.save();
            ctx.setLineDash([]);
            ctx.beginPath();
            ctx.rect(u.bbox.left, u.bbox.top, u.bbox.width, u.bbox.height);
            ctx.clip();
            let count = 0;
            for (const s of this.model?.markers ?? []) {
              ctx.strokeStyle = s.color;
              ctx.fillStyle = s.color;
              ctx.lineWidth = 1.5 * devicePixelRatio;
              for (let i = 0; i < s.x.length; i++) {
                const x = u.valToPos(s.x[i], 'x', true);
                const y = u.valToPos(s.y[i], 'y', true);
                if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
                if (s.yLo && s.yHi) {
                  ctx.beginPath();
                  ctx.moveTo(x, u.valToPos(s.yLo[i], 'y', true));
                  ctx.lineTo(x, u.valToPos(s.yHi[i], 'y', true));
                  ctx.stroke();
                }
                drawMarker(ctx, s.shape, x, y, r);
                ctx.fill();
                ctx.strokeStyle = '#000';
                ctx.lineWidth = 0.6 * devicePixelRatio;
                ctx.stroke();
                ctx.strokeStyle = s.color;
                ctx.lineWidth = 1.5 * devicePixelRatio;
                count++;
              }
            }
            ctx.restore();
            this.dispatchEvent(new CustomEvent('chart-drawn', { detail: { id: this.model?.id, markers: count }, bubbles: true, composed: true }));
          },
        ],
      },
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

  /** The figure as a standalone SVG document (axes, legend, caption). */
  svg(): string {
    if (!this.model) return '';
    const x = this.plot?.scales.x;
    const y = this.plot?.scales.y;
    const xr = x && x.min !== undefined && x.max !== undefined ? ([x.min, x.max] as [number, number]) : undefined;
    const yr = y && y.min !== undefined && y.max !== undefined ? ([y.min, y.max] as [number, number]) : undefined;
    return chartToSvg(this.model, xr, yr);
  }

  /** The figure as a PNG with its title, legend text and caption under the plot. */
  async png(): Promise<Blob> {
    const src = this.plot?.ctx.canvas;
    if (!src || !this.model) throw new Error('no figure drawn yet');
    const m = this.model;
    const legend = [...m.lines.map((l) => `— ${l.label}`), ...m.markers.map((s) => s.label)].join('    ');
    const words = `${legend}. ${m.caption}`.split(/\s+/);
    const out = document.createElement('canvas');
    const w = src.width;
    const ctx0 = out.getContext('2d')!;
    ctx0.font = `${12 * devicePixelRatio}px sans-serif`;
    const lines: string[] = [];
    let line = '';
    for (const wd of words) {
      const t = line ? line + ' ' + wd : wd;
      if (ctx0.measureText(t).width > w - 20 && line) {
        lines.push(line);
        line = wd;
      } else line = t;
    }
    if (line) lines.push(line);
    const lh = 16 * devicePixelRatio;
    out.width = w;
    out.height = src.height + 30 * devicePixelRatio + lines.length * lh + 10;
    const ctx = out.getContext('2d')!;
    ctx.fillStyle = '#fff';
    ctx.fillRect(0, 0, out.width, out.height);
    ctx.fillStyle = '#000';
    ctx.font = `bold ${14 * devicePixelRatio}px sans-serif`;
    ctx.fillText(m.title, 10, 20 * devicePixelRatio);
    ctx.drawImage(src, 0, 30 * devicePixelRatio);
    ctx.font = `${12 * devicePixelRatio}px sans-serif`;
    lines.forEach((l, i) => ctx.fillText(l, 10, src.height + 30 * devicePixelRatio + (i + 1) * lh));
    return new Promise((resolve, reject) => out.toBlob((b) => (b ? resolve(b) : reject(new Error('PNG encoding failed'))), 'image/png'));
  }

  private async exportPng(): Promise<void> {
    const blob = await this.png();
    this.dispatchEvent(new CustomEvent('download', { detail: { name: `${this.model!.id}.png`, blob }, bubbles: true, composed: true }));
  }

  private exportSvg(): void {
    const blob = new Blob([this.svg()], { type: 'image/svg+xml' });
    this.dispatchEvent(new CustomEvent('download', { detail: { name: `${this.model!.id}.svg`, blob }, bubbles: true, composed: true }));
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'audit-chart': AuditChart;
  }
}
