#!/usr/bin/env node
// npm start: builds the static site if any source is newer than the bundle, then serves public/ on
// http://127.0.0.1:$PORT (default 8080). Plain node:http; .js is served as text/javascript (module
// workers need it); paths outside public/ are refused; every response carries the page's CSP.
import { createServer } from 'node:http';
import { existsSync, readFileSync, readdirSync, statSync } from 'node:fs';
import { extname, join, normalize, resolve, dirname } from 'node:path';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const pub = join(root, 'public');
const CSP = "default-src 'none'; script-src 'self'; worker-src 'self'; style-src 'self'; img-src 'self' data: blob:; connect-src 'self'; font-src 'self'; base-uri 'none'; form-action 'none'";
const TYPES = { '.html': 'text/html; charset=utf-8', '.js': 'text/javascript; charset=utf-8', '.css': 'text/css; charset=utf-8', '.map': 'application/json', '.json': 'application/json', '.png': 'image/png', '.svg': 'image/svg+xml', '.md': 'text/markdown; charset=utf-8' };

function newest(dir) {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newest(p) : statSync(p).mtimeMs);
  }
  return t;
}

export function buildIfNeeded() {
  const app = join(pub, 'app.js');
  const worker = join(pub, 'audit.worker.js');
  const srcTime = Math.max(newest(join(root, 'src')), newest(join(root, 'workers')));
  if (existsSync(app) && existsSync(worker) && statSync(app).mtimeMs > srcTime && statSync(worker).mtimeMs > srcTime) return;
  const r = spawnSync(process.execPath, [join(root, 'node_modules/rollup/dist/bin/rollup'), '-c', '--silent'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) throw new Error('build failed');
}

export function serve(port, host = '127.0.0.1') {
  const server = createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://x');
    let path = decodeURIComponent(url.pathname);
    if (path.endsWith('/')) path += 'index.html';
    const file = normalize(join(pub, path));
    if (!file.startsWith(pub + '/') && file !== pub) {
      res.writeHead(403).end('forbidden');
      return;
    }
    if (!existsSync(file) || !statSync(file).isFile()) {
      res.writeHead(404, { 'Content-Type': 'text/plain' }).end('not found');
      return;
    }
    res.writeHead(200, { 'Content-Type': TYPES[extname(file)] ?? 'application/octet-stream', 'Content-Security-Policy': CSP, 'Cache-Control': 'no-cache' });
    res.end(readFileSync(file));
  });
  return new Promise((ok) => server.listen(port, host, () => ok(server)));
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  buildIfNeeded();
  const port = Number(process.env.PORT ?? 8080);
  const server = await serve(port);
  console.log(`Baryon Audit on http://127.0.0.1:${server.address().port}/ (Ctrl-C to stop)`);
}
