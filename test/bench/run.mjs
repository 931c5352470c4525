#!/usr/bin/env node
// npm run bench: every benchmark of the project. The numeric core, populations and audit (bundled
// from test/bench/bench.ts with esbuild), then the web app in headless Chromium (test/bench/web.mjs).
// No timing assertions anywhere: this prints medians, targets and scaling exponents.
import { existsSync, rmSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { pathToFileURL } from 'node:url';
import { bundleForNode } from '../../src/cli/bundle.mjs';

const out = `node_modules/.cache/baryon-audit/bench-${process.pid}.mjs`;
// the audit alone in a process of its own, for the side-by-side runs with numpy (bench.ts, 5b)
const ownProcess = `node_modules/.cache/baryon-audit/own-process-audit-${process.pid}.mjs`;
await bundleForNode('test/bench/bench.ts', out);
await bundleForNode('test/bench/own-process-audit.ts', ownProcess);
process.env.BENCH_OWN_PROCESS_BUNDLE = ownProcess;
try {
  await import(pathToFileURL(out).href);
} finally {
  rmSync(out, { force: true }); // the bundles are this run's own
  rmSync(ownProcess, { force: true });
}
if (process.env.BENCH_NUMPY_ONLY === '1' || process.env.BENCH_NO_WEB === '1') console.log('\n(web benchmarks skipped: BENCH_NUMPY_ONLY or BENCH_NO_WEB)');
else if (existsSync('/usr/bin/chromium')) spawnSync(process.execPath, ['test/bench/web.mjs'], { stdio: 'inherit' });
else console.log('\n(web benchmarks skipped: /usr/bin/chromium is not installed; apt-get install chromium)');
