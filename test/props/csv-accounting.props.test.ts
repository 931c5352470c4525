import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decodeText, editDistance, indexSample, parseSample, type ParsedSample } from '../../src/core/audit/index.js';

const known = (n: string): boolean => ['salpeter', 'chabrier', 'kroupa', 'top-heavy-flat', 'top-heavy-cmb'].includes(n);

/** Header lines + every row's lines + the empty lines = every physical line of the file. */
function accounted(p: ParsedSample): number {
  const h = p.lines.header[1] - p.lines.header[0] + 1;
  return h + p.rows.reduce((s, r) => s + r.lines[1] - r.lines[0] + 1, 0) + p.lines.empty.length;
}
const physicalLines = (t: string): number => {
  const body = t.replace(/^\uFEFF/, '');
  const nl = body.includes('\n') ? '\n' : body.includes('\r') ? '\r' : '\n';
  const parts = body.split(nl);
  return parts[parts.length - 1] === '' ? parts.length - 1 : parts.length;
};

describe('nothing silently dropped or merged', () => {
  it('every physical line is accounted for, whatever the line ends, quotes and empty lines', () => {
    const cell = fc.oneof(fc.constantFrom('', 'A', '9.1', '-20', '"q, x"', '"multi\nline"', '"a ""b"""', ' '), fc.stringMatching(/^[a-z0-9.]{0,5}$/));
    const lineArb = fc.array(cell, { minLength: 1, maxLength: 4 }).map((c) => c.join(','));
    fc.assert(
      fc.property(fc.array(lineArb, { maxLength: 12 }), fc.array(fc.constantFrom('\n', '\r\n'), { minLength: 13, maxLength: 13 }), fc.boolean(), (lines, ends, trailing) => {
        let t = 'id,z,muv,notes';
        lines.forEach((l, i) => (t += ends[i] + l));
        if (trailing) t += ends[12];
        const p = parseSample(t, known);
        expect(accounted(p)).toBe(p.lines.total);
        expect(p.lines.total).toBe(physicalLines(t));
      }),
      { numRuns: 300 },
    );
  });

  it('a CRLF header with LF rows reads every row, and says the line ends are mixed', () => {
    const p = parseSample('id,z,muv\r\nA,9,-20\nB,9.5,-21\nC,10,-20.5\n', known);
    expect(p.rows.map((r) => r.status)).toEqual(['ok', 'ok', 'ok']);
    expect(p.rows.map((r) => r.lineEnd)).toEqual(['LF', 'LF', 'LF']);
    expect(p.fileWarnings.join(' ')).toMatch(/line ends are mixed \(CRLF on line 1; LF on lines 2, 3, 4\)/);
  });

  it('an unterminated quote is an error on its row naming the lines it swallowed, and a file-level error', () => {
    const p = parseSample('id,z,muv,notes\nA,9,-20,ok\nB,9,-20,"never closed\nC,9,-20,x\nD,9,-20,y\n', known);
    expect(p.rows.map((r) => r.status)).toEqual(['ok', 'rejected']);
    expect(p.rows[1].lines).toEqual([3, 5]);
    expect(p.rows[1].errors[0]).toMatchObject({ row: 2, column: '(row)', reason: expect.stringMatching(/lines 3–5.*never closed/) });
    expect(accounted(p)).toBe(5);
  });

  it('a repeated column is a file-level error and rejects every row; nothing is merged', () => {
    const p = parseSample('id,z,muv,Z\nA,9,-20,12\n', known);
    expect(p.fileErrors[0]).toMatch(/"z" twice \(columns 2 and 4\)/);
    expect(p.rows[0].status).toBe('rejected');
    expect(p.rows[0].errors.some((e) => e.column === '(header)')).toBe(true);
  });

  it('every column is echoed, __proto__, empty header cells and cells beyond the header included', () => {
    const p = parseSample('id,z,muv,__proto__,,constructor\nA,9,-20,evil,blank,c,extra\n', known);
    const raw = p.rows[0].raw;
    expect(raw['__proto__']).toBe('evil');
    expect(raw['(column 5)']).toBe('blank');
    expect(raw['constructor']).toBe('c');
    expect(raw['(column 7)']).toBe('extra');
    expect(Object.keys(raw)).toHaveLength(7);
    expect(JSON.parse(JSON.stringify(raw))['__proto__']).toBe('evil');
  });

  it('header names match case-insensitively and trimmed; a near miss gets a "did you mean"', () => {
    const p = parseSample(' ID , Z ,MUV,M_UV,redshift\nA,9,-20,-20,9\n', known);
    expect(p.rows[0].status).toBe('ok');
    expect(p.rows[0].galaxy).toMatchObject({ id: 'A', z: 9, muv: -20 });
    expect(p.fileWarnings.join(' ')).not.toMatch(/"M_UV".*did you mean/); // muv is present
    const q = parseSample('id,z,M_UV,redshft\nA,9,-20,1\n', known);
    expect(q.fileWarnings.join(' ')).toMatch(/"M_UV" .*did you mean "muv"/);
    const r = parseSample('id,redshift,muv\nA,9,-20\n', known);
    expect(r.fatal).toMatch(/"z"/);
    expect(editDistance('m_uv', 'muv')).toBe(1);
    expect(editDistance('kitten', 'sitting')).toBe(3); // the textbook example (Levenshtein 1966), from memory
  });

  it('a file without id or z, or without a header row, is fatal with one line saying so', () => {
    expect(parseSample('A,9,-20\nB,9,-20\n', known).fatal).toMatch(/first line must be a header/);
    expect(parseSample('id,muv\nA,-20\n', known).fatal).toMatch(/no "z" column/);
    expect(parseSample('', known).fatal).toMatch(/empty/);
    expect(parseSample('id,z\n', known).fatal).toBeUndefined();
  });

  it('UTF-16 with a BOM is read; without one, or invalid UTF-8, it is refused naming the encoding', () => {
    const text = 'id,z,muv\nÅ-1,9,-20\n';
    const le = new Uint8Array(2 + text.length * 2);
    le.set([0xff, 0xfe]);
    for (let i = 0; i < text.length; i++) [le[2 + 2 * i], le[3 + 2 * i]] = [text.charCodeAt(i) & 0xff, text.charCodeAt(i) >> 8];
    expect(decodeText(le)).toEqual({ text, encoding: 'utf-16le' });
    const be = le.slice();
    for (let i = 0; i < be.length; i += 2) [be[i], be[i + 1]] = [le[i + 1], le[i]];
    expect(decodeText(be)).toEqual({ text, encoding: 'utf-16be' });
    expect(() => decodeText(le.subarray(2), 'sample')).toThrow(/sample looks like UTF-16 without a byte-order mark/);
    expect(() => decodeText(Uint8Array.from([0x69, 0x64, 0x0a, 0x41, 0xe9, 0x0a]), 'sample')).toThrow(/not valid UTF-8 \(byte 0xe9 at offset 4, line 2\).*Latin-1/);
    expect(decodeText(Uint8Array.from([0xef, 0xbb, 0xbf, 0x69, 0x64])).text).toBe('id');
  });

  it('a row read again alone from the index is the row read with the whole file (any dialect, quotes, line ends)', () => {
    // The audit keeps only where each record lies and reads it again when it is audited (flat memory);
    // that reading must not depend on the rest of the file.
    const cell = fc.oneof(fc.constantFrom('', 'A', 'A', '9.1', '-20', ' 7 ', '"q, x"', '"q; x"', '"multi\nline"', '"cr\r\nline"', '"a ""b"""', '"open', '\t', '=1+1'), fc.stringMatching(/^[a-z0-9.]{0,5}$/));
    fc.assert(
      fc.property(
        fc.constantFrom(',', ';', '\t'),
        fc.array(fc.array(cell, { minLength: 1, maxLength: 5 }), { maxLength: 10 }),
        fc.array(fc.constantFrom('\n', '\r\n', '\r'), { minLength: 11, maxLength: 11 }),
        fc.boolean(),
        (sep, lines, ends, bom) => {
          const head = ['id', 'z', 'muv', 'notes'].join(sep);
          let t = (bom ? '\uFEFF' : '') + head;
          lines.forEach((l, i) => (t += ends[i] + l.join(sep)));
          const whole = parseSample(t, known);
          const idx = indexSample(t, known);
          expect(idx.rowCount).toBe(whole.rows.length);
          for (let i = 0; i < idx.rowCount; i++) expect(idx.rowAt(i)).toEqual(whole.rows[i]);
          const { rows: _rows, ...fileFacts } = whole;
          const { rowCount: _n, rowAt: _at, ...indexFacts } = idx;
          expect(indexFacts).toEqual(fileFacts);
        },
      ),
      { numRuns: 400 },
    );
  });

  it('the index sums up the accepted rows (z range and reach, imf_ref values, every column), as the rows say', () => {
    const p = indexSample('id,z,z_lo,z_hi,z_alt,p_alt,log_mstar,imf_ref\nA,9,8.5,9.2,,,10,kroupa\nB,12,11,12.1,2,0.1,10,salpeter\nC,40,,,,,10,kroupa\nD,8,,,,,10,chabrier,extra\n', known);
    expect(p.summary.accepted).toBe(2); // C has z > 30; D has a cell beyond the header
    expect(p.summary.zLowest).toBe(9);
    expect(p.summary.zHighest).toBe(12);
    expect(p.summary.zReach).toBeCloseTo(Math.max(9 + 5 * 0.5, 12 + 5 * 1), 12); // z + 5 × the larger half-interval
    expect(p.summary.imfRefs).toEqual(['kroupa', 'salpeter']);
    expect(p.summary.inputColumns).toEqual(['id', 'z', 'z_lo', 'z_hi', 'z_alt', 'p_alt', 'log_mstar', 'imf_ref', '(column 9)']);
  });
});
