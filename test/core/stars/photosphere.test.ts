import { describe, expect, it } from 'vitest';
import expn from './fixtures/expn.json';
import {
  balmerJumpDex,
  BALMER_EDGE_UM,
  continuousOpacity,
  expIntegralE1,
  expIntegralE2,
  fluxKernel,
  fluxKernelIntegral,
  gasState,
  gauntBoundFree,
  hMinusAbsorption,
  hMinusBoundFreeCrossSection,
  hMinusSahaFactor,
  hydrogenAbsorption,
  hydrogenBoundFreeCrossSection,
  hydrogenEdgeAngstrom,
  hydrogenMassFraction,
  hydrogenSahaFactor,
  KRAMERS_BF_CM2_HZ3,
  KRAMERS_FF_CGS,
  photosphereAt,
  photosphereFluxRatio,
  photosphericLayer,
  rosselandMean,
} from '../../../src/core/stars/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const HC_K_UM_K = 14387.7688;
const planckShape = (t: number, lam: number): number => {
  const x = HC_K_UM_K / (lam * t);
  return x > 700 ? 0 : 1 / (lam ** 3 * Math.expm1(x));
};

describe('exponential integrals and the flux kernel', () => {
  it('E_1 and E_2 match scipy.special.expn (fixtures/generate_expn.py) to 1e-12 relative', () => {
    // Tolerance: both are double-precision evaluations of convergent series / continued fractions.
    for (const r of expn.rows) {
      expect(rel(expIntegralE1(r.x), r.e1)).toBeLessThan(1e-12);
      expect(rel(expIntegralE2(r.x), r.e2)).toBeLessThan(1e-12);
    }
  });
  it('E_2(0) = 1, and E_1 refuses x ≤ 0 with a message naming x', () => {
    expect(expIntegralE2(0)).toBe(1);
    expect(() => expIntegralE1(0)).toThrow(/x > 0/);
  });
  it('the kernel 2E_2 has the moments ∫ t^m 2E_2 dt = 2 m!/(m + 2): 1, ⅔, 1, 12/5 (closed form), to 1e-6', () => {
    // Tolerance: the 40-node rule's error on smooth integrands, measured ≤ 1e-6.
    const mom = (m: number): number => fluxKernelIntegral((t) => t ** m);
    expect(Math.abs(mom(0) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(mom(1) - 2 / 3)).toBeLessThan(1e-6);
    expect(Math.abs(mom(2) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(mom(3) - 12 / 5)).toBeLessThan(1e-5);
    expect(fluxKernel().t.length).toBe(40);
  });
  it('the formal solution is exact for a linear source: F/π = S(⅔), the Eddington–Barbier relation (closed form)', () => {
    expect(Math.abs(fluxKernelIntegral((t) => 3 + 5 * t) - (3 + (5 * 2) / 3))).toBeLessThan(1e-5);
  });
  it('a grey Eddington atmosphere conserves flux exactly: ∫ ¾(τ + ⅔) 2E_2 dτ = 1 (closed form from the moments)', () => {
    expect(Math.abs(fluxKernelIntegral((t) => 0.75 * (t + 2 / 3)) - 1)).toBeLessThan(1e-6);
  });
});

describe('hydrogen and H⁻ opacities against their closed forms and published values', () => {
  it("Kramers' constants from e, m_e, h, c: 2.815e29 cm² Hz³ (bound-free) and 3.69e8 cgs (free-free; Rybicki & Lightman 1979, eq. 5.18b: 3.7e8)", () => {
    // Tolerance: the printed digits of the references.
    expect(rel(KRAMERS_BF_CM2_HZ3, 2.815e29)).toBeLessThan(5e-4);
    expect(rel(KRAMERS_FF_CGS, 3.69e8)).toBeLessThan(2e-3);
  });
  it('edges n²/R_H: Lyman 911.8 Å, Balmer 3647.1 Å, Paschen 8206 Å (vacuum; closed form)', () => {
    expect(Math.abs(hydrogenEdgeAngstrom(1) - 911.76)).toBeLessThan(0.05);
    expect(Math.abs(hydrogenEdgeAngstrom(2) - 3647.05)).toBeLessThan(0.1);
    expect(Math.abs(hydrogenEdgeAngstrom(3) - 8205.9)).toBeLessThan(0.2);
    expect(BALMER_EDGE_UM).toBeCloseTo(0.364705, 5);
  });
  it('H(1s) at threshold: Kramers 7.91e-18 cm², and with the gaunt factor within 5% of the exact 6.30e-18 cm² (Osterbrock & Ferland 2006, Table 2.1 — from memory)', () => {
    const kramers = hydrogenBoundFreeCrossSection(911.7, 1) / gauntBoundFree(911.7, 1);
    expect(rel(kramers, 7.91e-18)).toBeLessThan(2e-3);
    // Tolerance: the first-order Menzel–Pekeris gaunt factor is 0.827 at the Lyman edge, the exact value 0.797.
    expect(rel(hydrogenBoundFreeCrossSection(911.7, 1), 6.3e-18)).toBeLessThan(0.05);
  });
  it('Kramers threshold cross-sections grow as n (σ_n ∝ ν_n⁻³/n⁵ ∝ n), and vanish longward of each edge', () => {
    for (const n of [2, 3, 4]) {
      const e = hydrogenEdgeAngstrom(n) * (1 - 1e-9);
      expect(rel(hydrogenBoundFreeCrossSection(e, n) / gauntBoundFree(e, n), n * 7.906e-18)).toBeLessThan(3e-3);
      expect(hydrogenBoundFreeCrossSection(hydrogenEdgeAngstrom(n) * 1.001, n)).toBe(0);
    }
  });
  it('H⁻ photo-detachment peaks near 4e-17 cm² around 8500 Å and vanishes past 1.64 μm (Wishart 1979; from memory)', () => {
    let best = 0;
    let at = 0;
    for (let l = 2000; l < 16000; l += 50) {
      const s = hMinusBoundFreeCrossSection(l);
      if (s > best) [best, at] = [s, l];
    }
    // Tolerance: the remembered peak is given to one digit.
    expect(rel(best, 4e-17)).toBeLessThan(0.1);
    expect(Math.abs(at - 8500)).toBeLessThan(1000);
    expect(hMinusBoundFreeCrossSection(16500)).toBe(0);
  });
  it('Saha factors: n_p n_e/n_H0 = 2.4147e15 T^{3/2} e^{−157 803/T} cm⁻³ (2πm_e k/h² and χ_H/k); H⁻/H0 = 4.158e-10 θ^{5/2} P_e 10^{0.754θ} (Gray 2005, eq. 8.12; from memory)', () => {
    for (const t of [5000, 10000, 20000]) {
      // Tolerance: the reference's five printed digits (2e-5) and a unit in χ/k (2e-4 at 5000 K).
      expect(rel(hydrogenSahaFactor(t), 2.4147e15 * t ** 1.5 * Math.exp(-157803 / t))).toBeLessThan(3e-4);
      const th = 5040 / t;
      const gray = 4.158e-10 * th ** 2.5 * 10 ** (0.754 * th); // per unit P_e
      const ours = (1 / hMinusSahaFactor(t)) / (1.380649e-16 * t); // n_H⁻/(n_H0 P_e)
      expect(rel(ours, gray)).toBeLessThan(2e-3);
    }
  });
  it('the layer gas balances charge and pressure: n_p ≤ n_e ≤ n_p + 2n_He + n_metals, P = (n_H + n_He + n_M + n_e) kT (identities)', () => {
    for (const [t, p, z] of [[4500, 1e4, 0.02], [9000, 1e3, 0.02], [30000, 5e3, 0.001]]) {
      const g = gasState(t, p, z);
      const x = hydrogenMassFraction(z);
      const nH = g.nNeutral + g.nProton;
      expect(rel(g.rho, (nH * 1.6735575e-24) / x)).toBeLessThan(1e-12);
      expect(g.nElectron).toBeGreaterThanOrEqual(g.nProton * (1 - 1e-9));
      const nHe = (nH * (1 - x - z)) / (4 * x);
      expect(g.nElectron).toBeLessThanOrEqual(g.nProton + 2 * nHe + 2e-4 * nH);
      expect(rel((nH + nHe + g.nElectron) * 1.380649e-16 * t, p)).toBeLessThan(1e-3); // metals add < 1e-3 of the particles
    }
  });
  it('a hot, thin, fully ionised layer has the Thomson opacity σ_T (X + Y/2)/m_H ≈ 0.2(1 + X) cm²/g as its Rosseland mean (closed form)', () => {
    const z = 0.02;
    const x = hydrogenMassFraction(z);
    const thomson = (6.6524587321e-25 * (x + (1 - x - z) / 2)) / 1.6735575e-24;
    // Tolerance: free-free and the metals' electrons add < 1e-3 at 10⁵ K and 1 dyn/cm².
    expect(rel(rosselandMean(gasState(100000, 1, z)), thomson)).toBeLessThan(1e-3);
    // Tolerance: 0.2 is σ_T/(2m_H) = 0.1987 rounded, and 1 + X leaves out the metals' −Z.
    expect(rel(thomson, 0.2 * (1 + x))).toBeLessThan(0.02);
  });
  it('continuousOpacity is the sum of its parts: (hydrogen + H⁻ + σ_T n_e)/ρ (identity), to 1e-12', () => {
    for (const [t, p] of [[5000, 1e5], [12000, 2000], [30000, 5000]]) {
      const g = gasState(t, p, 0.02);
      for (const l of [1300, 3000, 3646, 3648, 6000, 10000, 20000]) {
        const h = hydrogenAbsorption(l, g.tK, g.nNeutral, g.nElectron, g.nProton);
        const hm = hMinusAbsorption(l, g.tK, g.nNeutral, g.nHMinus, g.pElectron);
        expect(rel(continuousOpacity(g, l), (h + hm + 6.6524587321e-25 * g.nElectron) / g.rho)).toBeLessThan(1e-12);
      }
    }
  });
  it('the photospheric layer is in hydrostatic equilibrium at τ_R = ⅔: P = ⅔ g/κ_R (identity), to 1e-6', () => {
    for (const [t, lg] of [[5772, 4.44], [10000, 4], [30000, 4], [20000, 2.5]]) {
      const layer = photosphericLayer(t, lg, 0.02);
      expect(rel(layer.pGas, ((2 / 3) * 10 ** lg) / rosselandMean(layer))).toBeLessThan(1e-6);
    }
  });
});

describe('photospheres from the LTE opacity', () => {
  it('flux is conserved: ∫F_ν dν = σT_eff⁴ to 0.5% for 3000–60 000 K and log g 1–4.5, between the table nodes too (measured ≤ 0.15% on 6000 wavelengths)', () => {
    // Tolerance: the table's interpolation between nodes in T_eff and log g; the nodes themselves conserve it to 1e-9.
    for (const lg of [1.1, 2.6, 4.05, 4.5]) {
      for (const t of [3000, 7500, 9000, 10500, 12000, 20000, 31000, 45000, 60000]) {
        const p = photosphereAt(t, lg);
        let model = 0;
        let bb = 0;
        const n = 2000;
        for (let i = 0; i < n; i++) {
          const lam = 0.005 * (60 / 0.005) ** ((i + 0.5) / n);
          const b = planckShape(t, lam) / lam;
          bb += b;
          model += b * photosphereFluxRatio(p, lam);
        }
        expect(rel(model, bb)).toBeLessThan(0.005);
      }
    }
  });
  it('a cool (grey) photosphere has the formal-solution spectrum of the Eddington grey atmosphere (closed-form structure, independent quadrature)', () => {
    const t = 4500;
    const p = photosphereAt(t, 2);
    for (const lam of [0.15, 0.4, 1.0, 3.0]) {
      // ∫ B(T(τ)) 2E_2(τ) dτ by the trapezoid rule on 200 000 steps to τ = 60
      let s = 0;
      const n = 200000;
      const h = 60 / n;
      for (let i = 0; i <= n; i++) {
        const tau = i * h;
        const f = planckShape(t * (0.75 * (tau + 2 / 3)) ** 0.25, lam) * 2 * expIntegralE2(tau);
        s += (i === 0 || i === n ? 0.5 : 1) * f * h;
      }
      // Tolerance: the trapezoid's error at the E_2 kink at τ = 0 (~1e-5) and the 40-node rule (~1e-6).
      expect(rel(photosphereFluxRatio(p, lam), s / planckShape(t, lam))).toBeLessThan(1e-4);
    }
  });
  it('hot stars are brighter than a black body of their T_eff at 1300 Å, bluer than it over 1300–2600 Å, and depressed in the Lyman continuum (physics of the hydrogen continua; common practice, no source)', () => {
    for (const t of [25000, 35000, 45000]) {
      const p = photosphereAt(t, 4);
      expect(photosphereFluxRatio(p, 0.13)).toBeGreaterThan(1);
      expect(photosphereFluxRatio(p, 0.13)).toBeGreaterThan(photosphereFluxRatio(p, 0.26));
      expect(photosphereFluxRatio(p, 0.08)).toBeLessThan(1);
    }
  });
  it('computed Balmer jumps: largest (0.35–0.65 dex) between 8000 and 11 000 K, as the measured maximum of ~0.5 dex near A0 (Chalonge & Divan 1952; from memory), falling through the B stars to < 0.05 dex at 40 000 K', () => {
    // Tolerance: the measured maximum is remembered to one digit, and the model has no metal opacity.
    let best = 0;
    let at = 0;
    for (let t = 6000; t <= 20000; t += 250) {
      const d = balmerJumpDex(t, 4);
      if (d > best) [best, at] = [d, t];
    }
    expect(best).toBeGreaterThan(0.35);
    expect(best).toBeLessThan(0.65);
    expect(at).toBeGreaterThan(8000);
    expect(at).toBeLessThan(11000);
    let last = Infinity;
    for (const t of [12000, 15000, 20000, 25000, 30000, 40000]) {
      const d = balmerJumpDex(t, 4);
      expect(d).toBeLessThan(last);
      last = d;
    }
    expect(last).toBeLessThan(0.05);
  });
  it('the photosphere refuses a non-positive T_eff or a non-finite log g, naming both', () => {
    expect(() => photosphereAt(0, 4)).toThrow(/T_eff > 0 K.*log g/);
    expect(() => photosphereAt(10000, NaN)).toThrow(/log g/);
  });
});
