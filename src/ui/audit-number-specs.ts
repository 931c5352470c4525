import { CHOICE_SPECS, CHOICE_SWITCHES, DRAW_RULE_SPECS, type ChoiceSpec, type DrawRuleKey, type NumericChoiceKey, type SwitchSpec, type SwitchChoiceKey } from '../core/audit/choice-specs.js';

/**
 * The choice panel's audit inputs: the core's tables of choices (CHOICE_SPECS and the adaptive rule's
 * DRAW_RULE_SPECS, which also drive the audit's checks, the CLI flags and the record schema), with the
 * step of each input's arrows, and the yes/no choices of CHOICE_SWITCHES.
 */
export interface ChoiceNumberSpec extends ChoiceSpec<NumericChoiceKey | DrawRuleKey> {
  /** Step of the input's arrows. */
  readonly step?: string;
  /** Optional in a choices object: absent means the default, and the default leaves the key out. */
  readonly optional?: boolean;
}

const STEPS: Readonly<Record<NumericChoiceKey | DrawRuleKey, string>> = { epsRef: '0.05', quantile: '0.001', draws: '1000', seed: '1', sliceDz: '0.1', formationZ: '1', metallicity: '0.002', drawPrecisionDex: '0.005' };

export const AUDIT_NUMBER_SPECS: readonly ChoiceNumberSpec[] = [
  ...CHOICE_SPECS.map((s) => ({ ...s, step: STEPS[s.key] })),
  ...DRAW_RULE_SPECS.map((s) => ({ ...s, step: STEPS[s.key], optional: true })),
];

export const AUDIT_SWITCH_SPECS: readonly SwitchSpec<SwitchChoiceKey>[] = CHOICE_SWITCHES;
