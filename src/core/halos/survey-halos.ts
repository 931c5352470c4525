import { ARCMIN2_SR } from '../constants.js';
import { gaussLegendre } from '../numeric/gauss-legendre.js';
import { findRoot } from '../numeric/root-find.js';
import type { HaloModel, HaloSlice } from './halo-model.js';

/**
 * Halo counts in a survey cone of areaArcmin2 between zMin and zMax, counted over the whole
 * redshift range (not at one redshift):
 *   N(>M) = Ω ∫_{z1}^{z2} dz (dV_C/dz dΩ) n(>M, z)            (Hogg 1999 eq. 28 for dV/dz/dΩ)
 * and the distribution of the most massive halo in that volume (extreme-value statistics):
 *   Poisson limit: Φ(M_max < M) = exp[−N(>M)]                  (Harrison & Coles 2011, MNRAS 418, L20; 2012, MNRAS 421, L19)
 *   exact order statistics for N_tot haloes above m_min: Φ = [1 − N(>M)/N_tot]^N_tot   (same papers)
 * The z-integral uses 6-point Gauss–Legendre on panels of ≤ 0.25 in z.
 */
export interface SurveyHalos {
  readonly areaArcmin2: number;
  readonly zMin: number;
  readonly zMax: number;
  /** Comoving volume, Mpc³. */
  readonly volumeMpc3: number;
  /** Expected number of haloes above M in the cone. */
  expected(massMsun: number): number;
  /** Poisson probability of at least one halo above M: 1 − exp(−N). */
  pAtLeastOne(massMsun: number): number;
  /** CDF of the most massive halo (Poisson limit). */
  cdfMax(massMsun: number): number;
  /** Exact order-statistics CDF for haloes above mMinMsun (Harrison & Coles 2011). */
  cdfMaxExact(massMsun: number, mMinMsun: number): number;
  /** PDF of the most massive halo per unit log10 M (Poisson limit). */
  pdfMaxPerLog10M(massMsun: number): number;
  /** Mass M such that Φ(M_max < M) = q (Poisson limit). */
  quantile(q: number): number;
}

export function makeSurveyHalos(halo: HaloModel, areaArcmin2: number, zMin: number, zMax: number): SurveyHalos {
  if (!(areaArcmin2 > 0) || !Number.isFinite(areaArcmin2)) throw new RangeError(`--area-arcmin2 must be a finite number > 0 (got ${areaArcmin2})`);
  if (!(zMin >= 0) || !(zMax > zMin) || !Number.isFinite(zMax)) throw new RangeError(`survey redshift range needs 0 ≤ z_min < z_max (got ${zMin}, ${zMax})`);
  const bg = halo.background;
  const omega = areaArcmin2 * ARCMIN2_SR;
  const panels = Math.max(1, Math.ceil((zMax - zMin) / 0.25));
  const g = gaussLegendre(6);
  const h = (zMax - zMin) / panels;
  const nodes: { slice: HaloSlice; weight: number }[] = [];
  for (let pI = 0; pI < panels; pI++) {
    const mid = zMin + (pI + 0.5) * h;
    for (let i = 0; i < 6; i++) {
      const z = mid + 0.5 * h * g.x[i];
      nodes.push({ slice: halo.slice(z), weight: 0.5 * h * g.w[i] * omega * bg.dVdzdOmegaMpc3(z) });
    }
  }
  const expected = (m: number): number => {
    let s = 0;
    for (const n of nodes) s += n.weight * n.slice.nAbove(m);
    return s;
  };
  const lnMin = halo.table.log10MMin * Math.LN10;
  const lnMax = halo.table.log10MMax * Math.LN10;
  return {
    areaArcmin2,
    zMin,
    zMax,
    volumeMpc3: bg.surveyVolumeMpc3(areaArcmin2, zMin, zMax),
    expected,
    pAtLeastOne: (m) => -Math.expm1(-expected(m)),
    cdfMax: (m) => Math.exp(-expected(m)),
    cdfMaxExact: (m, mMin) => {
      const nTot = expected(mMin);
      if (!(m > mMin)) return 0;
      return (1 - expected(m) / nTot) ** nTot;
    },
    pdfMaxPerLog10M: (m) => {
      let s = 0;
      for (const n of nodes) s += n.weight * n.slice.dndlnM(m);
      return Math.exp(-expected(m)) * s * Math.LN10;
    },
    quantile: (q) => {
      if (!(q > 0 && q < 1)) throw new RangeError(`quantile must lie strictly between 0 and 1 (got ${q})`);
      const target = -Math.log(q);
      const fLo = expected(Math.exp(lnMin)) - target;
      if (fLo < 0) throw new RangeError(`the survey volume holds fewer than ${target.toPrecision(3)} haloes even above 1e${halo.table.log10MMin} Msun: quantile ${q} is below the tabulated mass range`);
      const f = (lm: number): number => {
        const n = expected(Math.exp(lm));
        return Math.log(Math.max(n, 1e-300)) - Math.log(target);
      };
      return Math.exp(findRoot(f, lnMin, lnMax - 1e-6, 1e-10));
    },
  };
}
