import { describe, expect, it } from 'vitest';
import { makeBackground, PLANCK18 } from '../../../src/core/cosmology/index.js';
import { drawGalaxy } from '../../../src/core/audit/galaxy-draws.js';

describe('the tabulated background used by the Monte Carlo', () => {
  it('gives the same luminosity as the direct integrals to 1e-6 (fixed-z draws of an m_ab row)', () => {
    const bg = makeBackground(PLANCK18);
    const g = { row: 1, id: 'T', z: 9.37, pAlt: 0, mAB: 27, lambdaObsUm: 2, log10MstarErr: 0, magErr: 0, betaErr: 0 };
    const d = drawGalaxy(g, 10, 1, bg, { z: 9.37, alt: false });
    const dl = bg.luminosityDistanceMpc(9.37) * 3.0856775814913673e24;
    const want = Math.log10((4 * Math.PI * dl * dl * 10 ** (-0.4 * (27 + 48.6))) / 10.37);
    for (let k = 0; k < d.n; k++) expect(Math.abs(d.log10Lnu[k] - want)).toBeLessThan(1e-6 / Math.LN10);
    expect(10 ** Math.max(...d.log10AgeMyr)).toBeLessThanOrEqual(bg.ageGyr(9.37) * 1e3 * (1 + 1e-6));
  });
});
