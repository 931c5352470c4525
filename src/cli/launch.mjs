#!/usr/bin/env node
// Runs the command-line tool, bundling src/cli/main.ts with esbuild first when any source is newer
// than the cached bundle (node_modules/.cache/baryon-audit/<checkout>/cli.mjs).
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
// One bundle per checkout (keyed by its path), so checkouts that share node_modules never run each other's code.
const out = join(root, 'node_modules/.cache/baryon-audit', createHash('sha256').update(root).digest('hex').slice(0, 16), 'cli.mjs');

function newest(dir) {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    if (e.isDirectory()) t = Math.max(t, newest(p));
    else if (/\.(ts|json|csv)$/.test(e.name)) t = Math.max(t, statSync(p).mtimeMs);
  }
  return t;
}

const stale = !existsSync(out) || newest(join(root, 'src')) > statSync(out).mtimeMs;
if (stale) {
  const { bundleForNode } = await import('./bundle.mjs');
  await bundleForNode(join(root, 'src/cli/main.ts'), out);
}
const { main } = await import(pathToFileURL(out).href);
process.exitCode = await main(process.argv.slice(2));
