/**
 * Gauss–Legendre nodes and weights on [-1, 1], computed once by Newton iteration on P_n
 * (Abramowitz & Stegun 1964, §25.4.29). Used for every smooth quadrature in the core.
 */
export interface GaussRule {
  readonly x: Float64Array;
  readonly w: Float64Array;
}

const cache = new Map<number, GaussRule>();

export function gaussLegendre(n: number): GaussRule {
  const hit = cache.get(n);
  if (hit) return hit;
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-15) break;
    }
    x[i] = -z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
  }
  const rule = { x, w };
  cache.set(n, rule);
  return rule;
}

/** ∫_a^b f(x) dx with an n-point Gauss–Legendre rule on `panels` equal panels. */
export function integrate(f: (x: number) => number, a: number, b: number, panels = 1, n = 8): number {
  const { x, w } = gaussLegendre(n);
  const h = (b - a) / panels;
  let sum = 0;
  for (let p = 0; p < panels; p++) {
    const mid = a + (p + 0.5) * h;
    const half = 0.5 * h;
    for (let i = 0; i < n; i++) sum += w[i] * f(mid + half * x[i]);
  }
  return sum * 0.5 * h;
}
