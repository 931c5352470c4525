// Shared by the page benchmarks: probes installed before the page loads (long tasks, audit events)
// and an import of a sample file through the page's own "Import CSV…" picker.
export const BROWSER_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--enable-precise-memory-info'];

/** Records every long task (duration, start) and every audit-complete / audit-failed event. */
export async function installProbes(page) {
  await page.addInitScript(() => {
    const p = (window.__probe = { longTasks: [], audits: [], failures: [] });
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) p.longTasks.push([e.startTime, e.duration]);
    }).observe({ type: 'longtask', buffered: true });
    document.addEventListener('audit-complete', (e) => p.audits.push([performance.now(), e.detail]));
    document.addEventListener('audit-failed', (e) => p.failures.push([performance.now(), e.detail.message]));
  });
}

/**
 * Imports `file` with the sample editor's file picker and waits for the page to say "Audited <rows>"
 * with every figure drawn. Returns the wall time from the import to that moment, the long tasks in
 * between, and the JS heap then.
 */
export async function importSample(page, file, rows, timeout = 300000) {
  const t0 = await page.evaluate(() => {
    window.__probe.longTasks.length = 0;
    window.__probe.audits.length = 0;
    return performance.now();
  });
  const input = page.locator('sample-editor input[type=file]');
  await input.setInputFiles(file);
  await page.waitForFunction(
    (n) => {
      const p = window.__probe;
      if (p.failures.length) throw new Error(`the page failed: ${p.failures.at(-1)[1]}`);
      const app = document.querySelector('baryon-audit-app');
      const status = app?.shadowRoot?.querySelector('.status')?.textContent ?? '';
      return p.audits.length > 0 && status.includes(`Audited ${n}`);
    },
    rows,
    { timeout, polling: 100 },
  );
  return page.evaluate(async (t) => {
    const p = window.__probe;
    await new Promise((r) => setTimeout(r, 300)); // let the last long task be reported
    const end = p.audits.at(-1)[0];
    return { wallMs: end - t, longTasks: p.longTasks.filter(([s]) => s >= t - 1).map(([, d]) => d), heapBytes: performance.memory?.usedJSHeapSize ?? NaN };
  }, t0);
}

/** The page at `base` with the probes installed, its saved state cleared, after its first (demo) audit. */
export async function openFresh(page, base) {
  await installProbes(page);
  await page.goto(base);
  await page.evaluate(() => localStorage.clear());
  await page.reload();
  await page.waitForFunction(() => window.__probe.audits.length > 0, null, { timeout: 120000 });
}
