import { ARCMIN2_SR } from '../constants.js';
import { gaussLegendre } from '../numeric/gauss-legendre.js';
import { biasSmt01 } from '../halos/bias.js';
import type { HaloModel } from '../halos/halo-model.js';

/**
 * The ΛCDM ceiling for one survey field: for a galaxy at z, the most massive halo expected in the
 * field's redshift slice [z − Δ/2, z + Δ/2] (Δ = sliceDz, clipped at z = 0.02), at quantile q of its
 * extreme-value distribution Φ(M_max < M) = exp[−N(>M)] (Harrison & Coles 2011, Poisson limit),
 * N(>M) = Ω ∫ dz (dV/dz dΩ) n(>M, z) over the slice.
 * Tabulated on a 0.1 grid in z (Simpson's rule over the slice) and interpolated in log M.
 *
 * With cosmic variance, halo counts in the field scatter as N → N·e^{s g − s²/2}, g ~ N(0,1),
 * s² = ln[1 + (b σ_dm)²], with b the Sheth, Mo & Tormen 2001 bias at M and σ_dm the rms matter
 * fluctuation of the slice's box (Trenti & Stiavelli 2008 method; a log-normal keeps counts positive,
 * common practice, no source); the widened CDF is averaged over g.
 */
export interface CeilingTable {
  readonly areaArcmin2: number;
  readonly quantile: number;
  readonly sliceDz: number;
  /** Highest galaxy redshift the table covers. */
  readonly zMaxTable: number;
  /** Halo mass (Msun) of the most massive halo at quantile q in the slice around z. */
  haloMassAtQuantile(z: number): number;
  /** log10 of haloMassAtQuantile (no power of ten: for the Monte Carlo loop). */
  log10HaloMassAtQuantile(z: number): number;
  log10HaloMassAtQuantileCv(z: number, sigmaDm: number): number;
  /**
   * The same values as log10HaloMassAtQuantile (sigmaDm undefined) or log10HaloMassAtQuantileCv, bit
   * for bit, for z[idx[i]] (or z[i] without idx), plus `add`, written to out[i]: the nodes the batch
   * needs are filled first, then read from the array without a call per draw.
   */
  log10HaloMassesAt(z: ArrayLike<number>, idx: ArrayLike<number> | undefined, n: number, sigmaDm: number | undefined, add: number, out: Float64Array): Float64Array;
  /** Halo mass at any other quantile q2 of the same slice distribution (for figure bands). */
  haloMassAt(z: number, q2: number): number;
  /** log10 of the mass above which N(>M) = count haloes are expected in the slice, as a function of z, nodes cached (q2 = e^−count). */
  log10HaloMassAtCountFn(count: number): (z: number) => number;
  /** Same with cosmic variance widening, given σ_dm of the slice at z. */
  haloMassAtQuantileCv(z: number, sigmaDm: number): number;
  /** Expected number of haloes above M in the slice around z (nearest grid centre). */
  expectedAbove(massMsun: number, z: number): number;
  /** Slice limits for z. */
  sliceLimits(z: number): [number, number];
}

const STEP = 0.1;

export function makeCeilingTable(halo: HaloModel, areaArcmin2: number, quantile: number, zMinNeeded: number, zMaxNeeded: number, sliceDz = 1): CeilingTable {
  if (!(quantile > 0 && quantile < 1)) throw new RangeError(`quantile must lie strictly between 0 and 1 (got ${quantile})`);
  const bg = halo.background;
  const omega = areaArcmin2 * ARCMIN2_SR;
  const half = sliceDz / 2;
  const lm = halo.table.log10M;
  const nm = lm.length;
  const zLo = Math.max(0.02, Math.floor((zMinNeeded - half - 0.1) / STEP) * STEP);
  const zHi = Math.ceil((zMaxNeeded + half + 0.1) / STEP) * STEP;
  const nz = Math.round((zHi - zLo) / STEP) + 1;
  // dens[j*nm + i] = Ω dV/dz n(>M_i) at z_j.
  const dens = new Float64Array(nz * nm);
  for (let j = 0; j < nz; j++) {
    const z = zLo + j * STEP;
    const nodes = halo.slice(z).nAboveNodes;
    const f = omega * bg.dVdzdOmegaMpc3(z);
    for (let i = 0; i < nm; i++) dens[j * nm + i] = f * nodes[i];
  }
  const countsCache = new Map<number, Float64Array>();
  /** N(>M_i) over the slice centred on grid node jc (Simpson, or trapezoid for an odd count). */
  const countsAt = (jc: number): Float64Array => {
    const hit = countsCache.get(jc);
    if (hit) return hit;
    const zc = zLo + jc * STEP;
    const a = Math.max(0.02, zc - half);
    const ja = Math.max(0, Math.round((a - zLo) / STEP));
    const jb = Math.min(nz - 1, jc + Math.round(half / STEP));
    const out = new Float64Array(nm);
    const n = jb - ja;
    for (let i = 0; i < nm; i++) {
      let s = 0;
      if (n % 2 === 0 && n > 0) {
        for (let j = ja; j <= jb; j++) s += (j === ja || j === jb ? 1 : (j - ja) % 2 ? 4 : 2) * dens[j * nm + i];
        s *= STEP / 3;
      } else {
        for (let j = ja; j <= jb; j++) s += (j === ja || j === jb ? 0.5 : 1) * dens[j * nm + i];
        s *= STEP;
      }
      out[i] = s;
    }
    countsCache.set(jc, out);
    return out;
  };
  const target = -Math.log(quantile);
  /** log10 M where an increasing CDF sampled at the mass nodes crosses q. */
  const crossing = (cdf: (i: number) => number): number => {
    let prev = cdf(0);
    if (prev >= quantile) return lm[0];
    for (let i = 1; i < nm; i++) {
      const c = cdf(i);
      if (c >= quantile) {
        const t = (quantile - prev) / (c - prev);
        return lm[i - 1] + t * (lm[i] - lm[i - 1]);
      }
      prev = c;
    }
    return lm[nm - 1];
  };
  /** log10 M where Φ = exp(−N(>M)) reaches the quantile whose −ln q is `t`. */
  const poissonLogM = (jc: number, t = target): number => {
    const N = countsAt(jc);
    // Φ = exp(−N); interpolate log N linearly in log M between the bracketing nodes.
    let i = 0;
    while (i < nm - 1 && N[i + 1] > t) i++;
    if (i >= nm - 1) return lm[nm - 1];
    if (N[0] <= t) return lm[0];
    const l0 = Math.log(N[i]);
    const l1 = Math.log(Math.max(N[i + 1], 1e-300));
    const u = (Math.log(t) - l0) / (l1 - l0);
    return lm[i] + u * (lm[i + 1] - lm[i]);
  };
  const gh = gaussLegendre(48);
  const gNodes = Array.from(gh.x, (x) => 8 * x);
  const gW = Array.from(gh.w, (w, k) => 8 * w * Math.exp(-0.5 * gNodes[k] ** 2) / Math.sqrt(2 * Math.PI));
  const cvLogM = (jc: number, sigmaDm: number): number => {
    const N = countsAt(jc);
    const zc = zLo + jc * STEP;
    const d = halo.growth.d(zc);
    const dc = halo.deltaC(zc);
    return crossing((i) => {
      const nu = dc / (Math.exp(halo.table.lnSigma[i]) * d);
      const bs = biasSmt01(nu, dc) * sigmaDm;
      const s2 = Math.log(1 + bs * bs);
      const s = Math.sqrt(s2);
      let phi = 0;
      for (let k = 0; k < gNodes.length; k++) phi += gW[k] * Math.exp(-N[i] * Math.exp(s * gNodes[k] - 0.5 * s2));
      return phi;
    });
  };
  const interp = (z: number, f: (jc: number) => number): number => 10 ** interpLog(z, f);
  const interpLog = (z: number, f: (jc: number) => number): number => {
    if (!(z >= zLo && z <= zHi)) throw new RangeError(`redshift ${z} is outside the ceiling table (${zLo.toFixed(2)}–${zHi.toFixed(2)})`);
    const x = (z - zLo) / STEP;
    const j = Math.min(Math.floor(x), nz - 2);
    const t = x - j;
    return (1 - t) * f(j) + t * f(j + 1);
  };
  /** log10 M per grid node, filled on first use (NaN = not yet computed). */
  type NodeFn = ((jc: number) => number) & { readonly arr: Float64Array };
  const nodeArray = (fill: (jc: number) => number): NodeFn => {
    const arr = new Float64Array(nz).fill(Number.NaN);
    const f = (jc: number): number => {
      let v = arr[jc];
      if (v !== v) {
        v = fill(jc);
        arr[jc] = v;
      }
      return v;
    };
    return Object.assign(f, { arr });
  };
  const poissonCached = nodeArray((jc) => poissonLogM(jc));
  const cvArrays = new Map<number, NodeFn>();
  const cvFor = (sigmaDm: number): NodeFn => {
    let f = cvArrays.get(sigmaDm);
    if (!f) {
      f = nodeArray((jc) => cvLogM(jc, sigmaDm));
      if (cvArrays.size > 256) cvArrays.clear();
      cvArrays.set(sigmaDm, f);
    }
    return f;
  };
  return {
    areaArcmin2,
    quantile,
    sliceDz,
    zMaxTable: zHi - half,
    haloMassAtQuantile: (z) => interp(z, poissonCached),
    haloMassAt: (z, q2) => {
      if (!(q2 > 0 && q2 < 1)) throw new RangeError(`quantile must lie strictly between 0 and 1 (got ${q2})`);
      const t = -Math.log(q2);
      return interp(z, (jc) => poissonLogM(jc, t));
    },
    log10HaloMassAtCountFn: (t) => {
      if (!(t > 0) || !Number.isFinite(t)) throw new RangeError(`expected count must be finite and > 0 (got ${t})`);
      const nodes = nodeArray((jc) => poissonLogM(jc, t));
      return (z) => interpLog(z, nodes);
    },
    haloMassAtQuantileCv: (z, sigmaDm) => interp(z, cvFor(sigmaDm)),
    log10HaloMassAtQuantile: (z) => interpLog(z, poissonCached),
    log10HaloMassAtQuantileCv: (z, sigmaDm) => interpLog(z, cvFor(sigmaDm)),
    log10HaloMassesAt: (zs, idx, n, sigmaDm, add, out) => {
      const f = sigmaDm === undefined ? poissonCached : cvFor(sigmaDm);
      let zMin = Infinity;
      let zMax = -Infinity;
      for (let i = 0; i < n; i++) {
        const z = idx ? zs[idx[i]] : zs[i];
        if (z < zMin) zMin = z;
        if (z > zMax) zMax = z;
        if (!(z >= zLo && z <= zHi)) interpLog(z, f); // throws the per-point message
      }
      if (!(n > 0)) return out;
      // the nodes interpLog would read, filled once
      const j0 = Math.min(Math.floor((zMin - zLo) / STEP), nz - 2);
      const j1 = Math.min(Math.floor((zMax - zLo) / STEP), nz - 2) + 1;
      for (let j = j0; j <= j1; j++) f(j);
      const arr = f.arr;
      for (let i = 0; i < n; i++) {
        const z = idx ? zs[idx[i]] : zs[i];
        const x = (z - zLo) / STEP;
        const j = Math.min(Math.floor(x), nz - 2);
        const t = x - j;
        out[i] = add + ((1 - t) * arr[j] + t * arr[j + 1]);
      }
      return out;
    },
    expectedAbove: (m, z) => {
      const jc = Math.min(nz - 1, Math.max(0, Math.round((z - zLo) / STEP)));
      const N = countsAt(jc);
      const x = (Math.log10(m) - lm[0]) / (lm[1] - lm[0]);
      const i = Math.min(Math.max(Math.floor(x), 0), nm - 2);
      const t = x - i;
      const a = Math.log(Math.max(N[i], 1e-300));
      const b = Math.log(Math.max(N[i + 1], 1e-300));
      return Math.exp((1 - t) * a + t * b);
    },
    sliceLimits: (z) => [Math.max(0.02, z - half), z + half],
  };
}
