#!/usr/bin/env node
// npm run bench:web (also run by npm run bench): the web app in Debian's headless Chromium.
// Measures load → first complete figure on the demo, edit → updated figure over 50 edits (p50/p95),
// a large imported sample against the command line (test/bench/large-sample-bench.mjs; BENCH_LARGE=0
// skips it, BENCH_LARGE_10K=0 skips its 10⁴-row part), Cancel during a 10⁴-row import and run
// (test/bench/page-cancel.mjs; BENCH_CANCEL=0 skips it) and the gzipped bundle sizes.
// A benchmark, not a test: it prints, it never fails on a target.
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir, cpus } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { chromium } from 'playwright-core';
import { buildIfNeeded, serve } from '../../src/cli/serve.mjs';
import { largeSampleRows } from './large-sample-bench.mjs';
import { cancelRows } from './page-cancel.mjs';

const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const LARGE_ONLY = process.env.BENCH_LARGE_ONLY === '1';
const q = (xs, p) => {
  const s = [...xs].sort((a, b) => a - b);
  const h = (s.length - 1) * p;
  const lo = Math.floor(h);
  return s[lo] + (h - lo) * ((s[Math.min(lo + 1, s.length - 1)] ?? s[lo]) - s[lo]);
};

buildIfNeeded();
const server = await serve(0);
const base = `http://127.0.0.1:${server.address().port}/`;
const profile = mkdtempSync(join(tmpdir(), 'ba-bench-'));
const ctx = await chromium.launchPersistentContext(profile, { executablePath: '/usr/bin/chromium', headless: true, args: ARGS, viewport: { width: 1280, height: 800 } });
await ctx.addInitScript(() => {
  window.__events = [];
  document.addEventListener('audit-complete', () => window.__events.push(['audit', performance.now()]));
  document.addEventListener('chart-drawn', (e) => window.__events.push(['chart', performance.now(), e.detail.id]));
});
const rows = [];
try {
  if (process.env.BENCH_LARGE !== '0') rows.push(...(await largeSampleRows(ctx, base, profile)));
  if (process.env.BENCH_CANCEL !== '0') rows.push(...(await cancelRows(ctx, base, profile)));
  const loads = [];
  const firsts = [];
  for (let i = 0; i < 5 && !LARGE_ONLY; i++) {
    const page = await ctx.newPage();
    await page.goto(base);
    await page.evaluate(() => localStorage.clear());
    await page.reload();
    await page.waitForFunction(() => window.__events.some((e) => e[0] === 'audit'), null, { timeout: 60000 });
    loads.push(await page.evaluate(() => window.__events.find((e) => e[0] === 'audit')[1]));
    firsts.push(await page.evaluate(() => window.__events.find((e) => e[0] === 'chart')[1]));
    await page.close();
  }
  if (!LARGE_ONLY) await demoRows(rows, firsts, loads);
} finally {
  await ctx.close();
  server.close();
  rmSync(profile, { recursive: true, force: true });
}

/** The demo: load → first figure and complete audit, then choice and cell edits → updated figure. */
async function demoRows(rows, firsts, loads) {
  rows.push(['load → first complete figure (the halo-abundance explorer)', `${q(firsts, 0.5).toFixed(0)} ms`, '≤ 1000 ms']);
  rows.push(['load → complete demo audit with all figures (8 galaxies, 2000 draws, 5 IMFs)', `${q(loads, 0.5).toFixed(0)} ms`, '—']);
  const page = await ctx.newPage();
  await page.goto(base);
  await page.waitForFunction(() => window.__events.some((e) => e[0] === 'audit'), null, { timeout: 60000 });
  // Edits on a settled page: the second worker has built its tables after the first audit (a few seconds
  // at most), so small samples get a first look beside the whole audit.
  await page.waitForFunction(() => document.querySelector('baryon-audit-app').auditController.firstLooks, null, { timeout: 60000 });
  /**
   * Latency from a change event on an input to the redrawn stellar-mass figure, and to the whole audit
   * on show (audit-complete: what it would take, the summary and the exports too), 50 times.
   */
  const measure = (host, selector, value) =>
    Array.from({ length: 50 }).reduce(async (acc, _, i) => {
      const list = await acc;
      const dt = await page.evaluate(
        async ([h, sel, v]) => {
          const app = document.querySelector('baryon-audit-app');
          const el = app.shadowRoot.querySelector(h);
          const input = sel.startsWith('seed') ? [...el.shadowRoot.querySelectorAll('input[type=number]')].find((x) => x.parentElement.textContent.startsWith('seed')) : el.shadowRoot.querySelector(sel);
          const n0 = window.__events.length;
          const t0 = performance.now();
          input.value = String(v);
          input.dispatchEvent(new Event('change'));
          await new Promise((ok) => {
            const tick = () => (window.__events.slice(n0).some((e) => e[0] === 'audit') ? ok() : setTimeout(tick, 2));
            tick();
          });
          const ev = window.__events.slice(n0).filter((e) => e[0] === 'chart' && e[2] === 'mass-redshift').pop();
          const all = window.__events.slice(n0).find((e) => e[0] === 'audit');
          return [(ev ? ev[1] : performance.now()) - t0, all[1] - t0];
        },
        [host, selector, value(i)],
      );
      return [...list, dt];
    }, Promise.resolve([]));
  const lat = await measure('choice-panel', 'seed', (i) => 100 + i);
  const fig = lat.map((x) => x[0]);
  const all = lat.map((x) => x[1]);
  rows.push(['choice edit → updated figure, p50 over 50 edits (seed: every row re-audited)', `${q(fig, 0.5).toFixed(0)} ms`, '—']);
  rows.push(['choice edit → updated figure, p95 over 50 edits', `${q(fig, 0.95).toFixed(0)} ms`, '≤ 100 ms']);
  rows.push(['choice edit → whole audit on show (what it would take, summary, exports), p50 / p95', `${q(all, 0.5).toFixed(0)} / ${q(all, 0.95).toFixed(0)} ms`, '—']);
  const cellLat = await measure('sample-editor', 'input[aria-label="row 3, log_mstar"]', (i) => (11 + (i % 10) / 20).toFixed(2));
  const cell = cellLat.map((x) => x[0]);
  rows.push(['sample-cell edit → updated figure, p50 over 50 edits (one row re-audited)', `${q(cell, 0.5).toFixed(0)} ms`, '—']);
  rows.push(['sample-cell edit → updated figure, p95 over 50 edits', `${q(cell, 0.95).toFixed(0)} ms`, '≤ 100 ms']);
  rows.push(['sample-cell edit → whole audit on show, p50 / p95', `${q(cellLat.map((x) => x[1]), 0.5).toFixed(0)} / ${q(cellLat.map((x) => x[1]), 0.95).toFixed(0)} ms`, '—']);
}
if (LARGE_ONLY) {
  console.log('\n| benchmark | median | target |\n| --- | --- | --- |');
  for (const r of rows) console.log(`| ${r.join(' | ')} |`);
  process.exit(0);
}
const gz = (f) => gzipSync(readFileSync(join('public', f))).length;
const app = gz('app.js');
const worker = gz('audit.worker.js');
rows.push(['bundle app.js gzipped', `${(app / 1024).toFixed(1)} kB`, '—']);
rows.push(['bundle audit.worker.js gzipped', `${(worker / 1024).toFixed(1)} kB`, '—']);
rows.push(['app + worker gzipped', `${((app + worker) / 1024).toFixed(1)} kB`, '≤ 120 kB']);
// The figure elements are chunks app.js fetches as it starts (not in the budget of the first download, listed here).
const chunks = readdirSync('public').filter((f) => /^chunk-.*\.js$/.test(f));
rows.push([`figure chunks gzipped (${chunks.length} files, fetched on start)`, `${(chunks.reduce((a, f) => a + gz(f), 0) / 1024).toFixed(1)} kB`, '—']);
console.log(`\nWeb app benchmarks (headless Chromium, ${cpus().length} cores)\n`);
for (const r of rows) console.log(`${r[0].padEnd(72)} ${r[1].padStart(10)}   target ${r[2]}`);
console.log('\n| benchmark | median | target |\n| --- | --- | --- |');
for (const r of rows) console.log(`| ${r.join(' | ')} |`);
