import type { DisputedMap } from '../../core/audit/disputed-map.js';
import { DASH } from '../palette.js';
import { chainSegments } from './contour-lines.js';
import { FONT_PT, niceTicks, wrap } from './svg-export.js';
import { viridis } from './viridis.js';

/**
 * The fifth figure as drawing primitives, in one unit (pt for the SVG export, CSS px on screen): the median
 * ε_req of one galaxy over redshift × IMF slope as viridis cells with a colour bar in log10 ε, the contours
 * ε = 1 (solid) and ε = ε_ref (dashed), each over a white casing so it reads on every colour, and the galaxy
 * at its redshift and its headline IMF's slope with its redshift interval. Both renderers (sceneToSvg, and
 * the canvas of <disputed-map-figure>) draw exactly these.
 */
export interface Scene {
  readonly width: number;
  readonly height: number;
  readonly title: string;
  readonly caption: string;
  readonly cells: { x: number; y: number; w: number; h: number; fill: string }[];
  readonly lines: { pts: [number, number][]; stroke: string; width: number; dash: readonly number[]; cls: string }[];
  readonly frames: { x: number; y: number; w: number; h: number }[];
  readonly marks: { x: number; y: number; r: number }[];
  readonly texts: { x: number; y: number; text: string; size: number; anchor: 'start' | 'middle' | 'end'; rotate?: boolean; bold?: boolean }[];
}

export interface SceneFonts {
  readonly tick: number;
  readonly label: number;
  readonly legend: number;
  readonly caption: number;
  readonly title: number;
}

/** Screen fonts, CSS px. */
export const SCREEN_FONTS: SceneFonts = { tick: 11, label: 12, legend: 11, caption: 11, title: 13 };

/** Mean glyph advance of a sans-serif face, em (common practice for layout estimates, no source). */
const EM = 0.55;

/** Line styles of the contours: ε = 1 solid and heavier, ε = ε_ref dashed. */
export const CONTOUR_STYLE = { eps1: { width: 1.6, dash: DASH.solid }, ref: { width: 1.2, dash: DASH.dashed } } as const;

/** Value range of the colour scale: the finite cells' extent, widened to include log10 of the contour levels. */
export function colourRange(map: DisputedMap): [number, number] {
  const v = map.log10_eps_required.flat().filter(Number.isFinite);
  let lo = Math.min(...v, 0, Math.log10(map.eps_ref));
  let hi = Math.max(...v, 0, Math.log10(map.eps_ref));
  if (!(hi > lo)) (lo -= 0.5), (hi += 0.5);
  return [lo, hi];
}

/** Cell edges around grid nodes: midway between nodes, half a step beyond the ends. */
function edges(nodes: readonly number[]): number[] {
  if (nodes.length === 1) return [nodes[0] - 0.5, nodes[0] + 0.5];
  const e = [nodes[0] - (nodes[1] - nodes[0]) / 2];
  for (let i = 0; i + 1 < nodes.length; i++) e.push((nodes[i] + nodes[i + 1]) / 2);
  e.push(nodes[nodes.length - 1] + (nodes[nodes.length - 1] - nodes[nodes.length - 2]) / 2);
  return e;
}

/** The scene at `width` units across, fonts in the same unit; the caption wrapped under the legend when given. */
export function mapScene(map: DisputedMap, width: number, fonts: SceneFonts, title: string, caption = ''): Scene {
  const s = width / 510; // line widths and marks scale with the figure (510 pt = 180 mm)
  const unit = Math.max(0.6, Math.min(1.6, s * 1.6));
  const pad = 4 * unit;
  const titleH = fonts.title + 8 * unit;
  const L = fonts.label + fonts.tick * 3 * EM + 14 * unit;
  const barW = 10 * unit;
  const R = barW + 10 * unit + fonts.tick * 4 * EM + fonts.label + 10 * unit;
  const plotW = width - L - R;
  const T = titleH;
  const plotH = Math.min(width * 0.5, plotW * 0.62);
  const plotBottom = T + plotH;
  const ze = edges(map.z);
  const ae = edges(map.slope);
  const [x0, x1] = [ze[0], ze[ze.length - 1]];
  const [y0, y1] = [ae[0], ae[ae.length - 1]];
  const px = (x: number): number => L + ((x - x0) / (x1 - x0)) * plotW;
  const py = (y: number): number => plotBottom - ((y - y0) / (y1 - y0)) * plotH;
  const [c0, c1] = colourRange(map);
  const tOf = (v: number): number => (v - c0) / (c1 - c0);

  const cells: Scene['cells'] = [];
  map.log10_eps_required.forEach((row, j) =>
    row.forEach((v, i) => {
      const X0 = px(ze[i]);
      const Y0 = py(ae[j + 1]);
      // Overlap neighbours by a hair so no seam shows between cells when rasterised.
      cells.push({ x: X0, y: Y0, w: px(ze[i + 1]) - X0 + 0.3 * unit, h: py(ae[j]) - Y0 + 0.3 * unit, fill: Number.isFinite(v) ? viridis(tOf(v)) : '#bbbbbb' });
    }),
  );
  const lines: Scene['lines'] = [];
  const texts: Scene['texts'] = [];
  const marks: Scene['marks'] = [];
  const frames: Scene['frames'] = [{ x: L, y: T, w: plotW, h: plotH }];
  // Contours: casing, then the line.
  for (const c of map.contours) {
    const st = c.eps === 1 ? CONTOUR_STYLE.eps1 : CONTOUR_STYLE.ref;
    for (const pl of chainSegments(c.segments)) {
      const pts = pl.map(([z, a]) => [px(z), py(a)] as [number, number]);
      lines.push({ pts, stroke: '#ffffff', width: (st.width + 1.6) * unit, dash: DASH.solid, cls: 'casing' });
      lines.push({ pts, stroke: '#000000', width: st.width * unit, dash: st.dash.map((d) => d * unit), cls: c.eps === 1 ? 'contour-eps1' : 'contour-ref' });
    }
  }
  // The galaxy: its redshift interval as a bar, its position as a ring (at its IMF's slope, else along the top).
  const g = map.galaxy;
  const gy = g.slope !== undefined && g.slope >= y0 && g.slope <= y1 ? py(g.slope) : T + 6 * unit;
  const clampX = (z: number): number => px(Math.min(x1, Math.max(x0, z)));
  if (g.z_lo !== undefined || g.z_hi !== undefined) {
    const a = clampX(g.z_lo ?? g.z);
    const b = clampX(g.z_hi ?? g.z);
    for (const [stroke, w] of [['#ffffff', 3.2], ['#000000', 1.4]] as const) {
      lines.push({ pts: [[a, gy], [b, gy]], stroke, width: w * unit, dash: DASH.solid, cls: stroke === '#000000' ? 'z-interval' : 'casing' });
      for (const x of [a, b]) lines.push({ pts: [[x, gy - 3 * unit], [x, gy + 3 * unit]], stroke, width: w * unit, dash: DASH.solid, cls: 'casing' });
    }
  }
  if (g.z >= x0 && g.z <= x1) marks.push({ x: px(g.z), y: gy, r: 3.6 * unit });

  // Axes.
  for (const t of niceTicks(x0, x1, Math.max(3, Math.round(plotW / (45 * unit))))) {
    if (t < x0 || t > x1) continue;
    lines.push({ pts: [[px(t), plotBottom], [px(t), plotBottom + 3 * unit]], stroke: '#000000', width: 0.6 * unit, dash: DASH.solid, cls: 'tick' });
    texts.push({ x: px(t), y: plotBottom + fonts.tick + 4 * unit, text: String(t), size: fonts.tick, anchor: 'middle' });
  }
  for (const t of niceTicks(y0, y1, Math.max(3, Math.round(plotH / (30 * unit))))) {
    if (t < y0 || t > y1) continue;
    lines.push({ pts: [[L - 3 * unit, py(t)], [L, py(t)]], stroke: '#000000', width: 0.6 * unit, dash: DASH.solid, cls: 'tick' });
    texts.push({ x: L - 5 * unit, y: py(t) + fonts.tick * 0.35, text: String(t), size: fonts.tick, anchor: 'end' });
  }
  const xLabelY = plotBottom + fonts.tick + fonts.label + 8 * unit;
  texts.push({ x: L + plotW / 2, y: xLabelY, text: 'redshift z', size: fonts.label, anchor: 'middle' });
  texts.push({ x: fonts.label + 1 * unit, y: T + plotH / 2, text: 'IMF slope α above 0.5 Msun', size: fonts.label, anchor: 'middle', rotate: true });
  // Colour bar in log10 ε, with the contour levels marked on it.
  const bx = L + plotW + 10 * unit;
  const bands = 64;
  for (let k = 0; k < bands; k++) {
    const yTop = T + (plotH * (bands - 1 - k)) / bands;
    cells.push({ x: bx, y: yTop, w: barW, h: plotH / bands + 0.3 * unit, fill: viridis((k + 0.5) / bands) });
  }
  frames.push({ x: bx, y: T, w: barW, h: plotH });
  const by = (v: number): number => plotBottom - tOf(v) * plotH;
  for (const t of niceTicks(c0, c1, Math.max(3, Math.round(plotH / (30 * unit))))) {
    if (t < c0 || t > c1) continue;
    lines.push({ pts: [[bx + barW, by(t)], [bx + barW + 3 * unit, by(t)]], stroke: '#000000', width: 0.6 * unit, dash: DASH.solid, cls: 'tick' });
    texts.push({ x: bx + barW + 5 * unit, y: by(t) + fonts.tick * 0.35, text: String(t), size: fonts.tick, anchor: 'start' });
  }
  for (const c of map.contours) {
    const st = c.eps === 1 ? CONTOUR_STYLE.eps1 : CONTOUR_STYLE.ref;
    const y = by(Math.log10(c.eps));
    lines.push({ pts: [[bx - 2 * unit, y], [bx + barW + 2 * unit, y]], stroke: '#ffffff', width: (st.width + 1.6) * unit, dash: DASH.solid, cls: 'casing' });
    lines.push({ pts: [[bx - 2 * unit, y], [bx + barW + 2 * unit, y]], stroke: '#000000', width: st.width * unit, dash: st.dash.map((d) => (d * unit) / 2), cls: 'bar-level' });
  }
  texts.push({ x: width - pad - fonts.label * 0.3, y: T + plotH / 2, text: 'log10 ε_req (median)', size: fonts.label, anchor: 'middle', rotate: true });

  // Legend: the two contours and the galaxy.
  const legendY = xLabelY + fonts.legend + 8 * unit;
  const entries: { kind: 'eps1' | 'ref' | 'galaxy'; label: string }[] = [
    { kind: 'eps1', label: 'ε_req = 1 (all the halo’s baryons)' },
    ...(map.contours.some((c) => c.eps !== 1) ? [{ kind: 'ref' as const, label: `ε_req = ε_ref = ${map.eps_ref}` }] : []),
    { kind: 'galaxy', label: `${map.id}${g.slope !== undefined ? ` (z = ${g.z}, α = ${g.slope})` : ` (z = ${g.z}; its IMF has no single slope: marked at the top)`}${g.z_lo !== undefined || g.z_hi !== undefined ? ', bar: its redshift interval' : ''}` },
  ];
  let ex = pad;
  let ey = legendY;
  for (const e of entries) {
    const w = 26 * unit + e.label.length * fonts.legend * EM;
    if (ex > pad && ex + w > width - pad) (ex = pad), (ey += fonts.legend + 5 * unit);
    const ly = ey - fonts.legend * 0.35;
    if (e.kind === 'galaxy') marks.push({ x: ex + 10 * unit, y: ly, r: 3.6 * unit });
    else {
      const st = e.kind === 'eps1' ? CONTOUR_STYLE.eps1 : CONTOUR_STYLE.ref;
      lines.push({ pts: [[ex, ly], [ex + 20 * unit, ly]], stroke: '#000000', width: st.width * unit, dash: st.dash.map((d) => d * unit), cls: `legend-${e.kind}` });
    }
    texts.push({ x: ex + 24 * unit, y: ey, text: e.label, size: fonts.legend, anchor: 'start' });
    ex += w + 10 * unit;
  }
  let height = ey + 6 * unit;
  if (caption) {
    const capLines = wrap(caption, Math.floor((width - 2 * pad) / (fonts.caption * 0.5)));
    capLines.forEach((c, i) => texts.push({ x: pad, y: height + (i + 1) * (fonts.caption + 2 * unit) - 2 * unit, text: c, size: fonts.caption, anchor: 'start' }));
    height += capLines.length * (fonts.caption + 2 * unit) + pad;
  }
  texts.push({ x: width / 2, y: fonts.title + 4 * unit, text: title, size: fonts.title, anchor: 'middle', bold: true });
  return { width, height, title, caption, cells, lines, frames, marks, texts };
}

const esc = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const n2 = (v: number): string => (Math.round(v * 100) / 100).toString();

/** The figure as a standalone SVG document at print size: `widthMm` across, units pt, fonts as the other figures. */
export function mapSvg(map: DisputedMap, widthMm: number, title: string, caption: string): { svg: string; widthPt: number; heightPt: number } {
  const W = (widthMm / 25.4) * 72;
  const sc = mapScene(map, W, FONT_PT, title, caption);
  const p: string[] = [];
  p.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${n2(widthMm)}mm" height="${n2((sc.height / 72) * 25.4)}mm" viewBox="0 0 ${n2(W)} ${n2(sc.height)}" font-family="Helvetica, Arial, sans-serif" font-size="${FONT_PT.tick}">`);
  p.push(`<title>${esc(title)}</title><desc>${esc(caption)}</desc>`);
  p.push(`<rect width="100%" height="100%" fill="#fff"/>`);
  p.push('<g class="cells" shape-rendering="crispEdges">');
  for (const c of sc.cells) p.push(`<rect x="${n2(c.x)}" y="${n2(c.y)}" width="${n2(c.w)}" height="${n2(c.h)}" fill="${c.fill}"/>`);
  p.push('</g>');
  for (const f of sc.frames) p.push(`<rect x="${n2(f.x)}" y="${n2(f.y)}" width="${n2(f.w)}" height="${n2(f.h)}" fill="none" stroke="#000" stroke-width="0.6"/>`);
  for (const l of sc.lines) {
    const d = l.pts.map((q, i) => `${i ? 'L' : 'M'}${n2(q[0])},${n2(q[1])}`).join('');
    p.push(`<path class="${l.cls}" d="${d}" fill="none" stroke="${l.stroke}" stroke-width="${n2(l.width)}"${l.dash.length ? ` stroke-dasharray="${l.dash.map(n2).join(' ')}"` : ''} stroke-linecap="butt" stroke-linejoin="round"/>`);
  }
  for (const m of sc.marks) p.push(`<circle class="galaxy" cx="${n2(m.x)}" cy="${n2(m.y)}" r="${n2(m.r)}" fill="#fff" stroke="#000" stroke-width="1.2"/>`);
  for (const t of sc.texts) {
    const at = t.rotate ? `transform="translate(${n2(t.x)} ${n2(t.y)}) rotate(-90)"` : `x="${n2(t.x)}" y="${n2(t.y)}"`;
    p.push(`<text ${at} text-anchor="${t.anchor}" font-size="${n2(t.size)}"${t.bold ? ' font-weight="bold"' : ''}>${esc(t.text)}</text>`);
  }
  p.push('</svg>');
  return { svg: p.join('\n'), widthPt: W, heightPt: sc.height };
}
