import { bucketQuantiles } from './quantile-buckets.js';
import { selectKth } from './select.js';

/** Values in the pilot sample: the first PILOT of the vector. */
const PILOT = 1024;
/** Half-width of the pilot's window, in units of the rank spread √PILOT / 2 of the pilot's median. */
const PILOT_Z = 3.5;
/** Below this many values the pilot is too large a share: bucketQuantiles does it all. */
const MIN_VALUES = 4 * PILOT;
/** The fewest values windowMedian takes its window for (below, it buckets the vector: a caller that buckets on its own may as well). */
export const WINDOW_MEDIAN_MIN_VALUES = MIN_VALUES;

const pilot = new Float64Array(PILOT);
let inside = new Float64Array(0);

/**
 * The type-7 median (Hyndman & Fan 1996) of the first n values of a (a is not reordered), bit for bit
 * quantilesBySelection, by one pass over a window around a pilot estimate (the sampling step of
 * Floyd & Rivest 1975, CACM 18, 165, "Expected time bounds for selection"):
 * - the window is the values between ranks PILOT/2 ± PILOT_Z·√PILOT/2 of the first PILOT values
 *   (Monte Carlo draws in the order they were made, so a prefix is a random sample; were it not, the
 *   window would only miss more often, never give a wrong answer);
 * - one pass counts the values below and above the window and gathers those inside it;
 * - when both ranks of the median fall among the gathered values they are selected there; otherwise
 *   (a miss, ≈ 5e-4 for i.i.d. values; NaN in a; fewer than MIN_VALUES values) bucketQuantiles answers.
 * Two comparisons and one store per value, without branches, and no scatter into counts: cheaper
 * than bucketing a vector whose median alone is wanted.
 */
export function windowMedian(a: Float64Array, n: number): number {
  if (n < MIN_VALUES) return bucketQuantiles(a, n, [0.5])[0];
  pilot.set(a.subarray(0, PILOT));
  const half = (PILOT_Z * Math.sqrt(PILOT)) / 2;
  const kLo = Math.floor(PILOT / 2 - half);
  const lo = selectKth(pilot, kLo);
  // after the first selection everything right of kLo is ≥ lo
  const hi = selectKth(pilot, Math.ceil(PILOT / 2 + half), kLo);
  if (!(lo <= hi)) return bucketQuantiles(a, n, [0.5])[0]; // NaN in the pilot
  if (inside.length < n) inside = new Float64Array(Math.max(n, 1024));
  const g = inside;
  let below = 0;
  let m = 0;
  let above = 0;
  // Without branches (which of the three a value is cannot be predicted): every value is written at the
  // cursor, which moves on only for a value inside the window; a NaN is neither below nor above, so it
  // is gathered, and found below.
  for (let i = 0; i < n; i++) {
    const v = a[i];
    const b = +(v < lo);
    const c = +(v > hi);
    g[m] = v;
    m += 1 - b - c;
    below += b;
    above += c;
  }
  const h = (n - 1) * 0.5;
  const r0 = Math.floor(h);
  const r1 = h === r0 ? r0 : r0 + 1;
  // both ranks among the gathered values, and no NaN among them
  if (r0 < below || r1 >= below + m || hasNaN(g, m)) return bucketQuantiles(a, n, [0.5])[0];
  const v0 = selectKth(g, r0 - below, 0, m - 1);
  if (r1 === r0) return v0;
  // the next order statistic: everything right of r0 − below is ≥ v0 after the selection
  const v1 = selectKth(g, r1 - below, r0 - below, m - 1);
  return v0 + (h - r0) * (v1 - v0);
}

/** Whether a NaN is among the first n values of a (the window's gathered values: far fewer than the vector). */
function hasNaN(a: Float64Array, n: number): boolean {
  for (let i = 0; i < n; i++) if (a[i] !== a[i]) return true;
  return false;
}

/** For tests: the pilot's size, so a vector can be built whose first values mislead the window. */
export const WINDOW_MEDIAN_PILOT = PILOT;
