/**
 * Exponential integrals E_n(x) = ∫₁^∞ e^{−xt} t^{−n} dt for x > 0 (Abramowitz & Stegun 1964, ch. 5):
 * E_1 from its power series (eq. 5.1.11) for x ≤ 1 and its continued fraction (eq. 5.1.22, evaluated by
 * the modified Lentz method) above; E_2 by the recurrence E_{n+1} = (e^{−x} − x E_n)/n (eq. 5.1.14).
 * Relative accuracy ~1e-14. Dimensionless.
 */
const EULER_GAMMA = 0.5772156649015329;

export function expIntegralE1(x: number): number {
  if (!(x > 0)) throw new RangeError(`E_1(x) needs x > 0 (got ${x})`);
  if (x <= 1) {
    // E_1 = −γ − ln x − Σ_{k≥1} (−x)^k / (k · k!)
    let sum = 0;
    let term = 1;
    for (let k = 1; k < 60; k++) {
      term *= -x / k;
      const add = term / k;
      sum += add;
      if (Math.abs(add) < 1e-17 * Math.abs(sum)) break;
    }
    return -EULER_GAMMA - Math.log(x) - sum;
  }
  // E_1 = e^{−x} · 1/(x + 1 − 1²/(x + 3 − 2²/(x + 5 − …))), modified Lentz
  const tiny = 1e-300;
  let b = x + 1;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 500; i++) {
    const an = -i * i;
    b += 2;
    d = 1 / (an * d + b);
    c = b + an / c;
    const del = c * d;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) break;
  }
  return h * Math.exp(-x);
}

/** E_2(x) for x ≥ 0 (E_2(0) = 1), from E_1 by A&S eq. 5.1.14. */
export function expIntegralE2(x: number): number {
  if (x === 0) return 1;
  return Math.exp(-x) - x * expIntegralE1(x);
}
