import { afterAll, describe, expect, it } from 'vitest';
import { anovaIcc, mlComponents, momentsFromValues, outcomeStats, remlComponents } from '../../src/stats/index.js';
import { expectRel, logRelativeErrors, readReferenceCsv, referenceMoments } from './helpers.js';

const TOL = 1e-6;
afterAll(logRelativeErrors);

describe('outcomeStats on HSB mathach', () => {
  const groups = referenceMoments('hsb.csv', 'school', 'mathach');
  const stats = outcomeStats(groups);

  it('counts what the README describes', () => {
    expect(stats.n).toBe(7185); // README: 7,185 students
    expect(stats.groups).toBe(160); // README: 160 schools
  });

  it('combines the component estimators', () => {
    expect(stats.reml).toEqual(remlComponents(groups));
    expect(stats.ml).toEqual(mlComponents(groups));
    expect(stats.anova).toEqual(anovaIcc(groups));
  });

  it('matches the README summary values', () => {
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md
    expectRel(stats.reml.icc, 0.1803518, TOL, 'hsb reml icc');
    // fixtures/reference/README.md
    expectRel(stats.designEffect, 8.918571, TOL, 'hsb design effect');
    expectRel(stats.meanReliability, 0.9013773, TOL, 'hsb mean reliability');
    // effective N = N / deff (Kish 1965) with the README's N and design effect
    expectRel(stats.effectiveN, 7185 / 8.918571, TOL, 'hsb effective n');
    // `mean` is the ordinary mean of all scores, recomputed here straight from the CSV rows
    // (the GLS mean of Table 4.2 is stats.reml.mean)
    const scores = readReferenceCsv('hsb.csv').map((row) => Number(row.mathach));
    const direct = scores.reduce((a, b) => a + b, 0) / scores.length;
    expect(stats.mean).toBeCloseTo(direct, 10);
  });
});

describe('outcomeStats edge cases', () => {
  it('drops groups with n = 0 before anything else', () => {
    const groups = momentsFromValues([[1, 2, 3], [], [4, 6, 8, 9]]);
    const withoutEmpty = momentsFromValues([
      [1, 2, 3],
      [4, 6, 8, 9],
    ]);
    const stats = outcomeStats(groups);
    expect(stats.groups).toBe(2);
    expect(stats).toEqual(outcomeStats(withoutEmpty));
  });

  it('a single group: counts and mean, NaN elsewhere', () => {
    const stats = outcomeStats(momentsFromValues([[2, 4, 9]]));
    expect(stats.n).toBe(3);
    expect(stats.groups).toBe(1);
    expect(stats.mean).toBe(5);
    expect(stats.reml.tau2).toBeNaN();
    expect(stats.ml.sigma2).toBeNaN();
    expect(stats.anova.icc).toBeNaN();
    expect(stats.designEffect).toBeNaN();
    expect(stats.effectiveN).toBeNaN();
    expect(stats.meanReliability).toBeNaN();
  });

  it('all groups of size 1 (N − J = 0): counts and mean, NaN elsewhere', () => {
    const stats = outcomeStats(momentsFromValues([[1], [5], [6]]));
    expect(stats.n).toBe(3);
    expect(stats.groups).toBe(3);
    expect(stats.mean).toBe(4);
    expect(stats.reml.icc).toBeNaN();
    expect(stats.anova.f).toBeNaN();
    expect(stats.designEffect).toBeNaN();
  });

  it('no data at all', () => {
    const stats = outcomeStats([]);
    expect(stats.n).toBe(0);
    expect(stats.groups).toBe(0);
    expect(stats.mean).toBeNaN();
    expect(stats.reml.tau2).toBeNaN();
  });

  it('τ² = 0: design effect 1, reliability 0, negative ANOVA ICC', () => {
    const stats = outcomeStats(
      momentsFromValues([
        [1, 2, 3],
        [0, 2, 4],
        [3, 1, 2, 2],
      ]),
    );
    expect(stats.reml.tau2).toBe(0);
    expect(stats.designEffect).toBe(1);
    expect(stats.effectiveN).toBe(stats.n);
    expect(stats.meanReliability).toBe(0);
    expect(stats.anova.icc).toBeLessThan(0);
  });

  it('throws a clear error on invalid moments', () => {
    const good = { n: 3, mean: 1, ss: 2 };
    expect(() => outcomeStats([good, { n: 4, mean: 0, ss: -1 }])).toThrow('groups[1].ss must be a finite number >= 0, got -1');
    expect(() => outcomeStats([{ n: 2.5, mean: 0, ss: 1 }, good])).toThrow('groups[0].n must be a non-negative integer, got 2.5');
    expect(() => outcomeStats([good, { n: 2, mean: NaN, ss: 1 }])).toThrow('groups[1].mean must be a finite number, got NaN');
    expect(() => outcomeStats([good, { n: 1, mean: 3, ss: 0.1 }])).toThrow('groups[1].ss must be 0 for a group of one value, got 0.1');
  });
});
