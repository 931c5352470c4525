import type { ChartModel, DensityLayer, MarkerSet, PointStyle } from './chart-config.js';

/** Full-size markers with outlined shapes and solid error bars. */
export const FULL_POINTS: PointStyle = Object.freeze({ radius: 5, errorWidth: 1.5, alpha: 1, outline: true });

/** Up to this many points every marker is drawn at full size. */
export const THIN_ABOVE = 1500;
/** Above this many points the error bars of galaxies not in tension are left out and a density layer drawn. */
export const DENSITY_ABOVE = 6000;
/** At most this many galaxies are labelled, the most massive first. */
export const MAX_LABELS = 30;

/** How to draw n ordinary points so that they stay legible (thresholds are our own choice, set by eye). */
export function pointStyleFor(n: number): PointStyle {
  if (n <= THIN_ABOVE) return FULL_POINTS;
  if (n <= DENSITY_ABOVE) return { radius: 3, errorWidth: 0.6, alpha: 0.45, outline: false };
  return { radius: 2, errorWidth: 0, alpha: 0.5, outline: false };
}

/** Counts of every finite marker point on an nx × ny grid over the points' extent. */
export function densityLayer(sets: readonly MarkerSet[], nx = 64, ny = 40): DensityLayer {
  let x0 = Infinity;
  let x1 = -Infinity;
  let y0 = Infinity;
  let y1 = -Infinity;
  for (const s of sets)
    for (let i = 0; i < s.x.length; i++) {
      const x = s.x[i];
      const y = s.y[i];
      if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
      if (x < x0) x0 = x;
      if (x > x1) x1 = x;
      if (y < y0) y0 = y;
      if (y > y1) y1 = y;
    }
  const counts = new Uint32Array(nx * ny);
  let max = 0;
  if (x1 >= x0) {
    const dx = (x1 - x0 || 1) / nx;
    const dy = (y1 - y0 || 1) / ny;
    for (const s of sets)
      for (let i = 0; i < s.x.length; i++) {
        const x = s.x[i];
        const y = s.y[i];
        if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
        const cx = Math.min(nx - 1, Math.floor((x - x0) / dx));
        const cy = Math.min(ny - 1, Math.floor((y - y0) / dy));
        const k = cy * nx + cx;
        counts[k]++;
        if (counts[k] > max) max = counts[k];
      }
  } else (x0 = x1 = y0 = y1 = 0);
  return { x0, x1: x1 > x0 ? x1 : x0 + 1, y0, y1: y1 > y0 ? y1 : y0 + 1, nx, ny, counts, max };
}

/** Total number of marker points. */
export const pointCount = (sets: readonly MarkerSet[]): number => sets.reduce((a, s) => a + s.x.length, 0);

/** The drawing choices for marker sets, and the caption sentence that says what was done. */
export function legibility(sets: readonly MarkerSet[]): { points: PointStyle; density?: DensityLayer; note: string } {
  const n = pointCount(sets);
  const points = pointStyleFor(n);
  const tension = sets.some((s) => s.tension?.some((t) => t === 1));
  const top = tension ? ' Galaxies in tension (strained or over budget under their headline IMF) are drawn on top at full size with their error bars.' : '';
  if (n <= THIN_ABOVE) return { points, note: tension ? top.trim() : '' };
  if (n <= DENSITY_ABOVE) return { points, note: `All ${n} points are drawn; with more than ${THIN_ABOVE}, markers are smaller and error bars thinner and translucent.${top}` };
  return {
    points,
    density: densityLayer(sets),
    note: `All ${n} points are drawn as small markers over a grey density layer (counts on a 64 × 40 grid); with more than ${DENSITY_ABOVE}, error bars are shown only for galaxies in tension.${top}`,
  };
}

export interface LabelPoint {
  readonly id: string;
  readonly x: number;
  readonly y: number;
  readonly highlight: boolean;
}

/**
 * The points to label: the highlighted galaxy (always), then, if `tension` is asked for, galaxies in tension,
 * the most massive first, up to MAX_LABELS. Each galaxy is labelled once, at its highest point.
 */
export function labelPoints(m: ChartModel, highlight: string, tension: boolean): { labels: LabelPoint[]; omitted: number } {
  const best = new Map<string, { x: number; y: number; t: boolean }>();
  for (const s of m.markers) {
    if (!s.ids) continue;
    for (let i = 0; i < s.x.length; i++) {
      const id = s.ids[i];
      const t = s.tension?.[i] === 1;
      if (id !== highlight && !(tension && t)) continue;
      const y = s.y[i];
      if (!Number.isFinite(y) || !Number.isFinite(s.x[i])) continue;
      const b = best.get(id);
      if (!b || y > b.y) best.set(id, { x: s.x[i], y, t: t || (b?.t ?? false) });
    }
  }
  const hl = best.get(highlight);
  const rest = [...best.entries()].filter(([id]) => id !== highlight).sort((a, b) => b[1].y - a[1].y);
  const kept = rest.slice(0, MAX_LABELS);
  const labels: LabelPoint[] = kept.map(([id, p]) => ({ id, x: p.x, y: p.y, highlight: false }));
  if (hl) labels.push({ id: highlight, x: hl.x, y: hl.y, highlight: true });
  return { labels, omitted: rest.length - kept.length };
}

/** The caption with what the highlight and the labels add, for the exports. */
export function markedCaption(m: ChartModel, highlight: string, tension: boolean): string {
  const { labels, omitted } = labelPoints(m, highlight, tension);
  const parts = [m.caption];
  if (labels.some((l) => l.highlight)) parts.push(`Ringed and labelled: ${highlight}.`);
  const n = labels.filter((l) => !l.highlight).length;
  if (n) parts.push(`Labelled: ${n} galaxies in tension${omitted ? ` (the ${n} most massive; ${omitted} more not labelled)` : ''}.`);
  return parts.join(' ');
}
