import { describe, expect, it } from 'vitest';
import ref from '../../fixtures/scipy/regression.json';
import { imfMass, imfMeanMass, imfNumber, makeImf, resolveImf } from '../../../src/core/stars/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe('IMF integrals against closed forms', () => {
  it('Salpeter 0.1–100: normalised to 1 Msun, mean mass = (0.35/0.65)(0.1^-0.35 − 100^-0.35)/(0.1^-0.65 − 100^-0.65)·… to 1e-8', () => {
    const imf = resolveImf('salpeter');
    // ∫ m ξ = 1; ⟨m⟩ = ∫ m^-1.35 / ∫ m^-2.35 (closed form power-law integrals).
    const num = (0.1 ** -0.35 - 100 ** -0.35) / 0.35;
    const den = (0.1 ** -1.35 - 100 ** -1.35) / 1.35;
    expect(Math.abs(imfMass(imf) - 1)).toBeLessThan(1e-12);
    expect(rel(imfMeanMass(imf), num / den)).toBeLessThan(1e-8);
    expect(rel(imfMeanMass(imf), 0.35137)).toBeLessThan(1e-4); // same closed form, 5 digits
  });

  it('Kroupa 2001 is continuous at 0.5 Msun and its moments follow the two-segment closed form to 1e-8', () => {
    const imf = resolveImf('kroupa');
    const k2 = 0.5; // continuity: A1 0.5^-1.3 = A2 0.5^-2.3 → A2 = A1 · 0.5
    const massInt = (0.5 ** 0.7 - 0.1 ** 0.7) / 0.7 + (k2 * (0.5 ** -0.3 - 100 ** -0.3)) / 0.3;
    const numInt = (0.5 ** -0.3 - 0.1 ** -0.3) / -0.3 + k2 * (0.5 ** -1.3 - 100 ** -1.3) / 1.3;
    expect(rel(imfMeanMass(imf), massInt / numInt)).toBeLessThan(1e-8);
    const m8 = (k2 * (8 ** -0.3 - 100 ** -0.3)) / 0.3 / massInt;
    expect(rel(imfMass(imf, 8), m8)).toBeLessThan(1e-8);
  });

  it('a log-normal segment integrates in closed form (erf) to the same value as dense quadrature, 1e-8', () => {
    const imf = makeImf('ln', [{ kind: 'lognormal', mLo: 0.1, mHi: 10, mc: 0.3, sigma: 0.5 }]);
    let n = 0;
    const steps = 200000;
    const a = Math.log10(0.1);
    const b = Math.log10(10);
    const h = (b - a) / steps;
    for (let i = 0; i < steps; i++) {
      const x = a + (i + 0.5) * h;
      n += Math.exp(-((x - Math.log10(0.3)) ** 2) / (2 * 0.25)) * h;
    }
    let m = 0;
    for (let i = 0; i < steps; i++) {
      const x = a + (i + 0.5) * h;
      m += 10 ** x * Math.exp(-((x - Math.log10(0.3)) ** 2) / (2 * 0.25)) * h;
    }
    expect(rel(imfMeanMass(imf), m / n)).toBeLessThan(1e-8);
  });

  it('number and mass fractions above 8 Msun and above 1 Msun match independent integrals (scipy, regression values) to 1e-3', () => {
    // Regression values from test/fixtures/scipy (scipy quad of the published forms, 0.1–100 Msun). Chabrier single
    // stars with the published amplitude 4.43e-2 differs from our continuity join (0.04410) by 0.5%, hence 1e-2
    // against it; against the continuous form of the same fixture, 1e-3.
    const s = resolveImf('salpeter');
    const ws = ref.imf.salpeter_0p1_100;
    expect(rel(imfNumber(s, 8), ws.n_above_8_per_msun)).toBeLessThan(1e-3);
    expect(rel(imfMass(s, 8), ws.mass_fraction_above_8)).toBeLessThan(1e-3);
    expect(rel(imfMass(s, 1), ws.mass_fraction_above_1)).toBeLessThan(1e-3);
    const k = resolveImf('kroupa');
    const wk = ref.imf.kroupa_0p1_100;
    expect(rel(imfNumber(k, 8), wk.n_above_8_per_msun)).toBeLessThan(1e-3);
    expect(rel(imfMass(k, 8), wk.mass_fraction_above_8)).toBeLessThan(1e-3);
    expect(rel(imfMass(k, 1), wk.mass_fraction_above_1)).toBeLessThan(1e-3);
    const c = resolveImf('chabrier');
    const wp = ref.imf.chabrier_single_0p1_100_published;
    expect(rel(imfNumber(c, 8), wp.n_above_8_per_msun)).toBeLessThan(1e-2);
    expect(rel(imfMass(c, 8), wp.mass_fraction_above_8)).toBeLessThan(1e-2);
    const wc = ref.imf.chabrier_single_0p1_100_continuous;
    expect(rel(imfNumber(c, 8), wc.n_above_8_per_msun)).toBeLessThan(1e-3);
    expect(rel(imfMass(c, 8), wc.mass_fraction_above_8)).toBeLessThan(1e-3);
    expect(rel(imfMass(c, 1), wc.mass_fraction_above_1)).toBeLessThan(1e-3);
  });

  it('the CMB-heated IMF equals Chabrier at z = 0 and grows top-heavy with redshift', () => {
    expect(rel(imfMass(resolveImf('top-heavy-cmb', 0), 8), imfMass(resolveImf('chabrier'), 8))).toBeLessThan(1e-3);
    expect(imfMass(resolveImf('top-heavy-cmb', 12), 8)).toBeGreaterThan(imfMass(resolveImf('top-heavy-cmb', 8), 8));
  });

  it('custom IMFs parse, and bad specifications name the problem', () => {
    const c = resolveImf('custom:0.1:1.3:0.5:2.3:100');
    expect(rel(imfMeanMass(c), imfMeanMass(resolveImf('kroupa')))).toBeLessThan(1e-12);
    expect(() => resolveImf('custom:0.1:x:100')).toThrow(/item 2/);
    expect(() => resolveImf('custom:0.1:2.35:400')).toThrow(/300 Msun/);
    expect(() => resolveImf('nope')).toThrow(/unknown IMF/);
  });
});
