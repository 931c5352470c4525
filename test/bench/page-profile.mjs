#!/usr/bin/env node
// node test/bench/page-profile.mjs [rows=5000]: where the page's time goes when a large sample is
// imported with "Import CSV…" on the default choices. Records a CDP CPU profile of the page's main
// thread, a Chromium trace and its long tasks (PerformanceObserver), and prints the wall time from
// import to "Audited N galaxies", the top functions by self time (mapped to the TypeScript source
// through the bundle's source map), and for every main-thread task over 50 ms what it spent its time
// on: script by function, style, layout, paint. A diagnostic, not a test.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { buildIfNeeded, serve } from '../../src/cli/serve.mjs';
import { largeSampleCsv } from './large-sample.mjs';
import { importSample, BROWSER_ARGS, installProbes } from './page-probes.mjs';
import { sourceLookup } from './source-positions.mjs';

const rows = Number(process.argv[2] ?? 5000);
buildIfNeeded();
const toSource = sourceLookup('public/app.js.map');
const server = await serve(0);
const base = `http://127.0.0.1:${server.address().port}/`;
const dir = mkdtempSync(join(tmpdir(), 'ba-prof-'));
const file = join(dir, `sample-${rows}.csv`);
writeFileSync(file, largeSampleCsv(rows));
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: BROWSER_ARGS });

/** "name src/ui/file.ts:line" for a profile call frame (bundle positions mapped to the source). */
function frameName(cf) {
  const file = cf.url.split('/').pop();
  const src = file === 'app.js' ? toSource(cf.lineNumber, cf.columnNumber) : undefined;
  return `${cf.functionName || '(anon)'} ${src ?? (file ? `${file}:${cf.lineNumber + 1}` : '')}`.trim();
}

/** Trace event names summed per long task, grouped as the DevTools performance panel does. */
const PHASES = { style: ['UpdateLayoutTree', 'RecalculateStyles'], layout: ['Layout'], paint: ['PrePaint', 'Paint', 'Layerize', 'PaintImage', 'RasterTask'], gc: ['MajorGC', 'MinorGC', 'V8.GCScavenger', 'V8.GCFinalizeMC'] };

try {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  await installProbes(page);
  await page.goto(base);
  await page.evaluate(() => localStorage.clear());
  await page.reload();
  await page.waitForFunction(() => window.__probe.audits.length > 0, null, { timeout: 60000 });
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Profiler.enable');
  await cdp.send('Profiler.setSamplingInterval', { interval: 500 });
  await browser.startTracing(page, { categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'v8'] });
  await cdp.send('Profiler.start');
  const r = await importSample(page, file, rows, 900000);
  const { profile } = await cdp.send('Profiler.stop');
  const trace = JSON.parse((await browser.stopTracing()).toString('utf8'));
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  // sample timestamps (µs, the trace's clock)
  const times = new Float64Array(profile.samples.length);
  let t = profile.startTime;
  profile.timeDeltas.forEach((d, i) => (times[i] = t += d));
  const selfIn = (t0, t1) => {
    const self = new Map();
    for (let i = 0; i < times.length; i++) {
      if (times[i] < t0 || times[i] > t1) continue;
      const n = byId.get(profile.samples[i]);
      const key = frameName(n.callFrame);
      const dt = (times[i + 1] ?? times[i]) - times[i];
      self.set(key, (self.get(key) ?? 0) + dt / 1000);
    }
    return [...self.entries()].filter(([k]) => !k.startsWith('(idle)')).sort((a, b) => b[1] - a[1]);
  };
  const self = selfIn(-Infinity, Infinity);
  const total = self.reduce((a, [, v]) => a + v, 0);
  const lt = r.longTasks;
  console.log(`import → "Audited ${rows}": ${(r.wallMs / 1000).toFixed(2)} s; long tasks (observer): ${lt.length}, total ${(lt.reduce((a, b) => a + b, 0) / 1000).toFixed(2)} s, longest ${Math.max(0, ...lt).toFixed(0)} ms; JS heap ${(r.heapBytes / 2 ** 20).toFixed(0)} MB`);
  console.log(`main-thread profile, ${(total / 1000).toFixed(2)} s busy; top self time:`);
  for (const [k, v] of self.slice(0, 20)) console.log(`${v.toFixed(0).padStart(8)} ms  ${k}`);

  const events = trace.traceEvents;
  const main = events.filter((e) => e.ph === 'M' && e.name === 'thread_name' && e.args?.name === 'CrRendererMain').map((e) => `${e.pid}:${e.tid}`);
  const onMain = events.filter((e) => main.includes(`${e.pid}:${e.tid}`) && e.ph === 'X');
  const tasks = onMain.filter((e) => e.name === 'RunTask' && e.dur > 50000 && e.ts >= profile.startTime);
  console.log(`\nmain-thread tasks over 50 ms (trace): ${tasks.length}`);
  for (const task of tasks) {
    const inner = onMain.filter((e) => e.ts >= task.ts && e.ts + e.dur <= task.ts + task.dur && e !== task && `${e.pid}:${e.tid}` === `${task.pid}:${task.tid}`);
    const sum = (names) => inner.filter((e) => names.includes(e.name)).reduce((a, e) => a + e.dur, 0) / 1000;
    const phases = Object.entries(PHASES).map(([k, names]) => `${k} ${sum(names).toFixed(0)}`).join(', ');
    const js = selfIn(task.ts, task.ts + task.dur).slice(0, 6).map(([k, v]) => `${k} ${v.toFixed(0)}`).join('; ');
    console.log(`  at ${((task.ts - profile.startTime) / 1000).toFixed(0).padStart(6)} ms: ${(task.dur / 1000).toFixed(0).padStart(5)} ms — ${phases} ms; top self: ${js}`);
  }
  if (process.env.PROFILE_OUT) writeFileSync(process.env.PROFILE_OUT, JSON.stringify(profile));
} finally {
  await browser.close();
  server.close();
  rmSync(dir, { recursive: true, force: true });
}
