import type { Shape } from '../palette.js';
import { addMarkerPolygons, markerPolygons } from './marker-path.js';

/**
 * Markers (or error bars) per Path2D. Chromium's Path2D slows down with every closed sub-path it holds
 * (25 000 markers in one path took seconds to build; in batches of 256, ~0.1 s to build and fill), so the
 * markers of one set are split into batches. Measured in headless Chromium on this project's machine.
 */
export const PER_PATH = 256;

/** Pixel positions of the markers of one set that are drawn (finite), with their error-bar ends. */
export interface PixelPoints {
  readonly n: number;
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** Error-bar ends in pixels (NaN where the set has none). */
  readonly lo: Float64Array;
  readonly hi: Float64Array;
}

/** The batches of marker shapes at (x[i], y[i]), half-size r px: one shape definition for every marker. */
export function markerPaths(shape: Shape, p: PixelPoints, r: number): Path2D[] {
  const polys = markerPolygons(shape, r);
  const out: Path2D[] = [];
  for (let k = 0; k < p.n; k += PER_PATH) {
    const path = new Path2D();
    const end = Math.min(p.n, k + PER_PATH);
    for (let i = k; i < end; i++) addMarkerPolygons(path, polys, p.x[i], p.y[i], r);
    out.push(path);
  }
  return out;
}

/** The batches of vertical error bars from lo[i] to hi[i] at x[i] (bars with a non-finite end are left out). */
export function barPaths(p: PixelPoints): Path2D[] {
  const out: Path2D[] = [];
  for (let k = 0; k < p.n; k += PER_PATH) {
    const path = new Path2D();
    const end = Math.min(p.n, k + PER_PATH);
    for (let i = k; i < end; i++) {
      if (!Number.isFinite(p.lo[i]) || !Number.isFinite(p.hi[i])) continue;
      path.moveTo(p.x[i], p.lo[i]);
      path.lineTo(p.x[i], p.hi[i]);
    }
    out.push(path);
  }
  return out;
}
