import { closeSync, openSync, readSync } from 'node:fs';
import { decodeText } from '../core/audit/text-decoding.js';
import { num, type OptionSpec, type Parsed } from './args.js';
import { CliError } from './cli-error.js';

/** Input files are read up to this size unless --max-input-mb raises it (a file of 10⁶ sample rows is ~60 MB). */
export const DEFAULT_MAX_INPUT_MB = 200;

export const INPUT_OPTIONS: OptionSpec = { 'max-input-mb': { type: 'string' } };
export const INPUT_HELP = `  --max-input-mb N     largest input file read, in MB (default ${DEFAULT_MAX_INPUT_MB}; at most 2000)`;

/** The byte limit from --max-input-mb (or the default). */
export function inputLimitBytes(values: Parsed['values']): number {
  const mb = values['max-input-mb'] === undefined ? DEFAULT_MAX_INPUT_MB : num('max-input-mb', values['max-input-mb'], { gt: 0, max: 2000 });
  return Math.floor(mb * 1e6);
}

/**
 * Reads a file as text, in chunks, stopping one byte past `maxBytes` (so /dev/zero or a FIFO
 * cannot grow without bound), and decodes it (UTF-8, or UTF-16 with a BOM; see decodeText).
 * Problems are CliErrors (exit 2) naming the flag and the file.
 */
export function readInput(path: string, flag: string, maxBytes: number): string {
  let fd: number;
  try {
    fd = openSync(path, 'r');
  } catch (e) {
    throw new CliError(`${flag}: cannot read ${path} (${(e as NodeJS.ErrnoException).code ?? 'error'})`);
  }
  const chunks: Buffer[] = [];
  let total = 0;
  try {
    const chunk = 1 << 20;
    for (;;) {
      const buf = Buffer.allocUnsafe(Math.min(chunk, maxBytes + 1 - total));
      const got = readSync(fd, buf, 0, buf.length, null);
      if (got === 0) break;
      chunks.push(got === buf.length ? buf : buf.subarray(0, got));
      total += got;
      if (total > maxBytes) throw new CliError(`${flag}: ${path} is larger than the input limit of ${maxBytes / 1e6} MB; raise it with --max-input-mb`);
    }
  } catch (e) {
    if (e instanceof CliError) throw e;
    throw new CliError(`${flag}: cannot read ${path} (${(e as NodeJS.ErrnoException).code ?? 'error'})`);
  } finally {
    closeSync(fd);
  }
  try {
    return decodeText(Buffer.concat(chunks, total), `${flag} ${path}`).text;
  } catch (e) {
    throw new CliError((e as Error).message);
  }
}
