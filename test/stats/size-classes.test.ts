import { describe, expect, it } from 'vitest';
import { mlDeviance, mlDevianceDerivative } from '../../src/stats/ml-deviance.js';
import { glsMean, profiledQ } from '../../src/stats/profile-terms.js';
import { remlDeviance, remlDevianceDerivative } from '../../src/stats/reml-deviance.js';
import { bySize, SIZE_CLASSES_FROM } from '../../src/stats/size-classes.js';
import type { GroupMoments } from '../../src/stats/types.js';

// many small groups (a million groups of a few records each): the fits take groups together by
// size; every term of the profiled likelihood must be the same as over the groups themselves
function groups(count: number): GroupMoments[] {
  let seed = 12345;
  const rand = () => {
    seed = (seed * 16807) % 2147483647;
    return seed / 2147483647;
  };
  return Array.from({ length: count }, () => {
    const n = 1 + Math.floor(rand() * rand() * 25);
    return { n, mean: 50 + 8 * (rand() - 0.5) + (rand() - 0.5) * 6, ss: n > 1 ? (n - 1) * 20 * rand() : 0 };
  });
}

describe('size classes: the one-way likelihood over groups taken together by size', () => {
  const raw = groups(SIZE_CLASSES_FROM + 5000);
  const classes = bySize(raw);

  it('takes many groups together, and leaves few groups as they are', () => {
    expect(classes.length).toBeLessThan(30);
    const few = groups(100);
    expect(bySize(few)).toBe(few);
  });

  it.each([0, 1e-4, 0.05, 0.3, 2, 50])('deviances, derivatives, Q and the GLS mean agree at λ = %s', (lambda) => {
    const same = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-10 * Math.max(1, Math.abs(b)));
    same(remlDeviance(classes, lambda), remlDeviance(raw, lambda));
    same(mlDeviance(classes, lambda), mlDeviance(raw, lambda));
    same(remlDevianceDerivative(classes, lambda), remlDevianceDerivative(raw, lambda));
    same(mlDevianceDerivative(classes, lambda), mlDevianceDerivative(raw, lambda));
    same(profiledQ(classes, lambda), profiledQ(raw, lambda));
    same(glsMean(classes, lambda), glsMean(raw, lambda));
  });
});
