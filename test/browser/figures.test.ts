import { expect } from 'chai';
import '../../src/ui/audit-chart.js';
import type { AuditChart } from '../../src/ui/audit-chart.js';
import type { ChartModel } from '../../src/ui/chart/chart-config.js';
import { legibility } from '../../src/ui/chart/legibility.js';
import { pngInfo } from '../../src/ui/chart/png-dpi.js';
import { DASH, imfStyle } from '../../src/ui/palette.js';

/** <audit-chart>: print-size exports, legend line styles, the highlight label, thousands of points (invented data). */
const x = Float64Array.from({ length: 11 }, (_, i) => 7 + 0.4 * i);
const line = (d: number) => Array.from(x, (v) => 11.5 - 0.2 * (v - 7) + d);
function model(n = 6): ChartModel {
  const ids = Array.from({ length: n }, (_, i) => `P-${i}`);
  const s = imfStyle('salpeter');
  const markers = [{ label: 'salpeter', color: s.color, shape: s.shape, x: ids.map((_, i) => 7.2 + (3.6 * i) / n), y: ids.map((_, i) => 9 + ((i * 0.37) % 1) * 2), yLo: ids.map((_, i) => 8.8 + ((i * 0.37) % 1) * 2), yHi: ids.map((_, i) => 9.2 + ((i * 0.37) % 1) * 2), ids, tension: Uint8Array.from(ids, (_, i) => (i % 5 === 0 ? 1 : 0)) }];
  const leg = legibility(markers);
  return {
    id: 'fig-test',
    title: 'Test figure',
    xLabel: 'redshift z',
    yLabel: 'log10 M* [Msun]',
    caption: `Invented points for a test. ${leg.note}`,
    x,
    lines: [
      { label: 'solid line', color: '#000000', width: 2 },
      { label: 'dashed line', color: '#000000', dash: DASH.dashed },
      { label: 'band 16–84%', color: '#777777', dash: DASH.dotted },
      { label: 'band 84%', color: '#777777', dash: DASH.dotted, noLegend: true },
    ],
    lineData: [line(0), line(-0.5), line(-0.3), line(0.2)],
    bands: [[2, 3]],
    markers,
    points: leg.points,
    density: leg.density,
  };
}

async function mount(m: ChartModel): Promise<{ el: AuditChart; drawn: { markers: number; labels: string[] } }> {
  const el = document.createElement('audit-chart') as AuditChart;
  const drawn = new Promise<{ markers: number; labels: string[] }>((ok) => el.addEventListener('chart-drawn', (e) => ok((e as CustomEvent).detail), { once: true }));
  el.model = m;
  document.body.append(el);
  return { el, drawn: await drawn };
}
const nextDraw = (el: AuditChart) => new Promise<{ markers: number; labels: string[] }>((ok) => el.addEventListener('chart-drawn', (e) => ok((e as CustomEvent).detail), { once: true }));

describe('<audit-chart> exports for a journal', () => {
  it('exports a PNG 1039 px wide at 88 mm and 300 dpi (2126 px at 180 mm), with the resolution written in the file and the figure drawn', async () => {
    const { el } = await mount(model());
    const one = new Uint8Array(await (await el.png(88, 300)).arrayBuffer());
    expect(pngInfo(one)).to.include({ width: 1039, ppmX: 11811, ppmY: 11811 });
    const two = new Uint8Array(await (await el.png(180, 300)).arrayBuffer());
    expect(pngInfo(two).width).to.equal(2126);
    // The SVG was rasterised at that size: the frame and text leave dark pixels across the image.
    const bmp = await createImageBitmap(new Blob([one], { type: 'image/png' }));
    const c = new OffscreenCanvas(bmp.width, bmp.height);
    const ctx = c.getContext('2d')!;
    ctx.drawImage(bmp, 0, 0);
    const px = ctx.getImageData(0, 0, bmp.width, bmp.height).data;
    let dark = 0;
    for (let i = 0; i < px.length; i += 4) if (px[i] < 100 && px[i + 1] < 100 && px[i + 2] < 100) dark++;
    expect(dark).to.be.greaterThan(2000);
    el.remove();
  });

  it('exports at the width chosen on the page (select: single or double column)', async () => {
    const { el } = await mount(model());
    const sel = el.shadowRoot!.querySelector('select[aria-label="export width"]') as HTMLSelectElement;
    sel.value = '180';
    sel.dispatchEvent(new Event('change'));
    await el.updateComplete;
    const got = new Promise<{ name: string; blob: Blob }>((ok) => el.addEventListener('download', (e) => ok((e as CustomEvent).detail), { once: true }));
    (Array.from(el.shadowRoot!.querySelectorAll('button')).find((b) => b.textContent === 'PNG') as HTMLButtonElement).click();
    const d = await got;
    expect(d.name).to.equal('fig-test-180mm-300dpi.png');
    expect(pngInfo(new Uint8Array(await d.blob.arrayBuffer())).width).to.equal(2126);
    expect(el.svg()).to.match(/width="180mm"/);
    el.remove();
  });

  it('draws every legend line in its own style on the page and in the SVG, and keeps the band filled in the SVG', async () => {
    const { el } = await mount(model());
    const page = [...el.shadowRoot!.querySelectorAll('ul.legend li')].map((li) => ({ text: li.textContent!.trim(), dash: li.querySelector('line')?.getAttribute('stroke-dasharray') ?? null }));
    expect(page.slice(0, 3)).to.deep.equal([
      { text: 'solid line', dash: 'none' },
      { text: 'dashed line', dash: '8 5' },
      { text: 'band 16–84%', dash: '1.5 3' },
    ]);
    expect(page.map((p) => p.text)).to.not.include('band 84%');
    expect(page[3]).to.deep.equal({ text: 'salpeter', dash: null });
    const doc = new DOMParser().parseFromString(el.svg(), 'image/svg+xml');
    expect(doc.querySelector('parsererror')).to.equal(null);
    const legend = [...doc.querySelectorAll('line.legend-line')].map((l) => l.getAttribute('stroke-dasharray'));
    expect(legend).to.deep.equal([null, '4.8 3', '0.9 1.8']);
    expect(doc.querySelectorAll('polygon.band').length).to.equal(1);
    el.remove();
  });
});

describe('<audit-chart> highlight and labels', () => {
  it('rings and labels the highlighted galaxy on the canvas and in the exports, and labels galaxies in tension on request', async () => {
    const { el, drawn } = await mount(model());
    expect(drawn.labels).to.deep.equal([]);
    let d = nextDraw(el);
    el.highlight = 'P-3';
    expect((await d).labels).to.deep.equal(['P-3']);
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('figcaption')!.textContent).to.contain('Ringed and labelled: P-3.');
    const doc = new DOMParser().parseFromString(el.svg(), 'image/svg+xml');
    expect([...doc.querySelectorAll('text.label')].map((t) => t.textContent)).to.deep.equal(['P-3']);
    expect(doc.querySelectorAll('circle.highlight').length).to.equal(1);
    d = nextDraw(el);
    const box = el.shadowRoot!.querySelector('.tools input[type=checkbox]') as HTMLInputElement;
    expect(box.parentElement!.textContent).to.contain('label galaxies in tension');
    box.checked = true;
    box.dispatchEvent(new Event('change'));
    expect([...(await d).labels].sort()).to.deep.equal(['P-0', 'P-3', 'P-5']);
    d = nextDraw(el);
    el.highlight = 'nobody';
    expect((await d).labels.sort()).to.deep.equal(['P-0', 'P-5']);
    el.remove();
  });

  it('draws all of 8000 points, with a density layer, thinner bars and the galaxies in tension on top, and the caption says so', async () => {
    const m = model(8000);
    expect(m.density).to.not.equal(undefined);
    const t0 = performance.now();
    const { el, drawn } = await mount(m);
    const ms = performance.now() - t0;
    expect(drawn.markers).to.equal(8000);
    const cap = el.shadowRoot!.querySelector('figcaption')!.textContent!;
    expect(cap).to.contain('All 8000 points are drawn as small markers over a grey density layer');
    expect(cap).to.contain('drawn on top at full size');
    console.log(`8000 points: first draw ${ms.toFixed(0)} ms`);
    el.remove();
  });
});
