import { describe, expect, it } from 'vitest';
import { auditMarkdown, runAudit } from '../../src/core/audit/index.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';
import { FIRST_GALAXIES, summaryParts } from '../../src/ui/summary-parts.js';

/** The page's summary of a large sample: the report's own text, cut so the galaxy paragraphs after the first wait. */
function invented(rows: number): string {
  const lines = ['id,z,muv'];
  for (let i = 0; i < rows; i++) lines.push(`INV-${i + 1},${(7.2 + (3.6 * i) / rows).toFixed(2)},${(-22 + (3 * ((i * 7) % 11)) / 10).toFixed(2)}`);
  return lines.join('\n') + '\n';
}

describe('summaryParts', () => {
  const md = auditMarkdown(runAudit(invented(25), { ...DEFAULT_CHOICES, draws: 100 }));

  it('keeps the assumptions and the first galaxies in the head, the sample verdict, caution and references in the tail', () => {
    const p = summaryParts(md);
    expect(p.hidden.length).to.equal(25 - FIRST_GALAXIES);
    expect(p.head).to.contain('Assumptions:');
    expect(p.head.match(/^\*\*INV-/gm)?.length).to.equal(FIRST_GALAXIES);
    expect(p.hidden.every((h) => h.startsWith('**INV-'))).to.equal(true);
    expect(p.tail.startsWith('## Sample')).to.equal(true);
    expect(p.tail).to.contain('*Caution:*');
    expect(p.tail).to.contain('## References');
  });

  it('loses no text: head, the hidden paragraphs and tail put back together are the summary', () => {
    const p = summaryParts(md);
    expect(p.head + p.hidden.join('\n\n') + '\n\n' + p.tail).to.equal(md);
  });

  it('hides nothing for a small sample or a text without the galaxies heading', () => {
    expect(summaryParts(md, 25)).to.deep.equal({ head: md, hidden: [], tail: '' });
    expect(summaryParts('# a title\n\nsome text\n')).to.deep.equal({ head: '# a title\n\nsome text\n', hidden: [], tail: '' });
  });
});
