import { findRoot } from '../numeric/root-find.js';

/**
 * P(N ≥ k) for a Poisson count of mean μ: 1 − Σ_{i<k} e^−μ μ^i/i!, the regularised lower incomplete
 * gamma function P(k, μ) (closed form; e.g. Abramowitz & Stegun 1964, eq. 6.5.13 and 26.4.21). For
 * k = 1 it is 1 − e^−μ, the extreme-value statistic of one galaxy. Summed in the log domain: the upper
 * tail Σ_{i≥k} when μ < k (no cancellation for small probabilities), the complement otherwise.
 */
export function poissonAtLeast(k: number, mu: number): number {
  if (!(Number.isInteger(k) && k >= 0)) throw new RangeError(`poissonAtLeast: k must be a whole number ≥ 0 (got ${k})`);
  if (!(mu >= 0) || !Number.isFinite(mu)) throw new RangeError(`poissonAtLeast: μ must be finite and ≥ 0 (got ${mu})`);
  if (k === 0) return 1;
  if (mu === 0) return 0;
  if (k === 1) return -Math.expm1(-mu);
  const lnMu = Math.log(mu);
  if (mu < k) {
    // upper tail from i = k: terms fall once i > μ
    // The first term in the log domain, the rest by the ratio μ/(i + 1) < 1 (no exp or log per term).
    let t = Math.exp(-mu + k * lnMu - lnFactorial(k));
    let sum = 0;
    for (let i = k; i < k + 10000 && t > 0; i++) {
      sum += t;
      if (t < 1e-17 * sum) break;
      t *= mu / (i + 1);
    }
    return Math.min(sum, 1);
  }
  // μ ≥ k: the lower sum Σ_{i<k}, from its largest term (i = k − 1) downwards; terms fall by i/μ each
  // step, so it stops after O(√μ) terms (a sum from i = 0 would cost k terms at every call).
  // The first term in the log domain, the rest by the ratio i/μ < 1.
  let t = Math.exp(-mu + (k - 1) * lnMu - lnFactorial(k - 1));
  let lower = 0;
  for (let i = k - 1; i >= 0 && t > 0; i--) {
    lower += t;
    if (t < 1e-17 * lower) break;
    t *= i / mu;
  }
  return Math.max(0, 1 - lower);
}

/** ln k! (exact sum for k ≤ 170, Stirling series beyond; Abramowitz & Stegun 6.1.41). */
function lnFactorial(k: number): number {
  if (k <= 170) {
    let s = 0;
    for (let i = 2; i <= k; i++) s += Math.log(i);
    return s;
  }
  const x = k + 1;
  return (x - 0.5) * Math.log(x) - x + 0.5 * Math.log(2 * Math.PI) + 1 / (12 * x) - 1 / (360 * x ** 3);
}

/** The Poisson mean μ at which P(N ≥ k) = p (0 < p < 1, k ≥ 1); P(k, μ) rises monotonically with μ. */
export function poissonMeanForChance(k: number, p: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`poissonMeanForChance: p must lie in (0, 1) (got ${p})`);
  if (k === 1) return -Math.log1p(-p);
  let hi = k + 10 * Math.sqrt(k) + 10;
  while (poissonAtLeast(k, hi) < p) hi *= 2;
  const f = (lnMu: number): number => poissonAtLeast(k, Math.exp(lnMu)) - p;
  let lo = Math.log(hi) - 1;
  while (f(lo) > 0) lo -= 2;
  return Math.exp(findRoot(f, lo, Math.log(hi), 1e-12));
}
