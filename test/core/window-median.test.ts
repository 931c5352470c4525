import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { quantileSorted } from '../../src/core/numeric/index.js';
import { windowMedian, WINDOW_MEDIAN_PILOT } from '../../src/core/numeric/window-median.js';

// Reference: the type-7 median of the sorted sample (Hyndman & Fan 1996), bit for bit.
const sortedMedian = (xs: Float64Array, n: number): number => quantileSorted(Float64Array.from(xs.subarray(0, n)).sort(), 0.5);

/** Uniform deviates in [0, 1) from a seeded 32-bit LCG (multiplier 1103515245, increment 12345; common practice, no source). */
const lcg = (seed: number): (() => number) => {
  let s = seed;
  return () => (s = (Math.imul(s, 1103515245) + 12345) >>> 0) / 2 ** 32;
};

/** A seeded LCG sample in random order (the Monte Carlo case the window is made for). */
const sample = (n: number, shape: string, seed: number): Float64Array => {
  const u = lcg(seed);
  const xs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    if (shape === 'normal') xs[i] = Math.sqrt(-2 * Math.log(u() + 1e-12)) * Math.cos(6.283 * u());
    else if (shape === 'ties') xs[i] = Math.floor(u() * 3);
    else if (shape === 'infinite') xs[i] = u() < 0.3 ? Number.POSITIVE_INFINITY : u();
    else xs[i] = Math.exp(3 * Math.sqrt(-2 * Math.log(u() + 1e-12)) * Math.cos(6.283 * u()));
  }
  return xs;
};

describe('the median by a window around a pilot estimate', () => {
  it('equals the sorted-sample median for values in random order, odd and even n, with ties and +Infinity', () => {
    fc.assert(
      fc.property(fc.integer({ min: 4 * WINDOW_MEDIAN_PILOT, max: 30000 }), fc.constantFrom('normal', 'ties', 'infinite', 'lognormal'), fc.integer({ min: 1, max: 1e6 }), (n, shape, seed) => {
        const xs = sample(n + 7, shape, seed);
        const copy = xs.slice();
        expect(Object.is(windowMedian(xs, n), sortedMedian(xs, n))).toBe(true);
        expect(xs).toEqual(copy); // not reordered
      }),
      { numRuns: 60 },
    );
  });

  it('still equals it when the first values mislead the window (sorted, reversed, or the pilot all below the rest)', () => {
    const n = 20001;
    const up = Float64Array.from({ length: n }, (_, i) => i * 0.5);
    const down = up.slice().reverse();
    const low = sample(n, 'normal', 7).map((v, i) => (i < WINDOW_MEDIAN_PILOT ? v - 100 : v));
    for (const xs of [up, down, low]) expect(windowMedian(xs, n)).toBe(sortedMedian(xs, n));
    expect(windowMedian(up, n)).toBe(5000); // the middle of 0, 0.5, …, 10000 (closed form)
    const even = up.subarray(0, 20000);
    expect(windowMedian(even, 20000)).toBe(4999.75);
  });

  it('gives what the bucketed median gives when a NaN is in the vector (in the pilot or after it), and works below the pilot size', () => {
    // one NaN in the pilot, one after it, and 40 after it at scattered places, so that some lie among
    // the window's values, where the selection would place them anywhere
    const u = lcg(12345);
    const scattered = Array.from({ length: 40 }, () => WINDOW_MEDIAN_PILOT + Math.floor(u() * (9000 - WINDOW_MEDIAN_PILOT)));
    for (const at of [[3], [5000], scattered]) {
      const xs = sample(9000, 'normal', 11);
      for (const i of at) xs[i] = Number.NaN;
      // NaN goes to the lowest bucket there (quantile-buckets.ts), so the median is that of the rest shifted by one rank per NaN
      const rest = Float64Array.from(xs.filter((v) => !Number.isNaN(v))).sort();
      const h = (9000 - 1) * 0.5;
      const r0 = Math.floor(h) - (9000 - rest.length);
      expect(windowMedian(xs, 9000)).toBe(rest[r0] + (h - Math.floor(h)) * (rest[r0 + 1] - rest[r0]));
    }
    const short = sample(1000, 'lognormal', 3);
    expect(windowMedian(short, 1000)).toBe(sortedMedian(short, 1000));
  });
});
