#!/usr/bin/env node
// Bundles test/bench/profile-audit.ts and runs it in this process (see that file).
import { rmSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { bundleForNode } from '../../src/cli/bundle.mjs';

const out = `node_modules/.cache/baryon-audit/profile-audit-${process.pid}.mjs`;
await bundleForNode('test/bench/profile-audit.ts', out);
try {
  await import(pathToFileURL(out).href);
} finally {
  rmSync(out, { force: true }); // the bundle is this run's own
}
