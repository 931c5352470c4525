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
  const inv: AgeInverse = {
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

/** log10 of the surviving fraction 1 − R of a population table at a fractional age position x (MassToLightTable.gridPositionLog). */
export function logSurvivingAt(tab: MassToLightTable, x: number): number {
  const i = Math.min(Math.max(Math.floor(x), 0), tab.nAge - 2);
  const t = x - i;
  return (1 - t) * tab.logSurv[i] + t * tab.logSurv[i + 1];
}
