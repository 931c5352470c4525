import type { Shape } from '../palette.js';

/** A line series on the shared x axis (null where undefined). `dash` in CSS px; empty or absent = solid. */
export interface LineSpec {
  readonly label: string;
  readonly color: string;
  readonly dash?: readonly number[];
  readonly width?: number;
  /** Leave out of the legend (the second edge of a band already named by the first). */
  readonly noLegend?: boolean;
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
  /** Galaxy id of every point (for the highlight and the labels). */
  readonly ids?: readonly string[];
  /** 1 where the galaxy is in tension (headline verdict strained or over budget): drawn on top, full size. */
  readonly tension?: Uint8Array;
}

/** How the ordinary (not in tension) markers are drawn; chosen from the number of points (see legibility.ts). */
export interface PointStyle {
  /** Marker half-size, CSS px. */
  readonly radius: number;
  /** Error-bar width, CSS px (0: no error bars). */
  readonly errorWidth: number;
  /** Opacity of error bars and markers. */
  readonly alpha: number;
  /** Black outline around each marker. */
  readonly outline: boolean;
}

/** Point counts on a regular grid in data coordinates, drawn as grey cells beneath the markers. */
export interface DensityLayer {
  readonly x0: number;
  readonly x1: number;
  readonly y0: number;
  readonly y1: number;
  readonly nx: number;
  readonly ny: number;
  /** counts[j * nx + i] for cell column i, row j (row 0 at y0). */
  readonly counts: Uint32Array;
  readonly max: number;
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
  /** Style of the markers not in tension (full size when absent). */
  readonly points?: PointStyle;
  /** Density of all points, beneath the markers (for very many points). */
  readonly density?: DensityLayer;
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
