import { makeHaloModel } from '../../core/halos/index.js';
import { COSMOLOGY_HELP, COSMOLOGY_OPTIONS, cosmologyFrom, format, logRange, numList, parse } from '../args.js';
import { describeCosmology } from '../describe-cosmology.js';
import { HALO_HELP, HALO_OPTIONS, haloChoices } from '../halo-options.js';
import { toCsv, toJson } from '../output.js';
import { CliError } from '../cli-error.js';

export const HALOS_HELP = `Usage: halos --z 0,10 --mass 1e8:1e15:29 [--model NAME] [--transfer NAME] [--format json|csv]
Halo abundance per redshift and mass: σ(M, z), dn/dlog10M [Mpc^-3], n(>M) [Mpc^-3] and
ρ(>M) [Msun Mpc^-3], all comoving, masses in Msun (no h). --mass A:B:N gives N log-spaced
masses from A to B inclusive; a comma list also works.

${HALO_HELP}

${COSMOLOGY_HELP}`;

export function runHalos(argv: string[]): string {
  const { values } = parse(argv, { z: { type: 'string' }, mass: { type: 'string' }, ...HALO_OPTIONS, ...COSMOLOGY_OPTIONS });
  if (values.help) return HALOS_HELP;
  const fmt = format(values);
  const zs = numList('z', values.z, { min: 0, max: 200 });
  const masses = logRange('mass', values.mass ?? '1e8:1e15:29');
  for (const m of masses) if (m < 1e2 || m > 1e19) throw new CliError(`--mass: ${m.toExponential(3)} Msun is outside 1e2–1e19 Msun`);
  const p = cosmologyFrom(values);
  const hm = makeHaloModel({ cosmology: p, ...haloChoices(values) });
  const rows = zs.flatMap((z) => {
    const s = hm.slice(z);
    return masses.map((m) => ({
      z,
      mass_msun: m,
      sigma: hm.sigma(m, z),
      dndlog10m_mpc3: s.dndlnM(m) * Math.LN10,
      n_above_mpc3: s.nAbove(m),
      rho_above_msun_mpc3: s.rhoAbove(m),
    }));
  });
  if (fmt === 'csv') return toCsv(rows);
  return toJson({ cosmology: describeCosmology(p), model: hm.model.name, model_source: hm.model.source, transfer: hm.options.transfer.kind, rows });
}
