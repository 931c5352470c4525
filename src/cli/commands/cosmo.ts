import { makeBackground } from '../../core/cosmology/index.js';
import { COSMOLOGY_HELP, COSMOLOGY_OPTIONS, cosmologyFrom, format, numList, parse } from '../args.js';
import { describeCosmology } from '../describe-cosmology.js';
import { toCsv, toJson } from '../output.js';

export const COSMO_HELP = `Usage: cosmo --z 0,1,10 [--format json|csv] [cosmology flags]
Background quantities at each redshift: age and lookback time [Gyr], comoving, luminosity and
angular-diameter distances [Mpc], comoving volume element dV/dz/dΩ [Mpc^3/sr].

${COSMOLOGY_HELP}`;

export function runCosmo(argv: string[]): string {
  const { values } = parse(argv, { z: { type: 'string' }, ...COSMOLOGY_OPTIONS });
  if (values.help) return COSMO_HELP;
  const fmt = format(values);
  const zs = numList('z', values.z, { min: 0, max: 1e6 });
  const p = cosmologyFrom(values);
  const bg = makeBackground(p);
  const rows = zs.map((z) => ({
    z,
    age_gyr: bg.ageGyr(z),
    lookback_gyr: bg.lookbackGyr(z),
    comoving_distance_mpc: bg.comovingDistanceMpc(z),
    luminosity_distance_mpc: bg.luminosityDistanceMpc(z),
    angular_diameter_distance_mpc: bg.angularDiameterDistanceMpc(z),
    dvdz_mpc3_per_sr: bg.dVdzdOmegaMpc3(z),
  }));
  return fmt === 'csv' ? toCsv(rows) : toJson({ cosmology: describeCosmology(p), rows });
}
