import { expect } from 'chai';
import '../../src/ui/results-table.js';
import type { ResultsTable } from '../../src/ui/results-table.js';
import * as Comlink from 'comlink';
import type { AuditResult } from '../../src/core/audit/index.js';
import { reconcileSentence } from '../../src/core/audit/report.js';
import type { AuditApi } from '../../workers/audit.worker.js';
import { DEMO_SAMPLE_CSV } from '../../src/demo/demo-sample.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

/**
 * <results-table> on a real audit of the invented demo sample (run by the built worker, public/audit.worker.js): an expanded galaxy in
 * tension shows its attribution details, the Eddington shift (exact and first order), the time budget, P(ε > 1)
 * with the cosmology drawn and the ceiling's spread, and the reconciliation sentences; the sample summary
 * is the core's sentence, and file warnings show beside file errors.
 */
describe('<results-table> details of the audit', () => {
  // An empty line in the sample: the parser keeps a file warning for it.
  const csv = DEMO_SAMPLE_CSV.replace(/\n/, '\n\n');
  let result: AuditResult;
  let over: AuditResult['galaxies'][number];
  before(async () => {
    const w = new Worker(new URL('../../public/audit.worker.js', import.meta.url), { type: 'module' });
    const api = Comlink.wrap<AuditApi>(w);
    result = (await api.run({ id: 1, csv, choices: DEFAULT_CHOICES })).result!;
    w.terminate();
    over = result.galaxies.find((g) => g.verdict === 'over budget')!;
  });

  async function mount(): Promise<ResultsTable> {
    document.querySelectorAll('results-table').forEach((e) => e.remove());
    const el = document.createElement('results-table') as ResultsTable;
    el.result = result;
    document.body.append(el);
    await el.updateComplete;
    return el;
  }

  it('shows the new numbers of a galaxy in tension when its row is expanded', async () => {
    const el = await mount();
    const row = el.shadowRoot!.querySelector(`tr[data-id="${over.id}"]`)!;
    (row.querySelector('button.tog') as HTMLButtonElement).click();
    await el.updateComplete;
    const d = el.shadowRoot!.querySelector('tr.detail')!;
    const text = d.textContent!.replace(/\s+/g, ' ');
    const e = over.eddington!;
    expect(text).to.contain(`log M* lowered by ${e.shift_dex.toFixed(2)} dex (first order α σ² ln 10: ${e.shift_first_order_dex.toFixed(2)} dex`);
    const t = over.time_budget!;
    expect(text).to.contain(`${t.formed_mass_msun.toExponential(2)} Msun of stars formed while the ceiling halo accreted ${t.accreted_baryons_msun.toExponential(2)} Msun`);
    expect(text).to.contain(`P(ratio > 1) = ${t.p_ratio_over_1.toFixed(2)}`);
    expect(text).to.contain(`spread ${over.ceiling!.log_mass_cosmo_sd_dex!.toFixed(3)} dex`);
    const h = over.imf![over.headline_imf!];
    const headRow = [...d.querySelectorAll('tr')].find((r) => r.textContent!.includes('(headline)'))!;
    const cells = [...headRow.querySelectorAll('td')].map((c) => c.textContent!.trim());
    expect(cells[7]).to.equal(h.p_over_budget_cosmo!.toFixed(2));
    for (const a of over.attribution_detail!) expect(text).to.contain(`${a.cause} (via ${a.via}: ${a.verdict_after} after)`);
    const rc = [...d.querySelectorAll('p.rc')].map((p) => p.textContent!.replace(/\s+/g, ' ').trim());
    expect(rc).to.have.length(over.reconcile!.length);
    expect(rc.length).to.be.greaterThan(0);
    over.reconcile!.forEach((x, k) => expect(rc[k]).to.equal(reconcileSentence(x, 0.3, h.eps_required_median).trim()));
    // The whole detail block is inside its fixed-height box (no line clipped off the bottom).
    const box = d.querySelector('.d') as HTMLElement;
    const last = box.lastElementChild as HTMLElement;
    expect(last.getBoundingClientRect().bottom).to.be.at.most(box.getBoundingClientRect().bottom + 0.5);
  });

  it('words the sample with the core sentence and lists file warnings', async () => {
    const el = await mount();
    const s = [...el.shadowRoot!.querySelectorAll('p.sample')].map((p) => p.textContent!);
    expect(s).to.have.length(result.sample.bins.length);
    expect(s[0]).to.contain('judged like the galaxies at the 99.7% level');
    expect(result.sample.file_warnings.length).to.be.greaterThan(0);
    const w = el.shadowRoot!.querySelector('p.file-warnings')!.textContent!;
    expect(w).to.contain(result.sample.file_warnings[0]);
    expect(el.shadowRoot!.querySelector('p.file-errors')).to.equal(null);
  });

  it('explains the Eddington-driven cause', async () => {
    const el = await mount();
    const fake = { ...result, galaxies: result.galaxies.map((g) => (g.id === over.id ? { ...g, attribution: ['Eddington-driven'], attribution_detail: [{ cause: 'Eddington-driven', verdict_after: 'strained', via: 'debiased mass' }] } : g)) } as typeof result;
    el.result = fake;
    await el.updateComplete;
    const t = el.shadowRoot!.querySelector(`tr[data-id="${over.id}"] td.attr .term`)!;
    expect(t.textContent).to.equal('Eddington');
    expect(t.getAttribute('title')).to.contain('Eddington bias');
  });
});
