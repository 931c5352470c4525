/**
 * The audit benchmark's sample and choices, shared by bench.ts, the profile harness and the numpy
 * comparison: n invented galaxies at 7.2 ≤ z < 10.8 with split-normal redshift errors, M_UV from −19
 * to −21.9, 0.1 mag errors and β = −2.0.
 */
import { PLANCK18 } from '../../src/core/cosmology/index.js';
import { prepareAudit, type AuditChoices } from '../../src/core/audit/index.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

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

/**
 * Choices of the near-threshold sample (adaptive-draws.test.ts and the benchmark's check of the adaptive
 * verdicts): the page's defaults with two IMFs, 20 000 draws at most, a 40 arcmin² field at 8.5 < z < 9.5.
 */
export const nearChoices = (over: Partial<AuditChoices> = {}): AuditChoices => ({
  ...DEFAULT_CHOICES,
  imfs: ['salpeter', 'chabrier'],
  draws: 20000,
  seed: 3,
  survey: { name: 'test-field', areaArcmin2: 40, zMin: 8.5, zMax: 9.5 },
  ...over,
});

export const NEAR_HEADER = 'id,z,z_lo,z_hi,log_mstar,imf_ref,log_mstar_err';
/** Offsets of the near-threshold galaxies from each threshold, dex. */
const NEAR_OFFSETS = [-0.04, -0.02, -0.01, -0.005, 0, 0.005, 0.01, 0.02, 0.04];

/**
 * 18 invented reported masses at z = 9 placed around both thresholds (ε_ref = 0.3 and 1) of the headline
 * IMF: the stellar ceiling f_b M_q(9) from the audit's own ceiling table for `c`, offsets −0.04 to +0.04 dex
 * (ids R-0…R-8 around ε_ref, O-0…O-8 around 1).
 */
export function nearThresholdSample(c: AuditChoices = nearChoices()): string {
  const probe = prepareAudit(`${NEAR_HEADER}\nP-0,9,8.9,9.1,9,salpeter,0.15\n`, c);
  const logCeil9 = Math.log10(probe.ctx.halo.baryonFraction) + probe.ctx.ceilingFor(undefined).log10HaloMassAtQuantile(9);
  const rows: string[] = [];
  for (const [t, eps] of [['R', 0.3], ['O', 1]] as const) {
    NEAR_OFFSETS.forEach((d, i) => rows.push(`${t}-${i},9,8.9,9.1,${(logCeil9 + Math.log10(eps) + d).toFixed(4)},salpeter,0.15`));
  }
  return `${NEAR_HEADER}\n${rows.join('\n')}\n`;
}
