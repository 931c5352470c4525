#!/usr/bin/env node
// npm run bench: bundles test/bench/bench.ts with esbuild and runs it (no timing assertions anywhere).
import { build } from 'esbuild';
import { mkdirSync } from 'node:fs';
import { pathToFileURL } from 'node:url';

mkdirSync('node_modules/.cache/baryon-audit', { recursive: true });
const out = 'node_modules/.cache/baryon-audit/bench.mjs';
await build({
  entryPoints: ['test/bench/bench.ts'],
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  outfile: out,
  logLevel: 'error',
  banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
});
await import(pathToFileURL(out).href);
