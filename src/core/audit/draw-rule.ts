import erfc from '@stdlib/math-base-special-erfc';
import { DRAW_RULE_SPECS, specByKey } from './choice-specs.js';

/**
 * When a galaxy's Monte Carlo stops (the adaptive rule; with fixedDraws every galaxy gets `draws`).
 * Our own rule, from the usual order-statistics error of a sample median (common practice, no source):
 *
 * - draws come from the galaxy's one random stream (seeded by seed + id), FIRST_LOOK of them, then
 *   blocks of DRAW_BLOCK, up to `draws`; after each, over the valid draws so far and for every compared IMF:
 * - the Monte Carlo error of the median of log10 M⋆ and of log10 ε_req is half the distance between
 *   the order statistics at the ranks n/2 ± √n/2 (the binomial 1σ of the median's rank; for a normal
 *   sample this is 1.2533 σ/√n);
 * - the verdict is settled when the median of log10 ε_req is at least z·error away from both
 *   thresholds (log10 ε_ref and 0), z = Φ⁻¹(1 − P_CLASS_CHANGE_MAX / L) with L the number of looks
 *   the maximum allows (a Bonferroni bound, so the chance that any look stops on the wrong side stays
 *   below P_CLASS_CHANGE_MAX under the normal approximation of the median), the error taken there at
 *   its upper confidence limit (errorUpperLimit: the estimate itself scatters by ~n^(−1/4), and a low
 *   estimate must not settle a verdict that sits on its threshold);
 * - it stops when every IMF's verdict is settled and both errors are ≤ the precision drawPrecisionDex.
 * The rule depends only on the draws, so seed + id + these constants reproduce every stop.
 */
export const DRAW_BLOCK = 250;
/** The first look comes after this many draws (on the benchmark sample a quarter of the galaxies stop there at the default precision). */
export const FIRST_LOOK = 1000;
export const P_CLASS_CHANGE_MAX = 1e-3;

/** The precision of the medians the rule asks for: the choice, or its default (DRAW_RULE_SPECS). */
export function drawPrecisionOf(c: { readonly drawPrecisionDex?: number }): number {
  return c.drawPrecisionDex ?? specByKey(DRAW_RULE_SPECS, 'drawPrecisionDex').default!;
}

/** The rule in words, for the output's record of how the draws were made. */
export function drawRuleText(c: { readonly fixedDraws?: boolean; readonly draws: number; readonly drawPrecisionDex?: number }): string {
  if (c.fixedDraws === true) return `fixed: every galaxy gets ${c.draws} draws`;
  return (
    `adaptive: ${FIRST_LOOK} draws, then blocks of ${DRAW_BLOCK}, up to ${c.draws}; stop when, for every compared IMF, the Monte Carlo errors of the medians of ` +
    `log10 M* and log10 eps_req (half the spread of the order statistics at ranks n/2 ± sqrt(n)/2) are ≤ ${drawPrecisionOf(c)} dex and the ` +
    `median eps_req is z errors from both thresholds, z = Phi^-1(1 − ${P_CLASS_CHANGE_MAX}/looks), looks = ${looksFor(c.draws)}, the error there at its ` +
    `upper ${1 - P_CLASS_CHANGE_MAX} confidence limit (the spread spans k = (n − 1)/sqrt(n) gaps, ~ Gamma(k); Wilson–Hilferty quantile)`
  );
}

/** The quantiles whose order statistics give the median and its error: 0.5 ∓ 0.5/√n. */
export function medianErrorQuantiles(n: number): [number, number, number] {
  const d = 0.5 / Math.sqrt(Math.max(n, 1));
  return [0.5 - d, 0.5, 0.5 + d];
}

/**
 * The upper confidence limit of a median's Monte Carlo error estimate from n draws (medianErrorQuantiles):
 * the estimate is half the spread of the order statistics at the type-7 positions (n − 1)(0.5 ∓ 0.5/√n),
 * k = (n − 1)/√n gaps apart. Near the median the density is about constant, so the spread is that of
 * uniform order statistics, n (U₍ⱼ₎ − U₍ᵢ₎) → Gamma(j − i, 1) for large n (David & Nagaraja 2003,
 * "Order Statistics", 3rd ed., §2.5, from memory), and estimate/error ~ Gamma(k, 1)/k. The limit is
 * estimate · k / g, g the lower `alpha` quantile of Gamma(k, 1) by the Wilson & Hilferty (1931, PNAS 17,
 * 684) cube root: g = k (1 − 1/(9k) + Φ⁻¹(alpha)/(3√k))³, alpha = P_CLASS_CHANGE_MAX (slightly below the
 * exact quantile, by < 0.5% for k ≥ 20, i.e. n ≥ 400: adaptive-draws.test.ts against scipy), so the limit
 * errs high. Same unit as the estimate (dex).
 */
export function errorUpperLimit(errorDex: number, n: number): number {
  const k = (n - 1) / Math.sqrt(n);
  const g = gammaLowerQuantile(k);
  if (!(g > 0)) throw new RangeError(`median error's upper limit: ${n} draws are too few (the Gamma(${k.toFixed(2)}) quantile at ${P_CLASS_CHANGE_MAX} is not positive)`);
  return (errorDex * k) / g;
}

/** Φ⁻¹(P_CLASS_CHANGE_MAX), found once (normalQuantile bisects). */
let zAlpha: number | undefined;
/** The lower P_CLASS_CHANGE_MAX quantile of Gamma(k, 1) by the Wilson–Hilferty cube root (errorUpperLimit). */
export function gammaLowerQuantile(k: number): number {
  zAlpha ??= normalQuantile(P_CLASS_CHANGE_MAX);
  return k * (1 - 1 / (9 * k) + zAlpha / (3 * Math.sqrt(k))) ** 3;
}

/** Standard normal CDF Φ(x) = erfc(−x/√2)/2 (stdlib's erfc: accurate to rounding, also far in the lower tail). */
export function normalCdf(x: number): number {
  return 0.5 * erfc(-x / Math.SQRT2);
}

/** Φ⁻¹(p) for 0 < p < 1 by bisection on normalCdf (to 1e-12; only a few values per run). */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`normal quantile: p must lie in (0, 1) (got ${p})`);
  let lo = -40;
  let hi = 40;
  for (let i = 0; i < 200 && hi - lo > 1e-12; i++) {
    const mid = 0.5 * (lo + hi);
    if (normalCdf(mid) < p) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Number of looks the rule can take before the maximum: 1 + ⌈(max − FIRST_LOOK) / DRAW_BLOCK⌉. */
export function looksFor(maxDraws: number): number {
  return 1 + Math.max(0, Math.ceil((maxDraws - FIRST_LOOK) / DRAW_BLOCK));
}

/**
 * The chance that the verdict of a median of log10 ε_req at `logEpsMedian` with Monte Carlo error
 * `errorDex` lies on the wrong side of its nearest threshold (log10 ε_ref or 0): Φ(−d/error), d the
 * distance to that threshold; 0 for an error of 0 away from a threshold.
 */
export function pClassChange(logEpsMedian: number, errorDex: number, epsRef: number): number {
  const d = Math.min(Math.abs(logEpsMedian - Math.log10(epsRef)), Math.abs(logEpsMedian));
  if (!(errorDex > 0)) return d > 0 ? 0 : 0.5;
  return normalCdf(-d / errorDex);
}
