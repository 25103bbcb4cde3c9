// Reference values from outside the project: fixtures/reference/README.md (copied from
// /work/shared/reference-data), R 4.2.2 + lme4 1.1-31 and R's anova(lm(...)), plus published
// tables.
import { afterAll, describe, expect, it } from 'vitest';
import { anovaIcc, mlComponents, outcomeStats, remlComponents } from '../../src/stats/index.js';
import { expectRel, referenceMoments, relativeErrors } from './helpers.js';

const TOL = 1e-6;

describe('HSB mathach by school (7,185 students, 160 schools)', () => {
  const groups = referenceMoments('hsb.csv', 'school', 'mathach');
  const stats = outcomeStats(groups);

  it('has the data set size in the README', () => {
    expect(stats.n).toBe(7185); // README: 7,185 students
    expect(stats.groups).toBe(160); // README: 160 schools
  });

  it('matches lme4 REML', () => {
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md
    expectRel(stats.reml.tau2, 8.614025, TOL, 'hsb reml tau2');
    expectRel(stats.reml.sigma2, 39.148322, TOL, 'hsb reml sigma2');
    expectRel(stats.reml.mean, 12.636974, TOL, 'hsb reml mean');
    expectRel(stats.reml.icc, 0.1803518, TOL, 'hsb reml icc');
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md (2 decimals, so absolute 0.01)
    expect(Math.abs(stats.reml.logLik - -23558.4)).toBeLessThanOrEqual(0.01);
  });

  it('matches lme4 ML', () => {
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md
    expectRel(stats.ml.tau2, 8.553464, TOL, 'hsb ml tau2');
    expectRel(stats.ml.sigma2, 39.1484, TOL, 'hsb ml sigma2');
    expectRel(stats.ml.mean, 12.63707, TOL, 'hsb ml mean');
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md (2 decimals, so absolute 0.01)
    expect(Math.abs(stats.ml.logLik - -23557.91)).toBeLessThanOrEqual(0.01);
  });

  it('matches R one-way ANOVA', () => {
    // R anova(lm(mathach ~ factor(school))), per fixtures/reference/README.md
    expectRel(stats.anova.msb, 408.21986, TOL, 'hsb msb');
    expectRel(stats.anova.msw, 39.141634, TOL, 'hsb msw');
    expectRel(stats.anova.f, 10.4293, TOL, 'hsb f');
    expect(stats.anova.df1).toBe(159); // README: (159, 7025) df
    expect(stats.anova.df2).toBe(7025); // README: (159, 7025) df
    expectRel(stats.anova.n0, 44.88669, TOL, 'hsb n0');
    expectRel(stats.anova.icc, 0.1736008, TOL, 'hsb icc1');
    expectRel(stats.anova.ci95[0], 0.1422766, TOL, 'hsb icc1 lower');
    expectRel(stats.anova.ci95[1], 0.2135971, TOL, 'hsb icc1 upper');
    // The README gives no p here. F = 10.43 on (159, 7025) df puts p near 1e-217, where
    // 1 − cdf would round to exactly 0; the reciprocal-F form must keep it positive.
    expect(stats.anova.p).toBeGreaterThan(0);
    expect(stats.anova.p).toBeLessThan(1e-100);
  });

  it('matches the README reliability and design effect', () => {
    // fixtures/reference/README.md: mean of tau2/(tau2 + sigma2/n_j), REML components
    expectRel(stats.meanReliability, 0.9013773, TOL, 'hsb mean reliability');
    // fixtures/reference/README.md: 1 + (mean n_j − 1)·ICC_REML
    expectRel(stats.designEffect, 8.918571, TOL, 'hsb design effect');
    // effective N is defined as N / deff (Kish 1965); 7185 / 8.918571 from the README values
    expectRel(stats.effectiveN, 7185 / 8.918571, TOL, 'hsb effective n');
  });

  it('rounds to Raudenbush & Bryk (2002) Table 4.2', () => {
    // Raudenbush & Bryk 2002, Table 4.2, quoted from memory per fixtures/reference/README.md
    expect(stats.reml.mean.toFixed(2)).toBe('12.64');
    expect(stats.reml.tau2.toFixed(2)).toBe('8.61');
    expect(stats.reml.sigma2.toFixed(2)).toBe('39.15');
    expect(stats.reml.icc.toFixed(2)).toBe('0.18');
    expect(stats.meanReliability.toFixed(2)).toBe('0.90');
  });
});

describe('HSB ses by school', () => {
  const groups = referenceMoments('hsb.csv', 'school', 'ses');

  it('matches lme4 REML', () => {
    const reml = remlComponents(groups);
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md
    expectRel(reml.tau2, 0.16081679, TOL, 'ses reml tau2');
    expectRel(reml.sigma2, 0.44624439, TOL, 'ses reml sigma2');
    expectRel(reml.icc, 0.2649104, TOL, 'ses reml icc');
  });

  it('matches the R ANOVA ICC(1)', () => {
    // R anova(lm(ses ~ factor(school))), per fixtures/reference/README.md
    expectRel(anovaIcc(groups).icc, 0.2665809, TOL, 'ses icc1');
  });
});

describe('Shrout & Fleiss (1979) Table 2, target as group', () => {
  const groups = referenceMoments('shrout-fleiss-1979.csv', 'target', 'rating');
  const anova = anovaIcc(groups);

  it('matches the one-way ANOVA', () => {
    // Shrout & Fleiss 1979 data, values per fixtures/reference/README.md
    expectRel(anova.msb, 11.241667, TOL, 'sf msb');
    expectRel(anova.msw, 6.263889, TOL, 'sf msw');
    expectRel(anova.f, 1.794678, TOL, 'sf f');
    expect(anova.df1).toBe(5); // README: (5, 18) df
    expect(anova.df2).toBe(18); // README: (5, 18) df
    // README gives p to 5 significant digits, so 1e-4 relative
    expectRel(anova.p, 0.16477, 1e-4, 'sf p');
    expect(anova.n0).toBe(4); // balanced: 4 judges per target
  });

  it('matches ICC(1,1), ICC(1,k) and the F interval', () => {
    // fixtures/reference/README.md; published ICC(1,1) = .17, ICC(1,k) = .44 (Shrout & Fleiss 1979)
    expectRel(anova.icc, 0.1657418, TOL, 'sf icc1');
    expectRel(anova.icc2, 0.4427971, TOL, 'sf icc2');
    expectRel(anova.ci95[0], -0.1329323, TOL, 'sf icc1 lower');
    expectRel(anova.ci95[1], 0.7225601, TOL, 'sf icc1 upper');
    expect(anova.icc.toFixed(2)).toBe('0.17'); // Shrout & Fleiss 1979, published ICC(1,1)
    expect(anova.icc2.toFixed(2)).toBe('0.44'); // Shrout & Fleiss 1979, published ICC(1,k)
  });

  it('gives the REML components the README derives (balanced, so equal to ANOVA)', () => {
    const reml = remlComponents(groups);
    // fixtures/reference/README.md: REML tau2 = 1.244444, sigma2 = 6.263889
    expectRel(reml.tau2, 1.244444, TOL, 'sf reml tau2');
    expectRel(reml.sigma2, 6.263889, TOL, 'sf reml sigma2');
    // same ICC as ANOVA, per the README
    expectRel(reml.icc, 0.1657418, TOL, 'sf reml icc');
    // ML exists and stays below REML's τ² here (ML does not correct for estimating μ)
    expect(mlComponents(groups).tau2).toBeLessThan(reml.tau2);
  });
});

afterAll(() => {
  const worst = relativeErrors.reduce((a, b) => (b.error > a.error ? b : a), {
    label: '',
    error: 0,
  });
  console.log(
    relativeErrors.map((r) => `${r.label}: ${r.error.toExponential(2)}`).join('\n'),
    `\nmax relative error: ${worst.error.toExponential(3)} (${worst.label})`,
  );
});
