import { makeBackground } from '../../core/cosmology/index.js';
import { currentSfrPerMassFormed, IMF_PRESETS, intrinsicUvSlope, makePopulationCache } from '../../core/stars/index.js';
import { COSMOLOGY_HELP, COSMOLOGY_OPTIONS, cosmologyFrom, format, num, parse } from '../args.js';
import { CliError } from '../cli-error.js';
import { toCsv, toJson } from '../output.js';
import { imfList, sfhFrom, STAR_HELP, STAR_OPTIONS } from '../star-options.js';

export const STARS_HELP = `Usage: stars --imf salpeter,chabrier --sfh constant --age-myr 100 --wavelength-um 0.15 [--z Z] [--format json|csv]
       stars --list-imfs [--format json|csv]
Population synthesis per IMF: L_ν per Msun formed [erg/s/Hz], surviving fraction (stars +
remnants), returned fraction, mass-to-light [surviving Msun per erg/s/Hz] and, for constant SFR,
SFR/L_ν [Msun/yr per erg/s/Hz], at any rest wavelength from 0.1 to 1 μm (intrinsic light, before
dust and the intergalactic medium), and beta_uv, the intrinsic UV slope (least-squares slope of
log L_λ against log λ over 1300–2600 Å). --z sets the redshift for the CMB-heated IMF and caps
the age at the cosmic age there.

${STAR_HELP}

${COSMOLOGY_HELP}`;

function uvSlope(imf: string, f: () => number): number {
  try {
    return f();
  } catch (e) {
    throw new CliError(`--imf ${imf}: ${(e as Error).message}`);
  }
}

export function runStars(argv: string[]): string {
  const { values } = parse(argv, {
    'list-imfs': { type: 'boolean' },
    'age-myr': { type: 'string' },
    'wavelength-um': { type: 'string' },
    z: { type: 'string' },
    ...STAR_OPTIONS,
    ...COSMOLOGY_OPTIONS,
  });
  if (values.help) return STARS_HELP;
  const fmt = format(values);
  if (values['list-imfs']) {
    const imfs = IMF_PRESETS.map((p) => ({ name: p.name, top_heavy: p.topHeavy, source: p.source }));
    return fmt === 'csv' ? toCsv(imfs) : toJson({ imfs });
  }
  const names = imfList(values, ['salpeter', 'kroupa', 'chabrier']);
  const sfh = sfhFrom(values);
  const age = num('age-myr', values['age-myr'] ?? '100', { min: 1, max: 14000 });
  const lam = num('wavelength-um', values['wavelength-um'] ?? '0.15', { min: 0.1, max: 1 });
  const z = values.z === undefined ? undefined : num('z', values.z, { min: 0, max: 30 });
  if (z !== undefined) {
    const tMax = makeBackground(cosmologyFrom(values)).ageGyr(z) * 1e3;
    if (age > tMax) throw new CliError(`--age-myr ${age} exceeds the age of the universe at z = ${z} (${tMax.toFixed(1)} Myr)`);
  }
  const met = num('metallicity', values.metallicity ?? '0.02', { min: 1e-4, max: 0.03 });
  const cache = makePopulationCache(met);
  const rows = names.map((imf) => {
    const pop = cache.population(imf, z ?? 0);
    const lnu = pop.lnu(sfh, age, lam);
    if (!(lnu > 0)) throw new CliError(`--imf ${imf}: no light left at ${lam} μm after ${age} Myr (every star has died); use a younger --age-myr or an IMF with lower masses`);
    const surv = pop.survivingFraction(sfh, age);
    return {
      imf,
      sfh: typeof values.sfh === 'string' ? values.sfh : 'constant',
      age_myr: age,
      wavelength_um: lam,
      lnu_per_msun_formed: lnu,
      surviving_fraction: surv,
      returned_fraction: 1 - surv,
      mass_to_light: surv / lnu,
      sfr_per_lnu: sfh.kind === 'constant' ? currentSfrPerMassFormed(sfh, age) / lnu : null,
      beta_uv: uvSlope(imf, () => intrinsicUvSlope(pop, sfh, age)),
    };
  });
  return fmt === 'csv' ? toCsv(rows) : toJson({ metallicity: met, ...(z !== undefined ? { z } : {}), rows });
}
