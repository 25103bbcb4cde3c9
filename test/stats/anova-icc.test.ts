import fCdf from '@stdlib/stats-base-dists-f-cdf';
import { afterAll, describe, expect, it } from 'vitest';
import { anovaIcc, effectiveGroupSize, fUpperTail, icc1, icc1Interval, icc2, momentsFromValues } from '../../src/stats/index.js';
import { expectRel, logRelativeErrors, referenceMoments } from './helpers.js';

const TOL = 1e-6;
afterAll(logRelativeErrors);

describe('anovaIcc against R (fixtures/reference/README.md)', () => {
  it('HSB mathach by school', () => {
    const a = anovaIcc(referenceMoments('hsb.csv', 'school', 'mathach'));
    // R anova(lm(mathach ~ factor(school))), per fixtures/reference/README.md
    expectRel(a.msb, 408.21986, TOL, 'hsb msb');
    expectRel(a.msw, 39.141634, TOL, 'hsb msw');
    expectRel(a.f, 10.4293, TOL, 'hsb f');
    expect(a.df1).toBe(159); // README: (159, 7025) df
    expect(a.df2).toBe(7025); // README: (159, 7025) df
    expectRel(a.n0, 44.88669, TOL, 'hsb n0');
    expectRel(a.icc, 0.1736008, TOL, 'hsb icc1');
    expectRel(a.ci95[0], 0.1422766, TOL, 'hsb icc1 lower');
    expectRel(a.ci95[1], 0.2135971, TOL, 'hsb icc1 upper');
    // The README gives no p here. F = 10.43 on (159, 7025) df puts p near 1e-217, where
    // 1 − cdf would round to exactly 0; the reciprocal-F form must keep it positive.
    expect(a.p).toBeGreaterThan(0);
    expect(a.p).toBeLessThan(1e-100);
  });

  it('HSB ses by school', () => {
    const a = anovaIcc(referenceMoments('hsb.csv', 'school', 'ses'));
    // R anova(lm(ses ~ factor(school))), per fixtures/reference/README.md
    expectRel(a.icc, 0.2665809, TOL, 'hsb ses icc1');
  });

  it('Shrout & Fleiss (1979) Table 2, target as group', () => {
    const a = anovaIcc(referenceMoments('shrout-fleiss-1979.csv', 'target', 'rating'));
    // Shrout & Fleiss 1979 data, values per fixtures/reference/README.md
    expectRel(a.msb, 11.241667, TOL, 'sf msb');
    expectRel(a.msw, 6.263889, TOL, 'sf msw');
    expectRel(a.f, 1.794678, TOL, 'sf f');
    expect(a.df1).toBe(5); // README: (5, 18) df
    expect(a.df2).toBe(18); // README: (5, 18) df
    expectRel(a.p, 0.16477, 1e-4, 'sf p'); // README gives 5 significant digits: 1e-4
    expect(a.n0).toBe(4); // balanced design: 4 judges per target
    // fixtures/reference/README.md
    expectRel(a.icc, 0.1657418, TOL, 'sf icc1');
    expectRel(a.icc2, 0.4427971, TOL, 'sf icc2 = icc(1,k)');
    expectRel(a.ci95[0], -0.1329323, TOL, 'sf icc1 lower');
    expectRel(a.ci95[1], 0.7225601, TOL, 'sf icc1 upper');
    // Shrout & Fleiss 1979, published ICC(1,1) = .17 and ICC(1,k) = .44
    expect(a.icc.toFixed(2)).toBe('0.17');
    expect(a.icc2.toFixed(2)).toBe('0.44');
  });
});

describe('ANOVA formulas', () => {
  it('reports a negative ICC(1) as is when MSB < MSW', () => {
    // identical group means: MSB = 0, so ICC(1) = −MSW/((n0 − 1)MSW) = −1/(n0 − 1)
    const groups = momentsFromValues([
      [1, 2, 3],
      [0, 2, 4],
      [3, 1, 2, 2],
    ]);
    const a = anovaIcc(groups);
    expect(a.msb).toBe(0);
    expect(a.f).toBe(0);
    expect(a.p).toBe(1);
    expect(a.icc).toBeCloseTo(-1 / (a.n0 - 1), 14);
    expect(a.icc).toBeLessThan(0);
    expect(a.icc2).toBe(-Infinity); // (0 − MSW)/0: ICC(2) has no finite value when MSB = 0
  });

  it('n0 equals n for balanced groups and lies below n̄ otherwise', () => {
    const balanced = Array.from({ length: 5 }, () => ({ n: 7, mean: 0, ss: 1 }));
    expect(effectiveGroupSize(balanced)).toBe(7);
    // sizes 2, 4, 12: N = 18, Σn² = 164, n0 = (18 − 164/18)/2 = 4.4444… (by hand) < n̄ = 6
    const sizes = [2, 4, 12].map((n) => ({ n, mean: 0, ss: 1 }));
    expect(effectiveGroupSize(sizes)).toBeCloseTo((18 - 164 / 18) / 2, 14);
  });

  it('ICC(1) and ICC(2) follow their definitions', () => {
    // by hand: (10 − 2)/(10 + 4·2) = 8/18, (10 − 2)/10 = 0.8
    expect(icc1(10, 2, 5)).toBeCloseTo(8 / 18, 15);
    expect(icc2(10, 2)).toBeCloseTo(0.8, 15);
  });

  it('the upper tail equals 1 − cdf where that is accurate', () => {
    // P(F > f) = 1 − cdf for moderate p (@stdlib cdf as the independent value)
    for (const [f, d1, d2] of [
      [0.5, 3, 10],
      [2.5, 7, 40],
      [1, 1, 1],
    ]) {
      expect(fUpperTail(f, d1, d2)).toBeCloseTo(1 - fCdf(f, d1, d2), 12);
    }
  });

  it('the interval brackets the point estimate and narrows with level', () => {
    const [lo95, hi95] = icc1Interval(3, 20, 200, 10);
    const [lo80, hi80] = icc1Interval(3, 20, 200, 10, 0.8);
    const point = (3 - 1) / (3 + 10 - 1); // the bound formula at F itself
    expect(lo95).toBeLessThan(lo80);
    expect(lo80).toBeLessThan(point);
    expect(point).toBeLessThan(hi80);
    expect(hi80).toBeLessThan(hi95);
  });

  it('returns NaN fields when J < 2 or N − J < 1', () => {
    const single = anovaIcc(momentsFromValues([[1, 2, 3]]));
    const singletons = anovaIcc(momentsFromValues([[1], [2], [3]]));
    for (const a of [single, singletons]) {
      expect(a.msb).toBeNaN();
      expect(a.icc).toBeNaN();
      expect(a.ci95[0]).toBeNaN();
      expect(a.ci95[1]).toBeNaN();
    }
  });

  it('throws on a negative ss', () => {
    expect(() => anovaIcc([{ n: 2, mean: 0, ss: -0.5 }])).toThrow('groups[0].ss must be a finite number >= 0');
  });
});
