import { presetCovariance, type ParamCovariance } from '../cosmology/parameter-covariance.js';
import { PRESETS } from '../cosmology/presets.js';
import { ceilingSpreadDex } from './ceiling-spread.js';
import type { AuditChoices } from './choices.js';

/**
 * The covariance an audit propagates into its ceilings: the one given (`cosmologyCovariance`), else
 * the 1σ errors of the preset the cosmology equals, else those of Planck 2018 (the default preset),
 * with the source saying so.
 */
export function auditCovariance(c: AuditChoices): ParamCovariance {
  if (c.cosmologyCovariance) return c.cosmologyCovariance;
  const preset = Object.entries(PRESETS).find(([, p]) => JSON.stringify(p) === JSON.stringify(c.cosmology))?.[0];
  if (preset) return presetCovariance(preset);
  const planck = presetCovariance('planck18');
  return { matrix: planck.matrix, source: `${planck.source} (the cosmology is not a preset: Planck 2018's errors are used)` };
}

/** 1σ of log10 M_halo,q (dex) from the cosmological parameters, as a function of a galaxy's z. */
export interface CeilingUncertainty {
  sdDexAt(z: number): number;
  readonly source: string;
}

/**
 * The ceiling's spread by linear response (ceiling-spread.ts) on a 0.5 grid in z spanning the
 * galaxies' redshifts, interpolated linearly (it changes by ~0.002 dex per unit z).
 */
export function makeCeilingUncertainty(c: AuditChoices, areaArcmin2: number, zMin: number, zMax: number): CeilingUncertainty {
  const cov = auditCovariance(c);
  // no parameter varies: no spread, and no ceiling needs building
  if (cov.matrix.every((row) => row.every((v) => v === 0))) return { source: cov.source, sdDexAt: () => 0 };
  const z0 = Math.max(0.25, Math.floor(zMin * 2) / 2);
  const z1 = Math.max(z0 + 0.5, Math.ceil(zMax * 2) / 2);
  const zs: number[] = [];
  for (let z = z0; z <= z1 + 1e-9; z += 0.5) zs.push(Number(z.toFixed(2)));
  const sd = ceilingSpreadDex(c, areaArcmin2, c.quantile, c.sliceDz, zs, cov, { convergenceCheck: false }).map((s) => s.log_mass_cosmo_sd_dex);
  return {
    source: cov.source,
    sdDexAt: (z) => {
      const x = Math.min(Math.max((z - z0) / 0.5, 0), zs.length - 1);
      const i = Math.min(Math.floor(x), zs.length - 2);
      return zs.length === 1 ? sd[0] : sd[i] + (x - i) * (sd[i + 1] - sd[i]);
    },
  };
}
