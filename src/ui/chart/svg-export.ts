import type { ChartModel } from './chart-config.js';
import { extent } from './chart-config.js';
import { svgMarker } from './marker-path.js';

const esc = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

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

function wrap(text: string, width: number): string[] {
  const words = text.split(/\s+/);
  const lines: string[] = [];
  let line = '';
  for (const w of words) {
    if ((line + ' ' + w).length > width && line) {
      lines.push(line);
      line = w;
    } else line = line ? line + ' ' + w : w;
  }
  if (line) lines.push(line);
  return lines;
}

/** A standalone SVG of the figure: axes with labels and units, lines, markers with error bars, legend, caption. */
export function chartToSvg(m: ChartModel, xRange?: [number, number], yRange?: [number, number]): string {
  const W = 900;
  const H = 560;
  const L = 80;
  const R = 220;
  const T = 40;
  const B = 60;
  const captionLines = wrap(m.caption, 120);
  const HT = H + captionLines.length * 16 + 10;
  const xs = [...Array.from(m.x), ...m.markers.flatMap((s) => Array.from(s.x))];
  const ys = [...m.lineData.flatMap((d) => d.filter((v): v is number => v !== null)), ...m.markers.flatMap((s) => [...Array.from(s.y), ...Array.from(s.yLo ?? []), ...Array.from(s.yHi ?? [])])];
  const [x0, x1] = xRange ?? extent(xs);
  let [y0, y1] = yRange ?? extent(ys);
  if (!yRange) {
    const pad = 0.05 * (y1 - y0 || 1);
    y0 -= pad;
    y1 += pad;
  }
  const px = (x: number): number => L + ((x - x0) / (x1 - x0 || 1)) * (W - L - R);
  const py = (y: number): number => H - B - ((y - y0) / (y1 - y0 || 1)) * (H - T - B);
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${HT}" viewBox="0 0 ${W} ${HT}" font-family="sans-serif" font-size="13">`);
  parts.push(`<rect width="100%" height="100%" fill="#fff"/>`);
  parts.push(`<text x="${W / 2}" y="24" text-anchor="middle" font-size="16" font-weight="bold">${esc(m.title)}</text>`);
  parts.push(`<rect x="${L}" y="${T}" width="${W - L - R}" height="${H - T - B}" fill="none" stroke="#000"/>`);
  const xt = m.xCategories ? m.xCategories.map((_, i) => i + 1) : niceTicks(x0, x1);
  for (const t of xt) {
    if (t < x0 || t > x1) continue;
    const label = m.xCategories ? m.xCategories[t - 1] : String(t);
    parts.push(`<line x1="${px(t)}" x2="${px(t)}" y1="${H - B}" y2="${H - B + 5}" stroke="#000"/><text x="${px(t)}" y="${H - B + 20}" text-anchor="middle">${esc(label)}</text>`);
  }
  for (const t of niceTicks(y0, y1)) {
    parts.push(`<line x1="${L - 5}" x2="${L}" y1="${py(t)}" y2="${py(t)}" stroke="#000"/><text x="${L - 8}" y="${py(t) + 4}" text-anchor="end">${t}</text>`);
  }
  parts.push(`<text x="${(L + W - R) / 2}" y="${H - 15}" text-anchor="middle">${esc(m.xLabel)}</text>`);
  parts.push(`<text transform="translate(20 ${(T + H - B) / 2}) rotate(-90)" text-anchor="middle">${esc(m.yLabel)}</text>`);
  parts.push(`<clipPath id="plot"><rect x="${L}" y="${T}" width="${W - L - R}" height="${H - T - B}"/></clipPath><g clip-path="url(#plot)">`);
  m.lines.forEach((ln, i) => {
    const d = m.lineData[i];
    let path = '';
    let pen = false;
    d.forEach((v, j) => {
      if (v === null || !Number.isFinite(v)) {
        pen = false;
        return;
      }
      path += `${pen ? 'L' : 'M'}${px(m.x[j]).toFixed(1)},${py(v).toFixed(1)}`;
      pen = true;
    });
    parts.push(`<path d="${path}" fill="none" stroke="${ln.color}" stroke-width="${ln.width ?? 1.5}"${ln.dash ? ` stroke-dasharray="${ln.dash.join(' ')}"` : ''}/>`);
  });
  for (const s of m.markers) {
    for (let j = 0; j < s.x.length; j++) {
      if (s.yLo && s.yHi) parts.push(`<line x1="${px(s.x[j])}" x2="${px(s.x[j])}" y1="${py(s.yLo[j])}" y2="${py(s.yHi[j])}" stroke="${s.color}" stroke-width="1.5"/>`);
      parts.push(svgMarker(s.shape, px(s.x[j]), py(s.y[j]), 5, s.color));
    }
  }
  parts.push('</g>');
  let ly = T + 10;
  for (const ln of m.lines) {
    parts.push(`<line x1="${W - R + 15}" x2="${W - R + 45}" y1="${ly}" y2="${ly}" stroke="${ln.color}" stroke-width="${ln.width ?? 1.5}"${ln.dash ? ` stroke-dasharray="${ln.dash.join(' ')}"` : ''}/><text x="${W - R + 52}" y="${ly + 4}">${esc(ln.label)}</text>`);
    ly += 20;
  }
  for (const s of m.markers) {
    parts.push(svgMarker(s.shape, W - R + 30, ly, 5, s.color) + `<text x="${W - R + 52}" y="${ly + 4}">${esc(s.label.replace(/^\S+\s/, ''))}</text>`);
    ly += 20;
  }
  captionLines.forEach((c, i) => parts.push(`<text x="${L}" y="${H + 10 + i * 16}" font-size="12">${esc(c)}</text>`));
  parts.push('</svg>');
  return parts.join('\n');
}
