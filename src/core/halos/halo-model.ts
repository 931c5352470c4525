import { makeBackground, type Background } from '../cosmology/background.js';
import { DEFAULT_GROWTH_MODEL, makeGrowth, type Growth, type GrowthModel } from '../cosmology/growth.js';
import type { CosmologyParams } from '../cosmology/params.js';
import { gaussLegendre } from '../numeric/gauss-legendre.js';
import { makeLinearPower, type LinearPower } from '../power/linear-power.js';
import { makeSigmaTable, type SigmaTable } from '../power/sigma-table.js';
import type { TransferSpec } from '../power/transfer.js';
import { biasByName, type BiasName } from './bias.js';
import { DEFAULT_DELTA_C, deltaCOmegaM, type DeltaCSpec } from './collapse-threshold.js';
import { massFunctionByName } from './models.js';
import type { MultiplicityModel } from './multiplicity.js';

export interface HaloModelOptions {
  readonly cosmology: CosmologyParams;
  readonly transfer: TransferSpec;
  readonly massFunction: string;
  readonly deltaC?: DeltaCSpec;
  /** Growth factor: `matter-lambda` (default: radiation left out) or `with-radiation` (see cosmology/growth.ts). */
  readonly growth?: GrowthModel;
}

/** Halo abundances at one redshift, with cumulative integrals tabulated on the σ-table nodes. */
export interface HaloSlice {
  readonly z: number;
  /** dn/dlnM, comoving Mpc⁻³. */
  dndlnM(massMsun: number): number;
  /** n(>M) = ∫_M^{1e19 Msun} dn/dlnM' dlnM', comoving Mpc⁻³. */
  nAbove(massMsun: number): number;
  /** ρ(>M) = ∫_M^{1e19 Msun} M' dn/dlnM' dlnM', Msun per comoving Mpc³. */
  rhoAbove(massMsun: number): number;
  /** n(>M) at every σ-table node (log10 M = table.log10M), Mpc⁻³. */
  readonly nAboveNodes: Float64Array;
  /** ρ(>M) at every σ-table node, Msun Mpc⁻³. */
  readonly rhoAboveNodes: Float64Array;
}

export interface HaloModel {
  readonly options: HaloModelOptions;
  readonly background: Background;
  readonly growth: Growth;
  readonly power: LinearPower;
  readonly table: SigmaTable;
  readonly model: MultiplicityModel;
  /** Cosmic baryon fraction f_b = Ω_b/Ω_m. */
  readonly baryonFraction: number;
  deltaC(z: number): number;
  sigma(massMsun: number, z: number): number;
  nu(massMsun: number, z: number): number;
  dndlnM(massMsun: number, z: number): number;
  nAbove(massMsun: number, z: number): number;
  rhoAbove(massMsun: number, z: number): number;
  bias(massMsun: number, z: number, name?: BiasName): number;
  slice(z: number): HaloSlice;
}

const GL_N = 4;

/** Pieces that do not depend on the mass function, to share between models of one cosmology. */
export interface HaloModelShared {
  readonly background: Background;
  readonly growth: Growth;
  readonly power: LinearPower;
  readonly table: SigmaTable;
}

export function makeHaloModel(options: HaloModelOptions, shared?: HaloModelShared): HaloModel {
  const p = options.cosmology;
  const background = shared?.background ?? makeBackground(p);
  const growthModel = options.growth ?? DEFAULT_GROWTH_MODEL;
  if (shared && shared.growth.model !== growthModel) throw new RangeError(`shared growth factor is "${shared.growth.model}" but the halo model asks for "${growthModel}"`);
  const growth = shared?.growth ?? makeGrowth(p, false, growthModel);
  const power = shared?.power ?? makeLinearPower(p, options.transfer);
  const table = shared?.table ?? makeSigmaTable(power);
  const model = massFunctionByName(options.massFunction);
  const dcSpec = options.deltaC ?? DEFAULT_DELTA_C;
  const rho = table.rhoMMsunMpc3;
  const deltaC = (z: number): number => (dcSpec.kind === 'constant' ? dcSpec.value : deltaCOmegaM(background.omegaMz(z)));

  /** dn/dlnM at one mass and growth factor (Jenkins et al. 2001 convention). */
  const dnAt = (m: number, d: number, dc: number, z: number): number => {
    const s = table.sigma0(m) * d;
    const slope = table.dlnSigmaDlnM(m);
    return model.f({ sigma: s, deltaC: dc, z, nEff: -6 * slope - 3 }) * (rho / m) * Math.abs(slope);
  };
  const g = gaussLegendre(GL_N);
  const lnMax = table.log10MMax * Math.LN10;
  // σ0, |dlnσ/dlnM|, M and the quadrature weight at every Gauss point of every table interval,
  // computed once: a new redshift then costs only the multiplicity function at these points.
  const nodes = table.log10M.length;
  const nq = (nodes - 1) * GL_N;
  const qM = new Float64Array(nq);
  const qSigma0 = new Float64Array(nq);
  const qSlope = new Float64Array(nq);
  const qW = new Float64Array(nq);
  for (let i = 0; i < nodes - 1; i++) {
    const la = table.log10M[i] * Math.LN10;
    const lb = table.log10M[i + 1] * Math.LN10;
    for (let k = 0; k < GL_N; k++) {
      const j = i * GL_N + k;
      const m = Math.exp(0.5 * (la + lb) + 0.5 * (lb - la) * g.x[k]);
      qM[j] = m;
      qSigma0[j] = table.sigma0(m);
      qSlope[j] = table.dlnSigmaDlnM(m);
      qW[j] = 0.5 * (lb - la) * g.w[k];
    }
  }

  const slice = (z: number): HaloSlice => {
    const d = growth.d(z);
    const dc = deltaC(z);
    // cumN[i] = ∫ from node i to the top of the table.
    const cumN = new Float64Array(nodes);
    const cumR = new Float64Array(nodes);
    const seg = (la: number, lb: number): [number, number] => {
      const mid = 0.5 * (la + lb);
      const half = 0.5 * (lb - la);
      let sn = 0;
      let sr = 0;
      for (let i = 0; i < GL_N; i++) {
        const lm = mid + half * g.x[i];
        const m = Math.exp(lm);
        const v = dnAt(m, d, dc, z);
        sn += g.w[i] * v;
        sr += g.w[i] * v * m;
      }
      return [sn * half, sr * half];
    };
    for (let i = nodes - 2; i >= 0; i--) {
      let sn = 0;
      let sr = 0;
      for (let k = 0; k < GL_N; k++) {
        const j = i * GL_N + k;
        const m = qM[j];
        const slope = qSlope[j];
        const v = model.f({ sigma: qSigma0[j] * d, deltaC: dc, z, nEff: -6 * slope - 3 }) * (rho / m) * Math.abs(slope) * qW[j];
        sn += v;
        sr += v * m;
      }
      cumN[i] = cumN[i + 1] + sn;
      cumR[i] = cumR[i + 1] + sr;
    }
    const step = table.log10M[1] - table.log10M[0];
    const above = (m: number): [number, number] => {
      const lm = Math.log(m);
      if (lm >= lnMax) return [0, 0];
      table.sigma0(m); // range check with a clear message
      let i = Math.floor((Math.log10(m) - table.log10MMin) / step);
      i = Math.min(Math.max(i, 0), nodes - 2);
      const [sn, sr] = seg(lm, table.log10M[i + 1] * Math.LN10);
      return [cumN[i + 1] + sn, cumR[i + 1] + sr];
    };
    return {
      z,
      nAboveNodes: cumN,
      rhoAboveNodes: cumR,
      dndlnM: (m) => dnAt(m, d, dc, z),
      nAbove: (m) => above(m)[0],
      rhoAbove: (m) => above(m)[1],
    };
  };

  return {
    options,
    background,
    growth,
    power,
    table,
    model,
    baryonFraction: p.omegaB / p.omegaM,
    deltaC,
    sigma: (m, z) => table.sigma0(m) * growth.d(z),
    nu: (m, z) => deltaC(z) / (table.sigma0(m) * growth.d(z)),
    dndlnM: (m, z) => dnAt(m, growth.d(z), deltaC(z), z),
    nAbove: (m, z) => slice(z).nAbove(m),
    rhoAbove: (m, z) => slice(z).rhoAbove(m),
    bias: (m, z, name = 'smt01') => biasByName(name, deltaC(z) / (table.sigma0(m) * growth.d(z)), deltaC(z)),
    slice,
  };
}
