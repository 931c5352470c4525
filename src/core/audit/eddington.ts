/**
 * Eddington bias of a measured log mass, computed exactly (Eddington 1913, MNRAS 73, 359): the
 * posterior of the true log10 mass x given the measured x_obs with a Gaussian error of σ dex and a
 * prior φ(x), p(x | x_obs) ∝ φ(x) exp[−(x − x_obs)²/(2σ²)]. The reported shift is x_obs minus the
 * posterior median (dex; > 0 lowers the mass).
 *
 * For a power-law prior φ ∝ 10^(−a x) the posterior is a Gaussian of mean = median = x_obs − a σ² ln10
 * (closed form; the usual first-order formula, exact only for a pure power law).
 *
 * Integrated on 1601 points over ±10σ around the posterior's peak (trapezoid; the posterior is smooth and Gaussian-bounded,
 * so the median is good to ~1e-6 σ), with the prior in the log domain so that steep tails do not
 * underflow. For σ ≤ SMALL_SIGMA_DEX the prior is nearly a power law over ±10σ and the posterior
 * nearly Gaussian, so 401 points (and 101 to find the peak) do as well: on Sheth–Tormen priors at
 * z = 7–10 the median moves by ≤ 1.6e-6 σ from the 1601-point grid (eddington.test.ts holds it to 1e-5 σ).
 */
export interface EddingtonPosterior {
  /** x_obs − posterior median, dex. */
  readonly shiftMedianDex: number;
  /** x_obs − posterior mean, dex. */
  readonly shiftMeanDex: number;
}

/** Points of the integration grid and of the peak's grid, above and at or below SMALL_SIGMA_DEX. */
const POINTS = 1601;
const PEAK_POINTS = 401;
const SMALL_POINTS = 401;
const SMALL_PEAK_POINTS = 101;
export const SMALL_SIGMA_DEX = 0.1;

/** The grids of one posterior: `points` to integrate, `peakPoints` to find the peak (each ≥ 3, ≤ the defaults above σ_small). */
export interface PosteriorGrid {
  readonly points: number;
  readonly peakPoints: number;
}

/** The grids eddingtonPosterior uses at σ (dex): the coarser pair at σ ≤ SMALL_SIGMA_DEX. */
export function posteriorGridFor(sigmaDex: number): PosteriorGrid {
  return sigmaDex <= SMALL_SIGMA_DEX ? { points: SMALL_POINTS, peakPoints: SMALL_PEAK_POINTS } : { points: POINTS, peakPoints: PEAK_POINTS };
}

/**
 * A ln prior that can also fill a whole grid at once: out[i] = lnPrior(x0 + i h), the same values,
 * without a call per point (imf-statistics.ts gives one).
 */
export type LnPrior = ((x: number) => number) & { readonly onGrid?: (x0: number, h: number, n: number, out: Float64Array) => void };

/** Work vectors of one posterior (reused: the results are scalars). */
const gridBuf = new Float64Array(POINTS);
const lwBuf = new Float64Array(POINTS);
const wBuf = new Float64Array(POINTS);
const HALF_WIDTH_SIGMA = 10;

/**
 * @param lnPrior natural log of the prior density in x = log10 M (any additive constant), finite or −∞.
 * @param xObs measured log10 mass.
 * @param sigmaDex Gaussian 1σ error in dex (≥ 0; 0 gives no shift).
 */
export function eddingtonPosterior(lnPrior: LnPrior, xObs: number, sigmaDex: number, grid: PosteriorGrid = posteriorGridFor(sigmaDex)): EddingtonPosterior {
  if (!(sigmaDex > 0)) return { shiftMedianDex: 0, shiftMeanDex: 0 };
  const ok = (k: number): boolean => Number.isInteger(k) && k >= 3 && k <= POINTS;
  if (!ok(grid.points) || !ok(grid.peakPoints)) throw new RangeError(`Eddington correction: grids of ${grid.points} and ${grid.peakPoints} points asked for (3–${POINTS} each)`);
  // A first, coarser pass around x_obs finds the posterior's peak; the second integrates ±10σ around that peak,
  // so a large shift (a steep prior) is not truncated by the grid's edge.
  const peak = posteriorPeak(lnPrior, xObs, sigmaDex, xObs, grid.peakPoints);
  const { median, mean } = posteriorOnGrid(lnPrior, xObs, sigmaDex, peak, grid.points);
  return { shiftMedianDex: xObs - median, shiftMeanDex: xObs - mean };
}

/**
 * ln posterior (ln prior − (x − x_obs)²/2σ², up to a constant) on n points over ±10σ around `centre`,
 * into lw[0..n): the grid's first point, its step and the index of its largest value. Throws if the
 * prior vanishes over the whole grid.
 */
function lnPosteriorOnGrid(lnPrior: LnPrior, xObs: number, sigmaDex: number, centre: number, n: number, lw: Float64Array): { x0: number; h: number; iTop: number; top: number } {
  const h = (2 * HALF_WIDTH_SIGMA * sigmaDex) / (n - 1);
  const x0 = centre - HALF_WIDTH_SIGMA * sigmaDex;
  const prior = lnPrior.onGrid ? gridBuf : undefined;
  if (prior) lnPrior.onGrid!(x0, h, n, prior);
  let top = Number.NEGATIVE_INFINITY;
  let iTop = 0;
  for (let i = 0; i < n; i++) {
    const x = x0 + i * h;
    const d = (x - xObs) / sigmaDex;
    lw[i] = (prior ? prior[i] : lnPrior(x)) - 0.5 * d * d;
    if (lw[i] > top) {
      top = lw[i];
      iTop = i;
    }
  }
  if (!Number.isFinite(top)) throw new RangeError('Eddington correction: the mass-function prior vanishes over the whole ±10σ range of the measured mass');
  return { x0, h, iTop, top };
}

/**
 * The grid point of largest ln posterior on a grid of n points over ±10σ around `centre` (steps of
 * σ/20 with 401 points; σ/5 with 101). It only places the integration grid, which spans ±10σ around it, so a peak
 * off by up to σ/10 changes the median by the integration's own error only (~1e-6 σ; eddington.test.ts).
 */
function posteriorPeak(lnPrior: LnPrior, xObs: number, sigmaDex: number, centre: number, n: number): number {
  const { x0, h, iTop } = lnPosteriorOnGrid(lnPrior, xObs, sigmaDex, centre, n, lwBuf);
  return x0 + iTop * h;
}

/** The posterior's median and mean, by the trapezoid on n points over ±10σ around `centre`. */
function posteriorOnGrid(lnPrior: LnPrior, xObs: number, sigmaDex: number, centre: number, n: number): { median: number; mean: number } {
  const lw = lwBuf;
  const { x0, h, top } = lnPosteriorOnGrid(lnPrior, xObs, sigmaDex, centre, n, lw);
  const w = wBuf;
  let total = 0;
  let first = 0;
  for (let i = 0; i < n; i++) {
    w[i] = Math.exp(lw[i] - top);
    const edge = i === 0 || i === n - 1 ? 0.5 : 1;
    total += edge * w[i];
    first += edge * w[i] * (x0 + i * h);
  }
  // Median: the cumulative trapezoid reaches half the total inside one interval; solve the trapezoid's
  // quadratic there (the density is linear across the interval).
  let acc = 0;
  let median = centre;
  for (let i = 0; i < n - 1; i++) {
    const a = w[i];
    const b = w[i + 1];
    const piece = 0.5 * (a + b);
    if (acc + piece >= 0.5 * total) {
      // area over [0, t] of the interval: a t + (b − a) t²/2 = target
      const target = 0.5 * total - acc;
      const t = Math.abs(b - a) < 1e-12 * (a + b) ? target / a : (-a + Math.sqrt(a * a + 2 * (b - a) * target)) / (b - a);
      median = x0 + (i + t) * h;
      break;
    }
    acc += piece;
  }
  return { median, mean: first / total };
}

/** First-order shift α σ² ln10 for dn/dlog M ∝ M^−α (the small-σ limit of eddingtonPosterior), dex. */
export function eddingtonFirstOrderShiftDex(alpha: number, sigmaDex: number): number {
  return alpha * sigmaDex * sigmaDex * Math.LN10;
}
