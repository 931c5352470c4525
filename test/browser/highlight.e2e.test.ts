import { expect } from 'chai';

/**
 * End to end on the built bundle: choosing a galaxy in the results table highlights it, ringed and labelled
 * with its id, in every figure that shows galaxies; the table's compact comparison has a mark per IMF.
 */
await import(new URL('../../public/app.js', import.meta.url).href);

function deepAll(root: ParentNode, sel: string, out: Element[] = []): Element[] {
  root.querySelectorAll(sel).forEach((e) => out.push(e));
  root.querySelectorAll('*').forEach((e) => e.shadowRoot && deepAll(e.shadowRoot, sel, out));
  return out;
}

describe('highlight of the chosen galaxy, end to end', () => {
  it('labels the galaxy chosen in the table in the mass–redshift, density and per-IMF figures', async () => {
    localStorage.clear();
    history.replaceState(null, '', location.pathname);
    const app = document.createElement('baryon-audit-app');
    const done = new Promise<void>((ok, bad) => {
      app.addEventListener('audit-complete', () => ok(), { once: true });
      app.addEventListener('audit-failed', (e) => !/restarted/.test((e as CustomEvent).detail.message) && bad(new Error((e as CustomEvent).detail.message)));
    });
    document.body.append(app);
    await done;
    const table = deepAll(app.shadowRoot!, 'results-table')[0];
    const row = table.shadowRoot!.querySelector('tr[data-id="QF-322"]')!;
    expect(row.querySelectorAll('td.imf svg.mark').length).to.equal(5);
    const charts = deepAll(app.shadowRoot!, 'audit-chart') as (HTMLElement & { highlight: string; svg(): string; updateComplete: Promise<boolean> })[];
    const labelled = new Map<string, string[]>();
    const seen = Promise.all(
      charts.slice(0, 3).map(
        (c) =>
          new Promise<void>((ok) => {
            const h = (e: Event) => {
              const d = (e as CustomEvent).detail;
              if (!d.labels.includes('QF-322')) return;
              labelled.set(d.id, d.labels);
              c.removeEventListener('chart-drawn', h);
              ok();
            };
            c.addEventListener('chart-drawn', h);
          }),
      ),
    );
    (row.querySelector('button.pick') as HTMLButtonElement).click();
    await seen;
    expect([...labelled.keys()].sort()).to.deep.equal(['density', 'galaxy-imfs', 'mass-redshift']);
    for (const c of charts.slice(0, 3)) {
      expect(c.highlight).to.equal('QF-322');
      expect(c.svg()).to.match(/<text class="label"[^>]*>QF-322<\/text>/);
    }
    app.remove();
  });
});
