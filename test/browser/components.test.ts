import { expect } from 'chai';
import { sendKeys } from '@web/test-runner-commands';
import '../../src/ui/sample-editor.js';
import '../../src/ui/results-table.js';
import '../../src/ui/audit-chart.js';
import type { AuditChart } from '../../src/ui/audit-chart.js';
import type { SampleEditor } from '../../src/ui/sample-editor.js';
import type { ChartModel } from '../../src/ui/chart/chart-config.js';

function mount<T extends HTMLElement>(tag: string): T {
  const el = document.createElement(tag) as T;
  document.body.append(el);
  return el;
}

describe('<sample-editor>', () => {
  it('marks the cells named in problems, keeps rejected rows visible, and shows cell markup as text', async () => {
    const el = mount<SampleEditor>('sample-editor');
    el.csv = 'id,z,muv\nA,9,-20\n<b>bold</b>,abc,-20\n';
    el.problems = [{ row: 2, column: 'z', reason: '"abc" is not a number' }];
    await el.updateComplete;
    const bad = el.shadowRoot!.querySelectorAll('td.bad input');
    expect(bad.length).to.equal(1);
    expect((bad[0] as HTMLInputElement).title).to.contain('not a number');
    expect(el.shadowRoot!.querySelectorAll('tr.rejected').length).to.be.greaterThan(0);
    expect(el.shadowRoot!.querySelector('b')).to.equal(null);
    const idInput = el.shadowRoot!.querySelector('input[aria-label="row 2, id"]') as HTMLInputElement;
    expect(idInput.value).to.equal('<b>bold</b>');
    el.remove();
  });

  it('fires sample-change with the edited CSV on a cell edit, on add and on delete', async () => {
    const el = mount<SampleEditor>('sample-editor');
    el.csv = 'id,z,muv\nA,9,-20\n';
    await el.updateComplete;
    const seen: string[] = [];
    el.addEventListener('sample-change', (e) => seen.push((e as CustomEvent).detail.csv));
    const z = el.shadowRoot!.querySelector('input[aria-label="row 1, z"]') as HTMLInputElement;
    z.value = '10.5';
    z.dispatchEvent(new Event('change'));
    expect(seen[0]).to.contain('A,10.5,-20');
    (Array.from(el.shadowRoot!.querySelectorAll('button')).find((b) => b.textContent === 'Add row') as HTMLButtonElement).click();
    expect(seen[1].trim().split('\n')).to.have.length(3);
    await el.updateComplete;
    (el.shadowRoot!.querySelector('button[aria-label="delete row 1"]') as HTMLButtonElement).click();
    expect(seen[2]).not.to.contain('A,10.5');
    el.remove();
  });

  it('imports a file through its <input type="file">', async () => {
    const el = mount<SampleEditor>('sample-editor');
    await el.updateComplete;
    const got = new Promise<string>((ok) => el.addEventListener('sample-change', (e) => ok((e as CustomEvent).detail.csv)));
    const input = el.shadowRoot!.querySelector('input[type=file]') as HTMLInputElement;
    const dt = new DataTransfer();
    dt.items.add(new File(['id,z,muv\nF,8,-21\n'], 'f.csv', { type: 'text/csv' }));
    input.files = dt.files;
    input.dispatchEvent(new Event('change'));
    expect(await got).to.contain('F,8,-21');
    el.remove();
  });
});

describe('<sample-editor> paste and drop', () => {
  it('takes rows pasted from a spreadsheet (tab-separated) and turns them into CSV', async () => {
    const el = mount<SampleEditor>('sample-editor');
    el.csv = 'id,z,muv\n';
    await el.updateComplete;
    (Array.from(el.shadowRoot!.querySelectorAll('button')).find((b) => b.textContent?.startsWith('Paste')) as HTMLButtonElement).click();
    await el.updateComplete;
    const ta = el.shadowRoot!.querySelector('textarea') as HTMLTextAreaElement;
    ta.value = 'id\tz\tmuv\nP-1\t9.5\t-21\nP-2\t8.1\t-20';
    const got = new Promise<string>((ok) => el.addEventListener('sample-change', (e) => ok((e as CustomEvent).detail.csv), { once: true }));
    (Array.from(el.shadowRoot!.querySelectorAll('button')).find((b) => b.textContent === 'Add pasted rows') as HTMLButtonElement).click();
    const csv = await got;
    expect(csv).to.contain('P-1,9.5,-21');
    expect(csv).to.contain('P-2,8.1,-20');
    el.remove();
  });
  it('imports a CSV file dropped on the table', async () => {
    const el = mount<SampleEditor>('sample-editor');
    el.csv = 'id,z,muv\nA,9,-20\n';
    await el.updateComplete;
    const got = new Promise<string>((ok) => el.addEventListener('sample-change', (e) => ok((e as CustomEvent).detail.csv), { once: true }));
    const dt = new DataTransfer();
    dt.items.add(new File(['id,z,muv\nDROP-1,7.5,-19\n'], 'drop.csv', { type: 'text/csv' }));
    el.shadowRoot!.querySelector('.scroll')!.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    expect(await got).to.contain('DROP-1,7.5,-19');
    el.remove();
  });
});

describe('<sample-editor> with 10⁴ rows (windowed)', () => {
  const focused = (el: SampleEditor) => el.shadowRoot!.activeElement?.getAttribute('aria-label');
  const ctrl = async (key: string) => {
    await sendKeys({ down: 'Control' });
    await sendKeys({ press: key });
    await sendKeys({ up: 'Control' });
  };
  const settled = async (el: SampleEditor) => {
    for (let i = 0; i < 4; i++) await el.updateComplete; // measuring the rows may ask for one more pass
  };

  it('draws only the rows in view; scrolled to the end it draws the last row, which can be edited; the keyboard reaches both ends', async () => {
    const rows = Array.from({ length: 10000 }, (_, i) => `W-${i + 1},${(7 + (i % 40) / 10).toFixed(1)},-20`);
    const el = mount<SampleEditor>('sample-editor');
    el.csv = `id,z,muv\n${rows.join('\n')}\n`;
    await settled(el);
    expect(el.drawnRows).to.be.greaterThan(5);
    expect(el.drawnRows).to.be.lessThan(120);
    const box = el.shadowRoot!.querySelector('.scroll') as HTMLElement;
    box.scrollTop = box.scrollHeight;
    box.dispatchEvent(new Event('scroll'));
    await settled(el);
    expect(el.drawnRows).to.be.lessThan(120);
    const last = el.shadowRoot!.querySelector('input[aria-label="row 10000, z"]') as HTMLInputElement;
    expect(last, 'the last row is drawn').to.not.equal(null);
    expect(el.shadowRoot!.querySelector('input[aria-label="row 1, z"]'), 'the first row is not').to.equal(null);
    const got = new Promise<string>((ok) => el.addEventListener('sample-change', (e) => ok((e as CustomEvent).detail.csv), { once: true }));
    last.value = '12.5';
    last.dispatchEvent(new Event('change'));
    const lines = (await got).trim().split('\n');
    expect(lines).to.have.length(10001);
    expect(lines[10000]).to.equal('W-10000,12.5,-20');
    expect(lines[9999]).to.equal(`W-9999,${(7 + (9998 % 40) / 10).toFixed(1)},-20`);
    // Keyboard: Ctrl+Home to the first row, Page Down by a page, Ctrl+End back to the last row.
    await settled(el);
    (el.shadowRoot!.querySelector('input[aria-label="row 10000, z"]') as HTMLInputElement).focus();
    await ctrl('Home');
    await settled(el);
    expect(focused(el)).to.equal('row 1, z');
    await sendKeys({ press: 'PageDown' });
    await settled(el);
    const after = Number(/^row (\d+),/.exec(focused(el) ?? '')?.[1]);
    expect(after).to.be.greaterThan(2);
    await sendKeys({ press: 'ArrowDown' });
    await settled(el);
    expect(focused(el)).to.equal(`row ${after + 1}, z`);
    await ctrl('End');
    await settled(el);
    expect(focused(el)).to.equal('row 10000, z');
    expect((el.shadowRoot!.activeElement as HTMLInputElement).value).to.equal('12.5');
    expect(el.drawnRows).to.be.lessThan(120);
    el.remove();
  });
});

describe('<audit-chart>', () => {
  const model: ChartModel = {
    id: 't',
    title: 'Test figure',
    xLabel: 'x [unit]',
    yLabel: 'y [unit]',
    caption: 'A caption that states the assumptions.',
    x: Float64Array.from([1, 2, 3]),
    lines: [{ label: 'line', color: '#000000' }],
    lineData: [[1, 2, 3]],
    markers: [{ label: '● pts', color: '#0072B2', shape: 'circle', x: [1.5, 2.5], y: [1.5, 2.2], yLo: [1.2, 2], yHi: [1.8, 2.4] }],
  };
  it('draws with uPlot, reports the markers drawn, and redraws with setData', async () => {
    const el = mount<AuditChart>('audit-chart');
    const drawn = new Promise<{ markers: number }>((ok) => el.addEventListener('chart-drawn', (e) => ok((e as CustomEvent).detail), { once: true }));
    el.model = model;
    const d = await drawn;
    expect(d.markers).to.equal(2);
    const canvas = el.shadowRoot!.querySelector('canvas') as HTMLCanvasElement;
    expect(canvas.width).to.be.greaterThan(0);
    const again = new Promise<void>((ok) => el.addEventListener('chart-drawn', () => ok(), { once: true }));
    el.model = { ...model, lineData: [[3, 2, 1]] };
    await again;
    expect(el.shadowRoot!.querySelectorAll('canvas').length).to.equal(1);
    el.remove();
  });
  it('exports an SVG with title, axis labels and caption, and a PNG', async () => {
    const el = mount<AuditChart>('audit-chart');
    const drawn = new Promise<void>((ok) => el.addEventListener('chart-drawn', () => ok(), { once: true }));
    el.model = model;
    await drawn;
    const svg = el.svg();
    expect(svg).to.contain('<svg');
    expect(svg).to.contain('Test figure');
    expect(svg).to.contain('x [unit]');
    expect(svg).to.contain('A caption that states the assumptions.');
    const doc = new DOMParser().parseFromString(svg, 'image/svg+xml');
    expect(doc.querySelector('parsererror')).to.equal(null);
    const png = await el.png();
    expect(png.type).to.equal('image/png');
    expect(png.size).to.be.greaterThan(1000);
    el.remove();
  });
});
