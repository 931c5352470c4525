import type { AuditResult } from './run-audit.js';
import type { CeilingTable } from './ceiling.js';
import type { HaloModel } from '../halos/halo-model.js';

/**
 * Columns for the figures, as typed arrays (transferable; uPlot takes them as they are).
 * Ceiling curves: the stellar-mass ceiling ε f_b M_halo,q(z) of the survey's slices for ε = 1 and ε_ref at
 * the chosen quantile q, and the 16–84% band of the most massive halo (ε = 1).
 */
export interface CeilingCurves {
  readonly z: Float64Array;
  readonly log10MstarEps1: Float64Array;
  readonly log10MstarEpsRef: Float64Array;
  readonly log10MstarEps1Q16: Float64Array;
  readonly log10MstarEps1Q84: Float64Array;
}

export function ceilingCurves(halo: HaloModel, ceil: CeilingTable, epsRef: number, zMin: number, zMax: number, n = 81): CeilingCurves {
  const fb = halo.baryonFraction;
  const z = new Float64Array(n);
  const a = new Float64Array(n);
  const b = new Float64Array(n);
  const lo = new Float64Array(n);
  const hi = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    z[i] = zMin + ((zMax - zMin) * i) / (n - 1);
    const m = Math.log10(fb * ceil.haloMassAtQuantile(z[i]));
    a[i] = m;
    b[i] = m + Math.log10(epsRef);
    lo[i] = Math.log10(fb * ceil.haloMassAt(z[i], 0.16));
    hi[i] = Math.log10(fb * ceil.haloMassAt(z[i], 0.84));
  }
  return { z, log10MstarEps1: a, log10MstarEpsRef: b, log10MstarEps1Q16: lo, log10MstarEps1Q84: hi };
}

/** Galaxy points per IMF for the stellar-mass–redshift figure: z, median log M⋆ and its 16–84% range. */
export interface GalaxyPoints {
  readonly imf: string;
  readonly ids: string[];
  readonly z: Float64Array;
  readonly log10M: Float64Array;
  readonly log10MLo: Float64Array;
  readonly log10MHi: Float64Array;
}

export function galaxyPoints(r: AuditResult, imfs: readonly string[]): GalaxyPoints[] {
  const ok = r.galaxies.filter((g) => g.status === 'ok');
  return imfs.map((imf) => {
    const rows = ok.filter((g) => g.imf && g.imf[imf]);
    return {
      imf,
      ids: rows.map((g) => g.id),
      z: Float64Array.from(rows, (g) => Number(g.input.z)),
      log10M: Float64Array.from(rows, (g) => g.imf![imf].log_mstar_median),
      log10MLo: Float64Array.from(rows, (g) => g.imf![imf].log_mstar_p16),
      log10MHi: Float64Array.from(rows, (g) => g.imf![imf].log_mstar_p84),
    };
  });
}
