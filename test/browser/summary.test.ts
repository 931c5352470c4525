import { expect } from 'chai';
import '../../src/ui/audit-summary.js';
import type { AuditSummary } from '../../src/ui/audit-summary.js';

/** <audit-summary>: a long summary waits behind "Show all", which then shows every paragraph (invented text). */
const para = (i: number): string => `**INV-${i}** (z = 8.00) is **within budget** under an invented IMF.`;
const md = ['# Baryon budget audit', 'Assumptions: invented.', '## Galaxies', ...Array.from({ length: 450 }, (_, i) => para(i + 1)), '## Sample', 'The sample verdict.', '*Caution:* invented.', ''].join('\n\n');

describe('<audit-summary>', () => {
  it('shows the first galaxies and the sample, then every paragraph after "Show all", in blocks', async () => {
    const el = document.createElement('audit-summary') as AuditSummary;
    el.markdown = md;
    document.body.append(el);
    await el.updateComplete;
    const text = (): string => [...el.shadowRoot!.querySelectorAll('pre')].map((p) => p.textContent).join('');
    expect(text()).to.contain('**INV-10**');
    expect(text()).to.not.contain('**INV-11**');
    expect(text()).to.contain('The sample verdict.');
    const button = el.shadowRoot!.querySelector('button')!;
    expect(button.textContent).to.equal('Show all 440');
    button.click();
    await el.updateComplete;
    expect(el.shadowRoot!.querySelectorAll('pre.block').length).to.equal(1); // the first block at once, the rest in later tasks
    for (let i = 0; i < 50 && el.shadowRoot!.querySelectorAll('pre.block').length < 5; i++) await new Promise((ok) => setTimeout(ok, 10));
    expect(el.shadowRoot!.querySelectorAll('pre.block').length).to.equal(5);
    expect(text()).to.equal(md);
    el.remove();
  });
});
