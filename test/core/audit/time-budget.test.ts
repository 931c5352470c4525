import { describe, expect, it } from 'vitest';
import { makeBackground, PLANCK18 } from '../../../src/core/cosmology/index.js';
import { makeAccretionHistory, meanAccretionRateMsunYr } from '../../../src/core/audit/accretion.js';
import { logAccretedBaryons } from '../../../src/core/audit/time-budget.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const bg = makeBackground(PLANCK18);
const FB = 0.157424;

// An independent RK4 integration in z of the same ODE, with the rate written out from the paper's
// formula (46.1 Msun/yr, M^1.1, 1 + 1.11 z, √(Ω_m(1+z)³ + Ω_Λ)) and H from the background.
const hubbleYr = 1 / (bg.hubbleTimeGyr * 1e9);
const dMdz = (m: number, z: number): number =>
  (-46.1 * (m / 1e12) ** 1.1 * (1 + 1.11 * z) * Math.sqrt(PLANCK18.omegaM * (1 + z) ** 3 + bg.omegaDE)) / ((1 + z) * hubbleYr * bg.e(z));
const rk4 = (m0: number, z0: number, z1: number, steps = 4000): number => {
  let m = m0;
  const h = (z1 - z0) / steps;
  for (let i = 0; i < steps; i++) {
    const z = z0 + i * h;
    const k1 = dMdz(m, z);
    const k2 = dMdz(m + 0.5 * h * k1, z + 0.5 * h);
    const k3 = dMdz(m + 0.5 * h * k2, z + 0.5 * h);
    const k4 = dMdz(m + h * k3, z + h);
    m += (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
  }
  return m;
};

describe('mean accretion rate (Fakhouri, Ma & Boylan-Kolchin 2010, eq. 2; coefficients from memory)', () => {
  it('matches the reference sheet §12 table (Ω_m = 0.3111, Ω_Λ = 0.6889, [C]) to its printed 4 digits', () => {
    const rows: [number, number, number][] = [[0, 1e12, 46.1], [6, 1e11, 290.7], [8, 1e11, 545.7], [10, 1e10, 71.68], [10, 1e11, 902.4], [12, 1e11, 1372], [15, 1e11, 2308]];
    for (const [z, m, want] of rows) expect(rel(meanAccretionRateMsunYr(m, z, 0.3111, 0.6889), want)).toBeLessThan(6e-4);
  });
});

describe('mean mass history: dM/dz = −⟨dM/dt⟩/((1+z) H(z)), integrated', () => {
  const history = makeAccretionHistory(bg);
  it('M_h(z) back from (1e11 Msun, z = 10) to z = 11, 13, 20 matches RK4 to 1e-5', () => {
    for (const z of [11, 13, 20]) expect(rel(history.massAt(1e11, 10, z), rk4(1e11, 10, z))).toBeLessThan(1e-5);
  });
  it('accreted mass over a short interval equals rate × time (instantaneous limit): 0.1 Myr at z = 10, 1e11 Msun, 0.1% (the rate itself changes by ~0.03% in 0.1 Myr)', () => {
    const tObs = bg.ageGyr(10);
    // redshift one Myr earlier, from the background's age (bisection, independent of the project's inverse table)
    let lo = 10;
    let hi = 10.2;
    for (let i = 0; i < 80; i++) {
      const mid = 0.5 * (lo + hi);
      if (bg.ageGyr(mid) > tObs - 1e-4) lo = mid;
      else hi = mid;
    }
    const dm = history.accretedMsun(1e11, 10, lo);
    expect(rel(dm, meanAccretionRateMsunYr(1e11, 10, PLANCK18.omegaM, bg.omegaDE) * 1e5)).toBeLessThan(1e-3);
  });
});

describe('baryons accreted during each draw’s star formation (the time budget’s denominator)', () => {
  const history = makeAccretionHistory(bg);
  const lm = Math.log10(1e11);
  it('never more than f_b M_h: an age as old as the universe with z_form = 100 tends to f_b M_h (ratio → ε_req/(1 − R))', () => {
    const ageMyr = bg.ageGyr(10) * 1000;
    const [l] = logAccretedBaryons(bg, history, FB, 100, [10], [Math.log10(ageMyr)], [lm]);
    const frac = 10 ** l / (FB * 1e11);
    expect(frac).toBeLessThanOrEqual(1);
    expect(frac).toBeGreaterThan(0.99);
  });
  it('the formation redshift caps the interval: z_form = 12 accretes M_h(10) − M_h(12) whatever the age', () => {
    const [l] = logAccretedBaryons(bg, history, FB, 12, [10], [Math.log10(400)], [lm]);
    // 1e-5, as for the history against RK4 (both tables are linear on 0.002 steps of ln(1+z))
    expect(rel(10 ** l, FB * (1e11 - rk4(1e11, 10, 12)))).toBeLessThan(1e-5);
  });
  it('a young population is stricter than ε: after 10 Myr the halo has accreted under a tenth of its mass', () => {
    const [l] = logAccretedBaryons(bg, history, FB, 30, [10], [1], [lm]);
    expect(10 ** l / (FB * 1e11)).toBeLessThan(0.1);
  });
  it('an empty interval (z at the formation redshift) gives −∞, never a number that looks feasible', () => {
    expect(logAccretedBaryons(bg, history, FB, 10, [10], [2], [lm])[0]).toBe(Number.NEGATIVE_INFINITY);
  });
});
