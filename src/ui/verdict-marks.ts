import { html, svg, type TemplateResult } from 'lit';
import { markerPolygons } from './chart/marker-path.js';
import type { Shape } from './palette.js';

/** How full a mark is drawn: the verdict as a shape cue, never by colour alone. */
export type MarkFill = 'none' | 'half' | 'full';

/** within budget → hollow, strained → half filled, over budget → filled. */
export const VERDICT_FILL: Record<string, MarkFill> = { 'within budget': 'none', strained: 'half', 'over budget': 'full' };

/** Short verdict words for narrow cells. */
export const VERDICT_SHORT: Record<string, string> = { 'within budget': 'within', strained: 'strained', 'over budget': 'over' };

/** The marker shape as SVG geometry (the same polygons as the figures), centred on (c, c). */
function shapeGeometry(shape: Shape, c: number, r: number, attrs: { fill: string; stroke: string; sw: number }): TemplateResult {
  const polys = markerPolygons(shape, r);
  if (!polys) return svg`<circle cx=${c} cy=${c} r=${r} fill=${attrs.fill} stroke=${attrs.stroke} stroke-width=${attrs.sw}></circle>`;
  const pts = polys[0];
  const list: string[] = [];
  for (let i = 0; i < pts.length; i += 2) list.push(`${(c + pts[i]).toFixed(2)},${(c + pts[i + 1]).toFixed(2)}`);
  return svg`<polygon points=${list.join(' ')} fill=${attrs.fill} stroke=${attrs.stroke} stroke-width=${attrs.sw}></polygon>`;
}

/**
 * A small mark in an IMF's colour and shape (presentation attributes, no style= under the page's CSP).
 * `fill` shows the verdict: hollow, half (lower half filled) or full. Decorative: callers give the text.
 */
export function mark(shape: Shape, color: string, fill: MarkFill = 'full', size = 14): TemplateResult {
  const c = size / 2;
  const r = size * 0.3;
  const outline = { fill: fill === 'full' ? color : '#fff', stroke: fill === 'full' ? '#000' : color, sw: fill === 'full' ? 0.6 : 1.6 };
  return html`<svg class="mark" width=${size} height=${size} viewBox=${`0 0 ${size} ${size}`} aria-hidden="true" focusable="false">
    ${shapeGeometry(shape, c, r, outline)}
    ${fill === 'half'
      ? svg`<clipPath id=${`lower-${size}`}><rect x="0" y=${c} width=${size} height=${c}></rect></clipPath>
          <g clip-path=${`url(#lower-${size})`}>${shapeGeometry(shape, c, r, { fill: color, stroke: color, sw: 1.6 })}</g>`
      : ''}
  </svg>`;
}

/** A line sample for a legend, in the line's colour, width and dash. */
export function lineSample(color: string, dash: readonly number[] | undefined, width = 1.5): TemplateResult {
  return html`<svg class="mark" width="28" height="10" viewBox="0 0 28 10" aria-hidden="true" focusable="false">
    ${svg`<line x1="1" x2="27" y1="5" y2="5" stroke=${color} stroke-width=${width} stroke-dasharray=${dash && dash.length ? dash.join(' ') : 'none'} stroke-linecap="round"></line>`}
  </svg>`;
}
