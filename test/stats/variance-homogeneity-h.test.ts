import { describe, expect, it } from 'vitest';
import { varianceHomogeneityH } from '../../src/stats/variance-homogeneity-h.js';
import { expectRel, referenceMoments } from './helpers.js';

describe('H test of equal level-1 variances', () => {
  it('HSB mathach by school', () => {
    const h = varianceHomogeneityH(referenceMoments('hsb.csv', 'school', 'mathach'), 10);
    // recorded independent computation, numpy 2.4.6 + scipy 1.17.1 on the raw records of hsb.csv:
    // s2 = np.var(mathach of each school, ddof=1); f = n - 1; L = log(s2);
    // d = (L - (f*L).sum()/f.sum()) / sqrt(2/f); H = (d**2).sum() = 298.3387968951287 on 159 df,
    // scipy.stats.chi2.sf(H, 159) = 1.4665976692724775e-10
    expectRel(h.statistic, 298.3387968951287, 1e-9);
    expect(h.df).toBe(159);
    expectRel(h.p, 1.4665976692724775e-10, 1e-4);
    expect(h.groups).toBe(160);
    expect(h.excluded).toBe(0);
  });

  it('leaves out small groups and groups without spread; equal variances give H = 0', () => {
    const g = (n: number, variance: number) => ({ n, mean: 0, ss: variance * (n - 1) });
    const h = varianceHomogeneityH([g(12, 2), g(12, 2), g(20, 2), g(4, 9), g(15, 0)], 10);
    expect(h.groups).toBe(3);
    expect(h.excluded).toBe(2);
    expect(h.statistic).toBeCloseTo(0, 12);
    expect(h.p).toBeCloseTo(1, 12);
    expect(varianceHomogeneityH([g(12, 2)], 10).p).toBeNaN();
  });
});
