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
