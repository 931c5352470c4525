import { resolveImf } from './imf-presets.js';
import { makeMassToLightTable, type MassToLightTable } from './mass-to-light.js';
import { makePopulation, type Population } from './population.js';
import type { Sfh } from './sfh.js';

/**
 * Populations and mass-to-light tables, built once per (IMF, redshift bucket, metallicity) and
 * (…, SFH). The CMB-heated IMF depends on z; it is evaluated at z rounded to 0.5 (its characteristic mass changes by ≲ 10% per 0.5 in z at z ≈ 10).
 */
export interface PopulationCache {
  population(imfName: string, z: number): Population;
  table(imfName: string, z: number, sfh: Sfh): MassToLightTable;
}

export function makePopulationCache(metallicity = 0.02): PopulationCache {
  const pops = new Map<string, Population>();
  const tabs = new Map<string, MassToLightTable>();
  const zKey = (name: string, z: number): string => (name === 'top-heavy-cmb' ? `${name}@${(Math.round(z * 2) / 2).toFixed(1)}` : name);
  const population = (name: string, z: number): Population => {
    const k = zKey(name, z);
    let p = pops.get(k);
    if (!p) {
      p = makePopulation(resolveImf(name, Math.round(z * 2) / 2), { metallicity });
      pops.set(k, p);
    }
    return p;
  };
  return {
    population,
    table: (name, z, sfh) => {
      const k = `${zKey(name, z)}|${JSON.stringify(sfh)}`;
      let t = tabs.get(k);
      if (!t) {
        t = makeMassToLightTable(population(name, z), sfh);
        tabs.set(k, t);
      }
      return t;
    },
  };
}
