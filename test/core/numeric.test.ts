import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { quantileSorted, quantilesBySelection } from '../../src/core/numeric/index.js';

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


