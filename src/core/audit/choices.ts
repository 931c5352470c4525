import type { GrowthModel } from '../cosmology/growth.js';
import type { ParamCovariance } from '../cosmology/parameter-covariance.js';
import type { CosmologyParams } from '../cosmology/params.js';
import type { DeltaCSpec } from '../halos/collapse-threshold.js';
import type { TransferSpec } from '../power/transfer.js';
import { checkChoices, problemText } from './choice-schema.js';
import type { Survey } from './survey.js';

/** Every choice an audit depends on; with the sample text it reproduces the numbers exactly. */
export interface AuditChoices {
  readonly cosmology: CosmologyParams;
  readonly massFunction: string;
  readonly transfer: TransferSpec;
  readonly deltaC: DeltaCSpec;
  /** IMFs compared, in order. */
  readonly imfs: readonly string[];
  /**
   * The headline IMF for rows without imf_ref (default: the first of `imfs`); it is always compared
   * (normalizeChoices adds it to `imfs` when missing).
   */
  readonly headlineImf?: string;
  /** Growth factor: `matter-lambda` (default, radiation left out) or `with-radiation`. */
  readonly growth?: GrowthModel;
  /** Covariance of the base cosmological parameters for the ceiling's spread (default: the preset's 1σ errors). */
  readonly cosmologyCovariance?: ParamCovariance;
  /** Star-formation history, as text (see parseSfh). */
  readonly sfh: string;
  readonly metallicity: number;
  /** Reference efficiency ε_ref (strained above it). */
  readonly epsRef: number;
  /** Rarest-halo quantile q. */
  readonly quantile: number;
  /** Monte Carlo draws per galaxy: the most under the adaptive rule (draw-rule.ts), or all of them with fixedDraws. */
  readonly draws: number;
  /** Every galaxy gets exactly `draws` (default false: the adaptive rule). */
  readonly fixedDraws?: boolean;
  /** The adaptive rule's precision on the medians of log10 M⋆ and log10 ε_req, dex (default DRAW_RULE_SPECS). */
  readonly drawPrecisionDex?: number;
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

/** Every problem with the choices as "field: reason" lines (the schema of choice-schema.ts). */
export function validateChoices(c: AuditChoices): string[] {
  return problemText(checkChoices(c));
}

/** The choices with headlineImf set (default: the first of imfs) and always among the compared IMFs. */
export function normalizeChoices(c: AuditChoices): AuditChoices & { readonly headlineImf: string } {
  const headlineImf = c.headlineImf ?? c.imfs[0];
  const imfs = c.imfs.includes(headlineImf) ? c.imfs : [headlineImf, ...c.imfs];
  return { ...c, imfs, headlineImf };
}
