import { describe, expect, it } from 'vitest';
import { canRedo, canUndo, record, redo, startHistory, undo } from '../../src/ui/edit-history.js';

// Undo/redo semantics as in every editor: common practice, no source.
describe('edit history', () => {
  it('undoes and redoes in order, and a new edit clears the redo branch', () => {
    let h = startHistory('a');
    expect(canUndo(h)).toBe(false);
    h = record(h, 'b');
    h = record(h, 'c');
    expect(h.present).toBe('c');
    h = undo(h);
    expect(h.present).toBe('b');
    expect(canRedo(h)).toBe(true);
    h = undo(h);
    expect(h.present).toBe('a');
    expect(canUndo(h)).toBe(false);
    expect(undo(h)).toBe(h);
    h = redo(h);
    expect(h.present).toBe('b');
    h = record(h, 'x');
    expect(canRedo(h)).toBe(false);
    expect(redo(h)).toBe(h);
    expect(undo(h).present).toBe('b');
    expect(undo(undo(h)).present).toBe('a');
  });

  it('ignores an edit that changes nothing', () => {
    const h = record(startHistory({ v: 1 }), { v: 2 });
    const same = (a: { v: number }, b: { v: number }) => a.v === b.v;
    expect(record(h, { v: 2 }, {}, same)).toBe(h);
    expect(record(h, { v: 3 }, {}, same).past).toHaveLength(2);
  });

  it('keeps at most maxEntries past states, dropping the oldest', () => {
    let h = startHistory(0);
    for (let i = 1; i <= 10; i++) h = record(h, i, { maxEntries: 3 });
    expect(h.past).toEqual([7, 8, 9]);
    expect(h.present).toBe(10);
  });

  it('keeps the past within maxSize, dropping the oldest', () => {
    let h = startHistory('');
    for (const s of ['aaaa', 'bbbb', 'cccc', 'dddd']) h = record(h, s, { maxSize: 9, sizeOf: (x) => x.length });
    // past holds '', 'aaaa', 'bbbb', 'cccc' = 12 chars > 9 → the oldest go until ≤ 9
    expect(h.past).toEqual(['bbbb', 'cccc']);
    expect(h.present).toBe('dddd');
  });

  it('does not mutate the history it is given', () => {
    const h0 = record(startHistory(1), 2);
    const past = [...h0.past];
    undo(h0);
    redo(undo(h0));
    record(h0, 3);
    expect(h0.past).toEqual(past);
    expect(h0.present).toBe(2);
  });
});
