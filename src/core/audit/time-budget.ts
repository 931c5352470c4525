import type { Background } from '../cosmology/background.js';
import type { MassToLightTable } from '../stars/mass-to-light.js';
import type { AccretionHistory } from './accretion.js';

/**
 * The time budget of one Monte Carlo draw, like against like: the stellar mass FORMED within the
 * population's age, M⋆/(1 − R) (R = returned fraction of the population model at the drawn age and
 * IMF), against the baryons f_b ΔM_h that the ceiling halo accretes over that same interval on its mean
 * history (Fakhouri, Ma & Boylan-Kolchin 2010, integrated along M_h(z): see accretion.ts). Star
 * formation starts no earlier than the formation redshift: the interval is
 * [max(t(z) − age, t(z_form)), t(z)]. Since ΔM_h ≤ M_h, the ratio is never below ε_req/(1 − R) ≥ ε_req
 * (follows from the definitions).
 */

/** log10 of the redshift-from-age inverse, tabulated in u = ln(1+z) on 0 ≤ z ≤ 200 (0.002 steps). */
interface AgeInverse {
  redshiftAtAgeGyr(tGyr: number): number;
  /**
   * The same bracket and weight as redshiftAtAgeGyr, as u = ln(1+z) = (lo + w) h without the
   * exp/log round trip: lo is found from a uniform index over ln t and a short walk (the same node
   * the bisection finds), not by bisection.
   */
  bracket(lnTGyr: number): number;
  readonly lnT: Float64Array;
  readonly h: number;
  /** The uniform index over ln t: cell c = ⌊(lnT[0] − l)/dl⌋ starts its walk at node guess[c]. */
  readonly guess: Int32Array;
  readonly dl: number;
  /** Index of the node lo and weight w of the last bracket() call (lo + w = u / h). */
  lo: number;
  w: number;
}
const inverseCache = new WeakMap<Background, AgeInverse>();

function ageInverse(bg: Background): AgeInverse {
  const hit = inverseCache.get(bg);
  if (hit) return hit;
  const uTop = Math.log1p(200);
  const n = Math.ceil(uTop / 0.002) + 1;
  const h = uTop / (n - 1);
  const lnT = new Float64Array(n); // decreasing in u
  for (let i = 0; i < n; i++) lnT[i] = Math.log(bg.ageGyr(Math.expm1(i * h)));
  // guess[c]: the last node with lnT ≥ the top of cell c of a uniform index over [lnT[n−1], lnT[0]]
  const l0 = lnT[n - 1];
  // four cells per node: narrower than the closest two nodes (|Δ ln t| ≥ 0.9 h), so a cell holds at most
  // one node and the walk below is at most one step
  const cells = 4 * n;
  const dl = (lnT[0] - l0) / cells;
  const guess = new Int32Array(cells + 1);
  for (let c = 0, i = 0; c <= cells; c++) {
    const top = l0 + (cells - c) * dl;
    while (i < n - 2 && lnT[i + 1] >= top) i++;
    guess[c] = i;
  }
  const inv: AgeInverse = {
    lnT,
    h,
    guess,
    dl,
    lo: 0,
    w: 0,
    redshiftAtAgeGyr: (t) => {
      const l = Math.log(t);
      if (!(l <= lnT[0] && l >= lnT[n - 1])) throw new RangeError(`time budget: age ${t} Gyr outside the tabulated 0 ≤ z ≤ 200`);
      let lo = 0;
      let hi = n - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (lnT[mid] >= l) lo = mid;
        else hi = mid;
      }
      const w = (lnT[lo] - l) / (lnT[lo] - lnT[hi]);
      return Math.expm1((lo + w) * h);
    },
    bracket: (l) => {
      if (!(l <= lnT[0] && l >= lnT[n - 1])) throw new RangeError(`time budget: age ${Math.exp(l)} Gyr outside the tabulated 0 ≤ z ≤ 200`);
      const c = Math.min(Math.max(Math.floor((lnT[0] - l) / dl), 0), cells);
      let lo = guess[c];
      // the bisection's node: the last lo ≤ n − 2 with lnT[lo] ≥ l
      while (lo > 0 && lnT[lo] < l) lo--;
      while (lo < n - 2 && lnT[lo + 1] >= l) lo++;
      const w = (lnT[lo] - l) / (lnT[lo] - lnT[lo + 1]);
      inv.lo = lo;
      inv.w = w;
      return (lo + w) * h;
    },
  };
  inverseCache.set(bg, inv);
  return inv;
}

/**
 * log10 of the baryons f_b ΔM_h (Msun) the ceiling halo accretes during each draw's star formation.
 * Inputs per draw: the redshift z, log10 of the population age (Myr), log10 of the ceiling halo mass
 * at z (Msun). −Infinity where the interval is empty (z at or above the formation redshift).
 */
export function logAccretedBaryons(
  bg: Background,
  history: AccretionHistory,
  baryonFraction: number,
  formationZ: number,
  z: ArrayLike<number>,
  log10AgeMyr: ArrayLike<number>,
  log10HaloMassMsun: ArrayLike<number>,
): Float64Array {
  const inv = ageInverse(bg);
  const tForm = bg.ageGyr(formationZ);
  const lfb = Math.log10(baryonFraction);
  const out = new Float64Array(z.length);
  for (let i = 0; i < z.length; i++) {
    const tObs = bg.ageGyr(z[i]);
    const tStart = Math.max(tObs - 10 ** log10AgeMyr[i] / 1000, tForm);
    if (!(tStart < tObs)) {
      out[i] = Number.NEGATIVE_INFINITY;
      continue;
    }
    const zStart = inv.redshiftAtAgeGyr(tStart);
    out[i] = lfb + Math.log10(history.accretedMsun(10 ** log10HaloMassMsun[i], z[i], zStart));
  }
  return out;
}

/**
 * logAccretedBaryons for the Monte Carlo draws, the same formula and tables read without repeated
 * work: each draw's x = ln(1+z) and ln t(z) come from the draws (galaxy-draws.ts); the start of star
 * formation is taken in ln t, ln t_start = ln t + ln(1 − ρ) with ρ = age/t(z) (one exponential, no
 * cancellation), capped at ln t(z_form); it is placed on the age-inverse table's own bracket (the node
 * the bisection would find, by a uniform index over ln t) and G is read there in u directly, without
 * the z = e^u − 1 round trip of redshiftAtAgeGyr and the accretion history. It differs from
 * logAccretedBaryons on the same tables by rounding only (≤ 1e-12 relative in ΔM_h where the interval
 * is not tiny; draw-batches.test.ts). Draws i < n, picked by idx (x, ln t and age are indexed by
 * idx[i]; halo mass by i).
 *
 * @param bg the background whose tables are read (tabulatedBackground(bg): the ages of the draws).
 */
export function logAccretedBaryonsOfDraws(
  bg: Background,
  history: AccretionHistory,
  baryonFraction: number,
  formationZ: number,
  n: number,
  idx: ArrayLike<number>,
  x: ArrayLike<number>,
  lnAgeGyr: ArrayLike<number>,
  log10AgeMyr: ArrayLike<number>,
  log10HaloMassMsun: ArrayLike<number>,
  out: Float64Array,
): Float64Array {
  const inv = ageInverse(bg);
  const { lnT, guess, dl } = inv;
  const nT = lnT.length;
  const lTop = lnT[0];
  const lBottom = lnT[nT - 1];
  const cells = guess.length - 1;
  const lnTForm = Math.log(bg.ageGyr(formationZ));
  const lfb = Math.log10(baryonFraction);
  const { h, g, k } = history.gTable;
  const ng = g.length;
  const c10 = 0.1 * Math.LN10;
  const gyrPerMyr = 3 * Math.LN10; // ln 1000
  for (let i = 0; i < n; i++) {
    const j = idx[i];
    const xj = x[j];
    const lt = lnAgeGyr[j];
    if (!(lnTForm < lt)) {
      out[i] = Number.NEGATIVE_INFINITY; // z at or above the formation redshift: no interval
      continue;
    }
    // ln t_start = ln t + ln(1 − age/t), no earlier than t(z_form)
    const rho = Math.exp(log10AgeMyr[j] * Math.LN10 - gyrPerMyr - lt);
    let l = rho < 1 ? lt + Math.log1p(-rho) : Number.NEGATIVE_INFINITY;
    if (l < lnTForm) l = lnTForm;
    if (!(l <= lTop && l >= lBottom)) throw new RangeError(`time budget: age ${Math.exp(l)} Gyr outside the tabulated 0 ≤ z ≤ 200`);
    // u of the start on the age-inverse table (its bracket lo, weight w), then G there
    let c = Math.floor((lTop - l) / dl);
    if (c > cells) c = cells;
    let lo = guess[c];
    while (lo > 0 && lnT[lo] < l) lo--;
    while (lo < nT - 2 && lnT[lo + 1] >= l) lo++;
    const w = (lnT[lo] - l) / (lnT[lo] - lnT[lo + 1]);
    const gStart = g[lo] + w * (g[lo + 1] - g[lo]);
    // G at the draw's own redshift, as the history reads it (u = x)
    const t0 = xj / h;
    if (!(t0 >= 0 && t0 <= ng - 1)) throw new RangeError(`accretion history: redshift ${Math.expm1(xj)} outside 0–200`);
    const i0 = Math.min(Math.floor(t0), ng - 2);
    const g0 = g[i0] + (t0 - i0) * (g[i0 + 1] - g[i0]);
    // the history's ΔM_h = −m0 expm1(−10 ln(y/y0)), y = y0 + k (G(z_start) − G(z)), y0 = (m0/1e12)^−0.1,
    // as log10 m0 + log10(1 − (1 + e)^−10), e = k ΔG / y0: no powers and no cancellation in y/y0
    const lm = log10HaloMassMsun[i];
    const e = k * (gStart - g0) * Math.exp(c10 * (lm - 12));
    // 1 − q¹⁰ = (1 − q)(1 + q)(1 + q² + q⁴ + q⁶ + q⁸), q = 1/(1 + e), 1 − q = e q: positive terms only, so
    // a few ulp for every e ≥ 0 without a branch or a transcendental function
    const q = 1 / (1 + e);
    const q2 = q * q;
    const q4 = q2 * q2;
    const frac = e * q * (1 + q) * (1 + q2 + q4 + q4 * q2 + q4 * q4);
    out[i] = lfb + lm + Math.log(frac) / Math.LN10;
  }
  return out;
}

/** log10 of the surviving fraction 1 − R of a population table at a fractional age position x (MassToLightTable.gridPositionLog). */
export function logSurvivingAt(tab: MassToLightTable, x: number): number {
  const i = Math.min(Math.max(Math.floor(x), 0), tab.nAge - 2);
  const t = x - i;
  return (1 - t) * tab.logSurv[i] + t * tab.logSurv[i + 1];
}
