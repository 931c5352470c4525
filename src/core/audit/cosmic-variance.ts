import { gaussLegendre } from '../numeric/gauss-legendre.js';
import type { LinearPower } from '../power/linear-power.js';

/**
 * rms linear matter fluctuation in a rectangular box L_x × L_y × L_z (comoving Mpc) at z = 0:
 * σ²_dm = ∫ d³k/(2π)³ P(k) Π_i [sin(k_i L_i/2)/(k_i L_i/2)]²  (the pencil-beam window of
 * Trenti & Stiavelli 2008, ApJ 676, 767, §2). Scale by D(z) for other redshifts.
 * Numerics: Gauss–Legendre over q_i = k_i L_i/2 ∈ [0, 40] on panels of π/2 (4 points each), using the
 * x↔y symmetry of a square field; the window tail beyond q = 40 holds < 1% of σ² for the P(k) here.
 */
export function boxSigmaDm(power: LinearPower, lPerpMpc: number, lzMpc: number, qMax = 40): number {
  const g = gaussLegendre(4);
  const panels = Math.ceil(qMax / (Math.PI / 2));
  const h = qMax / panels;
  const q: number[] = [];
  const w: number[] = [];
  for (let p = 0; p < panels; p++) {
    for (let i = 0; i < 4; i++) {
      q.push((p + 0.5) * h + 0.5 * h * g.x[i]);
      w.push(0.5 * h * g.w[i]);
    }
  }
  const n = q.length;
  const sinc2 = q.map((x) => (Math.sin(x) / x) ** 2);
  const kPerp = q.map((x) => (2 * x) / lPerpMpc);
  const kz = q.map((x) => (2 * x) / lzMpc);
  let s = 0;
  for (let a = 0; a < n; a++) {
    for (let b = a; b < n; b++) {
      const sym = a === b ? 1 : 2;
      const wab = w[a] * w[b] * sinc2[a] * sinc2[b] * sym;
      const kp2 = kPerp[a] * kPerp[a] + kPerp[b] * kPerp[b];
      let inner = 0;
      for (let c = 0; c < n; c++) inner += w[c] * sinc2[c] * power.pMpc3(Math.sqrt(kp2 + kz[c] * kz[c]));
      s += wab * inner;
    }
  }
  // d³k = (2/L⊥)² (2/L_z) d³q over the positive octant ×8, divided by (2π)³.
  const jac = ((2 / lPerpMpc) ** 2 * (2 / lzMpc) * 8) / (2 * Math.PI) ** 3;
  return Math.sqrt(s * jac);
}
