import type { CosmologyParams } from '../cosmology/params.js';
import type { DeltaCSpec } from '../halos/collapse-threshold.js';
import type { TransferSpec } from '../power/transfer.js';
import type { Survey } from './survey.js';

/** Every choice an audit depends on; with the sample text it reproduces the numbers exactly. */
export interface AuditChoices {
  readonly cosmology: CosmologyParams;
  readonly massFunction: string;
  readonly transfer: TransferSpec;
  readonly deltaC: DeltaCSpec;
  /** IMFs compared, in order; the first is the headline IMF for rows without imf_ref. */
  readonly imfs: readonly string[];
  /** Headline IMF for rows given as light (default: the first of imfs); always compared. */
  readonly headlineImf?: string;
  /** Star-formation history, as text (see parseSfh). */
  readonly sfh: string;
  readonly metallicity: number;
  /** Reference efficiency ε_ref (strained above it). */
  readonly epsRef: number;
  /** Rarest-halo quantile q. */
  readonly quantile: number;
  readonly draws: number;
  readonly seed: number;
  /** Width of the redshift slice around each galaxy, Δz. */
  readonly sliceDz: number;
  /** Formation redshift for the time budget. */
  readonly formationZ: number;
  /** The default survey (used by rows without a `survey` cell). */
  readonly survey: Survey;
  /** Named surveys that `survey` cells refer to. */
  readonly surveys: readonly Survey[];
  /** Redshift bins for the sample-level densities; empty = the default survey's range. */
  readonly zBins: readonly (readonly [number, number])[];
}

export const DEFAULT_IMFS = ['salpeter', 'chabrier', 'kroupa', 'top-heavy-flat', 'top-heavy-cmb'] as const;

/** Rest wavelength at which a reported mass is rescaled between IMFs "at the same light", μm. */
export const RESCALE_REST_UM = 0.4;

export function validateChoices(c: AuditChoices): string[] {
  const e: string[] = [];
  if (!(c.epsRef >= 1e-4 && c.epsRef <= 1)) e.push(`--eps-ref must lie in [1e-4, 1] (got ${c.epsRef})`);
  if (!(c.quantile > 0 && c.quantile < 1)) e.push(`--quantile must lie strictly between 0 and 1 (got ${c.quantile})`);
  if (!(Number.isInteger(c.draws) && c.draws >= 100 && c.draws <= 1e6)) e.push(`--draws must be a whole number in [100, 1e6] (got ${c.draws})`);
  if (!(Number.isInteger(c.seed) && Math.abs(c.seed) < 2 ** 31)) e.push(`--seed must be a whole number with |seed| < 2^31 (got ${c.seed})`);
  if (!(c.sliceDz >= 0.1 && c.sliceDz <= 5)) e.push(`--slice-dz must lie in [0.1, 5] (got ${c.sliceDz})`);
  if (!(c.formationZ > 0 && c.formationZ <= 100)) e.push(`--formation-z must lie in (0, 100] (got ${c.formationZ})`);
  if (!c.imfs.length) e.push('--imf: at least one IMF');
  return e;
}
