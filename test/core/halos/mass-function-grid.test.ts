import { describe, expect, it } from 'vitest';
import { PLANCK18 } from '../../../src/core/cosmology/index.js';
import { makeHaloModel, MASS_FUNCTION_NAMES } from '../../../src/core/halos/index.js';
import { GRID_DZ, lnMassFunctionGrid } from '../../../src/core/halos/mass-function-grid.js';

// The shared (z, log10 M) table of ln dn/dlnM against the halo model's own per-point mass function,
// which it replaces in the Eddington priors (the per-point one is checked against scipy in
// mass-function.test.ts). Bound: 1e-4 in ln dn/dlnM, the accuracy asked of the table (it moves an
// Eddington shift by ≤ 1e-4 × σ²-scale terms, far below the shift's own 1e-6 σ integration error
// budget at σ ≤ 0.6 dex; imf-statistics.test.ts bounds the shift itself).
describe('lnMassFunctionGrid: cubic reads of the shared table equal the direct ln dn/dlnM', () => {
  for (const mf of MASS_FUNCTION_NAMES) {
    it(`${mf}: 0.1 ≤ z ≤ 20, 1e7–1e15 Msun, off-node points where ln dn/dlnM > −650: |Δ ln dn/dlnM| ≤ 1e-4`, () => {
      const halo = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: mf, deltaC: { kind: 'constant', value: 1.686 } });
      const grid = lnMassFunctionGrid(halo);
      let worst = 0;
      let checked = 0;
      // irrational-ish steps so the points fall everywhere between nodes
      for (let z = 0.1; z <= 20; z += 0.3137) {
        for (let lg = 7; lg <= 15; lg += 0.0731) {
          const want = Math.log(halo.dndlnM(10 ** lg, z));
          // below e^−650 dn/dlnM nears the subnormal doubles (e^−708), where its own ln loses digits
          if (!(want > -650)) continue;
          const got = grid.at(z, lg);
          worst = Math.max(worst, Math.abs(got - want));
          checked++;
        }
      }
      expect(checked).toBeGreaterThan(5000);
      expect(worst).toBeLessThan(1e-4);
    });
  }
  it('on a node the read is the node itself (the weights are 0, 1, 0, 0); below z = GRID_DZ and past the σ table it is the direct value', () => {
    const halo = makeHaloModel({ cosmology: PLANCK18, transfer: { kind: 'eh98' }, massFunction: 'sheth-tormen', deltaC: { kind: 'constant', value: 1.686 } });
    const grid = lnMassFunctionGrid(halo);
    const lo = halo.table.log10M[0];
    const z = 30 * GRID_DZ;
    const lg = lo + 500 * 0.01;
    expect(Math.abs(grid.at(z, lg) - Math.log(halo.dndlnM(10 ** lg, z)))).toBeLessThan(1e-12);
    expect(grid.at(0.5 * GRID_DZ, 11.3)).toBe(Math.log(halo.dndlnM(10 ** 11.3, 0.5 * GRID_DZ)));
    const top = halo.table.log10M[halo.table.log10M.length - 1] - 0.005;
    expect(grid.at(8, top)).toBe(Math.log(halo.dndlnM(10 ** top, 8)));
  });
});
