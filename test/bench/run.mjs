#!/usr/bin/env node
// npm run bench: every benchmark of the project. The numeric core, populations and audit (bundled
// from test/bench/bench.ts with esbuild), then the web app in headless Chromium (test/bench/web.mjs).
// No timing assertions anywhere: this prints medians, targets and scaling exponents.
import { build } from 'esbuild';
import { existsSync, mkdirSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
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
if (existsSync('/usr/bin/chromium')) spawnSync(process.execPath, ['test/bench/web.mjs'], { stdio: 'inherit' });
else console.log('\n(web benchmarks skipped: /usr/bin/chromium is not installed; apt-get install chromium)');
