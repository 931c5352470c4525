#!/usr/bin/env node
// node test/bench/page-profile.mjs [rows=5000]: where the page's time goes when a large sample is
// imported with "Import CSV…" on the default choices. Records a CDP CPU profile of the page's main
// thread and its long tasks (PerformanceObserver), and prints the top functions by self time, the
// longest tasks and the wall time from import to "Audited N galaxies". A diagnostic, not a test.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { buildIfNeeded, serve } from '../../src/cli/serve.mjs';
import { largeSampleCsv } from './large-sample.mjs';
import { importSample, BROWSER_ARGS, installProbes } from './page-probes.mjs';

const rows = Number(process.argv[2] ?? 5000);
buildIfNeeded();
const server = await serve(0);
const base = `http://127.0.0.1:${server.address().port}/`;
const dir = mkdtempSync(join(tmpdir(), 'ba-prof-'));
const file = join(dir, `sample-${rows}.csv`);
writeFileSync(file, largeSampleCsv(rows));
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: BROWSER_ARGS });
try {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await installProbes(page);
  await page.goto(base);
  await page.evaluate(() => localStorage.clear());
  await page.reload();
  await page.waitForFunction(() => window.__probe.audits.length > 0, null, { timeout: 60000 });
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Profiler.enable');
  await cdp.send('Profiler.setSamplingInterval', { interval: 1000 });
  await cdp.send('Profiler.start');
  const r = await importSample(page, file, rows, 600000);
  const { profile } = await cdp.send('Profiler.stop');
  const self = new Map();
  const dt = profile.timeDeltas;
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  profile.samples.forEach((id, i) => {
    const n = byId.get(id);
    const cf = n.callFrame;
    const key = `${cf.functionName || '(anon)'} ${cf.url.split('/').pop()}:${cf.lineNumber + 1}:${cf.columnNumber + 1}`;
    self.set(key, (self.get(key) ?? 0) + (dt[i] ?? 0) / 1000);
  });
  const total = [...self.values()].reduce((a, b) => a + b, 0);
  console.log(`import → "Audited ${rows}": ${(r.wallMs / 1000).toFixed(2)} s; long tasks: ${r.longTasks.length}, total ${(r.longTasks.reduce((a, b) => a + b, 0) / 1000).toFixed(2)} s, longest ${Math.max(0, ...r.longTasks).toFixed(0)} ms; JS heap ${(r.heapBytes / 2 ** 20).toFixed(0)} MB`);
  console.log(`main-thread profile, ${(total / 1000).toFixed(2)} s sampled; top self time:`);
  for (const [k, v] of [...self.entries()].sort((a, b) => b[1] - a[1]).slice(0, 30)) console.log(`${v.toFixed(0).padStart(8)} ms  ${k}`);
  if (process.env.PROFILE_OUT) writeFileSync(process.env.PROFILE_OUT, JSON.stringify(profile));
} finally {
  await browser.close();
  server.close();
  rmSync(dir, { recursive: true, force: true });
}
