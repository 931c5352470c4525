import type { ChartModel, MarkerSet } from './chart-config.js';
import { extent } from './chart-config.js';
import { FULL_POINTS, labelPoints, markedCaption } from './legibility.js';
import { svgMarker } from './marker-path.js';

const esc = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const n2 = (v: number): string => (Math.round(v * 100) / 100).toString();

/** "Nice" tick values covering [lo, hi] (Heckbert 1990, Graphics Gems, "nice numbers for graph labels"). */
export function niceTicks(lo: number, hi: number, count = 6): number[] {
  const span = hi - lo || 1;
  const raw = span / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + 1e-9 * span; v += step) out.push(Number(v.toPrecision(12)));
  return out;
}

/** Words wrapped into lines of at most `width` characters. */
export function wrap(text: string, width: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const w of text.split(/\s+/)) {
    if (line && (line + ' ' + w).length > width) {
      lines.push(line);
      line = w;
    } else line = line ? line + ' ' + w : w;
  }
  if (line) lines.push(line);
  return lines;
}

/** Print sizes: journal column widths, mm. */
export const COLUMN_MM = { single: 88, double: 180 } as const;
/** Font sizes at print size, pt (common practice for journal figures: 6–9 pt at final size, no source). */
export const FONT_PT = { tick: 7, label: 8, legend: 7, caption: 7, title: 8.5, mark: 6.5 } as const;
/** Screen CSS px → pt at print size for marker sizes, line widths and dashes (our choice, set by eye). */
const PX_TO_PT = 0.6;
/** Mean glyph advance of a sans-serif face, in em (common practice for layout estimates, no source). */
const EM_ADVANCE = 0.55;

const textWidth = (s: string, pt: number): number => s.length * pt * EM_ADVANCE;

export interface SvgOptions {
  readonly xRange?: [number, number];
  readonly yRange?: [number, number];
  /** Width at print size, mm (default: double column). */
  readonly widthMm?: number;
  /** Title and caption in the image (default true); without them, for a paper whose caption is typeset. */
  readonly caption?: boolean;
  /** Galaxy id to ring and label. */
  readonly highlight?: string;
  /** Label the galaxies in tension. */
  readonly labelTension?: boolean;
}

/** Width and height of an exported figure, pt (1 pt = 1/72 in). */
export interface SvgSize {
  readonly widthPt: number;
  readonly heightPt: number;
}

/** A legend entry: a line sample (with its dash) or a marker. */
type Entry = { kind: 'line'; label: string; color: string; dash?: readonly number[]; width?: number } | { kind: 'marker'; label: string; set: MarkerSet };

export function legendEntries(m: ChartModel): Entry[] {
  return [
    ...m.lines.filter((l) => !l.noLegend).map((l) => ({ kind: 'line' as const, label: l.label, color: l.color, dash: l.dash, width: l.width })),
    ...m.markers.map((s) => ({ kind: 'marker' as const, label: s.label, set: s })),
  ];
}

/** stroke-dasharray for a dash pattern in CSS px, scaled to the output ('' when solid). */
export const dashAttr = (dash: readonly number[] | undefined, scale = 1): string => (dash && dash.length ? ` stroke-dasharray="${dash.map((d) => n2(d * scale)).join(' ')}"` : '');

/**
 * A standalone SVG of the figure at print size: width in mm, coordinates in pt, fonts sized for print.
 * Axes with labels and units, the shaded bands, the density layer, lines with their dashes, markers with
 * error bars (galaxies in tension on top), the highlighted galaxy ringed and labelled, a legend that draws
 * every line in its own style and every marker in its own shape, and (optionally) title and caption.
 */
export function chartToSvg(m: ChartModel, opts: SvgOptions = {}): string {
  return layoutSvg(m, opts).svg;
}

export function layoutSvg(m: ChartModel, opts: SvgOptions = {}): { svg: string; size: SvgSize } {
  const widthMm = opts.widthMm ?? COLUMN_MM.double;
  const withCaption = opts.caption ?? true;
  const highlight = opts.highlight ?? '';
  const W = (widthMm / 25.4) * 72;
  const pad = 4;
  const titleH = withCaption ? FONT_PT.title + 6 : 0;
  const L = 44;
  const R = 10;
  const T = titleH + 6;
  const plotW = W - L - R;
  const plotH = Math.min(W * 0.6, 210);
  // Categorical labels are turned when they would overlap.
  const cats = m.xCategories ?? [];
  const slot = cats.length ? plotW / (cats.length + 1) : Infinity;
  const turn = cats.some((c) => textWidth(c, FONT_PT.tick) > slot * 0.95);
  const tickBand = turn ? Math.max(...cats.map((c) => textWidth(c, FONT_PT.tick))) * 0.6 + 10 : FONT_PT.tick + 6;
  const plotBottom = T + plotH;
  const xLabelY = plotBottom + tickBand + FONT_PT.label + 2;
  // Legend in columns under the axis label.
  const entries = legendEntries(m);
  const colW = Math.max(40, ...entries.map((e) => e.label.length * FONT_PT.legend * 0.5 + 30));
  const cols = Math.max(1, Math.min(entries.length, Math.floor((W - 2 * pad) / colW)));
  const legendLeft = pad + Math.max(0, (W - 2 * pad - cols * colW) / 2);
  const rowH = FONT_PT.legend + 4;
  const legendTop = xLabelY + 8;
  const legendH = Math.ceil(entries.length / cols) * rowH;
  const caption = withCaption ? markedCaption(m, highlight, opts.labelTension ?? false) : '';
  const capLines = withCaption ? wrap(caption, Math.floor((W - 2 * pad) / (FONT_PT.caption * 0.5))) : [];
  const capTop = legendTop + legendH + 6;
  const H = capTop + capLines.length * (FONT_PT.caption + 2) + pad;

  const xs = [...Array.from(m.x), ...m.markers.flatMap((s) => Array.from(s.x))];
  const ys = [...m.lineData.flatMap((d) => d.filter((v): v is number => v !== null)), ...m.markers.flatMap((s) => [...Array.from(s.y), ...Array.from(s.yLo ?? []), ...Array.from(s.yHi ?? [])])];
  let [x0, x1] = opts.xRange ?? extent(xs);
  if (!opts.xRange && cats.length) (x0 -= 0.5), (x1 += 0.5);
  let [y0, y1] = opts.yRange ?? extent(ys);
  if (!opts.yRange) {
    const padY = 0.05 * (y1 - y0 || 1);
    y0 -= padY;
    y1 += padY;
  }
  if (!Number.isFinite(x0) || !Number.isFinite(x1)) (x0 = 0), (x1 = 1);
  if (!Number.isFinite(y0) || !Number.isFinite(y1)) (y0 = 0), (y1 = 1);
  const px = (x: number): number => L + ((x - x0) / (x1 - x0 || 1)) * plotW;
  const py = (y: number): number => plotBottom - ((y - y0) / (y1 - y0 || 1)) * plotH;

  const p: string[] = [];
  const wMm = n2(widthMm);
  const hMm = n2((H / 72) * 25.4);
  p.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${wMm}mm" height="${hMm}mm" viewBox="0 0 ${n2(W)} ${n2(H)}" font-family="Helvetica, Arial, sans-serif" font-size="${FONT_PT.tick}">`);
  p.push(`<title>${esc(m.title)}</title><desc>${esc(caption || m.caption)}</desc>`);
  p.push(`<rect width="100%" height="100%" fill="#fff"/>`);
  if (withCaption) p.push(`<text x="${n2(W / 2)}" y="${n2(FONT_PT.title + 4)}" text-anchor="middle" font-size="${FONT_PT.title}" font-weight="bold">${esc(m.title)}</text>`);
  // Axes and ticks.
  p.push(`<rect x="${n2(L)}" y="${n2(T)}" width="${n2(plotW)}" height="${n2(plotH)}" fill="none" stroke="#000" stroke-width="0.6"/>`);
  const xt = cats.length ? cats.map((_, i) => i + 1) : niceTicks(x0, x1, Math.max(3, Math.round(plotW / 45)));
  for (const t of xt) {
    if (t < x0 || t > x1) continue;
    const label = cats.length ? cats[t - 1] : String(t);
    const X = n2(px(t));
    p.push(`<line x1="${X}" x2="${X}" y1="${n2(plotBottom)}" y2="${n2(plotBottom + 3)}" stroke="#000" stroke-width="0.6"/>`);
    p.push(
      turn
        ? `<text transform="translate(${X} ${n2(plotBottom + FONT_PT.tick + 3)}) rotate(-35)" text-anchor="end">${esc(label)}</text>`
        : `<text x="${X}" y="${n2(plotBottom + FONT_PT.tick + 4)}" text-anchor="middle">${esc(label)}</text>`,
    );
  }
  for (const t of niceTicks(y0, y1, Math.max(3, Math.round(plotH / 30)))) {
    const Y = n2(py(t));
    p.push(`<line x1="${n2(L - 3)}" x2="${n2(L)}" y1="${Y}" y2="${Y}" stroke="#000" stroke-width="0.6"/><text x="${n2(L - 5)}" y="${n2(py(t) + FONT_PT.tick * 0.35)}" text-anchor="end">${t}</text>`);
  }
  p.push(`<text x="${n2(L + plotW / 2)}" y="${n2(xLabelY)}" text-anchor="middle" font-size="${FONT_PT.label}">${esc(m.xLabel)}</text>`);
  p.push(`<text transform="translate(${n2(FONT_PT.label + 1)} ${n2(T + plotH / 2)}) rotate(-90)" text-anchor="middle" font-size="${FONT_PT.label}">${esc(m.yLabel)}</text>`);
  // Plot contents, clipped to the frame.
  p.push(`<clipPath id="plot-${esc(m.id)}"><rect x="${n2(L)}" y="${n2(T)}" width="${n2(plotW)}" height="${n2(plotH)}"/></clipPath><g clip-path="url(#plot-${esc(m.id)})">`);
  const d = m.density;
  if (d && d.max > 0) {
    const cw = (d.x1 - d.x0) / d.nx;
    const ch = (d.y1 - d.y0) / d.ny;
    for (let j = 0; j < d.ny; j++)
      for (let i = 0; i < d.nx; i++) {
        const c = d.counts[j * d.nx + i];
        if (!c) continue;
        const a = 0.12 + (0.55 * Math.log1p(c)) / Math.log1p(d.max);
        const X0 = px(d.x0 + i * cw);
        const Y0 = py(d.y0 + (j + 1) * ch);
        p.push(`<rect x="${n2(X0)}" y="${n2(Y0)}" width="${n2(px(d.x0 + (i + 1) * cw) - X0)}" height="${n2(py(d.y0 + j * ch) - Y0)}" fill="#555" fill-opacity="${n2(a)}"/>`);
      }
  }
  for (const [a, b] of m.bands ?? []) {
    const la = m.lineData[a];
    const lb = m.lineData[b];
    let seg: number[] = [];
    const flush = (): void => {
      if (seg.length > 1) {
        const fwd = seg.map((j) => `${n2(px(m.x[j]))},${n2(py(la[j]!))}`);
        const back = [...seg].reverse().map((j) => `${n2(px(m.x[j]))},${n2(py(lb[j]!))}`);
        p.push(`<polygon class="band" points="${[...fwd, ...back].join(' ')}" fill="#787878" fill-opacity="0.18" stroke="none"/>`);
      }
      seg = [];
    };
    for (let j = 0; j < m.x.length; j++) {
      if (la[j] !== null && lb[j] !== null && Number.isFinite(la[j]) && Number.isFinite(lb[j])) seg.push(j);
      else flush();
    }
    flush();
  }
  m.lines.forEach((ln, i) => {
    let path = '';
    let pen = false;
    m.lineData[i].forEach((v, j) => {
      if (v === null || !Number.isFinite(v)) {
        pen = false;
        return;
      }
      path += `${pen ? 'L' : 'M'}${n2(px(m.x[j]))},${n2(py(v))}`;
      pen = true;
    });
    p.push(`<path d="${path}" fill="none" stroke="${ln.color}" stroke-width="${n2((ln.width ?? 1.5) * PX_TO_PT)}"${dashAttr(ln.dash, PX_TO_PT)} stroke-linecap="round"/>`);
  });
  const ps = m.points ?? FULL_POINTS;
  const drawSet = (s: MarkerSet, top: boolean): void => {
    const st = top ? FULL_POINTS : ps;
    const r = st.radius * PX_TO_PT;
    const ew = st.errorWidth * PX_TO_PT;
    const op = st.alpha < 1 ? ` opacity="${st.alpha}"` : '';
    const outline = st.outline ? 'stroke="#000" stroke-width="0.4"' : 'stroke="none"';
    for (let j = 0; j < s.x.length; j++) {
      if ((s.tension?.[j] === 1) !== top) continue;
      const X = px(s.x[j]);
      const Y = py(s.y[j]);
      if (!Number.isFinite(X) || !Number.isFinite(Y)) continue;
      if (ew > 0 && s.yLo && s.yHi && Number.isFinite(s.yLo[j]) && Number.isFinite(s.yHi[j]))
        p.push(`<line x1="${n2(X)}" x2="${n2(X)}" y1="${n2(py(s.yLo[j]))}" y2="${n2(py(s.yHi[j]))}" stroke="${s.color}" stroke-width="${n2(ew)}"${op}/>`);
      p.push(svgMarker(s.shape, X, Y, r, s.color, outline + op));
    }
  };
  for (const s of m.markers) drawSet(s, false);
  for (const s of m.markers) drawSet(s, true);
  const { labels } = labelPoints(m, highlight, opts.labelTension ?? false);
  const rTop = FULL_POINTS.radius * PX_TO_PT;
  for (const l of labels) {
    const X = px(l.x);
    const Y = py(l.y);
    if (l.highlight) p.push(`<circle class="highlight" cx="${n2(X)}" cy="${n2(Y)}" r="${n2(rTop * 2)}" fill="none" stroke="#000" stroke-width="1"/>`);
    p.push(`<text class="label" x="${n2(X + rTop * 2.2)}" y="${n2(Y - rTop * 1.6)}" font-size="${FONT_PT.mark}"${l.highlight ? ' font-weight="bold"' : ''} paint-order="stroke" stroke="#fff" stroke-width="2">${esc(l.id)}</text>`);
  }
  p.push('</g>');
  // Legend: every line drawn in its own colour, width and dash; every marker in its own shape.
  entries.forEach((e, k) => {
    const ex = legendLeft + (k % cols) * colW;
    const ey = legendTop + Math.floor(k / cols) * rowH + rowH / 2;
    if (e.kind === 'line') p.push(`<line class="legend-line" x1="${n2(ex)}" x2="${n2(ex + 20)}" y1="${n2(ey)}" y2="${n2(ey)}" stroke="${e.color}" stroke-width="${n2((e.width ?? 1.5) * PX_TO_PT)}"${dashAttr(e.dash, PX_TO_PT)} stroke-linecap="round"/>`);
    else p.push(svgMarker(e.set.shape, ex + 10, ey, FULL_POINTS.radius * PX_TO_PT, e.set.color, 'stroke="#000" stroke-width="0.4"'));
    p.push(`<text x="${n2(ex + 24)}" y="${n2(ey + FONT_PT.legend * 0.35)}" font-size="${FONT_PT.legend}">${esc(e.label)}</text>`);
  });
  capLines.forEach((c, i) => p.push(`<text x="${pad}" y="${n2(capTop + (i + 1) * (FONT_PT.caption + 2) - 2)}" font-size="${FONT_PT.caption}">${esc(c)}</text>`));
  p.push('</svg>');
  return { svg: p.join('\n'), size: { widthPt: W, heightPt: H } };
}
