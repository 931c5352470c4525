import fc from 'fast-check';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { readCsv, writeCsv } from '../../src/ui/csv-text.js';

// Reference: papaparse 5.7.1 (a general-purpose CSV library from the npm registry), the reader the
// audit itself uses. The page's own reader must give the same rows on any text, or the table's row
// numbers would not be the audit's; and the writer the same text.
const alphabet = ['a', 'b', '1', ' ', ',', '\t', ';', '|', '"', '\n', '\r', '\r\n', '\ufeff'];
const hostile = fc.array(fc.constantFrom(...alphabet), { maxLength: 60 }).map((a) => a.join(''));
const runs = { numRuns: 3000 };

describe('CSV text as papaparse reads and writes it', () => {
  it('reads like papaparse with the delimiter and line ending guessed (hostile text, blank lines skipped)', () => {
    fc.assert(fc.property(hostile, (t) => {
      expect(readCsv(t, { skipEmptyLines: true })).toEqual(Papa.parse<string[]>(t, { skipEmptyLines: true }).data);
    }), runs);
  });

  it('reads like papaparse with the delimiter given (tab and comma), blank lines kept', () => {
    for (const delimiter of [',', '\t']) {
      fc.assert(fc.property(hostile, (t) => {
        expect(readCsv(t, { delimiter })).toEqual(Papa.parse<string[]>(t, { delimiter }).data);
      }), runs);
    }
  });

  it('reads like papaparse on spreadsheet-like tables with quoted cells', () => {
    const cell = fc.array(fc.constantFrom('x', '9.5', ' ', ',', '"', '\n', '\t', ''), { maxLength: 4 }).map((a) => a.join(''));
    const table = fc.array(fc.array(cell, { minLength: 1, maxLength: 5 }), { minLength: 1, maxLength: 8 });
    fc.assert(
      fc.property(table, fc.constantFrom('\n', '\r\n'), (rows, nl) => {
        const text = Papa.unparse(rows, { newline: nl });
        expect(readCsv(text, { skipEmptyLines: true })).toEqual(Papa.parse<string[]>(text, { skipEmptyLines: true }).data);
      }),
      runs,
    );
  });

  it('writes like papaparse, and reads back what it wrote', () => {
    const cell = fc.array(fc.constantFrom('x', '1', ' ', ',', '"', '\n', '\r', '\ufeff', ''), { maxLength: 5 }).map((a) => a.join(''));
    const table = fc.array(fc.array(cell, { minLength: 2, maxLength: 5 }), { minLength: 1, maxLength: 6 });
    fc.assert(
      fc.property(table, (rows) => {
        const text = writeCsv(rows);
        expect(text).toBe(Papa.unparse(rows, { newline: '\n' }));
        if (!rows.some((r) => r.every((c) => c === ''))) expect(readCsv(text, { delimiter: ',' })).toEqual(rows);
      }),
      runs,
    );
  });

  it('keeps a tab-separated paste, a BOM and CRLF line ends as papaparse does (worked example)', () => {
    const t = '\ufeffid\tz\tnotes\r\nA-1\t9.5\t"two, words"\r\n\r\nA-2\t8\t\r\n';
    expect(readCsv(t, { skipEmptyLines: true })).toEqual([['id', 'z', 'notes'], ['A-1', '9.5', 'two, words'], ['A-2', '8', '']]);
    expect(readCsv(t, { skipEmptyLines: true })).toEqual(Papa.parse(t, { skipEmptyLines: true }).data);
  });
});
