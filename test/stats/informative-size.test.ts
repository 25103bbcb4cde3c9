import { describe, expect, it } from 'vitest';
import { informativeSize, sizeMeanCorrelation, weightingGap } from '../../src/stats/informative-size.js';

// seven groups: sizes and group means of the outcome
const sizes = [2, 3, 5, 8, 12, 4, 9];
const means = [1.0, 1.2, 1.1, 1.9, 2.4, 0.7, 1.3];

describe('informative group size', () => {
  it('correlation and weighting gap against numpy', () => {
    // numpy 2.4.6: np.corrcoef(n, y)[0, 1] and np.sum((n / n.sum() - 1 / len(n)) * y)
    expect(sizeMeanCorrelation(sizes, means)).toBeCloseTo(0.8391670096896333, 12);
    expect(weightingGap(sizes, means)).toBeCloseTo(0.2471760797342193, 12);
  });

  it('all 7! permutations enumerated: the exact p-value', () => {
    // Python 3 itertools.permutations over the sizes (numpy 2.4.6 for the gap): 83 of the 5,040
    // orderings give |gap| at least the observed one
    const r = informativeSize(sizes, means, { permutations: 5040, seed: 1 });
    expect(r).toMatchObject({ exact: true, permutations: 5040 });
    expect(r.p).toBe(83 / 5040);
  });

  it('seeded random permutations agree with the exact value within Monte Carlo error, and repeat', () => {
    const r = informativeSize(sizes, means, { permutations: 4000, seed: 20240611 });
    expect(r.exact).toBe(false);
    const exact = 83 / 5040;
    expect(Math.abs(r.p - exact)).toBeLessThan(4 * Math.sqrt((exact * (1 - exact)) / 4000));
    expect(informativeSize(sizes, means, { permutations: 4000, seed: 20240611 }).p).toBe(r.p);
  });

  it('equal sizes: no gap and p = 1', () => {
    const r = informativeSize([5, 5, 5, 5], [1, 2, 3, 4], { permutations: 100, seed: 1 });
    expect(r.gap).toBeCloseTo(0, 15);
    expect(r.p).toBe(1);
  });
});
