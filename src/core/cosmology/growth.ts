import { gaussLegendre } from '../numeric/gauss-legendre.js';
import type { CosmologyParams } from './params.js';
import { radiationDensity } from './radiation.js';

/**
 * The growth-factor choices.
 * - `matter-lambda` (default): radiation is left out of the growth equation and dark energy fills
 *   1 − Ω_m − Ω_k (the usual convention for halo mass functions, common practice, no source).
 * - `with-radiation`: photons + massless neutrinos (Ω_r from T_CMB and N_eff, as in the background)
 *   enter H(z), and dark energy fills 1 − Ω_m − Ω_r − Ω_k.
 */
export const GROWTH_MODELS = ['matter-lambda', 'with-radiation'] as const;
export type GrowthModel = (typeof GROWTH_MODELS)[number];
export const DEFAULT_GROWTH_MODEL: GrowthModel = 'matter-lambda';

/** Checks a growth-model name (e.g. from a flag or a record); the message lists the allowed names. */
export function parseGrowthModel(name: string): GrowthModel {
  if ((GROWTH_MODELS as readonly string[]).includes(name)) return name as GrowthModel;
  throw new RangeError(`unknown growth model "${name}" (allowed: ${GROWTH_MODELS.join(', ')})`);
}

/**
 * Linear growth of matter perturbations, D(z) with D(0) = 1.
 * `matter-lambda`:
 *   Λ (w0 = −1, wa = 0), any curvature: exact integral of Heath 1977,
 *     D(a) ∝ (5Ω_m/2) E(a) ∫_0^a da'/(a'E(a'))³   (form of Hamilton 2001, MNRAS 322, 419, eq. 1).
 *   CPL dark energy: the linear growth ODE in x = ln a (e.g. Linder & Jenkins 2003, MNRAS 346, 573),
 *     D'' + (2 + dlnH/dlna) D' − (3/2) Ω_m(a) D = 0, D = D' = a at a = 1e-5, fixed-step RK4.
 * `with-radiation`: the same ODE with Ω_r a⁻⁴ in E(a)² (any curvature, Λ or CPL). Approximation:
 *   radiation acts only through H(z); it is taken as smooth (no radiation perturbations, no
 *   baryon–photon coupling, no neutrino free-streaming), so D stays scale-independent (sub-horizon,
 *   pressureless matter). Start at a = 1e-5 on the growing mode of a matter + radiation universe,
 *   the Mészáros solution D ∝ 1 + 3y/2, y = a/a_eq, a_eq = Ω_r/Ω_m (Mészáros 1974, A&A 37, 225),
 *   normalised as D = a + 2a_eq/3, D' = a (so D → a once matter dominates, as in the other method).
 */
export interface Growth {
  readonly method: 'heath-integral' | 'ode';
  readonly model: GrowthModel;
  /** D(z)/D(0). */
  d(z: number): number;
  /** D(a = 1) in the normalisation D → a once matter dominates (diagnostic). */
  readonly dToday: number;
  /** Growth rate f = dlnD/dlna at z. */
  rate(z: number): number;
}

const U0 = Math.log(1e-5);
const DU = 0.005;
const N = Math.ceil(-U0 / DU) + 1;

/**
 * @param forceOde use the ODE even where the Heath integral applies (for tests).
 * @param model `matter-lambda` (default, bit-identical to the growth without this argument) or
 *   `with-radiation`.
 */
export function makeGrowth(p: CosmologyParams, forceOde = false, model: GrowthModel = DEFAULT_GROWTH_MODEL): Growth {
  parseGrowthModel(model);
  const om = p.omegaM;
  const okk = p.omegaK;
  const withRad = model === 'with-radiation';
  const orr = withRad ? radiationDensity(p) : 0;
  const ode = withRad ? 1 - om - orr - okk : 1 - om - okk;
  const lambda = p.w0 === -1 && p.wa === 0;
  const deF = (a: number): number => (lambda ? 1 : a ** (-3 * (1 + p.w0 + p.wa)) * Math.exp(-3 * p.wa * (1 - a)));
  const e2 = withRad
    ? (a: number): number => om / (a * a * a) + orr / (a * a * a * a) + okk / (a * a) + ode * deF(a)
    : (a: number): number => om / (a * a * a) + okk / (a * a) + ode * deF(a);
  /** dlnE²/dlna. */
  const dlnE2 = (a: number): number => {
    const dde = lambda ? 0 : ode * deF(a) * (-3 * (1 + p.w0 + p.wa) + 3 * p.wa * a);
    const drad = withRad ? (-4 * orr) / (a * a * a * a) : 0;
    return (-3 * om / (a * a * a) + drad - 2 * okk / (a * a) + dde) / e2(a);
  };
  const uAt = (j: number): number => (j === N - 1 ? 0 : U0 + j * DU);
  const D = new Float64Array(N);
  const dD = new Float64Array(N);
  const useOde = forceOde || !lambda || withRad;
  /** 2a_eq/3 of the Mészáros growing mode (0 without radiation). */
  const early = withRad ? (2 * orr) / (3 * om) : 0;
  if (!useOde) {
    const g = gaussLegendre(8);
    const integrand = (u: number): number => Math.exp(-2 * u) * e2(Math.exp(u)) ** -1.5;
    let I = Math.exp(2.5 * U0) / (2.5 * om ** 1.5);
    for (let j = 0; j < N; j++) {
      if (j > 0) {
        const a0 = uAt(j - 1);
        const b0 = uAt(j);
        const mid = 0.5 * (a0 + b0);
        const half = 0.5 * (b0 - a0);
        let s = 0;
        for (let i = 0; i < 8; i++) s += g.w[i] * integrand(mid + half * g.x[i]);
        I += s * half;
      }
      const a = Math.exp(uAt(j));
      const E = Math.sqrt(e2(a));
      D[j] = 2.5 * om * E * I;
      dD[j] = 2.5 * om * (0.5 * dlnE2(a) * E * I + E * integrand(uAt(j)));
    }
  } else {
    const rhs = (u: number, y0: number, y1: number): [number, number] => {
      const a = Math.exp(u);
      const omA = om / (a * a * a) / e2(a);
      return [y1, -(2 + 0.5 * dlnE2(a)) * y1 + 1.5 * omA * y0];
    };
    // Growing mode at a_i: D = a_i (+ 2a_eq/3 with radiation, the Mészáros solution), D' = a_i.
    let y0 = Math.exp(U0) + early;
    let y1 = Math.exp(U0);
    D[0] = y0;
    dD[0] = y1;
    for (let j = 1; j < N; j++) {
      const u = uAt(j - 1);
      const h = uAt(j) - u;
      const k1 = rhs(u, y0, y1);
      const k2 = rhs(u + h / 2, y0 + (h / 2) * k1[0], y1 + (h / 2) * k1[1]);
      const k3 = rhs(u + h / 2, y0 + (h / 2) * k2[0], y1 + (h / 2) * k2[1]);
      const k4 = rhs(u + h, y0 + h * k3[0], y1 + h * k3[1]);
      y0 += (h / 6) * (k1[0] + 2 * k2[0] + 2 * k3[0] + k4[0]);
      y1 += (h / 6) * (k1[1] + 2 * k2[1] + 2 * k3[1] + k4[1]);
      D[j] = y0;
      dD[j] = y1;
    }
  }
  const dToday = D[N - 1];
  /** Cubic Hermite interpolation of D and its derivative in u. */
  const evalU = (u: number): [number, number] => {
    if (u <= U0) {
      if (!withRad) return [D[0] * Math.exp(u - U0), D[0] * Math.exp(u - U0)];
      // Before a = 1e-5: the Mészáros growing mode D = a + 2a_eq/3 (matter + radiation).
      return [Math.exp(u) + early, Math.exp(u)];
    }
    let j = Math.floor((u - U0) / DU);
    if (j > N - 2) j = N - 2;
    const u0 = uAt(j);
    const h = uAt(j + 1) - u0;
    const t = (u - u0) / h;
    const t2 = t * t;
    const t3 = t2 * t;
    const h00 = 2 * t3 - 3 * t2 + 1;
    const h10 = t3 - 2 * t2 + t;
    const h01 = -2 * t3 + 3 * t2;
    const h11 = t3 - t2;
    const v = h00 * D[j] + h10 * h * dD[j] + h01 * D[j + 1] + h11 * h * dD[j + 1];
    const dv = ((6 * t2 - 6 * t) * D[j] + (3 * t2 - 4 * t + 1) * h * dD[j] + (-6 * t2 + 6 * t) * D[j + 1] + (3 * t2 - 2 * t) * h * dD[j + 1]) / h;
    return [v, dv];
  };
  return {
    method: useOde ? 'ode' : 'heath-integral',
    model,
    dToday,
    d: (z) => {
      if (!(z >= 0) || !Number.isFinite(z)) throw new RangeError(`redshift must be a finite number ≥ 0 (got ${z})`);
      return evalU(-Math.log1p(z))[0] / dToday;
    },
    rate: (z) => {
      const [v, dv] = evalU(-Math.log1p(z));
      return dv / v;
    },
  };
}
