// The large-sample benchmark of `npm run bench:web`: the page against the command line on the same
// invented sample and the same choices (40 arcmin², 7 < z < 11, five IMFs, 2000 draws: the page's
// defaults), measured side by side in one run. Page: a fresh tab opens on the demo, then the sample is
// imported with "Import CSV…"; the clock runs from the import to "Audited N galaxies" with every figure
// drawn. CLI: `assess FILE --format json` as a child process, wall time. Also the page's long tasks
// (PerformanceObserver 'longtask'), split into the import and audit phase and the drawing of the
// result, and the main thread's JS heap after the audit (CDP Runtime.getHeapUsage after a GC).
import { spawnSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { largeSampleCsv } from './large-sample.mjs';
import { openFresh } from './page-probes.mjs';

const IMFS = 'salpeter,chabrier,kroupa,top-heavy-flat,top-heavy-cmb';

export function cliWallMs(file) {
  const t0 = performance.now();
  const r = spawnSync(process.execPath, ['src/cli/launch.mjs', 'assess', file, '--area-arcmin2', '40', '--z-range', '7:11', '--imf', IMFS, '--draws', '2000', '--format', 'json'], { stdio: ['ignore', 'ignore', 'inherit'] });
  if (r.status !== 0) throw new Error(`the CLI run failed (${r.status})`);
  return performance.now() - t0;
}

/** One import of `file` (rows rows) into a fresh tab of `ctx`. */
export async function pageRun(ctx, base, file, rows) {
  const page = await ctx.newPage();
  try {
    await openFresh(page, base);
    const t0 = await page.evaluate(() => {
      window.__probe.longTasks.length = 0;
      window.__probe.audits.length = 0;
      return performance.now();
    });
    await page.locator('sample-editor input[type=file]').setInputFiles(file);
    await page.waitForFunction(
      (n) => {
        const p = window.__probe;
        if (p.failures.length) throw new Error(`the page failed: ${p.failures.at(-1)[1]}`);
        const status = document.querySelector('baryon-audit-app')?.shadowRoot?.querySelector('.status')?.textContent ?? '';
        return p.audits.length > 0 && status.includes(`Audited ${n}`);
      },
      rows,
      { timeout: 900000, polling: 100 },
    );
    const r = await page.evaluate(async (t) => {
      await new Promise((ok) => setTimeout(ok, 300)); // the last long task is reported after it ends
      const p = window.__probe;
      const end = p.audits.at(-1)[0];
      const result = performance.getEntriesByName('baryon-audit:result').at(-1)?.startTime ?? end;
      const tasks = p.longTasks.filter(([s]) => s >= t - 1 && s <= end);
      const max = (xs) => xs.reduce((a, [, d]) => Math.max(a, d), 0);
      return {
        wallMs: end - t,
        resultMs: result - t,
        longTasks: tasks.length,
        longest: max(tasks),
        // the task that receives the last page of the result also draws it: it counts as drawing
        longestRun: max(tasks.filter(([s, d]) => s + d < result)),
        longestDraw: max(tasks.filter(([s, d]) => s + d >= result)),
        firstTask: tasks[0]?.[1] ?? 0,
      };
    }, t0);
    const cdp = await ctx.newCDPSession(page);
    await cdp.send('HeapProfiler.collectGarbage');
    const heap = await cdp.send('Runtime.getHeapUsage');
    return { ...r, heapMB: heap.usedSize / 2 ** 20 };
  } finally {
    await page.close();
  }
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)];

/** Rows for the benchmark table: the page/CLI ratio at 5000 rows, the long tasks and heap at 10⁴. */
export async function largeSampleRows(ctx, base, dir, rounds = Number(process.env.BENCH_LARGE_ROUNDS ?? 3)) {
  const out = [];
  const f5 = join(dir, 'sample-5000.csv');
  writeFileSync(f5, largeSampleCsv(5000));
  cliWallMs(f5); // bundles the CLI if needed and warms the disk cache
  const cli = [];
  const pages = [];
  for (let i = 0; i < rounds; i++) {
    cli.push(cliWallMs(f5));
    pages.push(await pageRun(ctx, base, f5, 5000));
    const p = pages.at(-1);
    console.error(`  round ${i + 1}: CLI ${(cli[i] / 1000).toFixed(2)} s, page ${(p.wallMs / 1000).toFixed(2)} s (ratio ${(p.wallMs / cli[i]).toFixed(2)}), longest task ${p.longest.toFixed(0)} ms`);
  }
  const ratios = pages.map((p, i) => p.wallMs / cli[i]);
  const toResult = pages.map((p, i) => p.resultMs / cli[i]);
  const best = [...pages].sort((a, b) => a.wallMs - b.wallMs)[Math.floor((pages.length - 1) / 2)];
  const each = (xs) => xs.map((x) => x.toFixed(2)).join(', ');
  out.push(['CLI audit, 5000 rows × 2000 draws × 5 IMFs, wall time', `${(median(cli) / 1000).toFixed(2)} s`, '—']);
  out.push(['page, 5000 rows: import → "Audited 5000" with every figure drawn', `${(best.wallMs / 1000).toFixed(2)} s`, '—']);
  out.push([`page / CLI wall time, 5000 rows, median of ${rounds} side-by-side rounds (each: ${each(ratios)})`, `${median(ratios).toFixed(2)}×`, '≤ 1.5×']);
  out.push(['page, 5000 rows: import → whole result on the main thread', `${(best.resultMs / 1000).toFixed(2)} s`, '—']);
  out.push([`page / CLI, import → whole result on the main thread (each: ${each(toResult)})`, `${median(toResult).toFixed(2)}×`, '—']);
  out.push(['page, 5000 rows: long tasks (> 50 ms) from import to last figure', `${best.longTasks}`, '—']);
  out.push(['page, 5000 rows: longest task, import and audit', `${best.longestRun.toFixed(0)} ms`, '≤ 200 ms']);
  out.push(['page, 5000 rows: longest task, drawing the result', `${best.longestDraw.toFixed(0)} ms`, '≤ 200 ms']);
  for (const r of out) console.error(`  ${r[0]}: ${r[1]}`); // as they come: a later failure keeps these
  if (process.env.BENCH_LARGE_10K !== '0') {
    const f10 = join(dir, 'sample-10000.csv');
    writeFileSync(f10, largeSampleCsv(10000));
    let p;
    try {
      p = await pageRun(ctx, base, f10, 10000);
    } catch (e) {
      out.push(['page, 10⁴ rows', `failed: ${e.message.split('\n')[0]}`, '—']);
      return out;
    }
    out.push(['page, 10⁴ rows: import → "Audited 10000"', `${(p.wallMs / 1000).toFixed(2)} s`, '—']);
    out.push(['page, 10⁴ rows: longest task, import and audit', `${p.longestRun.toFixed(0)} ms`, '≤ 200 ms']);
    out.push(['page, 10⁴ rows: longest task, drawing the result', `${p.longestDraw.toFixed(0)} ms`, '≤ 200 ms']);
    out.push(['page, 10⁴ rows: main-thread JS heap after the audit (after GC)', `${p.heapMB.toFixed(0)} MB`, '—']);
  }
  return out;
}
