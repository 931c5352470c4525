import { expect } from 'chai';

/**
 * Large samples on the built bundle: progress with rate and time left, Cancel in the middle of a large
 * run and during the import of 10⁴ rows (while the workers read the sample), a worker that dies silently (no error event: only the liveness check can tell), and a worker
 * script that cannot load (restarts back off and stop). Every wait fails at once with the page's own
 * message if the page reports a failure it was not expected to.
 */
await import(new URL('../../public/app.js', import.meta.url).href);

type Ctl = {
  livenessMs: number;
  kill(): void;
  stopWorkerSilently(which?: 'main' | 'pool'): boolean;
  setWorkerFactory(make: () => Worker): void;
};
type App = HTMLElement & { auditController?: Ctl; updateComplete: Promise<boolean> };

/** An invented sample of `rows` rows (ids SYN-…), z 7.2–10.8, as the benchmark's. */
function sampleCsv(rows: number): string {
  const lines = ['id,z,z_lo,z_hi,muv,mag_err'];
  for (let i = 0; i < rows; i++) {
    const z = 7.2 + (3.6 * ((i * 37) % 101)) / 100;
    lines.push(`SYN-${i + 1},${z.toFixed(3)},${(z - 0.15).toFixed(3)},${(z + 0.15).toFixed(3)},${(-22.5 + (4 * ((i * 13) % 29)) / 28).toFixed(2)},0.1`);
  }
  return lines.join('\n') + '\n';
}

/** Waits for `type` on the app (matching `pred`); an audit-failed rejects with its message unless `failures` are expected. */
function waitFor(app: HTMLElement, type: string, pred: (d: { message?: string }) => boolean = () => true, timeout = 50000, failures = false): Promise<{ message?: string }> {
  return new Promise((resolve, reject) => {
    const done = (): void => {
      clearTimeout(t);
      app.removeEventListener(type, h);
      app.removeEventListener('audit-failed', f);
    };
    const t = setTimeout(() => (done(), reject(new Error(`no ${type} within the time limit`))), timeout);
    const h = (e: Event): void => {
      const d = (e as CustomEvent).detail;
      if (pred(d)) (done(), resolve(d));
    };
    const f = (e: Event): void => {
      if (type !== 'audit-failed' && !failures) (done(), reject(new Error(`the page reported a failure: ${(e as CustomEvent).detail.message}`)));
    };
    app.addEventListener(type, h);
    app.addEventListener('audit-failed', f);
  });
}

function shadowAll(root: ParentNode, sel: string, out: Element[] = []): Element[] {
  root.querySelectorAll(sel).forEach((e) => out.push(e));
  root.querySelectorAll('*').forEach((e) => e.shadowRoot && shadowAll(e.shadowRoot, sel, out));
  return out;
}

const statusText = (app: App): string => app.shadowRoot!.querySelector('.status')?.textContent?.replace(/\s+/g, ' ') ?? '';

/** Polls `pred` every 20 ms (for states the page shows without an event). */
async function until(pred: () => boolean, what: string, timeout = 50000): Promise<void> {
  const t0 = performance.now();
  while (!pred()) {
    if (performance.now() - t0 > timeout) throw new Error(`not seen within the time limit: ${what}`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

/** Imports `csv` through the sample editor's "Import CSV…" picker, as a user would. */
function importCsv(app: App, csv: string, name = 'sample.csv'): void {
  const input = shadowAll(app.shadowRoot!, 'sample-editor').flatMap((e) => shadowAll(e.shadowRoot!, 'input[type=file]'))[0] as HTMLInputElement;
  const dt = new DataTransfer();
  dt.items.add(new File([csv], name, { type: 'text/csv' }));
  input.files = dt.files;
  input.dispatchEvent(new Event('change'));
}

async function freshApp(): Promise<App> {
  document.querySelectorAll('baryon-audit-app').forEach((e) => e.remove());
  history.replaceState(null, '', location.pathname + location.search);
  const app = document.createElement('baryon-audit-app') as App;
  const done = waitFor(app, 'audit-complete');
  document.body.append(app);
  await done;
  return app;
}

describe('large samples in the page', () => {
  beforeEach(() => localStorage.clear());

  it('shows rows, rows per second and time left; Cancel in the middle of a large run answers at once and the page stays usable', async () => {
    const app = await freshApp();
    importCsv(app, sampleCsv(3000), 'large.csv');
    await until(() => /Auditing… \d+\/3000 rows/.test(statusText(app)) && /\d+ rows\/s, about \d+ s left/.test(statusText(app)), 'progress with rate and time left');
    const shown = statusText(app);
    const done = Number(/Auditing… (\d+)\/3000/.exec(shown)![1]);
    expect(done).to.be.greaterThan(0).and.lessThan(3000);
    const cancel = shadowAll(app.shadowRoot!, 'button').find((b) => b.textContent === 'Cancel') as HTMLButtonElement;
    cancel.click();
    // answered by the page itself in the same turn, without waiting for any worker
    await app.updateComplete;
    expect(statusText(app)).to.not.contain('Auditing');
    expect(app.shadowRoot!.textContent).to.contain('run cancelled');
    // the previous (demo) result stays on the page, said to be for earlier inputs, with a way to run again
    expect(statusText(app)).to.contain('Audited 8 galaxies');
    expect(app.shadowRoot!.querySelector('.out')?.getAttribute('data-state')).to.equal('behind');
    expect(shadowAll(app.shadowRoot!, 'button').some((b) => b.textContent === 'Run again with the current inputs')).to.equal(true);
    const next = waitFor(app, 'audit-complete');
    importCsv(app, sampleCsv(30), 'small.csv');
    await next;
    expect(statusText(app)).to.contain('Audited 30 galaxies');
    app.remove();
  });

  it('Cancel during the import of 10⁴ rows (the workers still reading the sample) answers at once, keeps the sample, and the workers take the next run', async () => {
    const app = await freshApp();
    importCsv(app, sampleCsv(10000), 'ten-thousand.csv');
    // the first moment the page offers Cancel: the sample is handed on and no row is audited yet
    await until(() => /Cancel/.test(statusText(app)), 'Cancel offered for the imported sample');
    const shown = statusText(app);
    expect(shown).to.match(/Auditing… 0\/(\?|10000) rows/);
    const cancel = shadowAll(app.shadowRoot!, 'button').find((b) => b.textContent === 'Cancel') as HTMLButtonElement;
    cancel.click();
    await app.updateComplete;
    expect(statusText(app)).to.not.contain('Auditing');
    expect(statusText(app)).to.contain('Audited 8 galaxies');
    expect(app.shadowRoot!.textContent).to.contain('run cancelled');
    const out = app.shadowRoot!.querySelector('.out')!;
    expect(out.getAttribute('data-state')).to.equal('behind');
    expect(app.shadowRoot!.querySelector('#stale-text')?.textContent).to.contain('earlier inputs');
    // the imported sample stays on the bench (Undo would bring the demo back)
    const editor = shadowAll(app.shadowRoot!, 'sample-editor')[0] as HTMLElement & { updateComplete: Promise<boolean> };
    await editor.updateComplete;
    expect(editor.shadowRoot!.querySelector('.bar')?.textContent).to.contain('10000 rows');
    // the workers let go of the cancelled run: the next one (the demo again, by Undo) completes
    const next = waitFor(app, 'audit-complete');
    (app as unknown as { undo(): void }).undo();
    await next;
    await app.updateComplete;
    expect(statusText(app)).to.contain('Audited 8 galaxies');
    expect(out.getAttribute('data-state')).to.equal('current');
    app.remove();
  });

  it('a worker that stops silently mid-run (no error event) is found by the liveness check, restarted, and the last good inputs are run again', async () => {
    const app = await freshApp();
    const ctl = app.auditController!;
    ctl.livenessMs = 1500;
    importCsv(app, sampleCsv(3000), 'large.csv');
    await until(() => /Auditing… [1-9]\d*\/3000/.test(statusText(app)), 'the large run under way');
    const failed = waitFor(app, 'audit-failed', (d) => /stopped answering/.test(d.message ?? ''));
    expect(ctl.stopWorkerSilently('main')).to.equal(true);
    expect((await failed).message).to.match(/stopped answering .*restarted and the last good inputs were run again/);
    // The restart comes restartBaseMs after the failure, so this wait is in place before it. The restarted
    // worker is judged by the page's own threshold again: a fresh worker building its tables on a loaded
    // machine can be quiet for more than the 1.5 s above, and a second failure now fails the test at once
    // with its message instead of waiting out the time limit.
    ctl.livenessMs = 15000;
    await waitFor(app, 'audit-complete');
    expect(statusText(app)).to.contain('Audited 8 galaxies');
    const alert = shadowAll(app.shadowRoot!, '.error')[0]?.textContent ?? '';
    expect(alert).to.contain('stopped answering');
    expect(alert).to.contain('kept');
    app.remove();
  });

  it('a worker script that cannot load is retried with growing pauses, then no more, and the page says so', async () => {
    const app = await freshApp();
    const ctl = app.auditController!;
    const starts: number[] = [];
    ctl.setWorkerFactory(() => {
      starts.push(performance.now());
      return new Worker(new URL('../../public/no-such-worker.js', import.meta.url), { type: 'module' });
    });
    const gaveUp = waitFor(app, 'audit-failed', (d) => /no longer restarted/.test(d.message ?? ''), 20000);
    ctl.kill();
    const msg = (await gaveUp).message!;
    expect(msg).to.contain('failed 4 times in a row');
    expect(msg).to.contain('reload the page');
    await new Promise((r) => setTimeout(r, 3000)); // nothing more is requested after giving up
    expect(starts.length).to.equal(3);
    const gaps = starts.slice(1).map((t, i) => t - starts[i]);
    expect(gaps[1]).to.be.greaterThan(gaps[0]); // the pauses grow
    const alert = shadowAll(app.shadowRoot!, '.error')[0]?.textContent ?? '';
    expect(alert).to.contain('no longer restarted');
    app.remove();
  });
});
