import { afterAll, describe, expect, it } from 'vitest';
import { designEffect, effectiveSampleSize, groupMeanReliability, meanReliability, remlComponents } from '../../src/stats/index.js';
import { expectRel, logRelativeErrors, referenceMoments } from './helpers.js';

const TOL = 1e-6;
afterAll(logRelativeErrors);

describe('group-mean reliability (Raudenbush & Bryk 2002, eq. 3.58)', () => {
  it('follows τ²/(τ² + σ²/n)', () => {
    // by hand: 1/(1 + 4/4) = 0.5
    expect(groupMeanReliability(1, 4, 4)).toBe(0.5);
    // Spearman–Brown form nρ/(1 + (n − 1)ρ) with ρ = 0.2, n = 10 gives 2/2.8 (same quantity)
    expect(groupMeanReliability(0.2, 0.8, 10)).toBeCloseTo(2 / 2.8, 15);
    expect(groupMeanReliability(0, 1, 50)).toBe(0);
  });

  it('averages over HSB schools', () => {
    const groups = referenceMoments('hsb.csv', 'school', 'mathach');
    const reml = remlComponents(groups);
    const r = meanReliability(groups, reml.tau2, reml.sigma2);
    // fixtures/reference/README.md: mean over schools, REML components
    expectRel(r, 0.9013773, TOL, 'hsb mean reliability');
    // Raudenbush & Bryk 2002, Table 4.2 (0.90), quoted from memory per the README
    expect(r.toFixed(2)).toBe('0.90');
  });

  it('ignores empty groups', () => {
    const groups = [
      { n: 4, mean: 1, ss: 2 },
      { n: 0, mean: NaN, ss: 0 },
    ];
    expect(meanReliability(groups, 1, 4)).toBe(0.5);
  });
});

describe('design effect and effective N (Kish 1965)', () => {
  it('follows 1 + (n̄ − 1)·ICC and N/deff', () => {
    // by hand: 1 + 19·0.1 = 2.9; 1000/2.9
    expect(designEffect(20, 0.1)).toBeCloseTo(2.9, 15);
    expect(effectiveSampleSize(1000, 2.9)).toBeCloseTo(1000 / 2.9, 12);
    expect(designEffect(20, 0)).toBe(1);
  });

  it('matches the HSB value in the README', () => {
    const groups = referenceMoments('hsb.csv', 'school', 'mathach');
    const deff = designEffect(7185 / 160, remlComponents(groups).icc);
    // fixtures/reference/README.md: 1 + (mean n_j − 1)·ICC_REML
    expectRel(deff, 8.918571, TOL, 'hsb design effect');
  });
});
