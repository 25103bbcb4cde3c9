import { describe, expect, it } from 'vitest';
import { type PairMoments, pairMomentsFromValues } from '../../src/stats/pair-moments.js';
import { withinBetweenOls, withinBetweenReml } from '../../src/stats/within-between.js';
import { expectRel, readReferenceCsv } from './helpers.js';

function hsbPairs(): PairMoments[] {
  const by = new Map<string, { xs: number[]; ys: number[] }>();
  for (const r of readReferenceCsv('hsb.csv')) {
    const g = by.get(r.school) ?? { xs: [], ys: [] };
    g.xs.push(Number(r.ses));
    g.ys.push(Number(r.mathach));
    by.set(r.school, g);
  }
  return [...by.values()].map((g) => pairMomentsFromValues(g.xs, g.ys));
}

describe('within- and between-group slopes (Mundlak-type regression) on HSB mathach and ses', () => {
  const pairs = hsbPairs();

  it('OLS equals a single-level fit on the records', () => {
    const o = withinBetweenOls(pairs);
    if (!o) throw new Error('no fit');
    // R 4.2.2: summary(lm(mathach ~ I(ses - meanses_j) + meanses_j, hsb))$coefficients, meanses_j = ave(ses, school)
    expectRel(o.within, 2.191171965, 1e-8, 'within');
    expectRel(o.seWithin, 0.11244380261, 1e-8, 'se within');
    expectRel(o.between, 5.716880893, 1e-8, 'between');
    expectRel(o.seBetween, 0.17961615156, 1e-8, 'se between');
    // R 4.2.2: lm(mathach ~ ses + meanses_j, hsb): the meanses_j coefficient is the gap
    expectRel(o.gap, 3.525708928, 1e-8, 'gap');
    expectRel(o.seGap, 0.21190934535, 1e-8, 'se gap');
  });

  it('REML with a random intercept equals a mixed-model fit', () => {
    const r = withinBetweenReml(pairs);
    if (!r) throw new Error('no fit');
    // R 4.2.2 + lme4 1.1-31: lmer(mathach ~ I(ses - meanses_j) + meanses_j + (1|school), hsb, REML = TRUE):
    // coefficients 2.191171965 (se 0.1086672878), 5.866173808 (se 0.3616993572); VarCorr school
    // 2.692529227, residual 37.019061406
    expectRel(r.within, 2.191171965, 1e-8, 'within');
    expectRel(r.seWithin, 0.1086672878, 1e-6, 'se within');
    expectRel(r.between, 5.866173808, 1e-6, 'between');
    expectRel(r.seBetween, 0.3616993572, 1e-6, 'se between');
    expectRel(r.tau2, 2.692529227, 1e-5, 'tau2');
    expectRel(r.sigma2, 37.019061406, 1e-6, 'sigma2');
    expect(r.seGap).toBeCloseTo(Math.hypot(0.1086672878, 0.3616993572), 6);
    expect(r.groups).toBe(160);
    expect(r.n).toBe(7185);
  });

  it('needs spread of x within and between groups', () => {
    const same = [1, 2, 3].map((k) => pairMomentsFromValues([1, 2, 3], [k, k + 1, k + 3]));
    expect(withinBetweenReml(same)).toBeNull();
    const constant = [1, 2, 3].map((k) => pairMomentsFromValues([k, k], [k, k + 1]));
    expect(withinBetweenOls(constant)).toBeNull();
  });
});
