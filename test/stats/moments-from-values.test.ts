import { describe, expect, it } from 'vitest';
import { momentsFromValues } from '../../src/stats/index.js';

describe('momentsFromValues', () => {
  it('gives n, mean and ss per group', () => {
    // by hand: [1, 2, 3] → mean 2, ss = 1 + 0 + 1 = 2; [5] → ss 0
    expect(momentsFromValues([[1, 2, 3], [5]])).toEqual([
      { n: 3, mean: 2, ss: 2 },
      { n: 1, mean: 5, ss: 0 },
    ]);
  });

  it('stays accurate for values far from zero', () => {
    // 1e9 + [4, 7, 13, 16]: mean 1e9 + 10, ss = 36 + 9 + 9 + 36 = 90 (by hand); the textbook
    // Σy² − nȳ² loses all digits here because y² ≈ 1e18 exceeds 2^53
    const [g] = momentsFromValues([[1e9 + 4, 1e9 + 7, 1e9 + 13, 1e9 + 16]]);
    expect(g.mean).toBe(1e9 + 10);
    expect(g.ss).toBeCloseTo(90, 6);
  });

  it('marks an empty group with n = 0', () => {
    const [g] = momentsFromValues([[]]);
    expect(g.n).toBe(0);
    expect(g.ss).toBe(0);
    expect(g.mean).toBeNaN();
  });

  it('rejects non-finite values', () => {
    expect(() => momentsFromValues([[1, NaN]])).toThrow('values[0][1] must be a finite number');
    expect(() => momentsFromValues([[1], [Infinity]])).toThrow(/values\[1\]\[0\]/);
  });
});
