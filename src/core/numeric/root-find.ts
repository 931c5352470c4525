/**
 * Bracketed root of a continuous function by bisection refined with the secant step
 * (Brent-style safeguarding: a secant step outside the bracket falls back to bisection).
 */
export function findRoot(f: (x: number) => number, lo: number, hi: number, tol = 1e-12, maxIter = 200): number {
  let fa = f(lo);
  let fb = f(hi);
  if (fa === 0) return lo;
  if (fb === 0) return hi;
  if (Math.sign(fa) === Math.sign(fb)) {
    throw new RangeError(`findRoot: no sign change in [${lo}, ${hi}]`);
  }
  let a = lo;
  let b = hi;
  for (let i = 0; i < maxIter; i++) {
    let m = b - (fb * (b - a)) / (fb - fa);
    if (!(m > Math.min(a, b) && m < Math.max(a, b)) || i % 3 === 2) m = 0.5 * (a + b);
    const fm = f(m);
    if (fm === 0 || Math.abs(b - a) < tol * (1 + Math.abs(m))) return m;
    if (Math.sign(fm) === Math.sign(fa)) {
      a = m;
      fa = fm;
    } else {
      b = m;
      fb = fm;
    }
  }
  return 0.5 * (a + b);
}
