import { describe, expect, it } from 'vitest';
import { makeBackground, PLANCK18 } from '../../../src/core/cosmology/index.js';
import {
  apparentFromAbsolute,
  atmosphereFluxRatio,
  balmerJumpDex,
  estimateMass,
  intrinsicUvSlope,
  makePopulation,
  makePopulationCache,
  resolveImf,
  type Sfh,
} from '../../../src/core/stars/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const csf: Sfh = { kind: 'constant' };
const salpeter = (z = 0.02) => makePopulation(resolveImf('salpeter'), { metallicity: z });
const sfrPerLnu = (lam: number) => 1 / (100e6 * salpeter().lnu(csf, 100, lam));

describe('intrinsic UV slope of the population model', () => {
  it('Salpeter 0.1–100, constant SFR, 100 Myr, Z = 0.02: β in [−2.6, −2.0] (Meurer, Heckman & Calzetti 1999 take β0 = −2.23 for dust-free starbursts; population models give −2.2 to −2.5, from memory)', () => {
    const b = intrinsicUvSlope(salpeter(), csf, 100);
    expect(b).toBeGreaterThan(-2.6);
    expect(b).toBeLessThan(-2.0);
  });

  it('the slope is the least-squares slope of log L_λ on log λ: a pure power law L_ν ∝ λ^(β+2) gives β back (closed form)', () => {
    const p = salpeter();
    const fake = { ...p, phases: p.phases, lnuAt: (_: unknown, lam: number) => 3e20 * lam ** (-2.37 + 2) };
    expect(Math.abs(intrinsicUvSlope(fake, csf, 100) + 2.37)).toBeLessThan(1e-12);
  });

  it('a population with no light left (every star dead) has no slope: a RangeError that says so, not NaN', () => {
    const p = makePopulation(resolveImf('custom:50:2.35:100'));
    expect(() => intrinsicUvSlope(p, { kind: 'burst' }, 1000)).toThrow(/no UV light left at 1000 Myr/);
  });

  it('a 10 Myr constant-SFR population is bluer than a 300 Myr one (more of the UV from O stars; common practice, no source)', () => {
    const p = salpeter();
    expect(intrinsicUvSlope(p, csf, 10)).toBeLessThan(intrinsicUvSlope(p, csf, 300) - 0.2);
  });

  it('lower metallicity is bluer: Z = 0.004 and 0.001 below Z = 0.02 at 100 Myr (hotter, more compact metal-poor stars; Tout et al. 1996 ZAMS; common practice, no source)', () => {
    const b02 = intrinsicUvSlope(salpeter(0.02), csf, 100);
    const b004 = intrinsicUvSlope(salpeter(0.004), csf, 100);
    const b001 = intrinsicUvSlope(salpeter(0.001), csf, 100);
    expect(b004).toBeLessThan(b02);
    expect(b001).toBeLessThan(b004);
  });
});

describe('UV SFR calibration across the 1500–2800 Å range (Kennicutt 1998, ARA&A 36, 189: SFR = 1.4e-28 L_ν over 1500–2800 Å, Salpeter 0.1–100, constant SFR ≳ 100 Myr)', () => {
  it('1500 Å within 10% (the model’s main-sequence factors were chosen with this number in view: a calibration, not a test)', () => {
    expect(rel(sfrPerLnu(0.15), 1.4e-28)).toBeLessThan(0.1);
  });
  it('2800 Å within 20% (not used in choosing any model number: a test)', () => {
    expect(rel(sfrPerLnu(0.28), 1.4e-28)).toBeLessThan(0.2);
  });
});

describe('hot-star photospheres: hydrogen continua instead of black bodies', () => {
  it('the Balmer jump of the model photosphere equals the measured one it was solved for (balmer-jump.ts), to 0.02 dex', () => {
    for (const t of [12000, 15000, 20000, 30000]) {
      const d = Math.log10(atmosphereFluxRatio(t, 0.3647) / atmosphereFluxRatio(t, 0.3645));
      // (r_P, j) are solved on a log-T_eff grid and interpolated between nodes, hence 0.02 dex rather than exact
      expect(Math.abs(d - balmerJumpDex(t))).toBeLessThan(0.02);
    }
  });
  it('flux is conserved: ∫F_ν dν of the photosphere equals σT_eff⁴ (Stefan–Boltzmann) to 1% for 3000–60 000 K (measured: ≤ 0.6%)', () => {
    for (const t of [3000, 4500, 9000, 15000, 25000, 40000, 60000]) {
      let model = 0;
      let bb = 0;
      const n = 4000;
      for (let i = 0; i < n; i++) {
        const lam = 0.005 * (60 / 0.005) ** ((i + 0.5) / n);
        const x = 14387.77 / (lam * t);
        const b = x > 700 ? 0 : 1 / (lam ** 4 * Math.expm1(x));
        bb += b;
        model += b * atmosphereFluxRatio(t, lam);
      }
      expect(rel(model, bb)).toBeLessThan(0.01);
    }
  });
  it('hot stars are brighter than a black body of their T_eff between 1300 and 2600 Å and bluer there; the Lyman continuum is depressed (physics of the Lyman and Balmer jumps; common practice, no source)', () => {
    for (const t of [25000, 35000, 45000]) {
      expect(atmosphereFluxRatio(t, 0.13)).toBeGreaterThan(1);
      expect(atmosphereFluxRatio(t, 0.13)).toBeGreaterThan(atmosphereFluxRatio(t, 0.26));
      expect(atmosphereFluxRatio(t, 0.08)).toBeLessThan(1);
    }
  });
});

describe('M_UV and a band magnitude give the same mass for a β = −2.2 galaxy (no beta column, so no dust correction)', () => {
  // The galaxy: f_ν ∝ λ^(β+2) (definition of β), M(λ) = M_UV − 2.5 (β + 2) log10(λ/1500 Å); the mass is the
  // median over the log-uniform age prior (estimateMass). Target: 0.03 dex across 1300–2600 Å.
  const bg = makeBackground(PLANCK18);
  const cache = makePopulationCache();
  const beta = -2.2;
  const muv = -20;
  const offset = (imf: string, z: number, lamRest: number): number => {
    const ref = estimateMass(cache, imf, csf, { kind: 'absolute-uv', muv }, { kind: 'none' }, z, bg);
    const m = apparentFromAbsolute(muv - 2.5 * (beta + 2) * Math.log10(lamRest / 0.15), bg.luminosityDistanceMpc(z), z);
    const e = estimateMass(cache, imf, csf, { kind: 'apparent', mAB: m, lambdaObsUm: lamRest * (1 + z) }, { kind: 'none' }, z, bg);
    return e.log10MstarBest - ref.log10MstarBest;
  };
  for (const z of [8, 10, 12]) {
    for (const imf of ['salpeter', 'chabrier']) {
      it(`z = ${z}, ${imf}: within 0.03 dex at rest 1300–2400 Å`, () => {
        for (const lam of [0.13, 0.14, 0.16, 0.18, 0.2, 0.22, 0.24]) expect(Math.abs(offset(imf, z, lam))).toBeLessThan(0.03);
      });
    }
  }
  it('known shortfall at 2500–2600 Å: 0.03–0.04 dex (the model spectrum bends down toward the Balmer edge); guarded at 0.045 dex, z = 8–12', () => {
    for (const z of [8, 10, 12]) for (const lam of [0.25, 0.26]) expect(Math.abs(offset('salpeter', z, lam))).toBeLessThan(0.045);
  });
});
