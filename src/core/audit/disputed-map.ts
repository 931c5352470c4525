import { LYMAN_ALPHA_UM } from '../constants.js';
import { quantilesBySelection } from '../numeric/select.js';
import { resolveImf } from '../stars/imf-presets.js';
import { MUV_REST_UM } from '../stars/mass-estimate.js';
import { MODEL_LAMBDA_MAX_UM } from '../stars/photometry.js';
import { fixedRedshiftCells, headlineAndCompared } from './galaxy-audit.js';
import { galaxyDeviates } from './galaxy-draws.js';
import { idSeed } from './random.js';
import { slopeImfName, SLOPE_MAX, SLOPE_MIN } from './reconcile.js';
import type { PreparedAudit } from './run-audit.js';

/**
 * The map for a disputed galaxy: the median ε_req (headline IMF family) over redshift × high-mass IMF
 * slope α of custom:0.1:1.3:0.5:α:100, the galaxy placed at each redshift as in the reconciliation (the
 * same band and flux, or the reported mass scaled by D_L²(1+z)), with the contour lines ε = 1 and
 * ε = ε_ref (marching squares on the grid, linear along cell edges) and the galaxy's own position.
 */
export interface DisputedMap {
  readonly id: string;
  readonly headline_imf: string;
  /** Redshift grid (columns) and slope grid (rows). */
  readonly z: number[];
  readonly slope: number[];
  /** log10 of the median ε_req, [slope index][z index]. */
  readonly log10_eps_required: number[][];
  readonly eps_ref: number;
  /** Contours, as line segments [[z0, α0], [z1, α1]]. */
  readonly contours: { readonly eps: number; readonly segments: [number, number][][] }[];
  /** The galaxy: its redshift and 68% interval, and the high-mass slope of its headline IMF (if it has one power-law slope above 1 Msun). */
  readonly galaxy: { readonly z: number; readonly z_lo?: number; readonly z_hi?: number; readonly slope?: number };
}

/** α of the power-law segment holding 10 Msun (the stars that make the UV), if that segment is a power law. */
export function highMassSlope(imfName: string, z: number): number | undefined {
  const seg = resolveImf(imfName, z).segments.find((s) => s.mLo <= 10 && s.mHi >= 10);
  return seg && seg.kind === 'power' ? seg.alpha : undefined;
}

/** Line segments where f crosses `level` on a grid f[j][i] over xs[i], ys[j] (marching squares, no saddle disambiguation). */
export function contourSegments(xs: readonly number[], ys: readonly number[], f: readonly (readonly number[])[], level: number): [number, number][][] {
  const out: [number, number][][] = [];
  const cross = (xa: number, ya: number, fa: number, xb: number, yb: number, fb: number): [number, number] => {
    const t = (level - fa) / (fb - fa);
    return [xa + t * (xb - xa), ya + t * (yb - ya)];
  };
  for (let j = 0; j + 1 < ys.length; j++) {
    for (let i = 0; i + 1 < xs.length; i++) {
      const c: [number, number, number][] = [
        [xs[i], ys[j], f[j][i]],
        [xs[i + 1], ys[j], f[j][i + 1]],
        [xs[i + 1], ys[j + 1], f[j + 1][i + 1]],
        [xs[i], ys[j + 1], f[j + 1][i]],
      ];
      const pts: [number, number][] = [];
      for (let k = 0; k < 4; k++) {
        const a = c[k];
        const b = c[(k + 1) % 4];
        if (a[2] < level !== b[2] < level) pts.push(cross(a[0], a[1], a[2], b[0], b[1], b[2]));
      }
      if (pts.length === 2) out.push(pts);
      else if (pts.length === 4) out.push([pts[0], pts[1]], [pts[2], pts[3]]);
    }
  }
  return out;
}

/** The map for row `index` of a prepared audit (nz redshifts; the slope grid every 0.05 in α). */
export function disputedMap(prep: PreparedAudit, index: number, nz = 24, draws = 1000): DisputedMap {
  const r = index >= 0 && index < prep.parsed.rowCount ? prep.parsed.rowAt(index) : undefined;
  if (!r || r.status !== 'ok') throw new RangeError(`row ${r?.row ?? index + 1}: not an audited galaxy`);
  const g = r.galaxy!;
  const { ctx, choices } = prep;
  const { headline } = headlineAndCompared(g, choices);
  const lambdaObs = g.mAB !== undefined ? g.lambdaObsUm! : g.muv !== undefined ? MUV_REST_UM * (1 + g.z) : undefined;
  const ceil = ctx.ceilingFor(g.survey);
  const zLow = Math.max(0.25, lambdaObs !== undefined ? lambdaObs / MODEL_LAMBDA_MAX_UM - 1 + 1e-3 : 0.25, g.z - 4);
  const zHigh = Math.min(ceil.zMaxTable, lambdaObs !== undefined ? lambdaObs / LYMAN_ALPHA_UM - 1 - 1e-3 : Infinity, g.z + 2);
  const z = Array.from({ length: nz }, (_, i) => zLow + ((zHigh - zLow) * i) / (nz - 1));
  const nAlpha = Math.round((SLOPE_MAX - SLOPE_MIN) / 0.05) + 1;
  const slope = Array.from({ length: nAlpha }, (_, j) => Number((SLOPE_MIN + 0.05 * j).toFixed(2)));
  const tables = slope.map((a) => ctx.cache.table(slopeImfName(a), g.z, ctx.sfh));
  const lfb = Math.log10(ctx.halo.baryonFraction);
  const grid = slope.map(() => new Array<number>(nz).fill(0));
  // the same draws at every redshift of the map: their deviates made once
  const kept = galaxyDeviates(g, draws, idSeed(choices.seed, g.id));
  z.forEach((zi, i) => {
    const cells = fixedRedshiftCells(ctx, g, zi, draws, kept);
    if (!cells) throw new RangeError(`row ${g.row}: the band leaves the model's rest range at z = ${zi.toFixed(2)}`);
    const lc = lfb + ceil.log10HaloMassAtQuantile(zi);
    const e = new Float64Array(cells.base.length);
    tables.forEach((tab, j) => {
      for (let k = 0; k < e.length; k++) e[k] = cells.base[k] + tab.logMassToLightAt(cells.gx[k], cells.gy[k]) - lc;
      grid[j][i] = quantilesBySelection(e, [0.5])[0];
    });
  });
  const levels = [...new Set([1, choices.epsRef])];
  return {
    id: g.id,
    headline_imf: headline,
    z,
    slope,
    log10_eps_required: grid,
    eps_ref: choices.epsRef,
    contours: levels.map((eps) => ({ eps, segments: contourSegments(z, slope, grid, Math.log10(eps)) })),
    galaxy: { z: g.z, ...(g.zLo !== undefined ? { z_lo: g.zLo } : {}), ...(g.zHi !== undefined ? { z_hi: g.zHi } : {}), ...(highMassSlope(headline, g.z) !== undefined ? { slope: highMassSlope(headline, g.z) } : {}) },
  };
}
