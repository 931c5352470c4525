import { expect } from 'chai';
import '../../src/ui/audit-chart.js';
import type { AuditChart } from '../../src/ui/audit-chart.js';
import type { ChartModel, MarkerSet } from '../../src/ui/chart/chart-config.js';
import { legibility, pointStyleFor } from '../../src/ui/chart/legibility.js';
import { PER_PATH } from '../../src/ui/chart/marker-batch.js';

/**
 * How <audit-chart> draws many markers: in batches (one Path2D per PER_PATH markers) and in slices of its
 * own tasks. What it draws must not depend on that: a translucent set is laid on at its opacity once, as
 * one path would be, however many batches it takes; every marker is counted, and `updateComplete` waits
 * for the last slice. Invented points.
 */
function model(sets: MarkerSet[]): ChartModel {
  const leg = legibility(sets);
  return {
    id: 'drawing-test',
    title: 'Drawing test',
    xLabel: 'x',
    yLabel: 'y',
    caption: 'Invented points.',
    x: Float64Array.of(0, 1),
    lines: [{ label: 'line', color: '#000000' }],
    lineData: [[0, 1]],
    markers: sets,
    points: leg.points,
    density: leg.density,
  };
}

function mount(m: ChartModel): { el: AuditChart; drawn: Promise<{ markers: number }> } {
  const el = document.createElement('audit-chart') as AuditChart;
  const drawn = new Promise<{ markers: number }>((ok) => el.addEventListener('chart-drawn', (e) => ok((e as CustomEvent).detail), { once: true }));
  el.model = m;
  document.body.append(el);
  return { el, drawn };
}

describe('<audit-chart> drawing many markers', () => {
  it('lays a translucent set of many batches on at its opacity once (markers of one set do not darken each other)', async () => {
    const n = 3000; // more than THIN_ABOVE: translucent markers; more than one batch
    expect(n).to.be.greaterThan(2 * PER_PATH);
    const st = pointStyleFor(n);
    expect(st.alpha).to.be.lessThan(1);
    // every marker at the same place: one path fills the spot once at the set's opacity
    const set: MarkerSet = { label: 'same place', color: '#0072B2', shape: 'square', x: new Float64Array(n).fill(0.33), y: new Float64Array(n).fill(0.33) };
    const { el, drawn } = mount(model([set]));
    expect((await drawn).markers).to.equal(n);
    await el.updateComplete;
    const canvas = el.shadowRoot!.querySelector('canvas')!;
    const ctx = canvas.getContext('2d')!;
    // the spot's opacity: the most common alpha among pixels of the marker's colour (the inside of the
    // square; its anti-aliased edge and the grid lines under it are few pixels)
    const img = ctx.getImageData(0, 0, canvas.width, canvas.height).data;
    const hist = new Map<number, number>();
    for (let i = 0; i < img.length; i += 4) if (img[i + 2] > 150 && img[i] < 40) hist.set(img[i + 3], (hist.get(img[i + 3]) ?? 0) + 1);
    const [alpha] = [...hist.entries()].sort((a, b) => b[1] - a[1])[0];
    expect(alpha / 255).to.be.closeTo(st.alpha, 0.02);
    el.remove();
  });

  it('counts every one of 50 000 markers, draws them over several tasks, and updateComplete waits for the last', async () => {
    const n = 10000;
    const sets: MarkerSet[] = ['circle', 'square', 'triangle', 'diamond', 'cross'].map((shape, k) => ({
      label: shape,
      color: '#009E73',
      shape: shape as MarkerSet['shape'],
      x: Float64Array.from({ length: n }, (_, i) => 7 + ((i * 0.618 + k * 0.1) % 1) * 4),
      y: Float64Array.from({ length: n }, (_, i) => 8 + ((i * 0.414) % 1) * 4),
      yLo: Float64Array.from({ length: n }, (_, i) => 7.8 + ((i * 0.414) % 1) * 4),
      yHi: Float64Array.from({ length: n }, (_, i) => 8.2 + ((i * 0.414) % 1) * 4),
      tension: Uint8Array.from({ length: n }, (_, i) => (i % 50 === 0 ? 1 : 0)),
    }));
    let drawnAt = 0;
    let tasks = 0;
    const { el, drawn } = mount(model(sets));
    const tick = (): void => {
      tasks++;
      if (!drawnAt) setTimeout(tick, 0);
    };
    setTimeout(tick, 0);
    void drawn.then(() => (drawnAt = performance.now()));
    await el.updateComplete;
    expect(drawnAt).to.be.greaterThan(0);
    expect((await drawn).markers).to.equal(5 * n);
    expect(tasks).to.be.greaterThan(1); // other tasks ran between the slices
    el.remove();
  });
});
