import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { jsonPieces } from '../../src/cli/json-pieces.js';

// The reference is the language's own serializer: JSON.stringify(value, null, 2) (ECMA-262, JSON.stringify).
describe('JSON written in pieces', () => {
  it('joins to exactly JSON.stringify(value, null, 2), nested at any indent, for any JSON-like value with long arrays', () => {
    const leaf = fc.oneof(fc.double({ noNaN: false }), fc.integer(), fc.string(), fc.boolean(), fc.constant(null), fc.constant(undefined));
    const { tree } = fc.letrec((tie) => ({
      tree: fc.oneof({ depthSize: 'small' }, leaf, tie('arr'), tie('obj')),
      arr: fc.oneof(fc.array(tie('tree'), { maxLength: 4 }), fc.array(leaf, { minLength: 65, maxLength: 90 })),
      obj: fc.dictionary(fc.string({ maxLength: 4 }), tie('tree'), { maxKeys: 4 }),
    }));
    fc.assert(
      fc.property(tree, fc.constantFrom('', '  ', '    '), (v, pad) => {
        const want = JSON.stringify(v, null, 2);
        if (want === undefined) return;
        expect([...jsonPieces(v, pad)].join('')).toBe(want.replace(/\n/g, `\n${pad}`));
      }),
      { numRuns: 300 },
    );
  });

  it('long strings (surrogate pairs, escapes, line breaks) written a piece at a time still join to JSON.stringify', () => {
    const text = fc.string({ unit: fc.constantFrom('a', '"', '\\', '\n', '\r', '\t', '\u0001', 'é', '😀', '𝔷'), maxLength: 60 });
    fc.assert(
      fc.property(fc.dictionary(fc.constantFrom('sample_csv', 'notes', 'id'), text, { maxKeys: 3 }), fc.integer({ min: 1, max: 9 }), (v, n) => {
        const pieces = [...jsonPieces(v, '  ', { split: 64, text: n })];
        expect(pieces.join('')).toBe(JSON.stringify(v, null, 2).replace(/\n/g, '\n  '));
      }),
      { numRuns: 300 },
    );
    // A piece that would end on the first half of a pair ends before it instead (limit 3 → 2 code units).
    for (const n of [2, 3]) expect([...jsonPieces('😀😀😀', '', { split: 64, text: n })]).toEqual(['"', '😀', '😀', '😀', '"']);
  });

  it('splits a long array into one piece per element, so no piece holds the whole', () => {
    const points = Array.from({ length: 1000 }, (_, i) => ({ id: `P-${i}`, log10M: 9 + i / 1000 }));
    const pieces = [...jsonPieces({ bins: [{ points }] })];
    expect(pieces.length).toBeGreaterThan(1000);
    expect(Math.max(...pieces.map((p) => p.length))).toBeLessThan(200);
  });
});
