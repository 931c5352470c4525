import { DEFAULT_GROWTH_MODEL, GROWTH_MODELS, type GrowthModel } from '../core/cosmology/index.js';
import { MASS_FUNCTION_NAMES } from '../core/halos/index.js';
import type { DeltaCSpec } from '../core/halos/index.js';
import { parsePowerTable, TRANSFER_NAMES, type TransferSpec } from '../core/power/index.js';
import { DELTA_C_SPEC } from '../core/audit/choice-specs.js';
import { choice, num, type OptionSpec, type Parsed } from './args.js';
import { CliError } from './cli-error.js';
import { INPUT_HELP, INPUT_OPTIONS, inputLimitBytes, readInput } from './read-input.js';

export const HALO_OPTIONS: OptionSpec = {
  model: { type: 'string' },
  transfer: { type: 'string' },
  'pk-file': { type: 'string' },
  'delta-c': { type: 'string' },
  growth: { type: 'string' },
  ...INPUT_OPTIONS,
};

export const HALO_HELP = `Halo abundance:
  --model NAME        mass function: ${MASS_FUNCTION_NAMES.join(', ')} (default sheth-tormen)
  --transfer NAME     ${TRANSFER_NAMES.join(', ')}, or table (needs --pk-file) (default eh98)
  --pk-file FILE      tabulated P(k) at z = 0: two columns, k [1/Mpc] and P [Mpc^3]
  --delta-c X|omega-m collapse threshold in [1, 2.5] (default 1.686; omega-m = 1.686[1+0.0123 log10 Ωm(z)])
  --growth NAME       linear growth: ${GROWTH_MODELS.join(' (default, radiation left out, the usual convention) or ')} (photons and
                      massless neutrinos in H(z))
${INPUT_HELP}`;

export function haloChoices(values: Parsed['values']): { massFunction: string; transfer: TransferSpec; deltaC: DeltaCSpec; growth?: GrowthModel } {
  const massFunction = choice('model', values.model, MASS_FUNCTION_NAMES, 'sheth-tormen');
  const tName = choice('transfer', values.transfer, [...TRANSFER_NAMES, 'table'] as const, values['pk-file'] ? 'table' : 'eh98');
  let transfer: TransferSpec;
  if (tName === 'table') {
    const file = values['pk-file'];
    if (typeof file !== 'string') throw new CliError('--transfer table needs --pk-file FILE');
    const text = readInput(file, '--pk-file', inputLimitBytes(values));
    try {
      transfer = { kind: 'table', ...parsePowerTable(text, `--pk-file ${file}`) };
    } catch (e) {
      throw new CliError((e as Error).message);
    }
  } else {
    transfer = { kind: tName };
  }
  const dcRaw = values['delta-c'];
  const deltaC: DeltaCSpec = dcRaw === 'omega-m' ? { kind: 'omega-m' } : { kind: 'constant', value: dcRaw === undefined ? 1.686 : num('delta-c', dcRaw, { min: DELTA_C_SPEC.min, max: DELTA_C_SPEC.max }) };
  const growth = values.growth === undefined ? undefined : choice('growth', values.growth, GROWTH_MODELS, DEFAULT_GROWTH_MODEL);
  return { massFunction, transfer, deltaC, ...(growth !== undefined ? { growth } : {}) };
}
