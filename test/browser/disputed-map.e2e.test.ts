import { expect } from 'chai';
import { pngInfo } from '../../src/ui/chart/png-dpi.js';

/**
 * The fifth figure end to end on the built bundle: the demo's over-budget galaxy (invented) chosen in the
 * results, the worker computes its map, the element draws it, the ε = 1 contour is there, the exports have
 * the print size.
 */
await import(new URL('../../public/app.js', import.meta.url).href);

type MapFigure = HTMLElement & { map?: { id: string; contours: { eps: number; segments: unknown[] }[]; galaxy: { z: number; slope?: number } }; png(mm?: number, dpi?: number): Promise<Blob>; svg(mm?: number): string; updateComplete: Promise<boolean> };

function waitFor<T>(what: string, f: () => T | undefined | false, timeout = 60000): Promise<T> {
  const t0 = performance.now();
  return new Promise((resolve, reject) => {
    const tick = () => {
      const v = f();
      if (v) return resolve(v);
      if (performance.now() - t0 > timeout) return reject(new Error(`timed out waiting for ${what}`));
      setTimeout(tick, 50);
    };
    tick();
  });
}

describe('the map of a disputed galaxy (fifth figure)', () => {
  it('draws for the over-budget demo galaxy, with the ε = 1 contour, and exports at print size', async () => {
    localStorage.clear();
    const app = document.createElement('baryon-audit-app');
    document.body.append(app);
    const table = await waitFor('the results', () => (app.shadowRoot?.querySelector('results-table')?.shadowRoot?.querySelector('tr[data-id]') ? app.shadowRoot!.querySelector('results-table')! : undefined));
    const over = [...table.shadowRoot!.querySelectorAll('tr[data-id]')].find((r) => r.querySelector('.verdict')?.textContent === 'over budget');
    expect(over, 'the demo has an over-budget galaxy').to.exist;
    const id = over!.getAttribute('data-id')!;
    const fig = app.shadowRoot!.querySelector('disputed-map-figure') as MapFigure;
    const drawn = new Promise<{ id: string; cells: number; contours: { eps: number; lines: number }[] }>((ok) => {
      const on = (e: Event) => {
        const d = (e as CustomEvent).detail;
        if (d.id === id) {
          fig.removeEventListener('map-drawn', on);
          ok(d);
        }
      };
      fig.addEventListener('map-drawn', on);
    });
    (over!.querySelector('button.pick') as HTMLButtonElement).click();
    const d = await drawn;
    expect(d.cells).to.be.greaterThan(100);
    const eps1 = d.contours.find((c) => c.eps === 1);
    expect(eps1, 'the ε = 1 contour').to.exist;
    expect(eps1!.lines).to.be.greaterThan(0);
    expect(d.contours.some((c) => c.eps === 0.3 && c.lines > 0), 'the ε_ref contour').to.equal(true);
    // The map itself: the galaxy sits on the map at its own redshift, and ε_req = 1 is crossed somewhere.
    expect(fig.map!.id).to.equal(id);
    expect(fig.map!.galaxy.z).to.equal(9.63);
    expect(fig.map!.galaxy.slope).to.equal(2.35); // its headline IMF is Salpeter (1955): α = 2.35
    // On screen: viridis cells were painted (a pixel in the middle of the plot is not white or grey).
    const canvas = fig.shadowRoot!.querySelector('canvas')!;
    expect(canvas.width).to.be.greaterThan(300);
    const px = canvas.getContext('2d')!.getImageData(Math.round(canvas.width / 2), Math.round(canvas.height * 0.25), 1, 1).data;
    expect(Math.max(px[0], px[1], px[2]) - Math.min(px[0], px[1], px[2])).to.be.greaterThan(30);
    // Exports: 88 mm at 300 dpi is 1039 px (88 / 25.4 × 300), the resolution written into the file.
    const one = pngInfo(new Uint8Array(await (await fig.png(88, 300)).arrayBuffer()));
    expect(one).to.include({ width: 1039, ppmX: 11811, ppmY: 11811 });
    expect(pngInfo(new Uint8Array(await (await fig.png(180, 300)).arrayBuffer())).width).to.equal(2126);
    const svg = new DOMParser().parseFromString(fig.svg(180), 'image/svg+xml');
    expect(svg.documentElement.getAttribute('width')).to.equal('180mm');
    expect(svg.querySelectorAll('path.contour-eps1').length).to.be.greaterThan(0);
    expect(svg.querySelectorAll('path.contour-ref')[0].getAttribute('stroke-dasharray')).to.not.equal(null);
    expect(svg.querySelectorAll('circle.galaxy').length).to.equal(2); // on the map and in the legend
    const desc = svg.querySelector('desc')!.textContent!;
    for (const s of ['custom:0.1:1.3:0.5:α:100', 'ε_req = 1', 'ε_ref = 0.3', '99.7% quantile', 'Sheth', 'Eisenstein', 'arcmin²', 'Δz = 1', 'SFH constant']) expect(desc).to.contain(s);
    app.remove();
  });
  it('under a first look, is asked for only once the first figures are drawn', async () => {
    localStorage.clear();
    const log: string[] = [];
    const Original = window.Worker;
    // every call the page makes to a worker, by method name, beside the figures' draws, in order
    window.Worker = class extends Original {
      constructor(url: string | URL, options?: WorkerOptions) {
        super(url, options);
        const post = this.postMessage.bind(this) as (m: unknown, t?: Transferable[]) => void;
        this.postMessage = ((m: { type?: string; path?: string[] }, t?: Transferable[]) => {
          if (m?.type === 'APPLY') log.push(`call:${m.path?.join('.')}`);
          post(m, t);
        }) as Worker['postMessage'];
      }
    };
    const onDrawn = (e: Event) => log.push(`drawn:${(e as CustomEvent).detail.id}`);
    const onComplete = () => log.push('audit-complete');
    document.addEventListener('chart-drawn', onDrawn);
    document.addEventListener('audit-complete', onComplete);
    const app = document.createElement('baryon-audit-app') as HTMLElement & { auditController?: { firstLooks: boolean } };
    try {
      document.body.append(app);
      await waitFor('the first audit', () => log.includes('audit-complete'));
      await waitFor('a second worker ready for first looks', () => app.auditController?.firstLooks);
      const from = log.length;
      const panel = app.shadowRoot!.querySelector('choice-panel')!;
      const seed = [...panel.shadowRoot!.querySelectorAll('input[type=number]')].find((x) => x.parentElement!.textContent!.startsWith('seed')) as HTMLInputElement;
      seed.value = '4242';
      seed.dispatchEvent(new Event('change'));
      await waitFor('the edit audited and its map asked for', () => log.indexOf('audit-complete', from) > 0 && log.indexOf('call:map', from) > 0);
      const mapAt = log.indexOf('call:map', from);
      for (const fig of ['mass-redshift', 'density', 'galaxy-imfs']) {
        const drawnAt = log.indexOf(`drawn:${fig}`, from);
        expect(drawnAt, `${fig} drawn`).to.be.greaterThan(-1);
        expect(mapAt, `the map asked for after ${fig} was drawn`).to.be.greaterThan(drawnAt);
      }
    } finally {
      window.Worker = Original;
      document.removeEventListener('chart-drawn', onDrawn);
      document.removeEventListener('audit-complete', onComplete);
      app.remove();
    }
  });
});
