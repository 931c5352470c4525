import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { quantileSorted, quantilesByBuckets, quantilesBySelection } from '../../src/core/numeric/index.js';

describe('quantiles by selection', () => {
  it('equal the type-7 quantiles of the sorted sample (Hyndman & Fan 1996) for any sample and any order of q', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 300 }), fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 5 }), (xs, qs) => {
        const sorted = Float64Array.from(xs).sort();
        const got = quantilesBySelection(Float64Array.from(xs), qs);
        qs.forEach((q, i) => expect(got[i]).toBe(quantileSorted(sorted, q)));
      }),
      { numRuns: 500 },
    );
  });
});

describe('quantiles by buckets', () => {
  // Reference: the type-7 quantiles of the sorted sample (Hyndman & Fan 1996), bit for bit.
  const check = (xs: Float64Array, qs: number[]): void => {
    const copy = xs.slice();
    const sorted = xs.slice().sort();
    const got = quantilesByBuckets(xs, xs.length, qs);
    qs.forEach((q, i) => expect(got[i]).toBe(quantileSorted(sorted, q)));
    expect(xs).toEqual(copy); // the input is not reordered
  };
  it('equal the sorted-sample quantiles for samples long enough to take the bucket path (ties, clusters, outliers)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 512, max: 5000 }),
        fc.constantFrom('uniform', 'ties', 'outlier', 'lognormal'),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 6 }),
        fc.integer({ min: 1, max: 1e6 }),
        (n, shape, qs, seed) => {
          let s = seed;
          const u = (): number => ((s = (Math.imul(s, 1103515245) + 12345) >>> 0) / 2 ** 32);
          const xs = new Float64Array(n);
          for (let i = 0; i < n; i++) {
            if (shape === 'uniform') xs[i] = u() * 10 - 5;
            else if (shape === 'ties') xs[i] = Math.floor(u() * 7);
            else if (shape === 'outlier') xs[i] = i === 0 ? 1e12 : u();
            else xs[i] = Math.exp(3 * Math.sqrt(-2 * Math.log(u() + 1e-12)) * Math.cos(6.283 * u()));
          }
          check(xs, [...qs, 0, 1, 0.5]);
        },
      ),
      { numRuns: 200 },
    );
  });
  it('read only the first n values, and fall back to exact selection for short or non-finite vectors', () => {
    const xs = Float64Array.from({ length: 2000 }, (_, i) => (i * 7919) % 2000);
    const got = quantilesByBuckets(xs, 1000, [0.5]);
    expect(got[0]).toBe(quantileSorted(xs.slice(0, 1000).sort(), 0.5));
    check(Float64Array.from([3, 1, 2, Infinity, -Infinity]), [0.1, 0.5, 0.9]);
    const withInf = Float64Array.from({ length: 1000 }, (_, i) => (i === 3 ? Infinity : i % 97));
    check(withInf, [0.05, 0.5, 0.999]);
    expect(quantilesByBuckets(new Float64Array(600).fill(2.5), 600, [0.3])).toEqual([2.5]);
  });
});
