import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';

async function run(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await main(args, (s) => (out += s + '\n'), (s) => (err += s + '\n'));
  return { code, out, err };
}

const junk = fc.oneof(
  fc.string({ maxLength: 12 }),
  fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e400', '-1e400', '', ' ', '0', '-0', '1,5', '1_000', '0x10', '1e-400', '-1', '1e9', ':', '1:2', '1:2:3', 'a,b', '--', '-5'),
  fc.double().map(String),
);

const COSMO = ['--preset', '--h0', '--omega-m', '--omega-b', '--omega-k', '--tcmb', '--neff', '--w0', '--wa', '--sigma8', '--ns'];
const HALO = ['--model', '--transfer', '--pk-file', '--delta-c'];
const STAR = ['--imf', '--sfh', '--metallicity'];
// Every flag of every subcommand (the cosmology flags everywhere), each with hostile values.
const SUBCOMMANDS: Record<string, { base: string[]; flags: string[] }> = {
  cosmo: { base: ['--z', '1'], flags: ['--z', '--format', ...COSMO] },
  halos: { base: ['--z', '8', '--mass', '1e10:1e12:3'], flags: ['--z', '--mass', '--format', ...HALO, ...COSMO] },
  rarest: { base: ['--z-min', '9', '--z-max', '10', '--area-arcmin2', '40'], flags: ['--z-min', '--z-max', '--area-arcmin2', '--quantiles', '--format', ...HALO, ...COSMO] },
  stars: { base: ['--imf', 'salpeter'], flags: ['--list-imfs', '--age-myr', '--wavelength-um', '--z', '--format', ...STAR, ...COSMO] },
  mass: { base: ['--z', '9', '--muv', '-21', '--imf', 'salpeter'], flags: ['--z', '--m-ab', '--lambda-obs-um', '--muv', '--lnu', '--lambda-rest-um', '--beta', '--av', '--format', ...STAR, ...COSMO] },
  assess: {
    base: ['--demo', '--draws', '200', '--imf', 'salpeter'],
    flags: ['--record', '--area-arcmin2', '--z-range', '--survey-name', '--surveys', '--headline-imf', '--eps-ref', '--quantile', '--draws', '--seed', '--slice-dz', '--formation-z', '--z-bins', '--jobs', '--max-input-mb', '--format', ...STAR, ...HALO, ...COSMO],
  },
};

describe('every CLI flag with hostile values, property-based', () => {
  for (const [cmd, spec] of Object.entries(SUBCOMMANDS)) {
    it(`${cmd}: exit 0 or 2 (never a crash), one error line naming a flag, no NaN or Infinity in the output`, async () => {
      await fc.assert(
        fc.asyncProperty(fc.constantFrom(...spec.flags), junk, async (flag, value) => {
          if (flag === '--jobs' && /^\d/.test(value) && Number(value) > 1) value = '1'; // threads need the bundled CLI
          const r = await run([cmd, ...spec.base, flag, value]);
          expect([0, 2]).toContain(r.code);
          if (r.code === 2) {
            expect(r.err.trim().split('\n')).toHaveLength(1);
            expect(r.err).toMatch(/^error: /);
            expect(r.err).not.toMatch(/\n\s+at /);
          } else {
            expect(r.out).not.toMatch(/\bNaN\b|Infinity/);
          }
        }),
        { numRuns: Number(process.env.CLI_PROP_RUNS ?? (cmd === "assess" ? 25 : 60)) },
      );
    }, 120000);
  }
});
