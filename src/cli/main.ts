import { CosmologyError } from '../core/cosmology/index.js';
import { CliError } from './cli-error.js';
import { runCosmo } from './commands/cosmo.js';
import { runHalos } from './commands/halos.js';
import { runRarest } from './commands/rarest.js';
import { runStars } from './commands/stars.js';
import { runMass } from './commands/mass.js';
import { runAssess } from './commands/assess.js';
import './parallel-audit.js';

/**
 * Where a command writes: one line per call; `write`, when present, writes text as it is (no line
 * break added), for an output line too long to build whole (the record's sample text).
 */
export interface LineOut {
  (line: string): void;
  write?: (text: string) => void;
}

/** A subcommand returns its output, or writes it itself through `out` (streaming) and returns undefined. */
type Command = (argv: string[], out: LineOut, err: (s: string) => void) => string | undefined | Promise<string | undefined>;

const stdoutLines: LineOut = Object.assign((s: string) => void process.stdout.write(s + '\n'), { write: (s: string) => void process.stdout.write(s) });

const COMMANDS: Record<string, Command> = {
  cosmo: runCosmo,
  halos: runHalos,
  rarest: runRarest,
  stars: runStars,
  mass: runMass,
  assess: runAssess,
};

export const MAIN_HELP = `Baryon Audit — can ΛCDM's haloes hold the stars reported in early galaxies?

Usage: npm run -s cli -- <subcommand> [flags]     (--help on any subcommand)
  cosmo    background cosmology: ages, distances, volume element
  halos    halo mass function, n(>M) and ρ(>M)
  rarest   mass distribution of the most massive halo in a survey volume
  stars    population synthesis per IMF: L_ν, surviving mass, mass-to-light
  mass     stellar mass per IMF from a magnitude or luminosity
  assess   the audit: required efficiency, verdicts and their causes for a sample`;

export function registerCommand(name: string, run: Command): void {
  COMMANDS[name] = run;
}

/** Runs one command line; returns the exit code (0 ok, 2 unusable input, 1 internal error). */
export async function main(argv: string[], out: LineOut = stdoutLines, err: (s: string) => void = (s) => process.stderr.write(s + '\n')): Promise<number> {
  const [cmd, ...rest] = argv;
  if (!cmd || cmd === '--help' || cmd === '-h' || cmd === 'help') {
    out(MAIN_HELP.replace(/\n  rarest.*$/m, (l) => l + extraHelp()));
    return cmd ? 0 : 2;
  }
  const run = COMMANDS[cmd];
  if (!run) {
    err(`error: unknown subcommand "${cmd}" (allowed: ${Object.keys(COMMANDS).join(', ')})`);
    return 2;
  }
  try {
    const text = await run(rest, out, err);
    if (text !== undefined) out(text);
    return 0;
  } catch (e) {
    if (e instanceof CliError || e instanceof CosmologyError || e instanceof RangeError) {
      err(`error: ${(e as Error).message}`);
      return 2;
    }
    err(`internal error: ${(e as Error).message}`);
    return 1;
  }
}

let extra = '';
export function addHelpLine(line: string): void {
  extra += '\n' + line;
}
function extraHelp(): string {
  return extra;
}
