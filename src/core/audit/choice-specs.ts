/**
 * The one table of the audit's numeric choices: ranges, defaults, CLI flags, labels and units.
 * It drives `validateChoices` (the core), the CLI's flags and help, the record / share-link /
 * saved-state schema, and the page's inputs. Messages name the field (`epsRef`); the CLI adds
 * its flag name.
 */
export interface ChoiceSpec<K extends string = string> {
  readonly key: K;
  /** The CLI flag, with its dashes. */
  readonly flag: string;
  readonly label: string;
  readonly unit: string;
  readonly min: number;
  readonly max: number;
  /** True: the bound itself is outside the range. */
  readonly minExclusive?: boolean;
  readonly maxExclusive?: boolean;
  readonly integer?: boolean;
  /** The default; undefined = required (no default). */
  readonly default: number | undefined;
  readonly doc: string;
}

export type NumericChoiceKey = 'epsRef' | 'quantile' | 'draws' | 'seed' | 'sliceDz' | 'formationZ' | 'metallicity';
export type SurveyNumberKey = 'areaArcmin2' | 'zMin' | 'zMax';

/** Full sky in arcmin²: 4π sr × (10800/π)² arcmin² sr⁻¹. */
export const FULL_SKY_ARCMIN2 = 148510660.5;

/**
 * Top-level numeric choices of an audit.
 * - quantile: at q < 0.5 the "ceiling" is below the median most massive halo, so it is no ceiling;
 *   above 1 − 1e-6 the halo mass reaches the top of the σ(M) table (1e19 Msun) for wide fields.
 * - formationZ: the time budget integrates the age from formationZ down to each galaxy's z.
 * - metallicity: the range of the population model's stellar tracks.
 */
export const CHOICE_SPECS: readonly ChoiceSpec<NumericChoiceKey>[] = [
  { key: 'epsRef', flag: '--eps-ref', label: 'ε_ref', unit: '', min: 1e-4, max: 1, default: 0.3, doc: 'reference star-formation efficiency: above it a galaxy is strained' },
  { key: 'quantile', flag: '--quantile', label: 'rarest-halo quantile', unit: '', min: 0.5, max: 0.999999, default: 0.997, doc: 'quantile of the most-massive-halo distribution used as the ceiling' },
  { key: 'draws', flag: '--draws', label: 'Monte Carlo draws', unit: '', min: 100, max: 1e6, integer: true, default: 20000, doc: 'Monte Carlo draws per galaxy (the most, unless --fixed-draws)' },
  { key: 'seed', flag: '--seed', label: 'seed', unit: '', min: -2147483647, max: 2147483647, integer: true, default: 1, doc: 'random seed (same seed, same numbers)' },
  { key: 'sliceDz', flag: '--slice-dz', label: 'slice Δz', unit: '', min: 0.1, max: 5, default: 1, doc: "width of the redshift slice around each galaxy" },
  { key: 'formationZ', flag: '--formation-z', label: 'formation z', unit: '', min: 1, max: 100, default: 30, doc: 'formation redshift for the time budget' },
  { key: 'metallicity', flag: '--metallicity', label: 'metallicity Z', unit: 'mass fraction', min: 1e-4, max: 0.03, default: 0.02, doc: 'stellar metallicity' },
];

/**
 * The survey's numbers. The smallest area, 1e-4 arcmin² (0.36 arcsec²), keeps the expected halo
 * counts of a slice well above the floating-point floor, so the ceiling stays finite; the largest is
 * the full sky. Redshifts: the halo and ceiling tables reach z = 30.
 */
export const SURVEY_SPECS: readonly ChoiceSpec<SurveyNumberKey>[] = [
  { key: 'areaArcmin2', flag: '--area-arcmin2', label: 'area', unit: 'arcmin²', min: 1e-4, max: FULL_SKY_ARCMIN2, default: undefined, doc: 'survey area' },
  { key: 'zMin', flag: '--z-range', label: 'z min', unit: '', min: 0, max: 30, maxExclusive: true, default: undefined, doc: 'lower end of the survey redshift range' },
  { key: 'zMax', flag: '--z-range', label: 'z max', unit: '', min: 0, max: 30, minExclusive: true, default: undefined, doc: 'upper end of the survey redshift range' },
];

/** A yes/no choice of an audit: its CLI flag (a switch, no value), label, default and doc. */
export interface SwitchSpec<K extends string = string> {
  readonly key: K;
  readonly flag: string;
  readonly label: string;
  readonly default: boolean;
  readonly doc: string;
}

export type SwitchChoiceKey = 'fixedDraws';
export type DrawRuleKey = 'drawPrecisionDex';

/**
 * Numeric choices of the adaptive Monte Carlo rule (draw-rule.ts), validated and flagged like
 * CHOICE_SPECS; optional in a choices object (absent: the default). A table of its own because the
 * page builds one input per CHOICE_SPECS entry with a step of its own per key.
 * - drawPrecisionDex: the Monte Carlo error allowed on the medians of log10 M⋆ and log10 ε_req.
 */
export const DRAW_RULE_SPECS: readonly ChoiceSpec<DrawRuleKey>[] = [
  { key: 'drawPrecisionDex', flag: '--draw-precision-dex', label: 'Monte Carlo precision', unit: 'dex', min: 0.001, max: 0.5, default: 0.03, doc: 'adaptive draws stop once the medians of log M* and log eps_req are this precise (and every verdict settled)' },
];

/**
 * The audit's yes/no choices, beside the numeric ones (same role: validation, CLI flag and help,
 * record). fixedDraws: every galaxy gets exactly `draws`; otherwise (the default) the adaptive rule of
 * draw-rule.ts stops a galaxy's draws once its verdicts and medians are settled, `draws` the most.
 */
export const CHOICE_SWITCHES: readonly SwitchSpec<SwitchChoiceKey>[] = [
  { key: 'fixedDraws', flag: '--fixed-draws', label: 'fixed draws', default: false, doc: 'every galaxy gets exactly --draws (default: adaptive, stopping once verdicts and medians are settled, --draws at most)' },
];

/** A constant collapse threshold δc (spherical collapse gives 1.686; beyond [1, 2.5] the mass functions are not calibrated). */
export const DELTA_C_SPEC: ChoiceSpec<'value'> = { key: 'value', flag: '--delta-c', label: 'δc', unit: '', min: 1, max: 2.5, default: 1.686, doc: 'collapse threshold' };

/** Redshift bins for the sample-level densities: 0 ≤ a < b ≤ 30, like the survey range. */
export const Z_BIN_SPEC: ChoiceSpec<'zBins'> = { key: 'zBins', flag: '--z-bins', label: 'z bins', unit: '', min: 0, max: 30, default: undefined, doc: 'redshift bins for the sample densities' };

export function specByKey<K extends string>(specs: readonly ChoiceSpec<K>[], key: K): ChoiceSpec<K> {
  const s = specs.find((x) => x.key === key);
  if (!s) throw new RangeError(`no choice spec "${key}"`);
  return s;
}

/** The range as text: [a, b], (a, b], … (and "whole number" when integer). */
export function rangeText(s: ChoiceSpec): string {
  const r = `${s.minExclusive ? '(' : '['}${s.min}, ${s.max}${s.maxExclusive ? ')' : ']'}`;
  return s.integer ? `a whole number in ${r}` : `in ${r}`;
}

/**
 * Why `v` is not allowed by `s`, or undefined if it is. Refuses non-numbers, NaN and ±Infinity.
 * The reason does not name the field: callers prefix the field (and the CLI its flag).
 */
export function specProblem(s: ChoiceSpec, v: unknown): string | undefined {
  if (typeof v !== 'number') return `must be a number ${rangeText(s)} (got ${v === undefined ? 'nothing' : JSON.stringify(v)})`;
  const inRange =
    Number.isFinite(v) &&
    (s.minExclusive ? v > s.min : v >= s.min) &&
    (s.maxExclusive ? v < s.max : v <= s.max) &&
    (!s.integer || Number.isInteger(v));
  return inRange ? undefined : `must be ${rangeText(s)} (got ${v})`;
}
