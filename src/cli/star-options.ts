import { IMF_NAMES, parseSfh, resolveImf, type Sfh } from '../core/stars/index.js';
import type { OptionSpec, Parsed } from './args.js';
import { CliError } from './cli-error.js';

export const STAR_OPTIONS: OptionSpec = {
  imf: { type: 'string' },
  sfh: { type: 'string' },
  metallicity: { type: 'string' },
};

export const STAR_HELP = `Stellar population:
  --imf A,B,...       IMFs: ${IMF_NAMES.join(', ')}, or custom:m0:α1:m1[:α2:m2...]
                      (power-law slopes of dN/dm ∝ m^-α between masses in Msun, ≤ 300 Msun)
  --sfh NAME          burst, constant, exp-declining[:τ_Myr], exp-rising[:τ_Myr],
                      piecewise:age0:sfr0:age1:sfr1... (SFR at lookback ages in Myr) (default constant)
  --metallicity Z     stellar metallicity, mass fraction (default 0.02)`;

export function imfList(values: Parsed['values'], fallback: readonly string[]): string[] {
  const raw = values.imf;
  const names = typeof raw === 'string' ? raw.split(',').map((s) => s.trim()).filter(Boolean) : [...fallback];
  if (!names.length) throw new CliError('--imf needs at least one IMF name');
  for (const n of names) {
    try {
      resolveImf(n, 0);
    } catch (e) {
      throw new CliError(`--imf: ${(e as Error).message}`);
    }
  }
  return names;
}

export function sfhFrom(values: Parsed['values']): Sfh {
  try {
    return parseSfh(typeof values.sfh === 'string' ? values.sfh : 'constant');
  } catch (e) {
    throw new CliError(`--sfh: ${(e as Error).message}`);
  }
}
