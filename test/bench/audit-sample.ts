/**
 * The audit benchmark's sample and choices, shared by bench.ts, the profile harness and the numpy
 * comparison: n invented galaxies at 7.2 ≤ z < 10.8 with split-normal redshift errors, M_UV from −19
 * to −21.9, 0.1 mag errors and β = −2.0.
 */
import { PLANCK18 } from '../../src/core/cosmology/index.js';
import type { AuditChoices } from '../../src/core/audit/index.js';

export const BENCH_IMFS = ['salpeter', 'chabrier', 'kroupa', 'top-heavy-flat'];

export const benchChoices: AuditChoices = {
  cosmology: PLANCK18, massFunction: 'sheth-tormen', transfer: { kind: 'eh98' }, deltaC: { kind: 'constant', value: 1.686 },
  imfs: BENCH_IMFS, sfh: 'constant', metallicity: 0.02, epsRef: 0.3, quantile: 0.997,
  draws: 20000, seed: 1, sliceDz: 1, formationZ: 30, survey: { name: 'bench', areaArcmin2: 40, zMin: 7, zMax: 11 }, surveys: [], zBins: [],
};

export function sample(n: number): string {
  const lines = ['id,z,z_lo,z_hi,muv,mag_err,beta'];
  for (let i = 0; i < n; i++) {
    const z = 7.2 + (3.6 * i) / n;
    lines.push(`B-${i},${z.toFixed(3)},${(z - 0.2).toFixed(3)},${(z + 0.25).toFixed(3)},${(-19 - (i % 30) / 10).toFixed(2)},0.1,-2.0`);
  }
  return lines.join('\n');
}
