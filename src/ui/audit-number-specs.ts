import { CHOICE_SPECS, type ChoiceSpec, type NumericChoiceKey } from '../core/audit/choice-specs.js';

/**
 * The choice panel's numeric audit inputs: the core's one table of choices (CHOICE_SPECS, which also
 * drives the audit's checks, the CLI flags and the record schema), with the step of each input's arrows.
 */
export interface ChoiceNumberSpec extends ChoiceSpec<NumericChoiceKey> {
  /** Step of the input's arrows. */
  readonly step?: string;
}

const STEPS: Readonly<Record<NumericChoiceKey, string>> = { epsRef: '0.05', quantile: '0.001', draws: '1000', seed: '1', sliceDz: '0.1', formationZ: '1', metallicity: '0.002' };

export const AUDIT_NUMBER_SPECS: readonly ChoiceNumberSpec[] = CHOICE_SPECS.map((s) => ({ ...s, step: STEPS[s.key] }));
