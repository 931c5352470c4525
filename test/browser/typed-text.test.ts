import { expect } from 'chai';
import { sendKeys } from '@web/test-runner-commands';
import '../../src/ui/sample-editor.js';
import type { SampleEditor } from '../../src/ui/sample-editor.js';

/**
 * The text being typed into a field (not yet committed) is the user's until it is committed (Enter, leaving
 * the field) or undone (Escape): a re-render in between (a run's results bringing new problems, another
 * cell committed, the page handing the same values on again) keeps it, and the commit then sends it. Only
 * a value from outside that differs (undo, import) replaces it (fieldValue; <choice-panel> and
 * <survey-editor> use it too, tested end to end in bench.e2e.test.ts).
 */

function mount(csv: string): SampleEditor {
  const el = document.createElement('sample-editor') as SampleEditor;
  el.csv = csv;
  document.body.append(el);
  return el;
}
const cell = (el: SampleEditor, label: string) => el.shadowRoot!.querySelector(`input[aria-label="${label}"]`) as HTMLInputElement;
const settled = async (el: SampleEditor) => {
  for (let i = 0; i < 4; i++) await el.updateComplete; // measuring the rows may ask for one more pass
};
function nextChange(el: SampleEditor): Promise<string> {
  return new Promise((ok) => el.addEventListener('sample-change', (e) => ok((e as CustomEvent).detail.csv), { once: true }));
}

describe('<sample-editor>: the text being typed into a cell', () => {
  it('survives a re-render with new problems (a run\'s results) and Enter commits it', async () => {
    const el = mount('id,z,muv\nA-1,9,-20\nA-2,8,-21\nA-3,7.5,-19\n');
    await settled(el);
    const id2 = cell(el, 'row 2, id');
    id2.focus();
    id2.select();
    await sendKeys({ type: 'NEW' });
    expect(id2.value).to.equal('NEW');
    // Results arrive while the text is uncommitted: a new problems list re-renders every drawn row.
    el.problems = [{ row: 3, column: 'z', reason: 'z is outside z_lo..z_hi' }];
    await settled(el);
    expect(cell(el, 'row 3, z').getAttribute('aria-invalid'), 'the problems were drawn').to.equal('true');
    expect(cell(el, 'row 2, id').value).to.equal('NEW');
    expect(el.shadowRoot!.activeElement).to.equal(cell(el, 'row 2, id'));
    await sendKeys({ type: '-ID' });
    const sent = nextChange(el);
    await sendKeys({ press: 'Enter' });
    expect((await sent).split('\n')[2]).to.equal('NEW-ID,8,-21');
    await settled(el);
    expect(cell(el, 'row 2, id').value).to.equal('NEW-ID');
    el.remove();
  });

  it('survives another cell committed meanwhile (its change event) and goes out when the cell is left', async () => {
    const el = mount('id,z,muv\nA-1,9,-20\nA-2,8,-21\n');
    await settled(el);
    const id2 = cell(el, 'row 2, id');
    id2.focus();
    id2.select();
    await sendKeys({ type: 'B-2' });
    const first = nextChange(el);
    const z1 = cell(el, 'row 1, z');
    z1.value = '9.5';
    z1.dispatchEvent(new Event('change'));
    expect((await first).split('\n').slice(1, 3)).to.deep.equal(['A-1,9.5,-20', 'A-2,8,-21']);
    await settled(el);
    expect(cell(el, 'row 2, id').value).to.equal('B-2');
    const second = nextChange(el);
    id2.blur();
    expect((await second).split('\n')[2]).to.equal('B-2,8,-21');
    el.remove();
  });

  it('gives way to a different value from outside (undo, import) and to Escape', async () => {
    const el = mount('id,z,muv\nA-1,9,-20\nA-2,8,-21\n');
    await settled(el);
    const id1 = cell(el, 'row 1, id');
    id1.focus();
    id1.select();
    await sendKeys({ type: 'TYPED' });
    el.csv = 'id,z,muv\nU-1,9,-20\nA-2,8,-21\n';
    await settled(el);
    expect(cell(el, 'row 1, id').value).to.equal('U-1');
    cell(el, 'row 1, id').select();
    await sendKeys({ type: 'AGAIN' });
    await sendKeys({ press: 'Escape' });
    expect(cell(el, 'row 1, id').value).to.equal('U-1');
    el.problems = [{ row: 2, column: 'z', reason: 'a problem' }];
    await settled(el);
    expect(cell(el, 'row 1, id').value).to.equal('U-1');
    el.remove();
  });

  it('in a windowed grid (200 rows) survives a re-render too', async () => {
    const rows = Array.from({ length: 200 }, (_, i) => `W-${i + 1},${(7 + (i % 40) / 10).toFixed(1)},-20`);
    const el = mount(`id,z,muv\n${rows.join('\n')}\n`);
    await settled(el);
    expect(el.drawnRows).to.be.lessThan(200);
    const z3 = cell(el, 'row 3, z');
    z3.focus();
    z3.select();
    await sendKeys({ type: '11.25' });
    el.problems = [{ row: 1, column: 'z', reason: 'a problem' }];
    await settled(el);
    expect(cell(el, 'row 3, z').value).to.equal('11.25');
    const sent = nextChange(el);
    await sendKeys({ press: 'Enter' });
    expect((await sent).split('\n')[3]).to.equal('W-3,11.25,-20');
    el.remove();
  });
});

