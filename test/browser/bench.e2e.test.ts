import { expect } from 'chai';
import { sendKeys, setViewport } from '@web/test-runner-commands';

/**
 * The page as a bench, end to end on the built bundle: rows added and deleted, pasted blocks appended or
 * (under other columns) replacing the sample after asking, undo and redo (buttons and keys), the demo
 * brought back, the survey and the headline IMF edited, results marked out of date while a choice is
 * invalid, and no sideways overflow at desktop and phone sizes.
 */
await import(new URL('../../public/app.js', import.meta.url).href);

type App = HTMLElement & { updateComplete: Promise<boolean>; undo(): void; redo(): void };

function nextAudit(app: HTMLElement, timeout = 50000): Promise<{ id: number }> {
  return new Promise((resolve, reject) => {
    const t = setTimeout(() => reject(new Error('no audit-complete within the time limit')), timeout);
    const done = (e: Event) => {
      clearTimeout(t);
      app.removeEventListener('audit-failed', fail);
      resolve((e as CustomEvent).detail);
    };
    const fail = (e: Event) => {
      clearTimeout(t);
      app.removeEventListener('audit-complete', done);
      reject(new Error(`audit failed: ${(e as CustomEvent).detail.message}`));
    };
    app.addEventListener('audit-complete', done, { once: true });
    app.addEventListener('audit-failed', fail, { once: true });
  });
}

/** Elements matching `sel` anywhere in the app's shadow trees; "host inner" looks inside every <host>. */
function deep(app: HTMLElement, sel: string): HTMLElement[] {
  const out: HTMLElement[] = [];
  const m = /^([a-z]+-[a-z-]+)\s+(.+)$/.exec(sel);
  const visit = (root: ParentNode) => {
    if (m) root.querySelectorAll(m[1]).forEach((h) => h.shadowRoot && h.shadowRoot.querySelectorAll<HTMLElement>(m[2]).forEach((e) => out.push(e)));
    else root.querySelectorAll<HTMLElement>(sel).forEach((e) => out.push(e));
    root.querySelectorAll('*').forEach((e) => e.shadowRoot && visit(e.shadowRoot));
  };
  visit(app.shadowRoot!);
  return [...new Set(out)];
}

const button = (app: HTMLElement, name: string): HTMLButtonElement => {
  const b = deep(app, 'button').find((x) => (x.getAttribute('aria-label') ?? x.textContent?.trim()) === name);
  if (!b) throw new Error(`no button "${name}"`);
  return b as HTMLButtonElement;
};
const cell = (app: HTMLElement, label: string): HTMLInputElement => {
  const c = deep(app, `sample-editor input[aria-label="${label}"]`)[0];
  if (!c) throw new Error(`no cell "${label}"`);
  return c as HTMLInputElement;
};
const ids = (app: HTMLElement): string[] => deep(app, 'sample-editor input[aria-label$=", id"]').map((i) => (i as HTMLInputElement).value);
const verdictIds = (app: HTMLElement): string[] => deep(app, 'results-table tr[data-id]').map((r) => r.getAttribute('data-id') ?? '');
const settle = async (app: App) => {
  await app.updateComplete;
  for (const el of deep(app, 'sample-editor, survey-editor, choice-panel')) await (el as unknown as App).updateComplete;
};

/** Waits until `pred` holds (polling), failing with `what` after the time limit. */
async function until(pred: () => boolean, what: string, timeout = 50000): Promise<void> {
  const t0 = performance.now();
  while (!pred()) {
    if (performance.now() - t0 > timeout) throw new Error(`timed out waiting until ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
const saved = () => JSON.parse(localStorage.getItem('baryon-audit:state') ?? 'null');
const current = (app: HTMLElement) => deep(app, '.out')[0]?.getAttribute('data-state') === 'current';
/** After an edit: the page has drawn it, then a run brings results that match the inputs again. */
async function caughtUp(app: App, what: string): Promise<void> {
  await settle(app);
  await until(() => current(app), what);
}

async function freshApp(): Promise<App> {
  document.querySelectorAll('baryon-audit-app').forEach((e) => e.remove());
  history.replaceState(null, '', location.pathname + location.search);
  const app = document.createElement('baryon-audit-app') as App;
  const first = nextAudit(app);
  document.body.append(app);
  await first;
  return app;
}

async function paste(app: App, text: string): Promise<void> {
  if (!deep(app, 'sample-editor textarea').length) {
    button(app, 'Paste from spreadsheet').click();
    await settle(app);
  }
  (deep(app, 'sample-editor textarea')[0] as HTMLTextAreaElement).value = text;
  button(app, 'Add pasted rows').click();
  await settle(app);
}

const DEMO_IDS = ['QF-101', 'QF-214', 'QF-322', 'QF-407', 'QF-518', 'QF-630', 'QF-745', 'QF-853'];

describe('the bench: editing the sample', () => {
  beforeEach(() => localStorage.clear());

  it('adds a row by click, Enter and Space; the blank rows survive a run and a reload', async () => {
    const app = await freshApp();
    const add = button(app, 'Add row');
    const ran = nextAudit(app);
    add.click();
    await ran;
    await settle(app);
    expect(deep(app, 'sample-editor tr[data-row]')).to.have.length(9);
    add.focus();
    await sendKeys({ press: 'Enter' });
    await settle(app);
    expect(deep(app, 'sample-editor tr[data-row]')).to.have.length(10);
    add.focus();
    await sendKeys({ press: 'Space' });
    await settle(app);
    expect(deep(app, 'sample-editor tr[data-row]')).to.have.length(11);
    // The new row takes the focus, ready to type into.
    expect(deep(app, 'sample-editor input:focus')[0]?.getAttribute('aria-label')).to.equal('row 11, id');
    await until(() => saved()?.sample_csv.trim().split('\n').length === 12, 'the saved state holds 11 rows');
    app.remove();
    const again = await freshApp();
    expect(deep(again, 'sample-editor tr[data-row]')).to.have.length(11);
    expect(verdictIds(again)).to.have.length(8); // blank rows are not audited
    again.remove();
  });

  it('appends pasted rows with the same header (any case) or none, and audits them', async () => {
    const app = await freshApp();
    await paste(app, 'ID\tZ\tMUV\nNEW-1\t9.5\t-21\nNEW-2\t8.1\t-20');
    expect(ids(app)).to.deep.equal([...DEMO_IDS, 'NEW-1', 'NEW-2']);
    expect(cell(app, 'row 9, muv').value).to.equal('-21');
    expect(cell(app, 'row 9, z_lo').value).to.equal('');
    await paste(app, 'NEW-3,7.7,7.6,7.8,,,-19.5');
    expect(ids(app)).to.have.length(11);
    expect(cell(app, 'row 11, z_hi').value).to.equal('7.8');
    await caughtUp(app, 'the results match the pasted sample');
    const v = verdictIds(app);
    for (const id of ['NEW-1', 'NEW-2', 'NEW-3', ...DEMO_IDS]) expect(v).to.include(id);
    app.remove();
  });

  it('asks before a block under other columns replaces the sample; Append merges the columns', async () => {
    const app = await freshApp();
    await paste(app, 'id,z,log_mstar,imf_ref,colour\nM-1,9,10.5,salpeter,red\nM-2,8,abc,salpeter,blue');
    expect(ids(app)).to.deep.equal(DEMO_IDS); // nothing changed yet: it asks
    const ask = deep(app, 'sample-editor .ask')[0];
    expect(ask?.textContent).to.contain('names other columns');
    const ran = nextAudit(app);
    button(app, 'Replace the sample').click();
    await ran;
    await settle(app);
    expect(ids(app)).to.deep.equal(['M-1', 'M-2']);
    // The pasted bad cell gets the audit's message on its cell.
    const bad = cell(app, 'row 2, log_mstar');
    expect(bad.getAttribute('aria-invalid')).to.equal('true');
    expect(bad.title).to.contain('abc');
    // Back to the demo, then append the same block: columns matched by name, the new one added.
    app.undo();
    await settle(app);
    await paste(app, 'id,z,log_mstar,imf_ref,colour\nM-1,9,10.5,salpeter,red');
    button(app, 'Append the rows').click();
    await settle(app);
    expect(ids(app)).to.deep.equal([...DEMO_IDS, 'M-1']);
    expect(cell(app, 'row 9, colour').value).to.equal('red');
    expect(cell(app, 'row 9, log_mstar').value).to.equal('10.5');
    expect(cell(app, 'row 1, colour').value).to.equal('');
    app.remove();
  });

  it('refuses a headerless line wider than the table with a message, keeping the pasted text', async () => {
    const app = await freshApp();
    const wide = 'X-1,' + new Array(20).fill('1').join(',');
    await paste(app, wide);
    expect(deep(app, 'sample-editor .paste [role=alert]')[0]?.textContent).to.contain('line 1 has 21 cells');
    expect((deep(app, 'sample-editor textarea')[0] as HTMLTextAreaElement).value).to.equal(wide);
    expect(ids(app)).to.deep.equal(DEMO_IDS);
    app.remove();
  });

  it('deletes a row, and its galaxy leaves the results', async () => {
    const app = await freshApp();
    const ran = nextAudit(app);
    button(app, 'delete row 2').click();
    await ran;
    expect(ids(app)).to.deep.equal(DEMO_IDS.filter((i) => i !== 'QF-214'));
    expect(verdictIds(app)).to.not.include('QF-214');
    app.remove();
  });

  it('undoes and redoes edits with the buttons and with Ctrl-Z / Shift-Ctrl-Z', async () => {
    const app = await freshApp();
    expect(button(app, 'Undo').disabled).to.equal(true);
    const z = cell(app, 'row 1, z');
    z.value = '9.99';
    z.dispatchEvent(new Event('change'));
    button(app, 'delete row 3').click();
    await settle(app);
    expect(ids(app)).to.not.include('QF-322');
    button(app, 'Undo').click();
    await settle(app);
    expect(ids(app)).to.include('QF-322');
    expect(cell(app, 'row 1, z').value).to.equal('9.99');
    button(app, 'Undo').click();
    await settle(app);
    expect(cell(app, 'row 1, z').value).to.equal('7.42');
    button(app, 'Redo').click();
    await settle(app);
    expect(cell(app, 'row 1, z').value).to.equal('9.99');
    // Keys, with the focus on a page control (not inside a field being typed into).
    button(app, 'Demo sample').focus();
    await sendKeys({ down: 'Control' });
    await sendKeys({ press: 'z' });
    await sendKeys({ up: 'Control' });
    await settle(app);
    expect(cell(app, 'row 1, z').value).to.equal('7.42');
    await sendKeys({ down: 'Control' });
    await sendKeys({ down: 'Shift' });
    await sendKeys({ press: 'Z' });
    await sendKeys({ up: 'Shift' });
    await sendKeys({ up: 'Control' });
    await settle(app);
    expect(cell(app, 'row 1, z').value).to.equal('9.99');
    // In a cell: while typing, Ctrl-Z is the cell's own; once the text is committed (Enter), it undoes the edit.
    const id2 = cell(app, 'row 2, id');
    id2.focus();
    id2.select();
    await sendKeys({ type: 'NEW-ID' });
    await sendKeys({ press: 'Enter' });
    await settle(app);
    expect(ids(app)[1]).to.equal('NEW-ID');
    await sendKeys({ press: 'ArrowUp' });
    await settle(app);
    expect(deep(app, 'sample-editor input:focus')[0]?.getAttribute('aria-label')).to.equal('row 2, id');
    await sendKeys({ down: 'Control' });
    await sendKeys({ press: 'z' });
    await sendKeys({ up: 'Control' });
    await settle(app);
    expect(ids(app)[1]).to.equal('QF-214');
    expect(cell(app, 'row 1, z').value).to.equal('9.99');
    // The results and the saved state follow the state undone to.
    button(app, 'Undo').click();
    await caughtUp(app, 'the results match the state undone to');
    expect(deep(app, 'results-table tr[data-id="QF-101"] td')[1].textContent).to.equal('7.42');
    await until(() => saved()?.sample_csv.includes('QF-101,7.42'), 'the saved state is the one undone to');
    app.remove();
  });

  it('keeps the text being typed into a cell while a run\'s results arrive, and Enter commits it', async () => {
    const app = await freshApp();
    // Row 1's z is edited and the user moves on to row 2's id: z's change event starts a run whose results
    // bring a new problem (z_hi = 7.55 is below z = 9.99). The first letters are typed in the same task,
    // so they are in the cell, uncommitted, before those results can arrive.
    const ran = nextAudit(app);
    const z = cell(app, 'row 1, z');
    z.value = '9.99';
    z.dispatchEvent(new Event('change'));
    const id2 = cell(app, 'row 2, id');
    id2.focus();
    id2.value = 'NEW';
    id2.dispatchEvent(new InputEvent('input', { bubbles: true, composed: true, inputType: 'insertText', data: 'NEW' }));
    await ran;
    await settle(app);
    expect(cell(app, 'row 1, z_hi').getAttribute('aria-invalid'), "the run's problems reached the table").to.equal('true');
    expect(cell(app, 'row 2, id').value).to.equal('NEW');
    expect(deep(app, 'sample-editor input:focus')[0]?.getAttribute('aria-label')).to.equal('row 2, id');
    id2.setSelectionRange(3, 3);
    await sendKeys({ type: '-ID' });
    await sendKeys({ press: 'Enter' });
    await caughtUp(app, 'the results include the renamed galaxy');
    expect(ids(app)[1]).to.equal('NEW-ID');
    expect(verdictIds(app)).to.include('NEW-ID');
    app.remove();
  });

  it('brings the demo back with "Demo sample", and Undo returns to your own sample and survey', async () => {
    const app = await freshApp();
    const file = deep(app, 'sample-editor input[type=file]')[0] as HTMLInputElement;
    const dt = new DataTransfer();
    dt.items.add(new File(['id,z,muv\nMINE-1,9.5,-21\nMINE-2,8,-20.5\n'], 'mine.csv', { type: 'text/csv' }));
    let ran = nextAudit(app);
    file.files = dt.files;
    file.dispatchEvent(new Event('change'));
    await ran;
    // Importing keeps the demo field: the page says so.
    expect(deep(app, '.notice').map((n) => n.textContent).join(' ')).to.contain('demo field');
    const name = deep(app, 'survey-editor input[aria-label="survey name"]')[0] as HTMLInputElement;
    ran = nextAudit(app);
    name.value = 'my-own-field';
    name.dispatchEvent(new Event('change'));
    await ran;
    expect(deep(app, 'pre.summary')[0].textContent).to.contain('my-own-field');
    expect(ids(app)).to.deep.equal(['MINE-1', 'MINE-2']);
    ran = nextAudit(app);
    button(app, 'Demo sample').click();
    await ran;
    await settle(app);
    expect(ids(app)).to.deep.equal(DEMO_IDS);
    expect((deep(app, 'survey-editor input[aria-label="survey name"]')[0] as HTMLInputElement).value).to.equal('quillfield-deep');
    ran = nextAudit(app);
    button(app, 'Undo').click();
    await ran;
    await settle(app);
    expect(ids(app)).to.deep.equal(['MINE-1', 'MINE-2']);
    expect((deep(app, 'survey-editor input[aria-label="survey name"]')[0] as HTMLInputElement).value).to.equal('my-own-field');
    app.remove();
  });
});

describe('the bench: survey and choices', () => {
  beforeEach(() => localStorage.clear());

  it('edits named surveys and redshift bins; a row naming a survey is audited in it', async () => {
    const app = await freshApp();
    let ran = nextAudit(app);
    button(app, 'Add survey').click();
    await ran;
    await settle(app);
    const area = deep(app, 'survey-editor input[aria-label="survey 1 area [arcmin²]"]')[0] as HTMLInputElement;
    ran = nextAudit(app);
    area.value = '4000';
    area.dispatchEvent(new Event('change'));
    await ran;
    ran = nextAudit(app);
    button(app, 'Add bin').click();
    await ran;
    await settle(app);
    expect(deep(app, 'survey-editor input[aria-label="bin 1 z from"]')).to.have.length(1);
    // A row that names field-1 (paste a block with a survey column: it asks; append).
    await paste(app, 'id,z,muv,survey\nWIDE-1,9.63,-22.6,field-1');
    button(app, 'Append the rows').click();
    await caughtUp(app, 'the results include the appended row');
    const json = saved();
    expect(json.choices.surveys).to.deep.equal([{ name: 'field-1', areaArcmin2: 4000, zMin: 7, zMax: 11 }]);
    expect(json.choices.zBins).to.have.length(1);
    expect(verdictIds(app)).to.include('WIDE-1');
    // A survey name that is taken is refused on its field.
    button(app, 'Add survey').click();
    await settle(app);
    const n2 = deep(app, 'survey-editor input[aria-label="survey 2 name"]')[0] as HTMLInputElement;
    n2.value = 'field-1';
    n2.dispatchEvent(new Event('change'));
    await settle(app);
    expect(n2.getAttribute('aria-invalid')).to.equal('true');
    expect(deep(app, 'survey-editor .err').map((e) => e.textContent).join(' ')).to.contain('taken');
    app.remove();
  });

  it('marks results and figures out of date while a choice is invalid, until a valid run replaces them', async () => {
    const app = await freshApp();
    const h0 = deep(app, 'choice-panel input[type=number]').find((i) => i.closest('label')?.textContent?.startsWith('H₀')) as HTMLInputElement;
    expect(h0).to.not.equal(undefined);
    h0.value = '-5';
    h0.dispatchEvent(new Event('change'));
    await settle(app);
    const out = deep(app, '.out')[0];
    expect(out.classList.contains('stale')).to.equal(true);
    expect(out.querySelector('results-table')).to.not.equal(null);
    expect(out.querySelectorAll('audit-chart').length).to.equal(4);
    expect(deep(app, '.stale-badge')[0].textContent).to.contain('out of date — fix the highlighted choice');
    const live = deep(app, '#stale-text')[0];
    expect(live.getAttribute('aria-live')).to.equal('polite');
    expect(live.textContent).to.contain('H₀');
    expect(h0.getAttribute('aria-invalid')).to.equal('true');
    expect(getComputedStyle(out.querySelector('.body')!).opacity).to.not.equal('1');
    const ran = nextAudit(app);
    h0.value = '70';
    h0.dispatchEvent(new Event('change'));
    await settle(app);
    expect(deep(app, '.stale-badge')).to.have.length(0);
    await ran;
    await settle(app);
    expect(deep(app, '.out')[0].getAttribute('data-state')).to.equal('current');
    expect(deep(app, '#stale-text')[0].textContent).to.equal('');
    app.remove();
  });

  it('the headline IMF is a choice: it leads the compared IMFs and is saved', async () => {
    const app = await freshApp();
    const sel = deep(app, 'choice-panel select[aria-label="headline IMF"]')[0] as HTMLSelectElement;
    expect(sel.value).to.equal('salpeter');
    const ran = nextAudit(app);
    sel.value = 'top-heavy-flat';
    sel.dispatchEvent(new Event('change'));
    await ran;
    const c = saved().choices;
    expect(c.headlineImf).to.equal('top-heavy-flat');
    expect(c.imfs[0]).to.equal('top-heavy-flat');
    expect(c.imfs).to.have.length(5);
    // QF-101 has no imf_ref: its headline verdict is now under the flat top-heavy IMF (the exported JSON says so).
    let blob: Blob | undefined;
    const orig = URL.createObjectURL;
    URL.createObjectURL = (b: Blob | MediaSource) => {
      blob = b as Blob;
      return orig.call(URL, b);
    };
    button(app, 'Full JSON record').click();
    URL.createObjectURL = orig;
    const out = JSON.parse(await blob!.text());
    expect(out.galaxies.find((g: { id: string }) => g.id === 'QF-101').headline_imf).to.equal('top-heavy-flat');
    expect(out.galaxies.find((g: { id: string }) => g.id === 'QF-322').headline_imf).to.equal('salpeter'); // its own imf_ref
    app.remove();
  });

  it('shows numbers at six digits and keeps the exact value; Enter adds a custom IMF; a fixed message goes', async () => {
    const app = await freshApp();
    const ob = deep(app, 'choice-panel input[type=number]').find((i) => i.closest('label')?.textContent?.startsWith('Ωb')) as HTMLInputElement;
    expect(ob.value.length).to.be.lessThan(10);
    const custom = deep(app, 'choice-panel #custom-imf')[0] as HTMLInputElement;
    custom.focus();
    custom.value = 'custom:0.1:1.3';
    await sendKeys({ press: 'Enter' });
    await settle(app);
    expect(deep(app, 'choice-panel .err').map((e) => e.textContent).join(' ')).to.contain('custom IMF');
    custom.value = 'custom:0.1:1.3:0.5:2.3:100';
    custom.dispatchEvent(new Event('input', { bubbles: true, composed: true }));
    await settle(app);
    expect(deep(app, 'choice-panel .err')).to.have.length(0);
    await sendKeys({ press: 'Enter' });
    await caughtUp(app, 'the results include the custom IMF');
    const c = saved().choices;
    expect(c.imfs).to.include('custom:0.1:1.3:0.5:2.3:100');
    expect(String(c.cosmology.omegaB).length).to.be.greaterThan(ob.value.length); // the exact value is kept
    expect(Number(ob.value)).to.be.closeTo(c.cosmology.omegaB, 1e-6);
    app.remove();
  });

  it('keeps the text typed into a choice and into the survey while their panels re-render, and commits it when the field is left', async () => {
    const app = await freshApp();
    // A choice: the headline IMF changes (a run and a UV slope on their way), the user goes on to type into H₀.
    const sel = deep(app, 'choice-panel select[aria-label="headline IMF"]')[0] as HTMLSelectElement;
    let ran = nextAudit(app);
    sel.value = 'top-heavy-flat';
    sel.dispatchEvent(new Event('change'));
    const h0 = deep(app, 'choice-panel input[type=number]').find((i) => i.closest('label')?.textContent?.startsWith('H₀')) as HTMLInputElement;
    h0.focus();
    h0.value = '71.5';
    h0.dispatchEvent(new InputEvent('input', { bubbles: true, composed: true, inputType: 'insertText', data: '71.5' }));
    await until(() => /of top-heavy-flat .*: -?\d/.test(deep(app, 'choice-panel .uv')[0]?.textContent ?? ''), 'the UV slope of the new headline IMF is shown');
    await ran;
    await settle(app);
    expect(h0.value).to.equal('71.5');
    // leaving the field commits it (a script's typing gets no change event from the browser: sent here)
    ran = nextAudit(app);
    h0.dispatchEvent(new Event('change'));
    h0.blur();
    await ran;
    expect(saved().choices.cosmology.h0).to.equal(71.5);
    // The survey: a cell edit starts a run (the page re-renders with its progress and its results, handing
    // the survey editor its value again each time) while the user types the area.
    ran = nextAudit(app);
    const z = cell(app, 'row 1, z');
    z.value = '7.45';
    z.dispatchEvent(new Event('change'));
    const area = deep(app, 'survey-editor input[aria-label="survey area [arcmin²]"]')[0] as HTMLInputElement;
    area.focus();
    area.value = '123';
    area.dispatchEvent(new InputEvent('input', { bubbles: true, composed: true, inputType: 'insertText', data: '123' }));
    await ran;
    await settle(app);
    expect(area.value).to.equal('123');
    ran = nextAudit(app);
    area.dispatchEvent(new Event('change'));
    area.blur();
    await ran;
    expect(saved().choices.survey.areaArcmin2).to.equal(123);
    app.remove();
  });

  it('explanations show on keyboard focus, not only on hover', async () => {
    const app = await freshApp();
    const h0 = deep(app, 'choice-panel input[type=number]')[0] as HTMLInputElement;
    h0.focus();
    await settle(app);
    expect(deep(app, 'choice-panel .help')[0].textContent).to.contain('Hubble constant');
    expect(h0.getAttribute('aria-describedby')).to.match(/^d-/);
    // Tab to the next field of the same panel: its explanation replaces the first.
    await sendKeys({ press: 'Tab' });
    await settle(app);
    expect(deep(app, 'choice-panel .help')[0].textContent).to.contain('matter density');
    app.remove();
  });
});

describe('the bench: keyboard and layout', () => {
  beforeEach(() => localStorage.clear());
  afterEach(async () => setViewport({ width: 800, height: 600 }));

  it('the sample grid is one tab stop; arrow keys move between cells; a skip link passes it', async () => {
    const app = await freshApp();
    const tabbable = deep(app, 'sample-editor table [tabindex="0"]');
    expect(tabbable).to.have.length(1);
    expect(deep(app, 'sample-editor table input, table button').filter((e) => e.getAttribute('tabindex') !== '-1')).to.have.length(1);
    cell(app, 'row 1, id').focus();
    await sendKeys({ press: 'ArrowDown' });
    await settle(app);
    expect(deep(app, 'sample-editor input:focus')[0]?.getAttribute('aria-label')).to.equal('row 2, id');
    await sendKeys({ press: 'ArrowRight' }); // the whole cell is selected on arrival: move on
    await settle(app);
    expect(deep(app, 'sample-editor input:focus')[0]?.getAttribute('aria-label')).to.equal('row 2, z');
    expect(deep(app, 'sample-editor table [tabindex="0"]')[0]?.getAttribute('aria-label')).to.equal('row 2, z');
    const skip = deep(app, 'a.skip')[0] as HTMLAnchorElement;
    expect(skip.textContent).to.contain('Skip the sample table');
    skip.click();
    expect(app.shadowRoot!.activeElement?.id).to.equal('survey-heading');
    app.remove();
  });

  for (const vp of [{ width: 1280, height: 800 }, { width: 390, height: 844 }]) {
    it(`nothing overflows the viewport at ${vp.width}×${vp.height} except inside a table's own scroll box`, async () => {
      await setViewport(vp);
      const app = await freshApp();
      await new Promise((r) => setTimeout(r, 300));
      const vw = document.documentElement.clientWidth;
      expect(vw).to.equal(vp.width);
      const escaped: string[] = [];
      const clipped = (el: Element): boolean => {
        for (let n: Node | null = el.parentNode; n; n = n instanceof ShadowRoot ? n.host : n.parentNode) {
          if (n instanceof Element && /(auto|scroll|hidden|clip)/.test(getComputedStyle(n).overflowX)) return true;
        }
        return false;
      };
      for (const el of deep(app, '*')) {
        const b = el.getBoundingClientRect();
        if (b.width === 0 || b.height === 0) continue;
        if ((b.right > vw + 0.5 || b.left < -0.5) && !clipped(el)) escaped.push(`<${el.tagName.toLowerCase()} class="${el.className}"> ${Math.round(b.left)}–${Math.round(b.right)}`);
      }
      expect(escaped).to.deep.equal([]);
      expect(document.documentElement.scrollWidth).to.equal(vw);
      app.remove();
    });
  }
});
