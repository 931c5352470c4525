import { CHOICE_SPECS, CHOICE_SWITCHES, DRAW_RULE_SPECS, SURVEY_SPECS, specProblem, type ChoiceSpec } from '../core/audit/index.js';
import { num, type OptionSpec, type Parsed } from './args.js';
import { CliError } from './cli-error.js';

/** The audit's numeric flags, from the core's table of choices. */
export const CHOICE_OPTIONS: OptionSpec = Object.fromEntries([
  ...CHOICE_SPECS.filter((s) => s.flag !== '--metallicity').map((s) => [s.flag.slice(2), { type: 'string' }] as const),
  ...DRAW_RULE_SPECS.map((s) => [s.flag.slice(2), { type: 'string' }] as const),
  ...CHOICE_SWITCHES.map((s) => [s.flag.slice(2), { type: 'boolean' }] as const),
]);

/** Every yes/no audit choice from its switch (given: true; absent: its default). */
export function switchChoices(values: Parsed['values']): Record<(typeof CHOICE_SWITCHES)[number]['key'], boolean> {
  return Object.fromEntries(CHOICE_SWITCHES.map((s) => [s.key, values[s.flag.slice(2)] === true ? true : s.default])) as never;
}

/** A flag's value checked against its spec; the message names the flag and the field. */
export function specFlag(spec: ChoiceSpec, raw: string | boolean | undefined, flag = spec.flag): number {
  const v = raw === undefined && spec.default !== undefined ? spec.default : num(flag.slice(2), raw);
  const p = specProblem(spec, v);
  if (p) throw new CliError(`${flag} (${spec.key}) ${p}`);
  return v;
}

/** Every numeric audit choice from its flag (or its default). */
export function numericChoices(values: Parsed['values']): Record<(typeof CHOICE_SPECS)[number]['key'] | (typeof DRAW_RULE_SPECS)[number]['key'], number> {
  return Object.fromEntries([...CHOICE_SPECS, ...DRAW_RULE_SPECS].map((s) => [s.key, specFlag(s, values[s.flag.slice(2)])])) as never;
}

/** The flag that sets a choice field (for messages about a whole choices object). */
export function flagOfField(field: string): string | undefined {
  const top = field.split(/[.[]/)[0];
  const s = CHOICE_SPECS.find((x) => x.key === top) ?? DRAW_RULE_SPECS.find((x) => x.key === top) ?? CHOICE_SWITCHES.find((x) => x.key === top);
  if (s) return s.flag;
  if (field.startsWith('survey.')) return SURVEY_SPECS.find((x) => x.key === field.slice(7))?.flag;
  const other: Record<string, string> = { imfs: '--imf', headlineImf: '--headline-imf', sfh: '--sfh', massFunction: '--model', transfer: '--transfer', deltaC: '--delta-c', zBins: '--z-bins', surveys: '--surveys', cosmology: '--preset', growth: '--growth', cosmologyCovariance: '--cosmo-cov' };
  return other[top];
}

export const CHOICE_HELP = [...CHOICE_SPECS, ...DRAW_RULE_SPECS].filter((s) => s.flag !== '--metallicity')
  .map((s) => `  ${(s.flag + ' X').padEnd(21)}${s.doc}${s.unit ? ' [' + s.unit + ']' : ''}, ${s.integer ? 'whole number ' : ''}${s.minExclusive ? '(' : '['}${s.min}, ${s.max}${s.maxExclusive ? ')' : ']'} (default ${s.default})`)
  .concat(CHOICE_SWITCHES.map((s) => `  ${s.flag.padEnd(21)}${s.doc}`))
  .join('\n');
