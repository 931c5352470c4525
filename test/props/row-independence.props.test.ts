import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fnv1a32, idSeed, runAudit, type GalaxyRow } from '../../src/core/audit/index.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

const CHOICES = { ...DEFAULT_CHOICES, draws: 200, imfs: ['salpeter', 'top-heavy-flat'] };
const HEADER = 'id,z,z_lo,z_hi,muv,mag_err';
const GOOD = ['G-1,9.1,8.9,9.4,-21.2,0.1', 'G-2,10.4,10.1,10.8,-20.5,0.2', 'G-3,7.6,7.4,7.9,-22.0,0.15', 'G-4,12.2,11.7,12.6,-20.9,0.1'];
const BAD = ['X-1,nine,,,-20,0.1', 'X-2,9,,,,', 'X-3,9,,,-20,-1', ',9,,,-20,0.1', 'X-5,9,,,-20'];

/** A galaxy's numbers without its row and line numbers (which do follow its position). */
const numbers = (g: GalaxyRow): unknown => ({ ...g, row: undefined, lines: undefined, line_end: undefined, errors: g.errors.map((e) => ({ ...e, row: undefined })) });
const byId = (rows: GalaxyRow[]): Map<string, unknown> => new Map(rows.filter((g) => g.status === 'ok').map((g) => [g.id, numbers(g)]));

describe('a row\'s result depends on that row alone', () => {
  const reference = byId(runAudit([HEADER, ...GOOD].join('\n'), CHOICES).galaxies);

  it('shuffling the rows and inserting bad rows leaves every galaxy\'s numbers bit-identical', () => {
    fc.assert(
      fc.property(fc.shuffledSubarray([...GOOD, ...BAD], { minLength: GOOD.length + BAD.length }), (lines) => {
        const got = byId(runAudit([HEADER, ...lines].join('\n'), CHOICES).galaxies);
        expect(got.size).toBe(GOOD.length);
        for (const [id, v] of reference) expect(got.get(id), id).toEqual(v);
      }),
      { numRuns: 6 },
    );
  });

  it('a galaxy audited alone has the numbers it has inside the sample', () => {
    const alone = byId(runAudit([HEADER, GOOD[2]].join('\n'), CHOICES).galaxies);
    expect(alone.get('G-3')).toEqual(reference.get('G-3'));
  });

  it('the stream seed is FNV-1a of the trimmed id mixed with the run seed', () => {
    // FNV-1a 32-bit test vectors (Fowler–Noll–Vo reference test suite, from memory): "" → 0x811c9dc5, "a" → 0xe40c292c, "foobar" → 0xbf9cf968.
    const enc = (s: string): Uint8Array => new TextEncoder().encode(s);
    expect(fnv1a32(enc(''))).toBe(0x811c9dc5);
    expect(fnv1a32(enc('a'))).toBe(0xe40c292c);
    expect(fnv1a32(enc('foobar'))).toBe(0xbf9cf968);
    expect(idSeed(1, ' G-1 ')).toBe(idSeed(1, 'G-1'));
    expect(idSeed(1, 'G-1')).not.toBe(idSeed(2, 'G-1'));
    expect(idSeed(1, 'G-1')).not.toBe(idSeed(1, 'G-2'));
    // UTF-8 bytes, not UTF-16 code units: "é" is two bytes.
    expect(idSeed(7, 'é')).not.toBe(idSeed(7, '\u00e9'.normalize('NFD')));
  });
});
