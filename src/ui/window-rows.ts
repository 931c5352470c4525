/**
 * Windowing for long tables: only the rows in view (plus a few on either side) are rendered, with spacers
 * above and below that keep the scroll height of the whole list.
 */

/** Prefix sums of row heights: offsets[i] is the top of row i, offsets[n] the total height (px). */
export function rowOffsets(heights: ArrayLike<number>): Float64Array {
  const out = new Float64Array(heights.length + 1);
  for (let i = 0; i < heights.length; i++) out[i + 1] = out[i] + heights[i];
  return out;
}

/** Index of the row that contains the vertical position y (clamped to [0, n − 1]; 0 for an empty list). */
export function rowAt(offsets: Float64Array, y: number): number {
  const n = offsets.length - 1;
  if (n <= 0) return 0;
  let lo = 0;
  let hi = n - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (offsets[mid] <= y) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

export interface RowWindow {
  /** First rendered row. */
  readonly start: number;
  /** One past the last rendered row. */
  readonly end: number;
  /** Height of the spacer above the rendered rows, px. */
  readonly padTop: number;
  /** Height of the spacer below them, px. */
  readonly padBottom: number;
}

/** The rows to render for a viewport of height viewHeight scrolled to scrollTop, with `overscan` extra rows each side. */
export function rowWindow(offsets: Float64Array, scrollTop: number, viewHeight: number, overscan = 8): RowWindow {
  const n = offsets.length - 1;
  if (n <= 0) return { start: 0, end: 0, padTop: 0, padBottom: 0 };
  const first = rowAt(offsets, Math.max(0, scrollTop));
  const last = rowAt(offsets, Math.max(0, scrollTop + Math.max(viewHeight, 1) - 1e-6));
  const start = Math.max(0, first - overscan);
  const end = Math.min(n, last + 1 + overscan);
  return { start, end, padTop: offsets[start], padBottom: offsets[n] - offsets[end] };
}

/** The scrollTop that brings row i fully into a viewport of height viewHeight, moving as little as possible. */
export function scrollToShow(offsets: Float64Array, i: number, scrollTop: number, viewHeight: number): number {
  const top = offsets[i];
  const bottom = offsets[i + 1];
  if (top < scrollTop) return top;
  if (bottom > scrollTop + viewHeight) return Math.max(0, bottom - viewHeight);
  return scrollTop;
}
