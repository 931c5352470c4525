import { parseArgs } from 'node:util';
import { PARAM_SPECS, PRESETS, type CosmologyParams } from '../core/cosmology/index.js';
import { CliError } from './cli-error.js';
import { isStrictNumber } from '../core/numeric/strict-number.js';

export type OptionSpec = Record<string, { type: 'string' | 'boolean'; short?: string; multiple?: boolean }>;

export const COSMOLOGY_OPTIONS: OptionSpec = Object.fromEntries([
  ['preset', { type: 'string' }],
  ...PARAM_SPECS.map((s) => [s.flag.slice(2), { type: 'string' }] as const),
]);

export const COMMON_OPTIONS: OptionSpec = { help: { type: 'boolean', short: 'h' }, format: { type: 'string' } };

export interface Parsed {
  values: Record<string, string | boolean | undefined>;
  positionals: string[];
}

/** Joins `--flag -2.5` into `--flag=-2.5` for string options, so negative numbers need no `=`. */
function joinNegatives(argv: string[], options: OptionSpec): string[] {
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const name = a.startsWith('--') && !a.includes('=') ? a.slice(2) : undefined;
    const next = argv[i + 1];
    if (name && options[name]?.type === 'string' && next !== undefined && /^-(\d|\.\d)/.test(next)) {
      out.push(`${a}=${next}`);
      i++;
    } else out.push(a);
  }
  return out;
}

export function parse(argv: string[], options: OptionSpec, allowPositionals = false): Parsed {
  try {
    const all = { ...COMMON_OPTIONS, ...options };
    const r = parseArgs({ args: joinNegatives(argv, all), options: all, strict: true, allowPositionals });
    return { values: r.values as Parsed['values'], positionals: r.positionals };
  } catch (e) {
    // node:util's messages run over several lines; keep one line that names the flag.
    const raw = (e as Error).message;
    const flag = /'(--?[\w-]+)'/.exec(raw)?.[1];
    if (/ambiguous/.test(raw) && flag) throw new CliError(`${flag}: its value starts with "-"; write ${flag}=VALUE`);
    if (/argument missing/.test(raw) && flag) throw new CliError(`${flag} needs a value`);
    throw new CliError(raw.split('\n')[0].replace(/\. To specify a positional argument.*$/, ''));
  }
}

/** A strictly parsed finite number: no trailing text, no thousands separators, no NaN/Infinity. */
export function num(flag: string, raw: string | boolean | undefined, opts: { min?: number; max?: number; gt?: number; lt?: number } = {}): number {
  if (typeof raw !== 'string' || raw.trim() === '') throw new CliError(`--${flag} needs a number`);
  const s = raw.trim();
  if (!isStrictNumber(s)) throw new CliError(`--${flag}: "${raw}" is not a number`);
  const v = Number(s);
  if (!Number.isFinite(v)) throw new CliError(`--${flag}: ${raw} is out of the floating-point range`);
  if (opts.min !== undefined && v < opts.min) throw new CliError(`--${flag} must be ≥ ${opts.min} (got ${raw})`);
  if (opts.max !== undefined && v > opts.max) throw new CliError(`--${flag} must be ≤ ${opts.max} (got ${raw})`);
  if (opts.gt !== undefined && !(v > opts.gt)) throw new CliError(`--${flag} must be > ${opts.gt} (got ${raw})`);
  if (opts.lt !== undefined && !(v < opts.lt)) throw new CliError(`--${flag} must be < ${opts.lt} (got ${raw})`);
  return v;
}

export function numList(flag: string, raw: string | boolean | undefined, opts: Parameters<typeof num>[2] = {}): number[] {
  if (typeof raw !== 'string' || raw.trim() === '') throw new CliError(`--${flag} needs a comma-separated list of numbers`);
  return raw.split(',').map((part, i) => {
    try {
      return num(flag, part, opts);
    } catch (e) {
      throw new CliError(`${(e as Error).message} (item ${i + 1} of --${flag})`);
    }
  });
}

/** `A:B:N` → N log-spaced values from A to B inclusive; a plain list is also accepted. */
export function logRange(flag: string, raw: string | boolean | undefined): number[] {
  if (typeof raw !== 'string') throw new CliError(`--${flag} needs A:B:N (N log-spaced values from A to B) or a list`);
  if (!raw.includes(':')) return numList(flag, raw, { gt: 0 });
  const parts = raw.split(':');
  if (parts.length !== 3) throw new CliError(`--${flag}: "${raw}" must be A:B:N`);
  const a = num(flag, parts[0], { gt: 0 });
  const b = num(flag, parts[1], { gt: 0 });
  const n = num(flag, parts[2], { min: 1, max: 100000 });
  if (!Number.isInteger(n)) throw new CliError(`--${flag}: N = ${parts[2]} must be a whole number`);
  if (n > 1 && !(b > a)) throw new CliError(`--${flag}: need A < B (got ${parts[0]}:${parts[1]})`);
  if (n === 1) return [a];
  return Array.from({ length: n }, (_, i) => 10 ** (Math.log10(a) + ((Math.log10(b) - Math.log10(a)) * i) / (n - 1)));
}

export function choice<T extends string>(flag: string, raw: string | boolean | undefined, allowed: readonly T[], fallback: T): T {
  if (raw === undefined) return fallback;
  if (typeof raw !== 'string' || !(allowed as readonly string[]).includes(raw)) {
    throw new CliError(`--${flag}: "${String(raw)}" is not one of ${allowed.join(', ')}`);
  }
  return raw as T;
}

export function format(values: Parsed['values'], allowed: readonly string[] = ['json', 'csv']): string {
  return choice('format', values.format, allowed, 'json');
}

/** Preset plus overrides; the result is validated by the core (messages name the flag). */
export function cosmologyFrom(values: Parsed['values']): CosmologyParams {
  const presetName = values.preset === undefined ? 'planck18' : String(values.preset);
  const preset = PRESETS[presetName];
  if (!preset) throw new CliError(`--preset: "${presetName}" is not one of ${Object.keys(PRESETS).join(', ')}`);
  const p: Record<string, number> = { ...preset };
  for (const spec of PARAM_SPECS) {
    const raw = values[spec.flag.slice(2)];
    if (raw !== undefined) p[spec.key] = num(spec.flag.slice(2), raw);
  }
  return p as unknown as CosmologyParams;
}

export const COSMOLOGY_HELP = `Cosmology (every subcommand):
  --preset planck18|wmap9   parameter preset (default planck18)
${PARAM_SPECS.map((s) => `  ${(s.flag + ' X').padEnd(24)}${s.doc}${s.unit ? ' [' + s.unit + ']' : ''}`).join('\n')}`;
