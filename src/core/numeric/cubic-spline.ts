/**
 * Natural cubic spline on strictly increasing abscissae (Press et al., Numerical Recipes, 3rd ed., §3.3).
 * Outside the table it extrapolates linearly with the end slopes.
 */
export interface CubicSpline {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly y2: Float64Array;
}

export function cubicSpline(x: ArrayLike<number>, y: ArrayLike<number>): CubicSpline {
  const n = x.length;
  if (n < 3 || y.length !== n) throw new Error(`cubicSpline needs ≥3 matching points (got ${n}, ${y.length})`);
  const xs = Float64Array.from(x);
  const ys = Float64Array.from(y);
  for (let i = 1; i < n; i++) {
    if (!(xs[i] > xs[i - 1])) throw new Error(`cubicSpline abscissae must increase strictly (index ${i})`);
  }
  const y2 = new Float64Array(n);
  const u = new Float64Array(n);
  for (let i = 1; i < n - 1; i++) {
    const sig = (xs[i] - xs[i - 1]) / (xs[i + 1] - xs[i - 1]);
    const p = sig * y2[i - 1] + 2;
    y2[i] = (sig - 1) / p;
    const d = (ys[i + 1] - ys[i]) / (xs[i + 1] - xs[i]) - (ys[i] - ys[i - 1]) / (xs[i] - xs[i - 1]);
    u[i] = ((6 * d) / (xs[i + 1] - xs[i - 1]) - sig * u[i - 1]) / p;
  }
  y2[n - 1] = 0;
  for (let k = n - 2; k >= 0; k--) y2[k] = y2[k] * y2[k + 1] + u[k];
  return { x: xs, y: ys, y2 };
}

/** Index i with x[i] <= v < x[i+1], clamped to [0, n-2]. Uniform grids take the fast path. */
function locate(xs: Float64Array, v: number): number {
  const n = xs.length;
  const x0 = xs[0];
  const h = (xs[n - 1] - x0) / (n - 1);
  let i = Math.floor((v - x0) / h);
  if (i < 0) i = 0;
  else if (i > n - 2) i = n - 2;
  if (xs[i] <= v && v <= xs[i + 1]) return i;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] > v) hi = mid;
    else lo = mid;
  }
  return lo;
}

export function splineEval(s: CubicSpline, v: number): number {
  const { x, y, y2 } = s;
  const n = x.length;
  if (v <= x[0]) {
    const h = x[1] - x[0];
    const slope = (y[1] - y[0]) / h - (h * (2 * y2[0] + y2[1])) / 6;
    return y[0] + slope * (v - x[0]);
  }
  if (v >= x[n - 1]) {
    const h = x[n - 1] - x[n - 2];
    const slope = (y[n - 1] - y[n - 2]) / h + (h * (y2[n - 2] + 2 * y2[n - 1])) / 6;
    return y[n - 1] + slope * (v - x[n - 1]);
  }
  const i = locate(x, v);
  const h = x[i + 1] - x[i];
  const a = (x[i + 1] - v) / h;
  const b = (v - x[i]) / h;
  return a * y[i] + b * y[i + 1] + ((a * a * a - a) * y2[i] + (b * b * b - b) * y2[i + 1]) * (h * h) / 6;
}

/** First derivative of the spline. */
export function splineDeriv(s: CubicSpline, v: number): number {
  const { x, y, y2 } = s;
  const n = x.length;
  const vv = Math.min(Math.max(v, x[0]), x[n - 1]);
  const i = locate(x, vv);
  const h = x[i + 1] - x[i];
  const a = (x[i + 1] - vv) / h;
  const b = (vv - x[i]) / h;
  return (y[i + 1] - y[i]) / h + ((-(3 * a * a - 1) * y2[i] + (3 * b * b - 1) * y2[i + 1]) * h) / 6;
}
