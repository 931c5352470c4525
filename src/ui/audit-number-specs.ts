import type { AuditChoices } from '../core/audit/choices.js';

type NumericChoice = { [K in keyof AuditChoices]: AuditChoices[K] extends number ? K : never }[keyof AuditChoices];

/**
 * One entry per numeric audit choice, shaped like the cosmology's PARAM_SPECS: it drives the choice
 * panel's inputs, their limits (as the audit's own checks and the CLI flags) and their explanations.
 * The one place to switch when the core gains a shared table of choice specs.
 */
export interface ChoiceNumberSpec {
  readonly key: NumericChoice;
  readonly flag: string;
  readonly label: string;
  readonly unit: string;
  readonly min: number;
  readonly max: number;
  readonly doc: string;
  /** Whole numbers only. */
  readonly integer?: boolean;
  /** Step of the input's arrows. */
  readonly step?: string;
}

export const AUDIT_NUMBER_SPECS: readonly ChoiceNumberSpec[] = [
  { key: 'epsRef', flag: '--eps-ref', label: 'ε_ref', unit: '', min: 1e-4, max: 1, step: '0.05', doc: 'reference star-formation efficiency: a galaxy needing more is strained' },
  { key: 'quantile', flag: '--quantile', label: 'rarest-halo quantile', unit: '', min: 0.5, max: 0.99999, step: '0.001', doc: 'quantile of the most-massive-halo distribution used as the ceiling' },
  { key: 'draws', flag: '--draws', label: 'Monte Carlo draws', unit: '', min: 100, max: 1e6, integer: true, step: '1000', doc: 'draws per galaxy (more: steadier numbers, slower run)' },
  { key: 'seed', flag: '--seed', label: 'seed', unit: '', min: -2147483647, max: 2147483647, integer: true, step: '1', doc: 'random seed: the same seed gives the same numbers' },
  { key: 'sliceDz', flag: '--slice-dz', label: 'slice Δz', unit: '', min: 0.1, max: 5, step: '0.1', doc: 'width of the redshift slice around each galaxy in which its rarest halo is sought' },
  { key: 'formationZ', flag: '--formation-z', label: 'formation z', unit: '', min: 0.1, max: 100, step: '1', doc: 'redshift at which star formation starts, for the time budget' },
  { key: 'metallicity', flag: '--metallicity', label: 'metallicity Z', unit: 'mass fraction', min: 1e-4, max: 0.03, step: '0.002', doc: 'stellar metallicity of the population synthesis (solar ≈ 0.02)' },
];
