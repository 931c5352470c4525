/**
 * How figure captions cite the methods behind a figure, as a paper would: one table for the mass functions,
 * the transfer functions, the IMFs and the cosmology presets (names as the core spells them). `cite` is the
 * short in-text form; `ref` the reference-list form (authors, year, journal, volume, first page).
 */
export interface Citation {
  readonly cite: string;
  readonly ref: string;
}

const c = (cite: string, ref: string): Citation => ({ cite, ref });

export const MASS_FUNCTION_CITATIONS: Readonly<Record<string, Citation>> = Object.freeze({
  'press-schechter': c('Press & Schechter (1974)', 'Press W. H., Schechter P., 1974, ApJ, 187, 425'),
  'sheth-tormen': c('Sheth & Tormen (1999)', 'Sheth R. K., Tormen G., 1999, MNRAS, 308, 119'),
  tinker08: c('Tinker et al. (2008)', 'Tinker J. et al., 2008, ApJ, 688, 709'),
  reed07: c('Reed et al. (2007)', 'Reed D. S. et al., 2007, MNRAS, 374, 2'),
  jenkins01: c('Jenkins et al. (2001)', 'Jenkins A. et al., 2001, MNRAS, 321, 372'),
});

export const TRANSFER_CITATIONS: Readonly<Record<string, Citation>> = Object.freeze({
  eh98: c('Eisenstein & Hu (1998)', 'Eisenstein D. J., Hu W., 1998, ApJ, 496, 605'),
  'eh98-nowiggle': c('Eisenstein & Hu (1998, no-wiggle form)', 'Eisenstein D. J., Hu W., 1998, ApJ, 496, 605'),
  bbks: c('Bardeen et al. (1986)', 'Bardeen J. M., Bond J. R., Kaiser N., Szalay A. S., 1986, ApJ, 304, 15'),
});

export const IMF_CITATIONS: Readonly<Record<string, Citation>> = Object.freeze({
  salpeter: c('Salpeter (1955)', 'Salpeter E. E., 1955, ApJ, 121, 161'),
  kroupa: c('Kroupa (2001)', 'Kroupa P., 2001, MNRAS, 322, 231'),
  chabrier: c('Chabrier (2003)', 'Chabrier G., 2003, PASP, 115, 763'),
  'top-heavy-flat': c('flat top-heavy (Baugh et al. 2005)', 'Baugh C. M. et al., 2005, MNRAS, 356, 1191'),
  'top-heavy-cmb': c('CMB-heated (after Chabrier 2003 and Jermyn et al. 2018)', 'Jermyn A. S., Steinhardt C. L., Tout C. A., 2018, MNRAS, 480, 4265'),
});

export const COSMOLOGY_CITATIONS: Readonly<Record<string, Citation>> = Object.freeze({
  planck18: c('Planck Collaboration (2020)', 'Planck Collaboration, 2020, A&A, 641, A6'),
  wmap9: c('Hinshaw et al. (2013)', 'Hinshaw G. et al., 2013, ApJS, 208, 19'),
});

/** In-text citation of a mass function. */
export function citeMassFunction(name: string): string {
  return MASS_FUNCTION_CITATIONS[name]?.cite ?? name;
}

/** In-text citation of a transfer function (a user table or power law is named as such). */
export function citeTransfer(kind: string): string {
  if (kind === 'table') return 'a tabulated P(k)';
  if (kind === 'power-law') return 'a power-law P(k)';
  return TRANSFER_CITATIONS[kind]?.cite ?? kind;
}

/** In-text citation of an IMF; a custom one is described by its segments (masses in Msun). */
export function citeImf(name: string): string {
  if (name.startsWith('custom:')) {
    const p = name.slice(7).split(':');
    const seg: string[] = [];
    for (let i = 1; i + 1 < p.length; i += 2) seg.push(`α = ${p[i]} over ${p[i - 1]}–${p[i + 1]}`);
    return `a custom power-law IMF (dN/dm ∝ m^−α, ${seg.join('; ')} Msun)`;
  }
  return IMF_CITATIONS[name]?.cite ?? name;
}

/**
 * In-text citation of a cosmology: the preset it equals (every parameter), or "a custom cosmology".
 * `presets` is the core's PRESETS table (passed in so this module stays a plain table).
 */
export function citeCosmology(params: object, presets: Readonly<Record<string, object>>): string {
  const same = (a: object, b: object): boolean => Object.keys(b).every((k) => (a as Record<string, unknown>)[k] === (b as Record<string, unknown>)[k]);
  for (const [name, p] of Object.entries(presets)) if (same(params, p) && COSMOLOGY_CITATIONS[name]) return `the ${COSMOLOGY_CITATIONS[name].cite} cosmology`;
  return 'a custom cosmology';
}
