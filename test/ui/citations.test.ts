import { describe, expect, it } from 'vitest';
import { MASS_FUNCTIONS } from '../../src/core/halos/index.js';
import { TRANSFER_NAMES } from '../../src/core/power/transfer.js';
import { IMF_PRESETS } from '../../src/core/stars/index.js';
import { PLANCK18, PRESETS, WMAP9 } from '../../src/core/cosmology/index.js';
import { IMF_CITATIONS, MASS_FUNCTION_CITATIONS, TRANSFER_CITATIONS, citeCosmology, citeImf, citeMassFunction, citeTransfer } from '../../src/ui/citations.js';

/** "Sheth & Tormen (1999)" → "Sheth & Tormen 1999", the spelling of the core's `source` fields. */
const plain = (cite: string): string => cite.replace(/ \((\d{4})\)$/, ' $1');

describe('citations', () => {
  it('cite every mass function of the core with the authors and year of its own source', () => {
    for (const [name, m] of Object.entries(MASS_FUNCTIONS)) {
      const c = MASS_FUNCTION_CITATIONS[name];
      expect(c, name).toBeDefined();
      expect(m.source.startsWith(plain(c)), `${name}: ${m.source} vs ${c}`).toBe(true);
    }
    expect(citeMassFunction('sheth-tormen')).toBe('Sheth & Tormen (1999)');
  });

  it('cite every named transfer function, and name a table or a power law as such', () => {
    for (const n of TRANSFER_NAMES) expect(TRANSFER_CITATIONS[n], n).toBeDefined();
    expect(citeTransfer('eh98')).toBe('Eisenstein & Hu (1998)');
    expect(citeTransfer('bbks')).toBe('Bardeen et al. (1986)');
    expect(citeTransfer('table')).toBe('a tabulated P(k)');
  });

  it('cite every IMF preset with authors and years its core source names, and describe a custom IMF by its segments', () => {
    for (const p of IMF_PRESETS) {
      const c = IMF_CITATIONS[p.name];
      expect(c, p.name).toBeDefined();
      for (const [, author, year] of c.matchAll(/([A-Z][a-z]+)(?: et al\.| & [A-Z][a-z]+)? \(?(\d{4})/g)) {
        expect(p.source, p.name).toContain(author);
        expect(p.source, p.name).toContain(year);
      }
      expect(/\d{4}/.test(c), p.name).toBe(true);
    }
    expect(citeImf('custom:0.1:1.3:0.5:2.3:100')).toBe('a custom power-law IMF (dN/dm ∝ m^−α, α = 1.3 over 0.1–0.5; α = 2.3 over 0.5–100 Msun)');
  });

  it('name a cosmology preset only when every parameter equals it', () => {
    expect(citeCosmology(PLANCK18, PRESETS)).toBe('the Planck Collaboration (2020) cosmology');
    expect(citeCosmology(WMAP9, PRESETS)).toBe('the Hinshaw et al. (2013) cosmology');
    expect(citeCosmology({ ...PLANCK18, sigma8: 0.9 }, PRESETS)).toBe('a custom cosmology');
  });
});
