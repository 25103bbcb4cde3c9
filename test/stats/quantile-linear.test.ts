import { describe, expect, it } from 'vitest';
import { quantileLinear } from '../../src/stats/quantile-linear.js';

describe('quantileLinear (Hyndman & Fan definition 7)', () => {
  it('equals numpy 2.4.6 np.quantile (its default method "linear" is definition 7)', () => {
    // np.quantile([0.3, 1.7, 2.2, 5.0, 9.1, 0.9, 4.4], [0, .25, .5, .75, 1]) = [0.3, 1.3, 2.2, 4.7, 9.1]
    const sorted = [0.3, 1.7, 2.2, 5.0, 9.1, 0.9, 4.4].sort((a, b) => a - b);
    const got = [0, 0.25, 0.5, 0.75, 1].map((p) => quantileLinear(sorted, p));
    for (const [k, want] of [0.3, 1.3, 2.2, 4.7, 9.1].entries()) expect(got[k]).toBeCloseTo(want, 12);
    // np.quantile([1, 2, 4, 8], 0.25) = 1.75
    expect(quantileLinear([1, 2, 4, 8], 0.25)).toBe(1.75);
  });

  it('one value is every quantile; none is NaN', () => {
    expect(quantileLinear([3], 0.25)).toBe(3);
    expect(quantileLinear([], 0.5)).toBeNaN();
  });
});
