import { describe, expect, it } from 'vitest';
import {
  glsMean,
  likelihoodTerms,
  logDetRatio,
  profiledQ,
  profiledQDerivative,
  sumSquaredWeights,
  sumWeights,
} from '../../src/stats/profile-terms.js';
import { bySize } from '../../src/stats/size-classes.js';
import { totalCount } from '../../src/stats/sums.js';
import type { GroupMoments } from '../../src/stats/types.js';

// the fused two-pass sums the fits use must be the one-formula functions, term by term
function groups(count: number): GroupMoments[] {
  let seed = 99;
  const rand = () => {
    seed = (seed * 16807) % 2147483647;
    return seed / 2147483647;
  };
  return Array.from({ length: count }, () => {
    const n = 1 + Math.floor(rand() * 40);
    return { n, mean: 30 + 12 * rand(), ss: n > 1 ? (n - 1) * 9 * rand() : 0 };
  });
}

describe('likelihoodTerms', () => {
  const raw = groups(300);
  const classes = bySize(groups(20_000));
  it.each([0, 1e-6, 0.02, 0.7, 40])('equals the separate terms at λ = %s, over groups and over size classes', (lambda) => {
    for (const g of [raw, classes]) {
      const t = likelihoodTerms(g, lambda);
      const same = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(b)));
      same(t.mu, glsMean(g, lambda));
      same(t.q, profiledQ(g, lambda));
      same(t.dq, profiledQDerivative(g, lambda));
      same(t.logDet, logDetRatio(g, lambda));
      same(t.sumW, sumWeights(g, lambda));
      same(t.sumW2, sumSquaredWeights(g, lambda));
      expect(t.total).toBe(totalCount(g));
    }
  });
});
