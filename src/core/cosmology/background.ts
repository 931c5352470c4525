import { ARCMIN2_SR, C_KM_S, HUBBLE_TIME_GYR_KMSMPC } from '../constants.js';
import { gaussLegendre } from '../numeric/gauss-legendre.js';
import type { CosmologyParams } from './params.js';
import { radiationDensity } from './radiation.js';
import { assertCosmology, CosmologyError, darkEnergyDensity, e2OfA } from './validate.js';

/**
 * Background expansion for one parameter set. Distances follow Hogg 1999 (arXiv:astro-ph/9905116)
 * §§4–9; times §10. Integrals are tabulated once in u = ln a on [−30, 0] (8-point Gauss–Legendre per
 * 0.01 step) and finished to the requested point with a 6-point rule, so every call is accurate to
 * ~1e-12 relative. Radiation is included, so z up to ~1e12 is valid.
 */
export interface Background {
  readonly params: CosmologyParams;
  readonly omegaR: number;
  readonly omegaDE: number;
  /** Hubble time 1/H0, Gyr. */
  readonly hubbleTimeGyr: number;
  /** Hubble distance c/H0, Mpc. */
  readonly hubbleDistanceMpc: number;
  /** E(z) = H(z)/H0. */
  e(z: number): number;
  /** Ω_m(z) = Ω_m (1+z)³ / E(z)². */
  omegaMz(z: number): number;
  /** Age of the universe at z, Gyr: t_H ∫_z^∞ dz'/((1+z')E) (Hogg §10). */
  ageGyr(z: number): number;
  /** Lookback time to z, Gyr: t_H ∫_0^z dz'/((1+z')E) (Hogg eq. 30). */
  lookbackGyr(z: number): number;
  /** Line-of-sight comoving distance D_C, Mpc (Hogg eq. 15). */
  comovingDistanceMpc(z: number): number;
  /** Transverse comoving distance D_M, Mpc, for all curvature signs (Hogg eq. 16). */
  transverseComovingDistanceMpc(z: number): number;
  /** Luminosity distance D_L = (1+z) D_M, Mpc (Hogg eq. 21). */
  luminosityDistanceMpc(z: number): number;
  /**
   * D_L (Mpc) of many redshifts at once, into `out` (allocated when absent): χ read from the node table
   * by cubic Hermite interpolation on its exact values and slopes dχ/du = −e^(−u)/E (error ≲ h⁴/384
   * |χ⁗|, h = 0.01: < 1e-9 relative against luminosityDistanceMpc; z < 0.25, where χ is small, takes the per-point rule).
   * Throws naming the first bad index.
   */
  luminosityDistancesMpc(zs: ArrayLike<number>, out?: Float64Array): Float64Array;
  /** Angular-diameter distance D_A = D_M/(1+z), Mpc (Hogg eq. 18). */
  angularDiameterDistanceMpc(z: number): number;
  /** Comoving volume element dV_C/dz/dΩ = D_H D_M² / E, Mpc³ sr⁻¹ (Hogg eq. 28). */
  dVdzdOmegaMpc3(z: number): number;
  /** All-sky comoving volume within z, Mpc³, curvature-exact (Hogg eq. 29). */
  comovingVolumeMpc3(z: number): number;
  /** Comoving volume of a field of areaArcmin2 between z1 < z2, Mpc³. */
  surveyVolumeMpc3(areaArcmin2: number, z1: number, z2: number): number;
}

const U_MIN = -30;
const DU = 0.01;
const NODES = Math.round(-U_MIN / DU) + 1;

function checkZ(z: number): void {
  if (!(z >= 0) || !Number.isFinite(z)) throw new RangeError(`redshift must be a finite number ≥ 0 (got ${z})`);
  if (z > 1e12) throw new RangeError(`redshift ${z} is beyond the tabulated range (≤ 1e12)`);
}

export function makeBackground(params: CosmologyParams): Background {
  const p = assertCosmology(params);
  const omegaR = radiationDensity(p);
  const omegaDE = darkEnergyDensity(p);
  const tH = HUBBLE_TIME_GYR_KMSMPC / p.h0;
  const dH = C_KM_S / p.h0;
  const invE = (u: number): number => 1 / Math.sqrt(e2OfA(p, omegaR, omegaDE, Math.exp(u)));
  const g8 = gaussLegendre(8);
  const g6 = gaussLegendre(6);

  // ageTab[j] = ∫_{-∞}^{u_j} du/E (in t_H); chiTab[j] = ∫_{u_j}^{0} e^{-u} du/E (in D_H).
  const ageTab = new Float64Array(NODES);
  const chiTab = new Float64Array(NODES);
  const uAt = (j: number): number => U_MIN + j * DU;
  const seg = (f: (u: number) => number, a: number, b: number, rule = g8): number => {
    const mid = 0.5 * (a + b);
    const half = 0.5 * (b - a);
    let s = 0;
    for (let i = 0; i < rule.x.length; i++) s += rule.w[i] * f(mid + half * rule.x[i]);
    return s * half;
  };
  const chiF = (u: number): number => Math.exp(-u) * invE(u);
  // Below u = −30 the integrand of the age falls at least as fast as a^1.5; its leading-order tail is
  // ∫_{-∞}^{u0} du/E ≈ 1/(E(u0) · s) with s = −dln(1/E)/du ∈ [1.5, 2]: take s = 1.5 (upper bound, < 1e-19 t_H).
  ageTab[0] = invE(U_MIN) / 1.5;
  for (let j = 1; j < NODES; j++) ageTab[j] = ageTab[j - 1] + seg(invE, uAt(j - 1), uAt(j));
  chiTab[NODES - 1] = 0;
  for (let j = NODES - 2; j >= 0; j--) chiTab[j] = chiTab[j + 1] + seg(chiF, uAt(j), uAt(j + 1));
  const age0 = ageTab[NODES - 1];
  if (p.omegaK < 0 && Math.sqrt(-p.omegaK) * chiTab[0] > Math.PI / 2) {
    // Beyond a quarter of a closed universe D_M stops growing (and past the antipode turns negative):
    // luminosity distances would no longer order sources by redshift.
    throw new CosmologyError([
      { field: 'omegaK', flag: '--omega-k', message: `--omega-k: Ωk = ${p.omegaK} closes the universe so tightly that D_M stops growing with z (a source would look fainter at lower redshift); use a less negative Ωk` },
    ]);
  }

  const idx = (u: number): number => Math.min(NODES - 2, Math.max(0, Math.floor((u - U_MIN) / DU)));
  /** ∫_{-∞}^{u} du/E in t_H. */
  const ageU = (u: number): number => {
    const j = idx(u);
    return ageTab[j] + seg(invE, uAt(j), u, g6);
  };
  /** ∫_{u}^{0} e^{-u} du/E in D_H. */
  const chiU = (u: number): number => {
    const j = idx(u);
    return chiTab[j + 1] + seg(chiF, u, uAt(j + 1), g6);
  };
  const uOf = (z: number): number => -Math.log1p(z);
  const ok = p.omegaK;
  const sk = Math.sqrt(Math.abs(ok));
  const dmOverDh = (chi: number): number => {
    if (Math.abs(ok) < 1e-12) return chi;
    return ok > 0 ? Math.sinh(sk * chi) / sk : Math.sin(sk * chi) / sk;
  };
  const e = (z: number): number => {
    checkZ(z);
    return 1 / invE(uOf(z));
  };
  const dc = (z: number): number => {
    checkZ(z);
    return z === 0 ? 0 : dH * chiU(uOf(z));
  };
  const dm = (z: number): number => dH * dmOverDh(dc(z) / dH);
  const volAllSky = (z: number): number => {
    const x = dm(z) / dH;
    if (Math.abs(ok) < 1e-12) return ((4 * Math.PI) / 3) * (dm(z) ** 3);
    const pre = (4 * Math.PI * dH ** 3) / (2 * ok);
    const root = Math.sqrt(1 + ok * x * x);
    const inv = ok > 0 ? Math.asinh(sk * x) / sk : Math.asin(sk * x) / sk;
    return pre * (x * root - inv);
  };
  // slopes dχ/du at the nodes, for the batch interpolation (filled on the first batch)
  let slopeTab: Float64Array | undefined;
  const batchDl = (zs: ArrayLike<number>, out?: Float64Array): Float64Array => {
    const n = zs.length;
    const res = out ?? new Float64Array(n);
    if (res.length < n) throw new RangeError(`luminosityDistancesMpc: the output holds ${res.length} values, fewer than the ${n} redshifts`);
    if (!slopeTab) {
      slopeTab = new Float64Array(NODES);
      for (let j = 0; j < NODES; j++) slopeTab[j] = -chiF(uAt(j));
    }
    const sl = slopeTab;
    for (let i = 0; i < n; i++) {
      const z = zs[i];
      if (!(z >= 0 && z <= 1e12)) throw new RangeError(`luminosityDistancesMpc: redshift at index ${i} must be a finite number in [0, 1e12] (got ${z})`);
      if (z < 0.25) {
        res[i] = (1 + z) * dm(z);
        continue;
      }
      const u = -Math.log1p(z);
      const t = (u - U_MIN) / DU;
      const j = Math.min(NODES - 2, Math.max(0, Math.floor(t)));
      const x = t - j;
      const x2 = x * x;
      const x3 = x2 * x;
      // cubic Hermite basis on [u_j, u_j+1]
      const chi = (2 * x3 - 3 * x2 + 1) * chiTab[j] + (x3 - 2 * x2 + x) * DU * sl[j] + (-2 * x3 + 3 * x2) * chiTab[j + 1] + (x3 - x2) * DU * sl[j + 1];
      res[i] = (1 + z) * dH * dmOverDh(chi);
    }
    return res;
  };
  return {
    params: p,
    omegaR,
    omegaDE,
    hubbleTimeGyr: tH,
    hubbleDistanceMpc: dH,
    e,
    omegaMz: (z) => (p.omegaM * (1 + z) ** 3) / e(z) ** 2,
    ageGyr: (z) => {
      checkZ(z);
      return tH * ageU(uOf(z));
    },
    lookbackGyr: (z) => {
      checkZ(z);
      return tH * (age0 - ageU(uOf(z)));
    },
    comovingDistanceMpc: dc,
    transverseComovingDistanceMpc: dm,
    luminosityDistanceMpc: (z) => (1 + z) * dm(z),
    luminosityDistancesMpc: batchDl,
    angularDiameterDistanceMpc: (z) => dm(z) / (1 + z),
    dVdzdOmegaMpc3: (z) => (dH * dm(z) ** 2) / e(z),
    comovingVolumeMpc3: volAllSky,
    surveyVolumeMpc3: (areaArcmin2, z1, z2) => {
      if (!(areaArcmin2 > 0) || !Number.isFinite(areaArcmin2)) throw new RangeError(`survey area must be > 0 arcmin² (got ${areaArcmin2})`);
      if (!(z2 > z1)) throw new RangeError(`survey redshift range needs z_min < z_max (got ${z1}, ${z2})`);
      const frac = (areaArcmin2 * ARCMIN2_SR) / (4 * Math.PI);
      return frac * (volAllSky(z2) - volAllSky(z1));
    },
  };
}
