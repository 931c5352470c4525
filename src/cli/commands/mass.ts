import { makeBackground } from '../../core/cosmology/index.js';
import { estimateMass, makePopulationCache, type Brightness, type DustSpec } from '../../core/stars/index.js';
import { COSMOLOGY_HELP, COSMOLOGY_OPTIONS, cosmologyFrom, format, num, parse } from '../args.js';
import { CliError } from '../cli-error.js';
import { describeCosmology } from '../describe-cosmology.js';
import { toCsv, toJson } from '../output.js';
import { imfList, sfhFrom, STAR_HELP, STAR_OPTIONS } from '../star-options.js';

export const MASS_CAUTION =
  'Stellar masses depend on the assumed IMF, star-formation history, dust and redshift; this estimate complements, not replaces, full spectral fitting and spectroscopic confirmation.';

export const MASS_HELP = `Usage: mass --z 9.1 (--m-ab 26.2 --lambda-obs-um 1.5 | --muv -21.3 | --lnu L --lambda-rest-um λ)
            [--beta -2.0 | --av 0.3] [--imf A,B,...] [--sfh constant] [--format json|csv]
Stellar mass (stars + remnants, Msun) per IMF from one brightness: the median over a log-uniform
age prior from 1 Myr to the cosmic age at z (log_mstar_median_age_prior; a prior median, not a
best fit) and the range over all allowed ages.
M_UV is taken at rest 1500 Å. Dust: --beta uses A1600 = 4.43 + 1.99β (Meurer et al. 1999),
--av uses A_V; both carried to the band with the Calzetti et al. (2000) curve.

${STAR_HELP}

${COSMOLOGY_HELP}`;

export function runMass(argv: string[]): string {
  const { values } = parse(argv, {
    z: { type: 'string' },
    'm-ab': { type: 'string' },
    'lambda-obs-um': { type: 'string' },
    muv: { type: 'string' },
    lnu: { type: 'string' },
    'lambda-rest-um': { type: 'string' },
    beta: { type: 'string' },
    av: { type: 'string' },
    ...STAR_OPTIONS,
    ...COSMOLOGY_OPTIONS,
  });
  if (values.help) return MASS_HELP;
  const fmt = format(values);
  const z = num('z', values.z, { gt: 0, max: 30 });
  const given = ['m-ab', 'muv', 'lnu'].filter((k) => values[k] !== undefined);
  if (given.length !== 1) throw new CliError(`give exactly one brightness: --m-ab (with --lambda-obs-um), --muv, or --lnu (with --lambda-rest-um)${given.length ? ` (got ${given.map((g) => '--' + g).join(' and ')})` : ''}`);
  let brightness: Brightness;
  if (values['m-ab'] !== undefined) {
    if (values['lambda-obs-um'] === undefined) throw new CliError('--m-ab needs --lambda-obs-um (observed band wavelength in μm)');
    brightness = { kind: 'apparent', mAB: num('m-ab', values['m-ab'], { min: -10, max: 50 }), lambdaObsUm: num('lambda-obs-um', values['lambda-obs-um'], { gt: 0, max: 30 }) };
  } else if (values.muv !== undefined) {
    brightness = { kind: 'absolute-uv', muv: num('muv', values.muv, { min: -30, max: 0 }) };
  } else {
    if (values['lambda-rest-um'] === undefined) throw new CliError('--lnu needs --lambda-rest-um (rest wavelength in μm)');
    brightness = { kind: 'luminosity', lnuErgSHz: num('lnu', values.lnu, { gt: 0 }), lambdaRestUm: num('lambda-rest-um', values['lambda-rest-um'], { min: 0.1216, max: 1 }) };
  }
  if (values.beta !== undefined && values.av !== undefined) throw new CliError('give --beta or --av, not both');
  if (values['lambda-obs-um'] !== undefined && brightness.kind !== 'apparent') throw new CliError('--lambda-obs-um goes with --m-ab only');
  if (values['lambda-rest-um'] !== undefined && brightness.kind !== 'luminosity') throw new CliError('--lambda-rest-um goes with --lnu only');
  const dust: DustSpec = values.beta !== undefined ? { kind: 'beta', beta: num('beta', values.beta, { min: -4, max: 4 }) } : values.av !== undefined ? { kind: 'av', av: num('av', values.av, { min: 0, max: 10 }) } : { kind: 'none' };
  const names = imfList(values, ['salpeter', 'kroupa', 'chabrier', 'top-heavy-flat', 'top-heavy-cmb']);
  const sfh = sfhFrom(values);
  const p = cosmologyFrom(values);
  const bg = makeBackground(p);
  const cache = makePopulationCache(num('metallicity', values.metallicity ?? '0.02', { min: 1e-4, max: 0.03 }));
  const rows = names.map((imf) => {
    const e = estimateMass(cache, imf, sfh, brightness, dust, z, bg);
    return { imf, log_mstar_median_age_prior: e.log10MstarBest, log_mstar_min: e.log10MstarMin, log_mstar_max: e.log10MstarMax, age_at_min_myr: e.ageMinMyr, age_at_max_myr: e.ageMaxMyr };
  });
  if (fmt === 'csv') return toCsv(rows);
  const inputs: Record<string, unknown> = { z, sfh: typeof values.sfh === 'string' ? values.sfh : 'constant' };
  if (brightness.kind === 'apparent') Object.assign(inputs, { m_ab: brightness.mAB, lambda_obs_um: brightness.lambdaObsUm });
  else if (brightness.kind === 'absolute-uv') inputs.muv = brightness.muv;
  else Object.assign(inputs, { lnu: brightness.lnuErgSHz, lambda_rest_um: brightness.lambdaRestUm });
  if (dust.kind === 'beta') inputs.beta = dust.beta;
  if (dust.kind === 'av') inputs.av = dust.av;
  return toJson({
    inputs,
    cosmology: describeCosmology(p),
    max_population_age_myr: bg.ageGyr(z) * 1e3,
    rows,
    caution: MASS_CAUTION,
  });
}
