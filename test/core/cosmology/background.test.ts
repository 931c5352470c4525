import { describe, expect, it } from 'vitest';
import fixture from '../../fixtures/astropy/background.json';
import { makeBackground, PLANCK18, validateCosmology, WMAP9, type CosmologyParams } from '../../../src/core/cosmology/index.js';

const base = { sigma8: 0.8, ns: 0.96 };
const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe('background against astropy (independent implementation, test/fixtures/astropy)', () => {
  for (const c of fixture.cases) {
    const bg = makeBackground({ ...base, ...c.params } as CosmologyParams);
    it(`${c.name}: ages, distances and volumes agree with astropy ${fixture.meta.version} to 1e-4 relative`, () => {
      // Tolerance 1e-4: the project's accuracy target for the background; both sides integrate to ~1e-8.
      for (const r of c.rows) {
        expect(rel(bg.ageGyr(r.z), r.age_gyr)).toBeLessThan(1e-4);
        if (r.z > 0) {
          expect(rel(bg.lookbackGyr(r.z), r.lookback_gyr)).toBeLessThan(1e-4);
          expect(rel(bg.comovingDistanceMpc(r.z), r.comoving_distance_mpc)).toBeLessThan(1e-4);
          expect(rel(bg.transverseComovingDistanceMpc(r.z), r.transverse_comoving_distance_mpc)).toBeLessThan(1e-4);
          expect(rel(bg.luminosityDistanceMpc(r.z), r.luminosity_distance_mpc)).toBeLessThan(1e-4);
          expect(rel(bg.angularDiameterDistanceMpc(r.z), r.angular_diameter_distance_mpc)).toBeLessThan(1e-4);
          expect(rel(bg.dVdzdOmegaMpc3(r.z), r.dvdz_mpc3_per_sr)).toBeLessThan(1e-4);
          expect(rel(bg.comovingVolumeMpc3(r.z), r.comoving_volume_mpc3)).toBeLessThan(1e-4);
        }
      }
    });
  }
});

describe('background: published values and closed forms', () => {
  it('Planck 2018 preset gives the Table 2 age 13.787 Gyr (A&A 641, A6) within 0.01 Gyr', () => {
    // Tolerance 0.01 Gyr: the published 1σ is 0.020 Gyr; our preset counts the 0.06 eV neutrino as matter
    // and all N_eff species as radiation, a ~1e-4 approximation of the full treatment.
    expect(Math.abs(makeBackground(PLANCK18).ageGyr(0) - 13.787)).toBeLessThan(0.01);
  });

  it('Planck-like universe is 0.47–0.50 Gyr old at z = 10 and 0.37–0.38 Myr old at z = 1090 (common practice, no source)', () => {
    const bg = makeBackground(PLANCK18);
    expect(bg.ageGyr(10)).toBeGreaterThan(0.47);
    expect(bg.ageGyr(10)).toBeLessThan(0.5);
    expect(bg.ageGyr(1090) * 1e3).toBeGreaterThan(0.37);
    expect(bg.ageGyr(1090) * 1e3).toBeLessThan(0.38);
  });

  it('WMAP9 preset age is within 0.02 Gyr of the published 13.772 ± 0.059 Gyr (Hinshaw et al. 2013, Table 4)', () => {
    expect(Math.abs(makeBackground(WMAP9).ageGyr(0) - 13.772)).toBeLessThan(0.02);
  });

  it('flat ΛCDM without radiation matches the closed-form age (2 t_H / 3√Ω_Λ) asinh(√(Ω_Λ/Ω_m)(1+z)^-1.5) to 1e-9', () => {
    const p: CosmologyParams = { ...PLANCK18, h0: 70, omegaM: 0.3, omegaB: 0.045, tcmbK: 0, nEff: 0 };
    const bg = makeBackground(p);
    for (const z of [0, 1, 6, 10, 50]) {
      const exact = ((2 * bg.hubbleTimeGyr) / (3 * Math.sqrt(0.7))) * Math.asinh(Math.sqrt(0.7 / 0.3) * (1 + z) ** -1.5);
      expect(rel(bg.ageGyr(z), exact)).toBeLessThan(1e-9);
    }
  });

  it('Einstein–de Sitter: D_C = 2 D_H (1 − (1+z)^-1/2) and t = (2/3) t_H (1+z)^-3/2 to 1e-9 (closed form)', () => {
    const bg = makeBackground({ ...PLANCK18, h0: 70, omegaM: 1, omegaB: 0.05, tcmbK: 0, nEff: 0 });
    for (const z of [0.5, 3, 10]) {
      expect(rel(bg.comovingDistanceMpc(z), 2 * bg.hubbleDistanceMpc * (1 - (1 + z) ** -0.5))).toBeLessThan(1e-9);
      expect(rel(bg.ageGyr(z), (2 / 3) * bg.hubbleTimeGyr * (1 + z) ** -1.5)).toBeLessThan(1e-9);
    }
  });

  it('open Λ = 0 universe matches the Mattig relation for D_M to 1e-9 (closed form)', () => {
    const om = 0.3;
    const bg = makeBackground({ ...PLANCK18, h0: 70, omegaM: om, omegaB: 0.04, omegaK: 0.7, tcmbK: 0, nEff: 0 });
    for (const z of [1, 3]) {
      const mattig = (2 * bg.hubbleDistanceMpc * (2 - om * (1 - z) - (2 - om) * Math.sqrt(1 + om * z))) / (om * om * (1 + z));
      expect(rel(bg.transverseComovingDistanceMpc(z), mattig)).toBeLessThan(1e-9);
    }
  });

  it('survey volume of a thin shell equals Ω · dV/dz/dΩ · Δz (Hogg 1999 eq. 28) to 1e-6', () => {
    const bg = makeBackground(PLANCK18);
    const area = 40;
    const omega = area * (Math.PI / 10800) ** 2;
    const v = bg.surveyVolumeMpc3(area, 9.9995, 10.0005);
    expect(rel(v, omega * bg.dVdzdOmegaMpc3(10) * 0.001)).toBeLessThan(1e-6);
  });

  it('refuses parameters with E(z)² ≤ 0 in the past (no hot big bang), Ωb > Ωm, σ8 ≤ 0 and NaN, naming each', () => {
    const bad = (p: Partial<CosmologyParams>) => validateCosmology({ ...PLANCK18, ...p }).map((x) => x.message).join(' | ');
    expect(bad({ omegaM: 0.05, omegaB: 0.01, omegaK: -0.5 })).toMatch(/E\(z\)² .* ≤ 0 at z = /);
    expect(bad({ omegaB: 0.5, omegaM: 0.3 })).toMatch(/--omega-b/);
    expect(bad({ sigma8: 0 })).toMatch(/--sigma8/);
    expect(bad({ h0: Number.NaN })).toMatch(/--h0.*finite/);
    expect(() => makeBackground({ ...PLANCK18, omegaM: 0.05, omegaB: 0.01, omegaK: -0.5 })).toThrow(/no hot big bang/);
  });

  it('refuses a negative redshift with a message naming it', () => {
    const bg = makeBackground(PLANCK18);
    expect(() => bg.ageGyr(-1)).toThrow(/redshift/);
  });
});
