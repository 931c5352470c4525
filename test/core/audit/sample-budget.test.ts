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
  ], 0.997);
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
    expect(binBudget(hm, 40, 9, 10, 0.1, [{ id: 'a', log10M: 10.5, log10MLo: 10.3, log10MHi: 10.7 }], 0.997).eps_required_rho).toBeCloseTo(e, 6);
  });

  it('Poisson terms of each cumulative point: μ = V n̄_h(>M⋆_k/f_b), P(N ≥ k) = P(k, μ) (closed forms for k = 1, 2)', () => {
    const [p1, p2] = b.points;
    const fb = hm.baryonFraction;
    const s1 = makeSurveyHalos(hm, 40, 9, 10);
    // the expected number of hosts is the survey-cone count itself (same definition), 1%
    expect(rel(p1.expected_hosts_eps1, s1.expected(10 ** 10.5 / fb))).toBeLessThan(0.01);
    expect(rel(p2.expected_hosts_eps1, s1.expected(10 ** 9.5 / fb))).toBeLessThan(0.01);
    // k = 1: 1 − e^−μ; k = 2: 1 − e^−μ (1 + μ) (closed forms)
    expect(rel(p1.p_chance_eps1, 1 - Math.exp(-p1.expected_hosts_eps1))).toBeLessThan(1e-12);
    const mu2 = p2.expected_hosts_eps1;
    expect(rel(p2.p_chance_eps1, 1 - Math.exp(-mu2) * (1 + mu2))).toBeLessThan(1e-9);
  });
  it('eps_required_q: at that ε, P(N ≥ k) = 1 − q for the k most massive (k = 1: N = −ln q, the per-galaxy criterion)', () => {
    const q = 0.997;
    const fb = hm.baryonFraction;
    const s1 = makeSurveyHalos(hm, 40, 9, 10);
    const [p1, p2] = b.points;
    // k = 1: expected hosts above M*/(ε f_b) equal −ln q (Φ = e^−N = q), 1% (survey-cone integral vs bin average)
    expect(rel(s1.expected(10 ** p1.log_mstar / (p1.eps_required_q * fb)), -Math.log(q))).toBeLessThan(0.01);
    // k = 2: 1 − e^−μ(1 + μ) = 1 − q at μ = expected hosts above M*_2/(ε f_b)
    const mu = s1.expected(10 ** p2.log_mstar / (p2.eps_required_q * fb));
    expect(Math.abs(1 - Math.exp(-mu) * (1 + mu) - (1 - q))).toBeLessThan(0.01 * (1 - q));
    expect(b.eps_required_q).toBe(Math.max(p1.eps_required_q, p2.eps_required_q));
  });
});

describe('sample-level budget: the bin nodes are kept between calls', () => {
  const members = [
    { id: 'a', log10M: 10.5, log10MLo: 10.3, log10MHi: 10.7 },
    { id: 'b', log10M: 9.5, log10MLo: 9.3, log10MHi: 9.7 },
  ];
  // Each call below on its own halo model (nothing kept) is the reference: a kept bin must give the same numbers bit for bit.
  const fresh = (area: number, z0: number, z1: number) => binBudget(makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen' }), area, z0, z1, 0.3, members, 0.997);
  it('a second call, and calls for another area or bin in between, give what a fresh model gives', () => {
    const kept = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen' });
    const first = binBudget(kept, 40, 9, 10, 0.3, members, 0.997);
    const other = binBudget(kept, 400, 9, 10, 0.3, members, 0.997);
    const otherBin = binBudget(kept, 40, 8, 10, 0.3, members, 0.997);
    expect(binBudget(kept, 40, 9, 10, 0.3, members, 0.997)).toEqual(first);
    expect(first).toEqual(fresh(40, 9, 10));
    expect(other).toEqual(fresh(400, 9, 10));
    expect(otherBin).toEqual(fresh(40, 8, 10));
    expect(other.volume_mpc3).toBeCloseTo(10 * first.volume_mpc3, 6); // the area enters: ten times the field, ten times the volume
  });
});
