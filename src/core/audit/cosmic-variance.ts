import { gaussLegendre } from '../numeric/gauss-legendre.js';
import type { LinearPower } from '../power/linear-power.js';

/**
 * rms linear matter fluctuation in a rectangular box L_x × L_y × L_z (comoving Mpc) at z = 0:
 * σ²_dm = ∫ d³k/(2π)³ P(k) Π_i [sin(k_i L_i/2)/(k_i L_i/2)]²  (the pencil-beam window of
 * Trenti & Stiavelli 2008, ApJ 676, 767, §2). Scale by D(z) for other redshifts.
 * Numerics, per axis in q = kL/2: Gauss–Legendre on [0, 20] in panels of width h ≈ π/2 (4 points each),
 * the first panel split geometrically at h/16, h/8, h/4, h/2 (P(|k|) ∝ |k|^n_s is not smooth at k = 0 and
 * turns over near 0.02 Mpc⁻¹, inside that panel for L⊥ ≈ 20 Mpc; unsplit, σ_dm comes out 1% high), and
 * the tail q > 20 with the window replaced by its mean 1/(2q²), integrated in u = 1/q (8 points);
 * the x↔y symmetry of a square field halves the work.
 */
function axisNodes(qMax: number): { q: Float64Array; w: Float64Array } {
  const g = gaussLegendre(4);
  const t = gaussLegendre(8);
  const panels = Math.ceil(qMax / (Math.PI / 2));
  const h = qMax / panels;
  const edges = [0, h / 16, h / 8, h / 4, h / 2];
  for (let p = 1; p <= panels; p++) edges.push(p * h);
  const q: number[] = [];
  const w: number[] = [];
  for (let p = 0; p + 1 < edges.length; p++) {
    const half = 0.5 * (edges[p + 1] - edges[p]);
    for (let i = 0; i < 4; i++) {
      const x = edges[p] + half * (1 + g.x[i]);
      q.push(x);
      w.push(half * g.w[i] * (Math.sin(x) / x) ** 2);
    }
  }
  const uMax = 1 / qMax;
  for (let i = 0; i < 8; i++) {
    const u = 0.5 * uMax * (1 + t.x[i]);
    q.push(1 / u);
    w.push(0.5 * uMax * t.w[i] * 0.5);
  }
  return { q: Float64Array.from(q), w: Float64Array.from(w) };
}

export function boxSigmaDm(power: LinearPower, lPerpMpc: number, lzMpc: number, qMax = 20): number {
  const { q, w } = axisNodes(qMax);
  const n = q.length;
  const kPerp = q.map((x) => (2 * x) / lPerpMpc);
  const kz2 = q.map((x) => ((2 * x) / lzMpc) ** 2);
  let s = 0;
  for (let a = 0; a < n; a++) {
    for (let b = a; b < n; b++) {
      const wab = w[a] * w[b] * (a === b ? 1 : 2);
      const kp2 = kPerp[a] * kPerp[a] + kPerp[b] * kPerp[b];
      let inner = 0;
      for (let c = 0; c < n; c++) inner += w[c] * power.pMpc3(Math.sqrt(kp2 + kz2[c]));
      s += wab * inner;
    }
  }
  // d³k = (2/L⊥)² (2/L_z) d³q over the positive octant ×8, divided by (2π)³.
  const jac = ((2 / lPerpMpc) ** 2 * (2 / lzMpc) * 8) / (2 * Math.PI) ** 3;
  return Math.sqrt(s * jac);
}
