import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseSample } from '../../src/core/audit/index.js';

const known = (n: string): boolean => ['salpeter', 'chabrier', 'kroupa', 'top-heavy-flat', 'top-heavy-cmb'].includes(n);
const HEADER = 'id,z,z_lo,z_hi,muv,notes';

/** Invariants every parse must keep, whatever the input. */
function checkParsed(p: ReturnType<typeof parseSample>): void {
  for (const r of p.rows) {
    expect(r.row).toBeGreaterThanOrEqual(1);
    if (r.status === 'rejected') {
      expect(r.errors.length).toBeGreaterThan(0);
      for (const e of r.errors) {
        expect(e.row).toBe(r.row);
        expect(typeof e.column).toBe('string');
        expect(e.column.length).toBeGreaterThan(0);
        expect(e.reason.length).toBeGreaterThan(0);
      }
    } else {
      const g = r.galaxy!;
      for (const v of Object.values(g)) if (typeof v === 'number') expect(Number.isFinite(v)).toBe(true);
      expect(g.z).toBeGreaterThan(0);
    }
  }
}

const goodRow = fc.record({
  id: fc.stringMatching(/^[A-W]{1,3}-[0-9]{1,4}$/), // bad rows below use X-…: a repeated id is rejected by design
  z: fc.double({ min: 0.25, max: 29, noNaN: true }), // the galaxy redshift domain (GALAXY_Z)
  muv: fc.double({ min: -25, max: -16, noNaN: true }),
});
const toLine = (r: { id: string; z: number; muv: number }, notes = ''): string => `${r.id},${r.z},,,${r.muv},${notes}`;

describe('CSV importer, property-based', () => {
  it('random bytes never crash it; every rejection names its row, column and reason', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 400 }), (bytes) => {
        checkParsed(parseSample(new TextDecoder('latin1').decode(bytes), known));
      }),
      { numRuns: 300 },
    );
  });

  it('random text after a valid header: no crash, no NaN in accepted rows', () => {
    fc.assert(
      fc.property(fc.array(fc.string({ maxLength: 40 }), { maxLength: 20 }), (lines) => {
        checkParsed(parseSample([HEADER, ...lines].join('\n'), known));
      }),
      { numRuns: 300 },
    );
  });

  it('a BOM, CRLF line ends and quoted fields change nothing for good rows', () => {
    fc.assert(
      fc.property(fc.uniqueArray(goodRow, { minLength: 1, maxLength: 12, selector: (r) => r.id }), (rows) => {
        const plain = parseSample([HEADER, ...rows.map((r) => toLine(r))].join('\n'), known);
        const fancy = parseSample('\uFEFF' + [HEADER, ...rows.map((r) => toLine(r, '"a, quoted ""note"""'))].join('\r\n') + '\r\n', known);
        expect(fancy.rows.map((r) => r.status)).toEqual(plain.rows.map((r) => r.status));
        fancy.rows.forEach((r, i) => {
          expect({ ...r.galaxy, notes: undefined }).toEqual({ ...plain.rows[i].galaxy, notes: undefined });
        });
        expect(fancy.rows[0].galaxy?.notes).toBe('a, quoted "note"');
      }),
      { numRuns: 100 },
    );
  });

  it('accepted rows are unchanged by bad rows mixed in among them', () => {
    const badLine = fc.constantFrom('X-1,abc,,,-20,', 'X-2,-3,,,-20,', 'X-3,9,,,,', 'X-4,1e400,,,-20,', 'X-5,"9,5",,,-20,', 'X-6,9,,,-20', ',9,,,-20,');
    fc.assert(
      fc.property(fc.uniqueArray(goodRow, { minLength: 1, maxLength: 8, selector: (r) => r.id }), fc.array(badLine, { maxLength: 6 }), fc.nat(), (good, bad, shuffle) => {
        const alone = parseSample([HEADER, ...good.map((r) => toLine(r))].join('\n'), known);
        const lines = good.map((r) => toLine(r));
        bad.forEach((b, i) => lines.splice((shuffle + i * 7) % (lines.length + 1), 0, b));
        const mixed = parseSample([HEADER, ...lines].join('\n'), known);
        const byId = new Map(mixed.rows.filter((r) => r.status === 'ok').map((r) => [r.galaxy!.id, r.galaxy!]));
        for (const r of alone.rows) {
          const m = byId.get(r.galaxy!.id)!;
          expect({ ...m, row: 0 }).toEqual({ ...r.galaxy!, row: 0 });
        }
        expect(mixed.rows.length).toBe(good.length + bad.length);
        checkParsed(mixed);
      }),
      { numRuns: 150 },
    );
  });

  it('thousands separators, comma decimals and 1e400 are refused with a reason, never coerced', () => {
    const p = parseSample([HEADER, 'A,"1,000",,,-20,', 'B,"9,1",,,-20,', 'C,1e400,,,-20,', 'D,"12,345.6",,,-20,'].join('\n'), known);
    expect(p.rows.map((r) => r.status)).toEqual(['rejected', 'rejected', 'rejected', 'rejected']);
    expect(p.rows[0].errors[0].reason).toMatch(/thousands separator/);
    expect(p.rows[3].errors[0].reason).toMatch(/thousands separators/);
    expect(p.rows[1].errors[0].reason).toMatch(/comma as decimal/);
    expect(p.rows[2].errors[0].reason).toMatch(/floating-point range/);
  });

  it('an empty file and a header-only file are reported, not crashed on', () => {
    expect(parseSample('', known).fileErrors[0]).toMatch(/empty/);
    expect(parseSample('\uFEFF\r\n', known).fileErrors[0]).toMatch(/empty/);
    expect(parseSample('id,foo\n', known).fileErrors[0]).toMatch(/"z"/);
  });

  it('10^5 rows parse, all accepted, with nothing dropped', () => {
    const lines = [HEADER];
    for (let i = 0; i < 100000; i++) lines.push(`G-${i},${(7 + (i % 400) / 100).toFixed(2)},,,-20,`);
    const p = parseSample(lines.join('\n'), known);
    expect(p.rows.length).toBe(100000);
    expect(p.rows.every((r) => r.status === 'ok')).toBe(true);
  });
});
