#!/usr/bin/env node
// Bundles test/bench/golden-dump.ts and runs it (see that file).
import { rmSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { bundleForNode } from '../../src/cli/bundle.mjs';

const out = 'node_modules/.cache/baryon-audit/golden-dump-' + process.pid + '.mjs';
await bundleForNode('test/bench/golden-dump.ts', out);
try {
  await import(pathToFileURL(out).href);
} finally {
  rmSync(out, { force: true }); // the bundle is this run's own
}
