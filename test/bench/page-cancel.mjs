// Cancel on a large sample (part of `npm run bench:web`; BENCH_CANCEL=0 skips it). A fresh tab opens on
// the demo, a 10⁴-row invented sample is imported with "Import CSV…", and the status line's Cancel is
// clicked with the mouse (a real input event, queued behind whatever the page is doing), either as soon
// as it shows (the import: the workers are reading the sample) or once a quarter of the rows are audited
// (the run). Two times, from the click's input timestamp:
//   - answered: until the page has painted a status line without "Auditing…" (the page's own answer);
//   - next run: "Demo sample" is clicked right after the answer; until the demo's audit is complete, with
//     its figures, i.e. until the workers have let go of the cancelled run and answered the next one.
// Plus the longest main-thread task from the import to the answer.
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { largeSampleCsv } from './large-sample.mjs';
import { openFresh } from './page-probes.mjs';

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)];

/** Records the Cancel click's input timestamp, the status it saw, and when the answer was painted. */
async function watchCancel(page) {
  await page.evaluate(() => {
    const w = (window.__cancel = {});
    const app = document.querySelector('baryon-audit-app');
    const status = () => app.shadowRoot.querySelector('.status')?.textContent.replace(/\s+/g, ' ').trim() ?? '';
    document.addEventListener(
      'click',
      (e) => {
        const b = e.composedPath()[0];
        if (!(b instanceof HTMLButtonElement) || b.textContent.trim() !== 'Cancel' || !b.closest('.status')) return;
        w.clickAt = e.timeStamp;
        w.handledAt = performance.now();
        w.before = status();
        // after the app's update: the next frame, then a task after its paint
        void app.updateComplete.then(() => requestAnimationFrame(() => setTimeout(() => ((w.answeredAt = performance.now()), (w.after = status())), 0)));
      },
      true,
    );
  });
}

/** One import of the 10⁴-row file and a Cancel in `phase` ('import' | 'run'). */
async function cancelOnce(ctx, base, file, rows, phase) {
  const page = await ctx.newPage();
  try {
    await openFresh(page, base);
    await watchCancel(page);
    const t0 = await page.evaluate(() => ((window.__probe.longTasks.length = 0), (window.__probe.audits.length = 0), performance.now()));
    await page.locator('sample-editor input[type=file]').setInputFiles(file);
    const cancel = page.locator('.status button', { hasText: 'Cancel' });
    await cancel.waitFor({ state: 'visible', timeout: 120000 });
    if (phase === 'run')
      await page.waitForFunction(
        (n) => {
          const s = document.querySelector('baryon-audit-app').shadowRoot.querySelector('.status')?.textContent ?? '';
          const m = /Auditing… (\d+)\//.exec(s);
          return m && Number(m[1]) >= n / 4;
        },
        rows,
        { timeout: 300000, polling: 50 },
      );
    await cancel.click({ timeout: 60000 });
    await page.waitForFunction(() => window.__cancel.answeredAt !== undefined, null, { timeout: 60000 });
    await page.locator('button', { hasText: 'Demo sample' }).click({ timeout: 60000 });
    await page.waitForFunction(
      () => {
        const p = window.__probe;
        if (p.failures.length) throw new Error(`the page failed: ${p.failures.at(-1)[1]}`);
        const s = document.querySelector('baryon-audit-app').shadowRoot.querySelector('.status')?.textContent ?? '';
        return p.audits.length > 0 && s.includes('Audited 8 galaxies');
      },
      null,
      { timeout: 300000, polling: 20 },
    );
    return await page.evaluate(async (t) => {
      await new Promise((ok) => setTimeout(ok, 300)); // the last long task is reported after it ends
      const w = window.__cancel;
      const p = window.__probe;
      const tasks = p.longTasks.filter(([s]) => s >= t - 1 && s <= w.answeredAt);
      return {
        answeredMs: w.answeredAt - w.clickAt,
        queuedMs: w.handledAt - w.clickAt,
        nextRunMs: p.audits.at(-1)[0] - w.clickAt,
        before: w.before,
        after: w.after,
        longest: tasks.reduce((a, [, d]) => Math.max(a, d), 0),
      };
    }, t0);
  } finally {
    await page.close();
  }
}

/** Rows for the benchmark table: Cancel during the import and during the run of 10⁴ rows. */
export async function cancelRows(ctx, base, dir, rounds = Number(process.env.BENCH_CANCEL_ROUNDS ?? 3)) {
  const rows = 10000;
  const file = join(dir, 'sample-10000.csv');
  writeFileSync(file, largeSampleCsv(rows));
  const out = [];
  for (const phase of ['import', 'run']) {
    const runs = [];
    for (let i = 0; i < rounds; i++) {
      const r = await cancelOnce(ctx, base, file, rows, phase);
      if (/Auditing/.test(r.after)) throw new Error(`after Cancel the page still says "${r.after}"`);
      runs.push(r);
      console.error(`  cancel during the ${phase}, round ${i + 1}: clicked at "${r.before}"; answered ${r.answeredMs.toFixed(0)} ms (${r.queuedMs.toFixed(0)} ms queued), next run complete ${r.nextRunMs.toFixed(0)} ms; longest task ${r.longest.toFixed(0)} ms`);
    }
    const each = (k) => runs.map((r) => r[k].toFixed(0)).join(', ');
    const when = phase === 'import' ? 'during the import (clicked as soon as it shows)' : 'during the run (a quarter of the rows audited)';
    out.push([`page, 10⁴ rows: Cancel ${when} → the page says so, click to paint, median of ${rounds} (each: ${each('answeredMs')})`, `${median(runs.map((r) => r.answeredMs)).toFixed(0)} ms`, '≤ 100 ms']);
    out.push([`page, 10⁴ rows: Cancel ${when} → the next run (demo) complete (each: ${each('nextRunMs')})`, `${median(runs.map((r) => r.nextRunMs)).toFixed(0)} ms`, '—']);
  }
  for (const r of out) console.error(`  ${r[0]}: ${r[1]}`);
  return out;
}
