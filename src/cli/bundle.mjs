// Bundles a TypeScript entry for Node with esbuild (ESM, with a `require` shim for CommonJS packages).
// Used by the CLI launcher and the benchmarks.
import { build } from 'esbuild';
import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';

export async function bundleForNode(entry, outfile) {
  mkdirSync(dirname(outfile), { recursive: true });
  await build({
    entryPoints: [entry],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outfile,
    logLevel: 'error',
    banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
  });
}
