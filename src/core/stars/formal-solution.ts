import { gaussLegendre } from '../numeric/gauss-legendre.js';
import { expIntegralE2 } from './exponential-integral.js';

/**
 * Emergent flux of a plane-parallel LTE atmosphere from the formal solution of the transfer equation,
 * F_ν(0) = 2π ∫₀^∞ S_ν(τ_ν) E_2(τ_ν) dτ_ν with S_ν = B_ν (Mihalas 1978, Stellar Atmospheres, ch. 2; Gray 2005,
 * ch. 7; chapters from memory); F_ν/π in the units of S_ν. The Eddington–Barbier relation F_ν ≈ πS_ν(⅔) is
 * its exact value for a source linear in τ_ν; a source that rises faster than linearly with depth (the Wien side
 * of the Planck function) gives more flux than Eddington–Barbier.
 *
 * Quadrature: ∫₀^∞ f(t) 2E_2(t) dt ≈ Σ_k w_k f(t_k), 5-point Gauss–Legendre on eight panels between 0 and 40
 * (E_2(40) < 1e-18) with the weight folded into w_k. Its moments ∫ t^m 2E_2 dt = 2 m!/(m + 2) (1, ⅔, 1, 12/5
 * for m = 0…3; from ∫₀^∞ t^m E_n(t) dt = m!/(m + n), A&S 1964, eq. 5.1.32, from memory) are reproduced to
 * < 1e-6 (test).
 */
const PANELS = [0, 0.02, 0.1, 0.4, 1.2, 3, 7, 16, 40];
const POINTS = 5;

function buildRule(): { t: Float64Array; w: Float64Array } {
  const g = gaussLegendre(POINTS);
  const t: number[] = [];
  const w: number[] = [];
  for (let p = 0; p + 1 < PANELS.length; p++) {
    const a = PANELS[p];
    const b = PANELS[p + 1];
    for (let k = 0; k < g.x.length; k++) {
      const x = 0.5 * (a + b) + 0.5 * (b - a) * g.x[k];
      t.push(x);
      w.push((b - a) * g.w[k] * expIntegralE2(x));
    }
  }
  return { t: Float64Array.from(t), w: Float64Array.from(w) };
}

let rule: { t: Float64Array; w: Float64Array } | undefined;

/** Nodes t_k and weights w_k of ∫₀^∞ f(t) 2E_2(t) dt (the flux kernel, normalised to ∫ 2E_2 = 1), built on first use. */
export function fluxKernel(): { readonly t: Float64Array; readonly w: Float64Array } {
  rule ??= buildRule();
  return rule;
}

/** ∫₀^∞ f(t) 2E_2(t) dt by the rule above: F_ν/π for the source function f(τ_ν). */
export function fluxKernelIntegral(f: (tau: number) => number): number {
  let s = 0;
  const { t, w } = fluxKernel();
  for (let k = 0; k < t.length; k++) s += w[k] * f(t[k]);
  return s;
}
