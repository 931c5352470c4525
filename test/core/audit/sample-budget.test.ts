import { describe, expect, it } from 'vitest';
import { PLANCK18 } from '../../../src/core/cosmology/index.js';
import { makeHaloModel, makeSurveyHalos } from '../../../src/core/halos/index.js';
import { binBudget } from '../../../src/core/audit/index.js';

const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const hm = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen' });

describe('sample-level budget', () => {
  const b = binBudget(hm, 40, 9, 10, 0.3, [
    { id: 'a', log10M: 10.5, log10MLo: 10.3, log10MHi: 10.7 },
    { id: 'b', log10M: 9.5, log10MLo: 9.3, log10MHi: 9.7 },
  ]);
  it('the volume-averaged halo abundance limit equals N(>M)/V from the survey-cone integral (same definition), to 1%', () => {
    const s = makeSurveyHalos(hm, 40, 9, 10);
    const m = 10 ** 10.5 / hm.baryonFraction;
    expect(rel(b.points[0].n_limit_eps1_mpc3, s.expected(m) / s.volumeMpc3)).toBeLessThan(0.01);
  });
  it('cumulative densities add up the members above each threshold', () => {
    expect(b.points[0].count).toBe(1);
    expect(rel(b.points[1].rho_above_msun_mpc3, (10 ** 10.5 + 10 ** 9.5) / b.volume_mpc3)).toBeLessThan(1e-12);
  });
  it('at the ε the sample requires, ε f_b ρ̄_m(>M*/(ε f_b)) equals ρ*(>M*) (independent volume average, 1%)', () => {
    const p = b.points[0];
    const e = p.eps_required_rho;
    const fb = hm.baryonFraction;
    const bg = hm.background;
    // ρ̄_m(>M) = ∫ dV/dz ρ(>M, z) dz / ∫ dV/dz dz over 9 < z < 10, by the midpoint rule on 200 steps
    const rhoBar = (m: number): number => {
      let num = 0;
      let den = 0;
      for (let i = 0; i < 200; i++) {
        const z = 9 + (i + 0.5) / 200;
        const w = bg.dVdzdOmegaMpc3(z);
        num += w * hm.rhoAbove(m, z);
        den += w;
      }
      return num / den;
    };
    expect(e).toBeGreaterThan(1e-4);
    expect(e).toBeLessThan(1e3);
    expect(rel(e * fb * rhoBar(10 ** p.log_mstar / (e * fb)), p.rho_above_msun_mpc3)).toBeLessThan(0.01);
    expect(binBudget(hm, 40, 9, 10, 0.1, [{ id: 'a', log10M: 10.5, log10MLo: 10.3, log10MHi: 10.7 }]).eps_required_rho).toBeCloseTo(e, 6);
  });
});
