import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { quantileSorted } from '../../src/core/numeric/index.js';
import { bucketQuantiles, layoutBuckets, makeBuckets, quantilesFromBuckets } from '../../src/core/numeric/quantile-buckets.js';

// Reference: the type-7 quantiles of the sorted sample (Hyndman & Fan 1996), bit for bit.
const sample = (n: number, shape: string, seed: number): Float64Array => {
  let s = seed;
  const u = (): number => ((s = (Math.imul(s, 1103515245) + 12345) >>> 0) / 2 ** 32);
  const xs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    if (shape === 'uniform') xs[i] = u() * 10 - 5;
    else if (shape === 'ties') xs[i] = Math.floor(u() * 7);
    else if (shape === 'outlier') xs[i] = i === 0 ? 1e12 : u();
    else xs[i] = Math.exp(3 * Math.sqrt(-2 * Math.log(u() + 1e-12)) * Math.cos(6.283 * u()));
  }
  return xs;
};
const arbitrary = fc.tuple(
  fc.integer({ min: 512, max: 5000 }),
  fc.constantFrom('uniform', 'ties', 'outlier', 'lognormal'),
  fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 6 }),
  fc.integer({ min: 1, max: 1e6 }),
);

describe('bucket quantiles with the counts made in the caller\'s loop', () => {
  it('equal the sorted-sample quantiles for any bounds: the vector\'s range, wider, narrower (values clamped into the end buckets), or shifted', () => {
    fc.assert(
      fc.property(arbitrary, fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: 0.05, max: 4, noNaN: true }), ([n, shape, qs0, seed], shift, widen) => {
        const xs = sample(n, shape, seed);
        const qs = [...qs0, 0, 1, 0.5];
        let lo = Infinity;
        let hi = -Infinity;
        for (const v of xs) {
          lo = Math.min(lo, v);
          hi = Math.max(hi, v);
        }
        const mid = 0.5 * (lo + hi) + shift * (hi - lo);
        const half = 0.5 * (hi - lo) * widen;
        const bk = makeBuckets();
        if (!layoutBuckets(bk, n, mid - half, mid + half)) return; // equal bounds (a constant sample): the caller falls back
        for (let i = 0; i < n; i++) {
          const v = xs[i];
          let b = ((v - bk.min) * bk.scale) | 0;
          if (b > bk.top) b = bk.top;
          else if (b < 0 || v !== v) b = 0;
          bk.of[i] = b;
          bk.counts[b]++;
        }
        const copy = xs.slice();
        const got = quantilesFromBuckets(xs, n, qs, bk);
        const sorted = xs.slice().sort();
        qs.forEach((q, i) => expect(got[i]).toBe(quantileSorted(sorted, q)));
        expect(xs).toEqual(copy);
      }),
      { numRuns: 300 },
    );
  });
  it('bucketQuantiles (two count tables) equals the sorted-sample quantiles, odd and even n, with and without bounds', () => {
    fc.assert(
      fc.property(arbitrary, ([n, shape, qs0, seed]) => {
        const xs = sample(n, shape, seed);
        const qs = [...qs0, 0, 1, 0.5];
        const sorted = xs.slice().sort();
        const got = bucketQuantiles(xs, n, qs);
        const bounded = bucketQuantiles(xs, n, qs, { min: sorted[0] - 1, max: sorted[n - 1] + 1 });
        qs.forEach((q, i) => {
          expect(got[i]).toBe(quantileSorted(sorted, q));
          expect(bounded[i]).toBe(quantileSorted(sorted, q));
        });
      }),
      { numRuns: 200 },
    );
  });
  it('refuses buckets it cannot lay out (short, non-finite or empty bounds), and falls back to selection for short or infinite vectors', () => {
    const bk = makeBuckets();
    expect(layoutBuckets(bk, 511, 0, 1)).toBe(false);
    expect(layoutBuckets(bk, 1000, 0, Infinity)).toBe(false);
    expect(layoutBuckets(bk, 1000, 2, 2)).toBe(false);
    expect(layoutBuckets(bk, 1000, 0, 1)).toBe(true);
    const withInf = Float64Array.from({ length: 1000 }, (_, i) => (i === 3 ? Infinity : i % 97));
    const sorted = withInf.slice().sort();
    expect(bucketQuantiles(withInf, 1000, [0.05, 0.5, 0.999])).toEqual([0.05, 0.5, 0.999].map((q) => quantileSorted(sorted, q)));
    const short = Float64Array.from([3, 1, 2]);
    expect(bucketQuantiles(short, 3, [0.5])).toEqual([2]);
    expect(bucketQuantiles(new Float64Array(600).fill(2.5), 600, [0.3])).toEqual([2.5]);
  });
});
