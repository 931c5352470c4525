import type { AuditChoices } from './choices.js';

/** One published method the audit uses: how a paper cites it in the text, and the reference entry. */
export interface Citation {
  readonly inText: string;
  readonly reference: string;
}

/**
 * Mass functions, transfer functions, IMFs and the audit's own ingredients, by the names the tool uses.
 * Journal volumes and pages are the papers' standard citations (from memory where the project's
 * reference sheet does not list them).
 */
export const CITATIONS: Readonly<Record<string, Citation>> = {
  'press-schechter': { inText: 'Press & Schechter (1974)', reference: 'Press, W. H., & Schechter, P. 1974, ApJ, 187, 425' },
  'sheth-tormen': { inText: 'Sheth & Tormen (1999)', reference: 'Sheth, R. K., & Tormen, G. 1999, MNRAS, 308, 119' },
  tinker08: { inText: 'Tinker et al. (2008)', reference: 'Tinker, J., et al. 2008, ApJ, 688, 709' },
  reed07: { inText: 'Reed et al. (2007)', reference: 'Reed, D. S., et al. 2007, MNRAS, 374, 2' },
  jenkins01: { inText: 'Jenkins et al. (2001)', reference: 'Jenkins, A., et al. 2001, MNRAS, 321, 372' },
  eh98: { inText: 'Eisenstein & Hu (1998)', reference: 'Eisenstein, D. J., & Hu, W. 1998, ApJ, 496, 605' },
  'eh98-nowiggle': { inText: 'Eisenstein & Hu (1998, no-wiggle form)', reference: 'Eisenstein, D. J., & Hu, W. 1998, ApJ, 496, 605' },
  bbks: { inText: 'Bardeen et al. (1986)', reference: 'Bardeen, J. M., Bond, J. R., Kaiser, N., & Szalay, A. S. 1986, ApJ, 304, 15' },
  table: { inText: 'a tabulated P(k) supplied by the user', reference: '' },
  salpeter: { inText: 'Salpeter (1955)', reference: 'Salpeter, E. E. 1955, ApJ, 121, 161' },
  kroupa: { inText: 'Kroupa (2001)', reference: 'Kroupa, P. 2001, MNRAS, 322, 231' },
  chabrier: { inText: 'Chabrier (2003)', reference: 'Chabrier, G. 2003, PASP, 115, 763' },
  'top-heavy-flat': { inText: 'a flat top-heavy IMF after Baugh et al. (2005)', reference: 'Baugh, C. M., et al. 2005, MNRAS, 356, 1191' },
  'top-heavy-cmb': { inText: 'a CMB-heated IMF after Larson (1998) and Jermyn et al. (2018)', reference: 'Larson, R. B. 1998, MNRAS, 301, 569; Jermyn, A. S., et al. 2018, MNRAS, 480, 4265' },
  planck18: { inText: 'Planck Collaboration (2020)', reference: 'Planck Collaboration 2020, A&A, 641, A6' },
  wmap9: { inText: 'Hinshaw et al. (2013)', reference: 'Hinshaw, G., et al. 2013, ApJS, 208, 19' },
  evs: { inText: 'Harrison & Coles (2011)', reference: 'Harrison, I., & Coles, P. 2011, MNRAS, 418, L20' },
  accretion: { inText: 'Fakhouri, Ma & Boylan-Kolchin (2010)', reference: 'Fakhouri, O., Ma, C.-P., & Boylan-Kolchin, M. 2010, MNRAS, 406, 2267' },
  'cosmic-variance': { inText: 'Trenti & Stiavelli (2008)', reference: 'Trenti, M., & Stiavelli, M. 2008, ApJ, 676, 767' },
  eddington: { inText: 'Eddington (1913)', reference: 'Eddington, A. S. 1913, MNRAS, 73, 359' },
  'dust-beta': { inText: 'Meurer, Heckman & Calzetti (1999)', reference: 'Meurer, G. R., Heckman, T. M., & Calzetti, D. 1999, ApJ, 521, 64' },
  'dust-curve': { inText: 'Calzetti et al. (2000)', reference: 'Calzetti, D., et al. 2000, ApJ, 533, 682' },
  lifetimes: { inText: 'Hurley, Pols & Tout (2000)', reference: 'Hurley, J. R., Pols, O. R., & Tout, C. A. 2000, MNRAS, 315, 543' },
  zams: { inText: 'Tout et al. (1996)', reference: 'Tout, C. A., Pols, O. R., Eggleton, P. P., & Han, Z. 1996, MNRAS, 281, 257' },
};

/** In-text citation for a tool name (a custom IMF or unknown name is described as given). */
export function citeInText(name: string): string {
  return CITATIONS[name]?.inText ?? (name.startsWith('custom:') ? `a custom IMF (${name})` : name);
}

/** The reference list an audit's report should end with, in alphabetical order, without repeats. */
export function referencesFor(c: AuditChoices, cosmologyPreset?: string): string[] {
  const keys = [c.massFunction, c.transfer.kind, ...c.imfs, 'evs', 'accretion', 'cosmic-variance', 'eddington', 'dust-beta', 'dust-curve', 'lifetimes', 'zams'];
  if (cosmologyPreset) keys.push(cosmologyPreset);
  const refs = keys.flatMap((k) => (CITATIONS[k]?.reference ? CITATIONS[k].reference.split('; ') : []));
  return [...new Set(refs)].sort((a, b) => a.localeCompare(b));
}
