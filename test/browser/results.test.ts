import { expect } from 'chai';
import '../../src/ui/results-table.js';
import type { ResultsTable } from '../../src/ui/results-table.js';
import type { AuditResult } from '../../src/core/audit/index.js';
import { imfStyle } from '../../src/ui/palette.js';

/**
 * <results-table> with thousands of rows (invented rows, built here: the table is a view, so the audit is not
 * run): windowing, keyboard navigation, sorting, filtering, the compact comparison per IMF and its expansion.
 */
const IMFS = ['salpeter', 'kroupa', 'top-heavy-flat'];
const VERDICTS = ['within budget', 'strained', 'over budget'] as const;
const verdictOf = (eps: number) => (eps > 1 ? 'over budget' : eps > 0.3 ? 'strained' : 'within budget');

function fixture(n: number): AuditResult {
  const galaxies = Array.from({ length: n }, (_, i) => {
    if (i % 97 === 5) return { row: i + 1, id: `R-${i}`, status: 'rejected', errors: [{ row: i + 1, column: 'z', reason: '"x" is not a number' }], survey: '', input: { z: 'x' } };
    const base = 0.02 + ((i * 0.6180339887) % 1) * 2;
    const imf = Object.fromEntries(
      IMFS.map((name, k) => {
        const e = base / (1 + 2 * k);
        return [name, { verdict: verdictOf(e), log_mstar_median: 9 + e, log_mstar_p16: 8.8 + e, log_mstar_p84: 9.2 + e, eps_required_median: e, eps_required_p05: e / 2, eps_required_p95: e * 2, p_over_budget: Math.min(1, e / 2), p_strained: Math.min(1, e), eps_required_median_debiased: e * 0.9, eps_required_median_cv: e * 0.8, verdict_cv: verdictOf(e * 0.8) }];
      }),
    );
    const headline = i % 3 === 0 ? 'kroupa' : 'salpeter';
    return {
      row: i + 1,
      id: `G-${String(i).padStart(5, '0')}`,
      status: 'ok',
      errors: [],
      survey: '',
      input: { z: (7 + (i % 40) / 10).toFixed(1) },
      headline_imf: headline,
      verdict: imf[headline].verdict,
      attribution: imf[headline].verdict === 'within budget' ? [] : ['IMF-driven'],
      imf,
      ceiling: { slice_z_min: 7, slice_z_max: 8, halo_mass_at_quantile_msun: 1e12, halo_mass_at_quantile_cv_msun: 1.2e12, stellar_ceiling_msun: 1.5e11, sigma_dm: 0.1, bias_smt01: 8 },
    };
  });
  return { galaxies, sample: { bins: [], accepted: n, rejected: 0, extra_columns: [], file_errors: [] }, caution: '', record: { choices: { epsRef: 0.3 } } } as unknown as AuditResult;
}

const frame = () => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
async function mount(n: number): Promise<ResultsTable> {
  const el = document.createElement('results-table') as ResultsTable;
  el.result = fixture(n);
  document.body.append(el);
  await el.updateComplete;
  await frame();
  await el.updateComplete;
  return el;
}
const q = (el: ResultsTable, s: string) => el.shadowRoot!.querySelector(s) as HTMLElement;
const qa = (el: ResultsTable, s: string) => [...el.shadowRoot!.querySelectorAll(s)] as HTMLElement[];
const rowIds = (el: ResultsTable) => qa(el, 'tr[data-id]').map((r) => r.dataset.id!);

describe('<results-table> with 5000 rows', () => {
  const N = 5000;
  let el: ResultsTable;
  beforeEach(async () => {
    el = await mount(N);
  });
  afterEach(() => el.remove());

  it('renders only the rows in view, and scrolling to the end shows the last row inside the viewport', async () => {
    const rendered = qa(el, 'tr[data-id]').length;
    expect(rendered).to.be.greaterThan(5);
    expect(rendered).to.be.lessThan(80);
    const scroller = q(el, '.scroll');
    expect(scroller.scrollHeight).to.be.greaterThan(N * 20);
    scroller.scrollTop = scroller.scrollHeight;
    scroller.dispatchEvent(new Event('scroll'));
    await frame();
    await el.updateComplete;
    const last = q(el, `tr[data-id="G-0${N - 1}"]`);
    expect(last, 'last row rendered').to.not.equal(null);
    const a = last.getBoundingClientRect();
    const b = scroller.getBoundingClientRect();
    expect(a.bottom).to.be.at.most(b.bottom + 1);
    expect(a.top).to.be.at.least(b.top);
    expect(qa(el, 'tr[data-id]').length).to.be.lessThan(80);
    // The active row follows the scroll, so the table's active descendant is always a rendered row.
    const active = q(el, 'table').getAttribute('aria-activedescendant')!;
    expect(el.shadowRoot!.getElementById(active), active).to.not.equal(null);
  });

  it('moves with the keyboard: End reaches the last row, ↑ the one before, Home the first; Enter selects', async () => {
    const table = q(el, 'table');
    table.focus();
    const key = async (k: string) => {
      table.dispatchEvent(new KeyboardEvent('keydown', { key: k, bubbles: true, composed: true }));
      await el.updateComplete;
      await frame();
      await el.updateComplete;
    };
    await key('End');
    expect(q(el, 'tr.active')?.dataset.id).to.equal(`G-0${N - 1}`);
    expect(table.getAttribute('aria-activedescendant')).to.equal(`row-${N - 1}`);
    await key('ArrowUp');
    expect(q(el, 'tr.active')?.dataset.id).to.equal(`G-0${N - 2}`);
    expect(q(el, '.explain').textContent).to.contain(`G-0${N - 2}:`);
    await key('Home');
    expect(q(el, 'tr.active')?.dataset.id).to.equal('G-00000');
    const picked = new Promise<string>((ok) => el.addEventListener('galaxy-select', (e) => ok((e as CustomEvent).detail.id), { once: true }));
    await key('Enter');
    expect(await picked).to.equal('G-00000');
  });

  it('sorts by ε under one IMF (either way) and by id', async () => {
    const rows = el.result!.galaxies.filter((g) => g.status === 'ok');
    const byEps = [...rows].sort((a, b) => b.imf!['kroupa'].eps_required_median - a.imf!['kroupa'].eps_required_median);
    const header = qa(el, 'th button.sort').find((b) => b.textContent!.includes('kroupa'))!;
    header.click();
    await el.updateComplete;
    expect(rowIds(el)[0]).to.equal(byEps[0].id);
    expect(header.closest('th')!.getAttribute('aria-sort')).to.equal('descending');
    header.click();
    await el.updateComplete;
    expect(rowIds(el)[0]).to.equal(byEps[byEps.length - 1].id);
    const idHead = qa(el, 'th button.sort').find((b) => b.textContent!.startsWith('galaxy'))!;
    idHead.click();
    await el.updateComplete;
    expect(rowIds(el).slice(0, 2)).to.deep.equal(['G-00000', 'G-00001']);
  });

  it('filters by verdict: only over budget leaves exactly the over-budget rows', async () => {
    const over = el.result!.galaxies.filter((g) => g.verdict === 'over budget').length;
    for (const label of qa(el, '.bar label')) {
      const box = label.querySelector('input[type=checkbox]') as HTMLInputElement | null;
      if (box && !label.textContent!.includes('over budget')) {
        box.checked = false;
        box.dispatchEvent(new Event('change'));
      }
    }
    await el.updateComplete;
    expect(q(el, '.bar [role=status]').textContent).to.equal(`${over} of ${N} rows`);
    expect(el.shownIds.length).to.equal(over);
    const shown = qa(el, 'tr[data-id] .verdict').map((v) => v.textContent);
    expect(shown.length).to.be.greaterThan(0);
    expect(new Set(shown)).to.deep.equal(new Set(['over budget']));
  });
});

describe('<results-table> compact comparison', () => {
  it('shows one mark per IMF in its palette colour and shape, the verdict in text, and the headline IMF beside the headline verdict', async () => {
    const el = await mount(12);
    const g = el.result!.galaxies[1];
    const row = q(el, `tr[data-id="${g.id}"]`);
    const cells = [...row.querySelectorAll('td.imf')];
    expect(cells.length).to.equal(IMFS.length);
    cells.forEach((td, k) => {
      const v = g.imf![IMFS[k]];
      const shape = td.querySelector('svg.mark > *')!;
      const colour = imfStyle(IMFS[k]).color;
      expect([shape.getAttribute('fill'), shape.getAttribute('stroke')]).to.include(colour);
      expect(shape.tagName).to.equal(imfStyle(IMFS[k]).shape === 'circle' ? 'circle' : 'polygon');
      expect(td.textContent).to.contain(`${IMFS[k]}: ${v.verdict}`);
      expect(td.querySelector('.eps')!.textContent).to.equal(v.eps_required_median >= 0.01 ? v.eps_required_median.toFixed(2) : v.eps_required_median.toExponential(1));
    });
    // A filled mark for over budget, a hollow one within budget: the verdict is not carried by colour alone.
    const fills = cells.map((td) => td.querySelector('svg.mark > *')!.getAttribute('fill'));
    cells.forEach((td, k) => {
      if (g.imf![IMFS[k]].verdict === 'within budget') expect(fills[k]).to.equal('#fff');
      if (g.imf![IMFS[k]].verdict === 'over budget') expect(fills[k]).to.equal(imfStyle(IMFS[k]).color);
    });
    expect(VERDICTS).to.include(row.querySelector('.verdict')!.textContent);
    const head = row.querySelector('.verdict')!.nextElementSibling!;
    expect(head.textContent).to.contain(`under ${g.headline_imf}`);
    expect(head.querySelector('svg.mark > *')!.getAttribute('fill')).to.equal(imfStyle(g.headline_imf!).color);
    expect(row.querySelector('td.imf.head')!.textContent).to.contain(g.headline_imf);
    el.remove();
  });

  it('expands a row to the full numbers by click and by → on the keyboard, and explains a column heading on focus', async () => {
    const el = await mount(12);
    const g = el.result!.galaxies[0];
    (q(el, `tr[data-id="${g.id}"] button.tog`) as HTMLButtonElement).click();
    await el.updateComplete;
    let detail = q(el, 'tr.detail');
    expect(detail).to.not.equal(null);
    const v = g.imf!['top-heavy-flat'];
    expect(detail.textContent).to.contain(`${v.log_mstar_median.toFixed(2)} (${v.log_mstar_p16.toFixed(2)}–${v.log_mstar_p84.toFixed(2)})`);
    expect(detail.textContent).to.contain('Eddington-corrected');
    (q(el, `tr[data-id="${g.id}"] button.tog`) as HTMLButtonElement).click();
    await el.updateComplete;
    expect(q(el, 'tr.detail')).to.equal(null);
    const table = q(el, 'table');
    table.focus();
    table.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowDown', bubbles: true }));
    table.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
    await el.updateComplete;
    detail = q(el, 'tr.detail');
    expect(detail.previousElementSibling!.getAttribute('data-id')).to.equal(el.result!.galaxies[1].id);
    const zHead = qa(el, 'th button.sort').find((b) => b.textContent!.trim() === 'z')!;
    zHead.focus();
    await el.updateComplete;
    expect(q(el, '.explain').textContent).to.equal('redshift as given');
    el.remove();
  });
});
