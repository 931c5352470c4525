import type { Shape } from '../palette.js';

/** A line series on the shared x axis (null where undefined). */
export interface LineSpec {
  readonly label: string;
  readonly color: string;
  readonly dash?: number[];
  readonly width?: number;
}

/** Markers with vertical error bars, drawn over the lines. */
export interface MarkerSet {
  readonly label: string;
  readonly color: string;
  readonly shape: Shape;
  readonly x: ArrayLike<number>;
  readonly y: ArrayLike<number>;
  readonly yLo?: ArrayLike<number>;
  readonly yHi?: ArrayLike<number>;
}

/** Everything a figure needs; built by pure functions in src/ui/chart/, drawn by <audit-chart>. */
export interface ChartModel {
  readonly id: string;
  readonly title: string;
  readonly xLabel: string;
  readonly yLabel: string;
  /** Caption stating the assumptions (exported with the figure). */
  readonly caption: string;
  readonly x: Float64Array;
  readonly lines: readonly LineSpec[];
  readonly lineData: readonly (readonly (number | null)[])[];
  readonly markers: readonly MarkerSet[];
  /** Pairs of line indices to shade between. */
  readonly bands?: readonly [number, number][];
  /** Tick labels for a categorical x axis (index → label). */
  readonly xCategories?: readonly string[];
}

export function extent(values: Iterable<number>): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (Number.isFinite(v)) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return [lo, hi];
}
