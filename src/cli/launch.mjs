#!/usr/bin/env node
// Runs the command-line tool, bundling src/cli/main.ts with esbuild first when any source is newer
// than the cached bundle (node_modules/.cache/baryon-audit/cli-<checkout>.mjs: one per checkout, since
// checkouts may share one node_modules and must not run each other's bundle).
import { existsSync, readdirSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { createHash } from 'node:crypto';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const out = join(root, `node_modules/.cache/baryon-audit/cli-${createHash('sha256').update(root).digest('hex').slice(0, 12)}.mjs`);

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
