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

  it('splits a long array into one piece per element, so no piece holds the whole', () => {
    const points = Array.from({ length: 1000 }, (_, i) => ({ id: `P-${i}`, log10M: 9 + i / 1000 }));
    const pieces = [...jsonPieces({ bins: [{ points }] })];
    expect(pieces.length).toBeGreaterThan(1000);
    expect(Math.max(...pieces.map((p) => p.length))).toBeLessThan(200);
  });
});
