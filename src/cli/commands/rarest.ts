import { makeHaloModel, makeSurveyHalos } from '../../core/halos/index.js';
import { COSMOLOGY_HELP, COSMOLOGY_OPTIONS, cosmologyFrom, format, num, numList, parse } from '../args.js';
import { CliError } from '../cli-error.js';
import { describeCosmology } from '../describe-cosmology.js';
import { HALO_HELP, HALO_OPTIONS, haloChoices } from '../halo-options.js';
import { toCsv, toJson } from '../output.js';

export const RAREST_HELP = `Usage: rarest --z-min 9 --z-max 11 --area-arcmin2 40 [--quantiles 0.5,0.84,0.997] [--model NAME] [--format json|csv]
Distribution of the most massive halo in a survey cone (area in arcmin^2, halos counted over
the whole redshift range): for each q, the mass [Msun] below which the most massive halo lies
with probability q (Poisson extreme-value statistics).

${HALO_HELP}

${COSMOLOGY_HELP}`;

export function runRarest(argv: string[]): string {
  const { values } = parse(argv, {
    'z-min': { type: 'string' },
    'z-max': { type: 'string' },
    'area-arcmin2': { type: 'string' },
    quantiles: { type: 'string' },
    ...HALO_OPTIONS,
    ...COSMOLOGY_OPTIONS,
  });
  if (values.help) return RAREST_HELP;
  const fmt = format(values);
  const zMin = num('z-min', values['z-min'], { min: 0, max: 100 });
  const zMax = num('z-max', values['z-max'], { gt: 0, max: 100 });
  if (!(zMax > zMin)) throw new CliError(`--z-max (${zMax}) must be greater than --z-min (${zMin})`);
  const area = num('area-arcmin2', values['area-arcmin2'], { gt: 0, max: 148510660.5 });
  const qs = numList('quantiles', values.quantiles ?? '0.5,0.84,0.997', { gt: 0, lt: 1 });
  const p = cosmologyFrom(values);
  const hm = makeHaloModel({ cosmology: p, ...haloChoices(values) });
  const sv = makeSurveyHalos(hm, area, zMin, zMax);
  const quantiles = qs.map((q) => ({ q, mass_msun: sv.quantile(q) }));
  if (fmt === 'csv') return toCsv(quantiles);
  return toJson({
    cosmology: describeCosmology(p),
    model: hm.model.name,
    transfer: hm.options.transfer.kind,
    area_arcmin2: area,
    z_min: zMin,
    z_max: zMax,
    volume_mpc3: sv.volumeMpc3,
    quantiles,
  });
}
