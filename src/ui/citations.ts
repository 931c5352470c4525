/**
 * How figure captions cite the methods behind a figure, as a paper would: one table for the mass functions,
 * the transfer functions, the IMFs and the cosmology presets (names as the core spells them), each to its
 * in-text citation, taken from the core's one citation table (src/core/audit/citations.ts, which the
 * Markdown report also uses, with journal, volume and page for its reference list).
 */
import { CITATIONS } from '../core/audit/citations.js';

const pick = (names: readonly string[]): Readonly<Record<string, string>> => Object.freeze(Object.fromEntries(names.map((n) => [n, CITATIONS[n].inText])));

export const MASS_FUNCTION_CITATIONS = pick(['press-schechter', 'sheth-tormen', 'tinker08', 'reed07', 'jenkins01']);
export const TRANSFER_CITATIONS = pick(['eh98', 'eh98-nowiggle', 'bbks']);
export const IMF_CITATIONS = pick(['salpeter', 'kroupa', 'chabrier', 'top-heavy-flat', 'top-heavy-cmb']);
export const COSMOLOGY_CITATIONS = pick(['planck18', 'wmap9']);

/** In-text citation of a mass function. */
export function citeMassFunction(name: string): string {
  return MASS_FUNCTION_CITATIONS[name] ?? name;
}

/** In-text citation of a transfer function (a user table or power law is named as such). */
export function citeTransfer(kind: string): string {
  if (kind === 'table') return 'a tabulated P(k)';
  if (kind === 'power-law') return 'a power-law P(k)';
  return TRANSFER_CITATIONS[kind] ?? kind;
}

/** In-text citation of an IMF; a custom one is described by its segments (masses in Msun). */
export function citeImf(name: string): string {
  if (name.startsWith('custom:')) {
    const p = name.slice(7).split(':');
    const seg: string[] = [];
    for (let i = 1; i + 1 < p.length; i += 2) seg.push(`α = ${p[i]} over ${p[i - 1]}–${p[i + 1]}`);
    return `a custom power-law IMF (dN/dm ∝ m^−α, ${seg.join('; ')} Msun)`;
  }
  return IMF_CITATIONS[name] ?? name;
}

/**
 * In-text citation of a cosmology: the preset it equals (every parameter), or "a custom cosmology".
 * `presets` is the core's PRESETS table (passed in so this module stays a plain table).
 */
export function citeCosmology(params: object, presets: Readonly<Record<string, object>>): string {
  const same = (a: object, b: object): boolean => Object.keys(b).every((k) => (a as Record<string, unknown>)[k] === (b as Record<string, unknown>)[k]);
  for (const [name, p] of Object.entries(presets)) if (same(params, p) && COSMOLOGY_CITATIONS[name]) return `the ${COSMOLOGY_CITATIONS[name]} cosmology`;
  return 'a custom cosmology';
}
