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
    let t: number;
    if (x > y) {
      t = x;
      x = y;
      y = t;
    }
    if (y > z) {
      t = y;
      y = z;
      z = t;
    }
    if (x > y) y = x;
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

/** Most buckets of the pre-pass (~5 values per bucket for 20 000 draws); fewer for shorter vectors. */
const MAX_BUCKETS = 4096;
let bucketOf = new Uint16Array(0);
let gathered = new Float64Array(0);
const counts = new Int32Array(MAX_BUCKETS + 1);
const start = new Int32Array(MAX_BUCKETS + 1);
const wantedRanks: number[] = [];

/** The bucket holding rank r (start[] cumulative over nb buckets). */
function bucketOfRank(r: number, nb: number): number {
  let lo = 0;
  let hi = nb - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (start[mid + 1] > r) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/**
 * The same type-7 quantiles as quantilesBySelection (bit for bit: the same order statistics and the
 * same interpolation), of the first n values of `a`, without reordering `a`, in three linear passes:
 * the range; a bucket index per value over equal buckets of [min, max] (n/4 of them, at most 4096;
 * monotone in the value, so buckets hold consecutive ranks) with the count per bucket; then only the
 * values of the buckets that hold a wanted rank are gathered and the exact order statistics selected
 * among them. Any monotone bucketing gives the same order statistics, so `range`, when the caller
 * already knows bounds that hold every value, skips the first pass. Falls back to
 * quantilesBySelection on a copy for short vectors and for vectors holding ±Infinity or NaN.
 */
export function quantilesByBuckets(a: Float64Array, n: number, qs: readonly number[], range?: { readonly min: number; readonly max: number }): number[] {
  let min = Infinity;
  let max = -Infinity;
  if (range && range.min > -Infinity && range.max < Infinity) {
    min = range.min;
    max = range.max;
  } else {
    for (let i = 0; i < n; i++) {
      const v = a[i];
      if (v < min) min = v;
      if (v > max) max = v;
    }
  }
  if (n < 512 || !(min > -Infinity && max < Infinity)) return quantilesBySelection(a.slice(0, n), qs);
  if (min === max) return qs.map(() => min);
  let nb = 64;
  while (nb < MAX_BUCKETS && nb * 4 < n) nb *= 2;
  if (bucketOf.length < n) bucketOf = new Uint16Array(n);
  const scale = nb / (max - min);
  counts.fill(0, 0, nb + 1);
  const top = nb - 1;
  for (let i = 0; i < n; i++) {
    const v = a[i];
    let b = ((v - min) * scale) | 0;
    if (b > top) b = top;
    else if (b < 0 || v !== v) b = 0;
    bucketOf[i] = b;
    counts[b]++;
  }
  // cumulative start of each bucket
  start[0] = 0;
  for (let b = 0; b < nb; b++) start[b + 1] = start[b] + counts[b];
  // the wanted buckets (those of ⌊h⌋ and, when h is fractional, ⌊h⌋ + 1), each with its write offset + 1 in counts[]
  counts.fill(0, 0, nb + 1);
  wantedRanks.length = 0;
  for (const q of qs) {
    const h = (n - 1) * q;
    const lo = Math.floor(h);
    wantedRanks.push(lo);
    if (h !== lo && lo + 1 < n) wantedRanks.push(lo + 1);
  }
  let total = 0;
  for (const r of wantedRanks) {
    const b = bucketOfRank(r, nb);
    if (counts[b] === 0) {
      counts[b] = total + 1;
      total += start[b + 1] - start[b];
    }
  }
  if (gathered.length < total) gathered = new Float64Array(Math.max(total, 1024));
  // offsets of the wanted buckets before the gather moves them on
  const offsets = new Map<number, number>();
  for (const r of wantedRanks) {
    const b = bucketOfRank(r, nb);
    if (!offsets.has(b)) offsets.set(b, counts[b] - 1);
  }
  for (let i = 0; i < n; i++) {
    const b = bucketOf[i];
    const c = counts[b];
    if (c !== 0) {
      gathered[c - 1] = a[i];
      counts[b] = c + 1;
    }
  }
  const orderStat = (r: number): number => {
    const b = bucketOfRank(r, nb);
    const off = offsets.get(b)!;
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
