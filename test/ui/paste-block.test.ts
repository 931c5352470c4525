import { describe, expect, it } from 'vitest';
import { appendWithHeader, isHeaderLine, readPasteBlock } from '../../src/ui/paste-block.js';

// Reading a pasted block against the table's header; the rules are the project's own (common
// practice for spreadsheets, no source): a first line of column names is a header, matched
// case-insensitively; numbers never make a header.
const header = ['id', 'z', 'muv'];

describe('pasted blocks', () => {
  it('appends data rows without a header in the table columns, padding short rows', () => {
    const b = readPasteBlock('P-1\t9.5\t-21\nP-2\t8.1', header);
    expect(b).toEqual({ kind: 'rows', rows: [['P-1', '9.5', '-21'], ['P-2', '8.1', '']], hadHeader: false });
  });

  it('treats the same header in another case and order as the table header, and maps columns by name', () => {
    const b = readPasteBlock('MUV,ID,Z\n-20,P-3,7.7\n', header);
    expect(b).toEqual({ kind: 'rows', rows: [['P-3', '7.7', '-20']], hadHeader: true });
  });

  it('appends under a header naming some of the table columns, filling the others with blanks', () => {
    const b = readPasteBlock('z\tid\nseven\tP-4', header);
    expect(b).toEqual({ kind: 'rows', rows: [['P-4', 'seven', '']], hadHeader: true });
  });

  it('reports a header that names other columns, for the caller to ask', () => {
    const b = readPasteBlock('id,z,log_mstar,imf_ref\nM-1,9,10.5,salpeter', header);
    expect(b.kind).toBe('other-header');
    if (b.kind === 'other-header') {
      expect(b.header).toEqual(['id', 'z', 'log_mstar', 'imf_ref']);
      expect(b.rows).toEqual([['M-1', '9', '10.5', 'salpeter']]);
    }
  });

  it('refuses a headerless line wider than the table and names the line', () => {
    const b = readPasteBlock('P-1,9,-20\nP-2,9,-20,extra', header);
    expect(b).toMatchObject({ kind: 'error' });
    if (b.kind === 'error') expect(b.message).toContain('line 2 has 4 cells');
  });

  it('says empty for blank text', () => {
    expect(readPasteBlock(' \n\t\n', header)).toEqual({ kind: 'empty' });
  });

  it('never takes a line with a number, or without any column name, for a header', () => {
    expect(isHeaderLine(['QF-1', '9.1', '-20'], header)).toBe(false);
    expect(isHeaderLine(['alpha', 'beta-ish'], header)).toBe(false);
    expect(isHeaderLine(['Id', 'Z'], header)).toBe(true);
    expect(isHeaderLine(['notes'], header)).toBe(true);
  });

  it('appends under another header: matched columns by name, new ones added, old rows widened', () => {
    const g = { header, rows: [['A', '9', '-20']] };
    const out = appendWithHeader(g, ['Z', 'id', 'notes'], [['8', 'B', 'new']]);
    expect(out.header).toEqual(['id', 'z', 'muv', 'notes']);
    expect(out.rows).toEqual([['A', '9', '-20', ''], ['B', '8', '', 'new']]);
  });
});
