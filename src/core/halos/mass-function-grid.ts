import type { HaloModel } from './halo-model.js';

/**
 * ln dn/dlnM (comoving Mpc⁻³) of a halo model on a shared (z, log10 M) grid, for work that reads the
 * mass function at many nearby (z, M), such as the Eddington priors of a whole sample (one table per
 * run instead of one per galaxy).
 *
 * Nodes: z_j = j·GRID_DZ (j ≥ 0), log10 M_i = log10 M_min + i·GRID_DLOG10M over the σ table; each node
 * is the halo model's own ln dndlnM, computed on first use and kept for the life of the model.
 * `nodeAt(z, i)` is 4-point Lagrange in z at mass node i; `at(z, lgM)` adds 4-point Lagrange in log10 M
 * over nodeAt (the tensor product, 16 nodes). Error ≈ (3/128)(Δz⁴ |∂⁴f/∂z⁴| + Δ⁴ |∂⁴f/∂lgM⁴|)
 * (the Lagrange remainder; common practice, no source). Measured against the direct mass function
 * (mass-function-grid.test.ts), for 0.1 ≤ z ≤ 20 and 1e7–1e15 Msun where ln dn/dlnM > −650: ≤ 2.5e-6
 * in ln dn/dlnM over the five mass functions (2e-7 for Sheth–Tormen); the test holds it to ≤ 1e-4.
 *
 * Where a stencil would leave the table (z < GRID_DZ, the first and last node intervals of the σ
 * table) or meets a node where the mass function vanishes (−∞), the read is the direct ln dndlnM
 * (at a mass node, clamped 1e-9 dex inside the σ table).
 */
export interface LnMassFunctionGrid {
  /** log10 M of mass node 0 and the number of mass nodes (spacing GRID_DLOG10M). */
  readonly log10M0: number;
  readonly nodes: number;
  /** ln dn/dlnM at mass node i (log10 M = log10M0 + i·GRID_DLOG10M) and redshift z, interpolated in z. */
  nodeAt(z: number, i: number): number;
  /** ln dn/dlnM at log10 M = lgM and redshift z (interpolated; direct where the stencil leaves the table). */
  at(z: number, lgM: number): number;
}

/** Node spacing in redshift. */
export const GRID_DZ = 0.05;
/** Node spacing in log10 M, dex. */
export const GRID_DLOG10M = 0.0025;

/** Mass nodes per allocated block of a column. */
const BLOCK_BITS = 8;
const BLOCK = 1 << BLOCK_BITS;

const cache = new WeakMap<HaloModel, LnMassFunctionGrid>();

export function lnMassFunctionGrid(halo: HaloModel): LnMassFunctionGrid {
  const hit = cache.get(halo);
  if (hit) return hit;
  const lm = halo.table.log10M;
  const lo = lm[0];
  const hi = lm[lm.length - 1];
  const nM = Math.floor((hi - lo) / GRID_DLOG10M) + 1;
  /**
   * Per z node, the mass nodes in blocks of BLOCK, allocated when first touched (NaN = not computed yet):
   * a sample's galaxies touch a few dex of mass per redshift, so a column holds a few blocks of 2 kB, not all 55 kB.
   */
  const columns: (Float64Array | undefined)[][] = [];
  const direct = (z: number, lgM: number): number => Math.log(halo.dndlnM(10 ** lgM, z));
  const node = (j: number, i: number): number => {
    const col = (columns[j] ??= []);
    let blk = col[i >> BLOCK_BITS];
    if (!blk) {
      blk = new Float64Array(1 << BLOCK_BITS).fill(Number.NaN);
      col[i >> BLOCK_BITS] = blk;
    }
    const k = i & (BLOCK - 1);
    let v = blk[k];
    if (v !== v) {
      v = direct(j * GRID_DZ, lo + i * GRID_DLOG10M);
      blk[k] = v;
    }
    return v;
  };
  /** The direct value at mass node i, the end nodes 1e-9 dex inside the σ table (where it is defined). */
  const directNode = (z: number, i: number): number => direct(z, Math.min(Math.max(lo + i * GRID_DLOG10M, lo + 1e-9), hi - 1e-9));
  const nodeAt = (z: number, i: number): number => {
    const tz = z / GRID_DZ;
    const j = Math.floor(tz);
    if (!(j >= 1 && i >= 1 && i <= nM - 2)) return directNode(z, i);
    const u = tz - j;
    const s =
      (-u * (u - 1) * (u - 2) * node(j - 1, i)) / 6 +
      ((u + 1) * (u - 1) * (u - 2) * node(j, i)) / 2 -
      ((u + 1) * u * (u - 2) * node(j + 1, i)) / 2 +
      ((u + 1) * u * (u - 1) * node(j + 2, i)) / 6;
    return Number.isFinite(s) ? s : directNode(z, i);
  };
  const grid: LnMassFunctionGrid = {
    log10M0: lo,
    nodes: nM,
    nodeAt,
    at(z, lgM) {
      const tm = (lgM - lo) / GRID_DLOG10M;
      const i = Math.floor(tm);
      if (!(i >= 2 && i + 2 <= nM - 2)) return direct(z, lgM);
      const u = tm - i;
      const s =
        (-u * (u - 1) * (u - 2) * nodeAt(z, i - 1)) / 6 +
        ((u + 1) * (u - 1) * (u - 2) * nodeAt(z, i)) / 2 -
        ((u + 1) * u * (u - 2) * nodeAt(z, i + 1)) / 2 +
        ((u + 1) * u * (u - 1) * nodeAt(z, i + 2)) / 6;
      return Number.isFinite(s) ? s : direct(z, lgM);
    },
  };
  cache.set(halo, grid);
  return grid;
}
