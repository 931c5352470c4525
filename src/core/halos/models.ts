import { jenkins01 } from './jenkins01.js';
import type { MultiplicityModel } from './multiplicity.js';
import { pressSchechter } from './press-schechter.js';
import { reed07 } from './reed07.js';
import { shethTormen } from './sheth-tormen.js';
import { tinker08 } from './tinker08.js';

export const MASS_FUNCTIONS: Readonly<Record<string, MultiplicityModel>> = Object.freeze({
  'press-schechter': pressSchechter,
  'sheth-tormen': shethTormen,
  tinker08,
  reed07,
  jenkins01,
});

export const MASS_FUNCTION_NAMES = Object.keys(MASS_FUNCTIONS);

export function massFunctionByName(name: string): MultiplicityModel {
  const m = MASS_FUNCTIONS[name];
  if (!m) throw new RangeError(`unknown mass function "${name}" (allowed: ${MASS_FUNCTION_NAMES.join(', ')})`);
  return m;
}
