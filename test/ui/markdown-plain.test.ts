import { describe, expect, it } from 'vitest';
import { escapeMarkdown } from '../../src/core/audit/output-safety.js';
import { plainFromMarkdown } from '../../src/ui/markdown-plain.js';

describe('plain text from Markdown-escaped names', () => {
  it('undoes the core escapeMarkdown for ids with every escaped character (invented ids)', () => {
    for (const id of ['QF-322', 'a_b*c', 'x\\y', '[draft](1)', 'A&amp;B', '<b>"q"\'s</b>', '#~|!`{}']) expect(plainFromMarkdown(escapeMarkdown(id))).toBe(id);
  });
  it('leaves unescaped text alone', () => {
    expect(plainFromMarkdown('In 7 < z < 11 (3 galaxies), ε ≥ 1.2')).toBe('In 7 < z < 11 (3 galaxies), ε ≥ 1.2');
  });
});
