/**
 * How figure captions cite the methods behind a figure, as a paper would: one table for the mass functions,
 * the transfer functions, the IMFs and the cosmology presets (names as the core spells them), each to its
 * in-text citation. The core's `source` fields give journal, volume and page.
 */

export const MASS_FUNCTION_CITATIONS: Readonly<Record<string, string>> = Object.freeze({
  'press-schechter': 'Press & Schechter (1974)',
  'sheth-tormen': 'Sheth & Tormen (1999)',
  tinker08: 'Tinker et al. (2008)',
  reed07: 'Reed et al. (2007)',
  jenkins01: 'Jenkins et al. (2001)',
});

export const TRANSFER_CITATIONS: Readonly<Record<string, string>> = Object.freeze({
  eh98: 'Eisenstein & Hu (1998)',
  'eh98-nowiggle': 'Eisenstein & Hu (1998, no-wiggle form)',
  bbks: 'Bardeen et al. (1986)',
});

export const IMF_CITATIONS: Readonly<Record<string, string>> = Object.freeze({
  salpeter: 'Salpeter (1955)',
  kroupa: 'Kroupa (2001)',
  chabrier: 'Chabrier (2003)',
  'top-heavy-flat': 'flat top-heavy (Baugh et al. 2005)',
  'top-heavy-cmb': 'CMB-heated (after Chabrier 2003 and Jermyn et al. 2018)',
});

export const COSMOLOGY_CITATIONS: Readonly<Record<string, string>> = Object.freeze({
  planck18: 'Planck Collaboration (2020)',
  wmap9: 'Hinshaw et al. (2013)',
});

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
