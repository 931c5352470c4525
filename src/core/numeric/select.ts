/**
 * k-th smallest element of an array in expected linear time (Hoare's quickselect, median-of-three
 * pivots); reorders the array in place. Used for Monte Carlo quantiles, where a full sort is wasted.
 */
export function selectKth(a: Float64Array, k: number, from = 0, to = a.length - 1): number {
  let lo = from;
  let hi = to;
  while (hi > lo) {
    const mid = (lo + hi) >> 1;
    // median of three as the pivot
    let x = a[lo];
    let y = a[mid];
    let z = a[hi];
    if (x > y) [x, y] = [y, x];
    if (y > z) [y, z] = [z, y];
    if (x > y) [x, y] = [y, x];
    const pivot = y;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k];
  }
  return a[k];
}

/**
 * Type-7 quantiles (Hyndman & Fan 1996), the same values as quantileSorted on the sorted array.
 * Quantiles are taken in increasing order; each selection leaves everything above its rank to the
 * right, so the next one searches only that part.
 */
export function quantilesBySelection(a: Float64Array, qs: readonly number[]): number[] {
  const n = a.length;
  const order = qs.map((q, i) => [q, i] as const).sort((x, y) => x[0] - y[0]);
  const out = new Array<number>(qs.length);
  let from = 0;
  for (const [q, idx] of order) {
    const h = (n - 1) * q;
    const lo = Math.floor(h);
    const v0 = selectKth(a, lo, Math.min(from, lo), n - 1);
    from = lo;
    if (lo + 1 >= n || h === lo) {
      out[idx] = v0;
      continue;
    }
    // the (lo+1)-th order statistic is the smallest value to the right of rank lo
    let v1 = Infinity;
    for (let i = lo + 1; i < n; i++) if (a[i] < v1) v1 = a[i];
    out[idx] = v0 + (h - lo) * (v1 - v0);
  }
  return out;
}

/** Buckets of the pre-pass; ~5 values per bucket for 20 000 draws. */
const BUCKETS = 4096;
let bucketOf = new Uint16Array(0);
let gathered = new Float64Array(0);
const counts = new Int32Array(BUCKETS + 1);
const start = new Int32Array(BUCKETS + 1);

/**
 * The same type-7 quantiles as quantilesBySelection (bit for bit: the same order statistics and the
 * same interpolation), of the first n values of `a`, without reordering `a`, in three linear passes:
 * the range; a bucket index per value over 4096 equal buckets of [min, max] (monotone in the value, so
 * buckets hold consecutive ranks) with the count per bucket; then only the values of the buckets that
 * hold a wanted rank are gathered and the exact order statistics selected among them. Falls back to
 * quantilesBySelection on a copy for short vectors and for vectors holding ±Infinity or NaN.
 */
export function quantilesByBuckets(a: Float64Array, n: number, qs: readonly number[]): number[] {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = a[i];
    if (v < min) min = v;
    if (v > max) max = v;
  }
  if (n < 512 || !(min > -Infinity && max < Infinity)) return quantilesBySelection(a.slice(0, n), qs);
  if (min === max) return qs.map(() => min);
  if (bucketOf.length < n) bucketOf = new Uint16Array(n);
  const scale = BUCKETS / (max - min);
  counts.fill(0);
  for (let i = 0; i < n; i++) {
    let b = ((a[i] - min) * scale) | 0;
    if (b >= BUCKETS) b = BUCKETS - 1;
    bucketOf[i] = b;
    counts[b]++;
  }
  // the ranks wanted: ⌊h⌋ and, when h is fractional, ⌊h⌋ + 1
  const ranks: number[] = [];
  for (const q of qs) {
    const h = (n - 1) * q;
    const lo = Math.floor(h);
    ranks.push(lo);
    if (h !== lo && lo + 1 < n) ranks.push(lo + 1);
  }
  // cumulative start of each bucket; slot of each wanted bucket in the gathered array
  start.fill(0);
  for (let b = 0; b < BUCKETS; b++) start[b + 1] = start[b] + counts[b];
  const bucketOfRank = (r: number): number => {
    let lo = 0;
    let hi = BUCKETS - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (start[mid + 1] > r) hi = mid;
      else lo = mid + 1;
    }
    return lo;
  };
  const wanted = [...new Set(ranks.map(bucketOfRank))];
  let total = 0;
  // counts[b] becomes the write position of a wanted bucket (+1, so 0 means not wanted)
  const offsetOf = new Map<number, number>();
  for (const b of wanted) {
    offsetOf.set(b, total);
    total += counts[b];
  }
  counts.fill(0);
  for (const b of wanted) counts[b] = offsetOf.get(b)! + 1;
  if (gathered.length < total) gathered = new Float64Array(Math.max(total, 1024));
  for (let i = 0; i < n; i++) {
    const c = counts[bucketOf[i]];
    if (c !== 0) {
      gathered[c - 1] = a[i];
      counts[bucketOf[i]] = c + 1;
    }
  }
  const orderStat = (r: number): number => {
    const b = bucketOfRank(r);
    const off = offsetOf.get(b)!;
    const size = start[b + 1] - start[b];
    return selectKth(gathered, off + (r - start[b]), off, off + size - 1);
  };
  return qs.map((q) => {
    const h = (n - 1) * q;
    const lo = Math.floor(h);
    const v0 = orderStat(lo);
    if (lo + 1 >= n || h === lo) return v0;
    return v0 + (h - lo) * (orderStat(lo + 1) - v0);
  });
}
