import { expect } from 'chai';

/**
 * The growth choice, the cosmological covariance (preset's errors or an imported CSV) and the headline IMF's
 * intrinsic UV slope on the page, end to end on the built bundle: choices reach the record and the saved
 * state; a bad covariance file is refused naming line and column; β comes from the worker.
 */
await import(new URL('../../public/app.js', import.meta.url).href);

type App = HTMLElement & { auditController?: { state: { status: string; settling?: boolean; response?: { result?: { record: { choices: Record<string, unknown> } } } } } };

async function until<T>(what: string, f: () => T | undefined | false | null, timeout = 50000): Promise<T> {
  const t0 = performance.now();
  for (;;) {
    const v = f();
    if (v) return v;
    if (performance.now() - t0 > timeout) throw new Error(`timed out waiting until ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
const panel = (app: App) => app.shadowRoot!.querySelector('choice-panel')!.shadowRoot!;
const recordChoices = (app: App) => app.auditController?.state.response?.result?.record.choices;
const saved = () => JSON.parse(localStorage.getItem('baryon-audit:state') ?? 'null');

function pickFile(input: HTMLInputElement, text: string, name: string): void {
  const dt = new DataTransfer();
  dt.items.add(new File([text], name, { type: 'text/csv' }));
  input.files = dt.files;
  input.dispatchEvent(new Event('change'));
}

describe('new choices on the page', () => {
  let app: App;
  before(async () => {
    localStorage.clear();
    app = document.createElement('baryon-audit-app') as App;
    document.body.append(app);
    await until('the first audit', () => recordChoices(app));
  });
  after(() => app.remove());

  it('shows the headline IMF’s intrinsic UV slope, computed in the worker (Salpeter, constant SFH, 100 Myr: the stars command gives −2.06, a value of our own model whose window test/core/stars/uv-slope.test.ts checks)', async () => {
    const line = await until('β is shown', () => panel(app).querySelector('p.uv strong'));
    expect(panel(app).querySelector('p.uv')!.textContent).to.contain('1300–2600 Å');
    expect(panel(app).querySelector('p.uv')!.textContent).to.contain('salpeter');
    expect(line.textContent).to.equal('-2.06');
  });

  it('chooses the growth factor with radiation: the record and the saved state keep it', async () => {
    const sel = panel(app).querySelector('select[aria-label="growth factor"]') as HTMLSelectElement;
    expect([...sel.options].map((o) => o.value)).to.deep.equal(['matter-lambda', 'with-radiation']);
    expect(sel.value).to.equal('matter-lambda');
    sel.value = 'with-radiation';
    sel.dispatchEvent(new Event('change'));
    await until('the audit with radiation in the growth', () => recordChoices(app)?.growth === 'with-radiation' && app.auditController!.state.status === 'done' && !app.auditController!.state.settling);
    await until('the saved state keeps the growth choice', () => saved()?.choices?.growth === 'with-radiation');
    sel.value = 'matter-lambda';
    sel.dispatchEvent(new Event('change'));
    await until('the default again, without the key', () => recordChoices(app) && !('growth' in recordChoices(app)!) && app.auditController!.state.status === 'done' && !app.auditController!.state.settling);
  });

  it('imports a covariance CSV into the choices, refuses a bad one naming line and column, and goes back to the preset’s errors', async () => {
    expect(panel(app).querySelector('.cov')!.textContent).to.contain('Planck');
    const input = panel(app).querySelector('input[aria-label="Import a covariance CSV file"]') as HTMLInputElement;
    const good = 'param,omega_b_h2,omega_c_h2,h0,n_s,sigma8\nomega_b_h2,2.25e-8,0,0,0,0\nomega_c_h2,0,1.44e-6,0,0,0\nh0,0,0,0.2916,0,0\nn_s,0,0,0,1.6e-5,0\nsigma8,0,0,0,0,3.6e-5\n';
    pickFile(input, good, 'invented-cov.csv');
    await until('the audit with the imported covariance', () => (recordChoices(app)?.cosmologyCovariance as { source?: string } | undefined)?.source?.includes('invented-cov.csv') && app.auditController!.state.status === 'done' && !app.auditController!.state.settling);
    const m = (recordChoices(app)!.cosmologyCovariance as { matrix: number[][] }).matrix;
    expect(m[2][2]).to.equal(0.2916);
    expect(panel(app).querySelector('.cov')!.textContent).to.contain('invented-cov.csv');
    pickFile(input, good.replace('0,0,0.2916,0,0', '0,0,abc,0,0'), 'broken-cov.csv');
    const msg = await until('the refusal', () => panel(app).querySelector('.cov .err'));
    expect(msg.textContent).to.contain('line 4');
    expect(msg.textContent).to.contain('column h0');
    expect(msg.textContent).to.contain('"abc"');
    expect((recordChoices(app)!.cosmologyCovariance as { source: string }).source).to.contain('invented-cov.csv'); // the previous one stays
    const preset = panel(app).querySelector('.cov input[type=radio]') as HTMLInputElement;
    preset.checked = true;
    preset.dispatchEvent(new Event('change'));
    await until('the preset’s errors again', () => recordChoices(app) && !('cosmologyCovariance' in recordChoices(app)!) && app.auditController!.state.status === 'done' && !app.auditController!.state.settling);
  });

  it('sets the Monte Carlo rule (fixed draws, precision): the record keeps it, the default leaves the keys out, and the results show each galaxy’s draws', async () => {
    type Galaxy = { id: string; status: string; monte_carlo?: { draws_made: number; stop: string } };
    const galaxies = () => (app.auditController!.state.response?.result as unknown as { galaxies: Galaxy[] } | undefined)?.galaxies ?? [];
    const settled = () => app.auditController!.state.status === 'done' && !app.auditController!.state.settling;
    const field = (label: string) => [...panel(app).querySelectorAll('label')].find((l) => l.textContent!.trim().startsWith(label))!.querySelector('input') as HTMLInputElement;
    const fixed = field('fixed draws');
    expect(fixed.type).to.equal('checkbox');
    expect(fixed.checked).to.equal(false);
    fixed.checked = true;
    fixed.dispatchEvent(new Event('change'));
    await until('the audit with fixed draws', () => recordChoices(app)?.fixedDraws === true && settled());
    const ok = galaxies().filter((g) => g.status === 'ok');
    expect(ok.length).to.be.greaterThan(0);
    for (const g of ok) expect(g.monte_carlo).to.deep.include({ draws_made: recordChoices(app)!.draws as number, stop: 'fixed' });
    // the results table's draws column and the Monte Carlo line of an expanded row
    const table = app.shadowRoot!.querySelector('results-table')!.shadowRoot!;
    const row = table.querySelector(`tr[data-id="${ok[0].id}"]`)!;
    expect(row.lastElementChild!.textContent!.trim()).to.equal(String(recordChoices(app)!.draws));
    (row.querySelector('button.tog') as HTMLButtonElement).click();
    await until('the expanded row', () => table.querySelector('tr.detail'));
    expect(table.querySelector('tr.detail')!.textContent).to.contain(`Monte Carlo: ${recordChoices(app)!.draws} draws (fixed number of draws)`);
    fixed.checked = false;
    fixed.dispatchEvent(new Event('change'));
    await until('adaptive again, without the key', () => recordChoices(app) && !('fixedDraws' in recordChoices(app)!) && settled());

    const precision = field('Monte Carlo precision');
    expect(precision.value).to.equal('0.03');
    precision.value = '0.9';
    precision.dispatchEvent(new Event('change'));
    await until('the range is named', () => panel(app).querySelector('[role="alert"]')?.textContent?.includes('[0.001, 0.5]'));
    precision.value = '0.05';
    precision.dispatchEvent(new Event('change'));
    await until('the audit at 0.05 dex', () => recordChoices(app)?.drawPrecisionDex === 0.05 && settled());
    await until('the saved state keeps it', () => saved()?.choices?.drawPrecisionDex === 0.05);
    precision.value = '0.03';
    precision.dispatchEvent(new Event('change'));
    await until('the default again, without the key', () => recordChoices(app) && !('drawPrecisionDex' in recordChoices(app)!) && settled());
  });
});
