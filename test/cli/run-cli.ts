import { main } from '../../src/cli/main.js';

/** Runs one command line in process and collects its standard output and error, line by line. */
export async function runCli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await main(args, (s) => (out += s + '\n'), (s) => (err += s + '\n'));
  return { code, out, err };
}
