import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { rowAt, rowOffsets, rowWindow, scrollToShow } from '../../src/ui/window-rows.js';

/** Brute force: every row that overlaps [top, top + h). */
const visible = (heights: number[], top: number, h: number): number[] => {
  const out: number[] = [];
  let y = 0;
  heights.forEach((hh, i) => {
    if (y + hh > top && y < top + h) out.push(i);
    y += hh;
  });
  return out;
};

describe('window-rows', () => {
  it('rowWindow covers every row overlapping the viewport, with the spacers summing to the rest of the list', () => {
    const heights = fc.array(fc.integer({ min: 1, max: 120 }), { minLength: 1, maxLength: 400 });
    fc.assert(
      fc.property(heights, fc.double({ min: 0, max: 1, noNaN: true }), fc.integer({ min: 1, max: 900 }), fc.integer({ min: 0, max: 10 }), (hs, frac, view, over) => {
        const off = rowOffsets(hs);
        const total = off[hs.length];
        const top = frac * Math.max(0, total - view);
        const w = rowWindow(off, top, view, over);
        const need = visible(hs, top, view);
        const covered = need.every((i) => i >= w.start && i < w.end);
        const sums = Math.abs(w.padTop + (off[w.end] - off[w.start]) + w.padBottom - total) < 1e-9;
        const tight = w.start >= Math.max(0, need[0] - over) && w.end <= Math.min(hs.length, need[need.length - 1] + 1 + over);
        return covered && sums && tight;
      }),
    );
  });

  it('10 000 rows of 27 px scrolled to the end render the last row and about a viewport of rows', () => {
    const off = rowOffsets(new Array(10000).fill(27));
    const w = rowWindow(off, 270000 - 540, 540, 8);
    expect(w.end).toBe(10000);
    expect(w.end - w.start).toBeLessThanOrEqual(20 + 1 + 8);
    expect(rowAt(off, 269999)).toBe(9999);
    expect(rowAt(off, 0)).toBe(0);
  });

  it('scrollToShow moves as little as needed to show a row', () => {
    const off = rowOffsets([10, 10, 10, 10, 10]);
    expect(scrollToShow(off, 4, 0, 25)).toBe(25);
    expect(scrollToShow(off, 0, 25, 25)).toBe(0);
    expect(scrollToShow(off, 3, 20, 25)).toBe(20);
  });
});
