import { expect } from 'chai';

/**
 * Failure recovery and security, on the built bundle: a killed worker, a worker that throws, a corrupt
 * saved state, the page's Content-Security-Policy, no requests to any other origin, no eval.
 */
await import(new URL('../../public/app.js', import.meta.url).href);

type Ctl = { kill(): void; failInWorker(): Promise<void> };
type App = HTMLElement & { auditController?: Ctl };

function waitFor(app: HTMLElement, type: string, pred: (d: { message?: string }) => boolean = () => true, timeout = 50000): Promise<{ message?: string }> {
  return new Promise((resolve, reject) => {
    const t = setTimeout(() => reject(new Error(`no ${type} within the time limit`)), timeout);
    const h = (e: Event) => {
      const d = (e as CustomEvent).detail;
      if (!pred(d)) return;
      clearTimeout(t);
      app.removeEventListener(type, h);
      resolve(d);
    };
    app.addEventListener(type, h);
  });
}

function shadowAll(root: ParentNode, sel: string, out: Element[] = []): Element[] {
  root.querySelectorAll(sel).forEach((e) => out.push(e));
  root.querySelectorAll('*').forEach((e) => e.shadowRoot && shadowAll(e.shadowRoot, sel, out));
  return out;
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

describe('failure recovery', () => {
  beforeEach(() => localStorage.clear());

  it('a worker killed mid-run is restarted, the page says so, and the user’s edits are kept', async () => {
    const app = await freshApp();
    const seed = shadowAll(app.shadowRoot!, 'choice-panel').flatMap((p) => shadowAll(p.shadowRoot!, 'input[type=number]')).find((i) => i.parentElement?.textContent?.startsWith('seed')) as HTMLInputElement;
    seed.value = '77';
    seed.dispatchEvent(new Event('change'));
    await new Promise((r) => setTimeout(r, 250)); // past the debounce: the run is in flight
    const failed = waitFor(app, 'audit-failed', (d) => /restarted/.test(d.message ?? ''));
    const recovered = waitFor(app, 'audit-complete');
    app.auditController!.kill();
    expect((await failed).message).to.contain('restarted');
    await recovered;
    const shown = shadowAll(app.shadowRoot!, '.error')[0]?.textContent ?? '';
    expect(shown).to.contain('kept');
    const saved = JSON.parse(localStorage.getItem('baryon-audit:state')!);
    expect(saved.choices.seed).to.equal(77);
    expect(shadowAll(app.shadowRoot!, 'results-table').length).to.equal(1);
    app.remove();
  });

  it('an error thrown inside the worker is shown, and the next edit is audited normally', async () => {
    const app = await freshApp();
    const failed = waitFor(app, 'audit-failed');
    await app.auditController!.failInWorker();
    expect((await failed).message).to.contain('deliberate failure');
    const again = waitFor(app, 'audit-complete');
    const btn = shadowAll(app.shadowRoot!, 'button').find((b) => b.textContent?.includes('Run again')) as HTMLButtonElement;
    btn.click();
    await again;
    app.remove();
  });

  it('a corrupt saved state is kept aside, the page says so and opens on the demo', async () => {
    localStorage.setItem('baryon-audit:state', '{"tool": "baryon-audit", "format": 1, "sample_csv": 3');
    const app = await freshApp();
    const notice = shadowAll(app.shadowRoot!, '.notice')[0]?.textContent ?? '';
    expect(notice).to.contain('saved state could not be read');
    expect(localStorage.getItem('baryon-audit:unreadable-state')).to.contain('"sample_csv": 3');
    expect(shadowAll(app.shadowRoot!, 'results-table').length).to.equal(1);
    app.remove();
  });

  it('markup typed into a cell is shown as text, never as HTML', async () => {
    const app = await freshApp();
    const idCell = shadowAll(app.shadowRoot!, 'sample-editor').flatMap((e) => shadowAll(e.shadowRoot!, 'input[aria-label="row 1, id"]'))[0] as HTMLInputElement;
    const done = waitFor(app, 'audit-complete');
    idCell.value = '<img src=x id=injected>';
    idCell.dispatchEvent(new Event('change'));
    await done;
    expect(shadowAll(app.shadowRoot!, 'img#injected').length).to.equal(0);
    const table = shadowAll(app.shadowRoot!, 'results-table')[0];
    expect(table.shadowRoot!.textContent).to.contain('<img src=x id=injected>');
    app.remove();
  });
});

describe('security of the built page', () => {
  it('the bundles contain no eval and no Function constructor', async () => {
    for (const f of ['app.js', 'audit.worker.js']) {
      const text = await (await fetch(new URL(`../../public/${f}`, import.meta.url))).text();
      expect(text.length).to.be.greaterThan(1000);
      expect(/[^\w.$]eval\(|new Function\(/.test(text), f).to.equal(false);
    }
  });

  it('index.html under its CSP: the audit runs with no violation, an injected inline script is blocked, no request leaves the origin', async () => {
    const frame = document.createElement('iframe');
    frame.style.width = '1280px';
    frame.style.height = '800px';
    const violations: string[] = [];
    frame.src = new URL('../../public/index.html', import.meta.url).href;
    const loaded = new Promise<void>((ok) => frame.addEventListener('load', () => ok(), { once: true }));
    document.body.append(frame);
    await loaded;
    const win = frame.contentWindow as Window & { __injected?: number };
    win.document.addEventListener('securitypolicyviolation', (e) => violations.push(`${e.violatedDirective}: ${e.blockedURI}`));
    const app = win.document.querySelector('baryon-audit-app') as HTMLElement;
    await waitFor(app, 'audit-complete');
    expect(violations, violations.join('\n')).to.deep.equal([]);
    const s = win.document.createElement('script');
    s.textContent = 'window.__injected = 1';
    const blocked = new Promise<void>((ok) => win.document.addEventListener('securitypolicyviolation', () => ok(), { once: true }));
    win.document.body.append(s);
    await blocked;
    expect(win.__injected).to.equal(undefined);
    expect(violations.some((v) => v.startsWith('script-src'))).to.equal(true);
    const resources = [...win.performance.getEntriesByType('resource'), ...performance.getEntriesByType('resource')].map((e) => e.name);
    const foreign = resources.filter((u) => !u.startsWith(location.origin) && !u.startsWith('data:') && !u.startsWith('blob:'));
    expect(foreign, foreign.join('\n')).to.deep.equal([]);
    frame.remove();
  });
});
