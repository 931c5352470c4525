import type { Shape } from '../palette.js';

/**
 * Vertices of a marker shape centred on (0, 0) with half-size r (y down), as closed polygons; a circle is
 * returned as null. One definition serves the canvas, the SVG export and the marks in the results table.
 */
export function markerPolygons(shape: Shape, r: number): number[][] | null {
  const t = r / 3;
  switch (shape) {
    case 'circle':
      return null;
    case 'square':
      return [[-r, -r, r, -r, r, r, -r, r]];
    case 'triangle':
      return [[0, -r * 1.2, r * 1.1, r * 0.9, -r * 1.1, r * 0.9]];
    case 'triangle-down':
      return [[0, r * 1.2, r * 1.1, -r * 0.9, -r * 1.1, -r * 0.9]];
    case 'diamond':
      return [[0, -r * 1.3, r * 1.1, 0, 0, r * 1.3, -r * 1.1, 0]];
    case 'cross':
      return [[-t, -r, t, -r, t, -t, r, -t, r, t, t, t, t, r, -t, r, -t, t, -r, t, -r, -t, -t, -t]];
    case 'x': {
      // The plus rotated by 45°.
      const [p] = markerPolygons('cross', r * 1.1)!;
      const c = Math.SQRT1_2;
      const out: number[] = [];
      for (let i = 0; i < p.length; i += 2) out.push(c * (p[i] - p[i + 1]), c * (p[i] + p[i + 1]));
      return [out];
    }
    case 'star': {
      const out: number[] = [];
      for (let k = 0; k < 10; k++) {
        const a = -Math.PI / 2 + (k * Math.PI) / 5;
        const rr = k % 2 ? r * 0.55 : r * 1.3;
        out.push(rr * Math.cos(a), rr * Math.sin(a));
      }
      return [out];
    }
  }
}

/** Adds one marker shape centred on (x, y) to the current path (no beginPath: many markers can share a path). */
export function addMarker(ctx: CanvasRenderingContext2D | Path2D, shape: Shape, x: number, y: number, r: number): void {
  addMarkerPolygons(ctx, markerPolygons(shape, r), x, y, r);
}

/** Adds a marker from its polygons (markerPolygons; null: a circle of radius r) centred on (x, y). */
export function addMarkerPolygons(ctx: CanvasRenderingContext2D | Path2D, polys: number[][] | null, x: number, y: number, r: number): void {
  if (!polys) {
    ctx.moveTo(x + r, y);
    ctx.arc(x, y, r, 0, 2 * Math.PI);
    return;
  }
  for (const p of polys) {
    ctx.moveTo(x + p[0], y + p[1]);
    for (let i = 2; i < p.length; i += 2) ctx.lineTo(x + p[i], y + p[i + 1]);
    ctx.closePath();
  }
}

/** Draws one marker shape centred on (x, y) with half-size r on a 2D canvas context (begins a new path). */
export function drawMarker(ctx: CanvasRenderingContext2D, shape: Shape, x: number, y: number, r: number): void {
  ctx.beginPath();
  addMarker(ctx, shape, x, y, r);
}

const f1 = (v: number): string => (Math.round(v * 100) / 100).toString();

/** The same shapes as one SVG element; `extra` is appended as attributes (fill, stroke, opacity…). */
export function svgMarker(shape: Shape, x: number, y: number, r: number, color: string, extra = 'stroke="#000" stroke-width="0.6"'): string {
  const polys = markerPolygons(shape, r);
  const f = `fill="${color}" ${extra}`;
  if (!polys) return `<circle cx="${f1(x)}" cy="${f1(y)}" r="${f1(r)}" ${f}/>`;
  const pts = polys[0];
  const list: string[] = [];
  for (let i = 0; i < pts.length; i += 2) list.push(`${f1(x + pts[i])},${f1(y + pts[i + 1])}`);
  return `<polygon points="${list.join(' ')}" ${f}/>`;
}
