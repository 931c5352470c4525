import { RHO_CRIT_H2_MSUN_MPC3 } from '../constants.js';
import type { CosmologyParams } from '../cosmology/params.js';
import { gaussLegendre } from '../numeric/gauss-legendre.js';
import { cubicSpline, splineEval, type CubicSpline } from '../numeric/cubic-spline.js';
import { topHat, topHatDeriv } from './top-hat.js';
import { makeTransfer, type TransferSpec } from './transfer.js';

/**
 * Linear matter power at z = 0, as the dimensionless Δ²(k) = k³P(k)/(2π²), with
 * P(k) = A k^{n_s} T(k)² normalised so that σ(R = 8 h⁻¹ Mpc) = σ8 (top hat; e.g. Peacock 1999 §16.2).
 * k in Mpc⁻¹, P in Mpc³, R in comoving Mpc. A table input is interpolated as a cubic spline in
 * ln P–ln k and continued as power laws beyond its ends (n_s below, the last two points' slope above).
 */
export interface LinearPower {
  readonly spec: TransferSpec['kind'];
  /** Δ²(k) at z = 0. */
  delta2(kMpc: number): number;
  /** P(k) at z = 0, Mpc³. */
  pMpc3(kMpc: number): number;
  /** σ(R) at z = 0 for a top hat of comoving radius R (Mpc). */
  sigmaR(rMpc: number, resolution?: number): number;
  /** σ(R) and dlnσ/dlnR at z = 0. */
  sigmaAndSlopeR(rMpc: number, resolution?: number): { sigma: number; dlnSigmaDlnR: number };
  /** Mean matter density today, Msun Mpc⁻³ (comoving). */
  readonly rhoMMsunMpc3: number;
}

const LNK_MIN = Math.log(1e-7);
const LNK_MAX = Math.log(1e7);
const LNK_STEP = 0.02;
/** Upper limit of x = kR for the quadrature; the rest is added analytically (see below). */
const X_MAX_PANELS = 128;

function sigma2Integrals(d2: (k: number) => number, r: number, resolution: number): [number, number] {
  // Region 1: ln x in [ln 1e-4, 0]: Gauss–Legendre panels of 0.25/resolution, 8 points each.
  // Region 2: x in [1, 1 + 128·π/2]: panels of (π/2)/resolution, 6 points each (W² oscillates with
  // period π); where k < 0.6 Mpc⁻¹ the panels shrink to half a baryon-oscillation period
  // (Δk ≈ 2π/150 Mpc⁻¹, i.e. Δx = 0.021 R) so the wiggles are resolved too.
  const g8 = gaussLegendre(8);
  const g6 = gaussLegendre(6);
  let s = 0;
  let ds = 0;
  const lnLo = Math.log(1e-4);
  const n1 = Math.ceil((-lnLo / 0.25) * resolution);
  const h1 = -lnLo / n1;
  for (let pI = 0; pI < n1; pI++) {
    const mid = lnLo + (pI + 0.5) * h1;
    for (let i = 0; i < 8; i++) {
      const lx = mid + 0.5 * h1 * g8.x[i];
      const x = Math.exp(lx);
      const w = topHat(x);
      const d = d2(x / r);
      const wt = 0.5 * h1 * g8.w[i];
      s += wt * d * w * w;
      ds += wt * d * 2 * w * topHatDeriv(x) * x;
    }
  }
  // below x = 1e-4: W = 1, Δ² ∝ k^(3+n) with n ≥ −1 in practice: tail = Δ²(x_lo/R)/(3+n) ≤ Δ²(x_lo/R)/2.
  const dLo = d2(1e-4 / r);
  const dLo2 = d2(2e-4 / r);
  const mLo = Math.log(dLo2 / dLo) / Math.LN2;
  if (mLo > 0) s += dLo / mLo;
  const h2 = Math.PI / 2 / resolution;
  const xMax = 1 + X_MAX_PANELS * h2 * resolution;
  const xBao = Math.min(xMax, Math.max(1, 0.6 * r));
  const hBao = Math.min(h2, (0.021 * r) / resolution);
  const nBao = Math.ceil((xBao - 1) / hBao);
  const nRest = Math.ceil((xMax - xBao) / h2);
  const region2 = (x0: number, width: number, count: number): void => {
    for (let pI = 0; pI < count; pI++) {
      const mid = x0 + (pI + 0.5) * width;
      for (let i = 0; i < 6; i++) {
        const x = mid + 0.5 * width * g6.x[i];
        const w = topHat(x);
        const d = d2(x / r);
        const wt = (0.5 * width * g6.w[i]) / x;
        s += wt * d * w * w;
        ds += wt * d * 2 * w * topHatDeriv(x) * x;
      }
    }
  };
  if (nBao > 0) region2(1, (xBao - 1) / nBao, nBao);
  if (nRest > 0) region2(xBao, (xMax - xBao) / nRest, nRest);
  // Tail beyond x_max: ⟨W²⟩ → 9/(2x⁴); with Δ² ∝ x^m locally, ∫ = Δ²(x_max/R) · 9/(2 x_max⁴ (4 − m)).
  const dHi = d2(xMax / r);
  const m = Math.log(d2((1.1 * xMax) / r) / dHi) / Math.log(1.1);
  if (m < 4) {
    const tail = (dHi * 9) / (2 * xMax ** 4 * (4 - m));
    s += tail;
    ds += -m * tail;
  }
  return [s, ds];
}

export function makeLinearPower(p: CosmologyParams, spec: TransferSpec): LinearPower {
  const h = p.h0 / 100;
  const rhoM = RHO_CRIT_H2_MSUN_MPC3 * h * h * p.omegaM;
  let raw: (k: number) => number;
  if (spec.kind === 'power-law') {
    const { n, amplitude } = spec;
    raw = (k) => (amplitude * k ** (3 + n)) / (2 * Math.PI * Math.PI);
  } else if (spec.kind === 'table') {
    const lnk = spec.kMpc.map(Math.log);
    const lnp = spec.pMpc3.map(Math.log);
    const s = cubicSpline(lnk, lnp);
    const n = lnk.length;
    const slopeHi = (lnp[n - 1] - lnp[n - 2]) / (lnk[n - 1] - lnk[n - 2]);
    raw = (k) => {
      const lk = Math.log(k);
      let lp: number;
      if (lk < lnk[0]) lp = lnp[0] + p.ns * (lk - lnk[0]);
      else if (lk > lnk[n - 1]) lp = lnp[n - 1] + slopeHi * (lk - lnk[n - 1]);
      else lp = splineEval(s, lk);
      return (k * k * k * Math.exp(lp)) / (2 * Math.PI * Math.PI);
    };
  } else {
    const t = makeTransfer(p, spec.kind);
    const nodes = Math.round((LNK_MAX - LNK_MIN) / LNK_STEP) + 1;
    const lk = new Float64Array(nodes);
    const ld = new Float64Array(nodes);
    for (let i = 0; i < nodes; i++) {
      lk[i] = LNK_MIN + i * LNK_STEP;
      const k = Math.exp(lk[i]);
      const tk = t(k);
      ld[i] = Math.log(k ** (3 + p.ns) * tk * tk);
    }
    const sp: CubicSpline = cubicSpline(lk, ld);
    raw = (k) => Math.exp(splineEval(sp, Math.log(k)));
  }
  let amp = 1;
  if (spec.kind !== 'power-law') {
    const [s8] = sigma2Integrals(raw, 8 / h, 1);
    amp = (p.sigma8 * p.sigma8) / s8;
  }
  const delta2 = (k: number): number => amp * raw(k);
  return {
    spec: spec.kind,
    rhoMMsunMpc3: rhoM,
    delta2,
    pMpc3: (k) => (delta2(k) * 2 * Math.PI * Math.PI) / (k * k * k),
    sigmaR: (r, resolution = 1) => Math.sqrt(sigma2Integrals(delta2, r, resolution)[0]),
    sigmaAndSlopeR: (r, resolution = 1) => {
      const [s, ds] = sigma2Integrals(delta2, r, resolution);
      return { sigma: Math.sqrt(s), dlnSigmaDlnR: ds / (2 * s) };
    },
  };
}
