import { parseStrictNumber } from '../numeric/strict-number.js';

/**
 * Star-formation histories, expressed as C(a): the fraction of all mass formed that is younger than
 * a (Myr), for a population whose oldest stars have age T (the population age). C(a ≥ T) = 1.
 * Exponential histories run forward in time: SFR(t') ∝ exp(∓t'/τ) for 0 ≤ t' ≤ T.
 * A piecewise history gives SFR at lookback ages (Myr) and is linear between points (0 outside).
 */
export type Sfh =
  | { readonly kind: 'burst' }
  | { readonly kind: 'constant' }
  | { readonly kind: 'exp-declining'; readonly tauMyr: number }
  | { readonly kind: 'exp-rising'; readonly tauMyr: number }
  | { readonly kind: 'piecewise'; readonly ageMyr: readonly number[]; readonly sfr: readonly number[] };

export const SFH_NAMES = ['burst', 'constant', 'exp-declining', 'exp-rising', 'piecewise'] as const;

function piecewiseCumulative(ages: readonly number[], sfr: readonly number[], a: number): number {
  let s = 0;
  for (let i = 1; i < ages.length; i++) {
    const lo = ages[i - 1];
    const hi = Math.min(ages[i], a);
    if (hi <= lo) break;
    const f = (x: number): number => sfr[i - 1] + ((sfr[i] - sfr[i - 1]) * (x - lo)) / (ages[i] - lo);
    s += 0.5 * (f(lo) + f(hi)) * (hi - lo);
  }
  return s;
}

/** Fraction of mass formed younger than a, for population age T (both Myr). */
export function cumulativeYoungerThan(sfh: Sfh, aMyr: number, tMyr: number): number {
  if (aMyr <= 0) return 0;
  if (aMyr >= tMyr) return 1;
  switch (sfh.kind) {
    case 'burst':
      return 0;
    case 'constant':
      return aMyr / tMyr;
    case 'exp-declining': {
      const x = tMyr / sfh.tauMyr;
      // (e^{−(T−a)/τ} − e^{−T/τ}) / (1 − e^{−T/τ}) = e^{−(T−a)/τ}(1 − e^{−a/τ}) / (1 − e^{−T/τ})
      return (Math.exp(-(tMyr - aMyr) / sfh.tauMyr) * -Math.expm1(-aMyr / sfh.tauMyr)) / -Math.expm1(-x);
    }
    case 'exp-rising': {
      // (e^{T/τ} − e^{(T−a)/τ}) / (e^{T/τ} − 1) = (1 − e^{−a/τ}) / (1 − e^{−T/τ})
      return -Math.expm1(-aMyr / sfh.tauMyr) / -Math.expm1(-tMyr / sfh.tauMyr);
    }
    case 'piecewise': {
      const total = piecewiseCumulative(sfh.ageMyr, sfh.sfr, tMyr);
      return total > 0 ? piecewiseCumulative(sfh.ageMyr, sfh.sfr, aMyr) / total : 0;
    }
  }
}

/** Present SFR per Msun formed, yr⁻¹ (for constant SFR: 1/T). */
export function currentSfrPerMassFormed(sfh: Sfh, tMyr: number): number {
  const h = Math.min(1e-3, tMyr * 1e-6);
  return cumulativeYoungerThan(sfh, h, tMyr) / (h * 1e6);
}

export function validateSfh(sfh: Sfh): void {
  if ((sfh.kind === 'exp-declining' || sfh.kind === 'exp-rising') && !(sfh.tauMyr > 0 && Number.isFinite(sfh.tauMyr))) {
    throw new RangeError(`SFH ${sfh.kind}: τ must be a finite number > 0 Myr (got ${sfh.tauMyr})`);
  }
  if (sfh.kind === 'piecewise') {
    const { ageMyr, sfr } = sfh;
    if (ageMyr.length < 2 || ageMyr.length !== sfr.length) throw new RangeError('SFH piecewise: needs ≥ 2 (age_Myr, SFR) pairs');
    for (let i = 0; i < ageMyr.length; i++) {
      if (!(Number.isFinite(ageMyr[i]) && ageMyr[i] >= 0)) throw new RangeError(`SFH piecewise: age ${i + 1} must be ≥ 0 Myr (got ${ageMyr[i]})`);
      if (i > 0 && !(ageMyr[i] > ageMyr[i - 1])) throw new RangeError(`SFH piecewise: ages must increase (point ${i + 1})`);
      if (!(Number.isFinite(sfr[i]) && sfr[i] >= 0)) throw new RangeError(`SFH piecewise: SFR ${i + 1} must be ≥ 0 (got ${sfr[i]})`);
    }
    if (!sfr.some((x) => x > 0)) throw new RangeError('SFH piecewise: SFR is zero everywhere');
  }
}

/** Parses `burst`, `constant`, `exp-declining:τ`, `exp-rising:τ` (Myr) or `piecewise:a0:s0:a1:s1…`. */
export function parseSfh(spec: string): Sfh {
  const [kind, ...rest] = spec.split(':');
  const nums = rest.map((r, i) => {
    const v = parseStrictNumber(r);
    if (!Number.isFinite(v)) throw new RangeError(`SFH "${spec}": item ${i + 1} ("${r}") is not a number`);
    return v;
  });
  let sfh: Sfh;
  switch (kind) {
    case 'burst':
    case 'constant':
      if (nums.length) throw new RangeError(`SFH "${kind}" takes no parameters`);
      sfh = { kind };
      break;
    case 'exp-declining':
    case 'exp-rising':
      sfh = { kind, tauMyr: nums.length ? nums[0] : 100 };
      break;
    case 'piecewise':
      if (nums.length % 2) throw new RangeError(`SFH "${spec}": piecewise needs pairs age_Myr:SFR`);
      sfh = { kind, ageMyr: nums.filter((_, i) => i % 2 === 0), sfr: nums.filter((_, i) => i % 2 === 1) };
      break;
    default:
      throw new RangeError(`unknown SFH "${kind}" (allowed: ${SFH_NAMES.join(', ')}; exp-*:τ_Myr; piecewise:age:sfr:…)`);
  }
  validateSfh(sfh);
  return sfh;
}
