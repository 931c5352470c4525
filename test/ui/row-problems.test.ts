import { describe, expect, it } from 'vitest';
import { keepSameProblems } from '../../src/ui/row-problems.js';

/** The editor is given the previous problems list itself when a run finds the same problems (by definition of "same"). */
describe('keepSameProblems', () => {
  const a = [
    { row: 1, column: 'z', reason: 'z is outside z_lo..z_hi' },
    { row: 4, column: 'muv', reason: '"x" is not a number' },
  ];

  it('keeps the previous list when row, column and reason agree in order', () => {
    const next = a.map((p) => ({ ...p }));
    expect(keepSameProblems(a, next)).to.equal(a);
    const none: never[] = [];
    expect(keepSameProblems(none, [])).to.equal(none);
  });

  it('takes the new list when any problem differs, is added, removed or moved', () => {
    for (const next of [
      [a[0], { ...a[1], reason: 'other' }],
      [a[0], { ...a[1], row: 5 }],
      [a[0], { ...a[1], column: 'z' }],
      [a[0]],
      [...a, a[0]],
      [a[1], a[0]],
      [],
    ]) expect(keepSameProblems(a, next)).to.equal(next);
  });
});
