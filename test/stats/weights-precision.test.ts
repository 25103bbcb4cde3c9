import { describe, expect, it } from 'vitest';
import { kishEffectiveSize, weightingDesignEffect, weightScaleFactors } from '../../src/stats/kish-weights.js';
import { plannedPrecision, shiftedTPower, unequalSizeDesignEffect } from '../../src/stats/planned-precision.js';

describe('Kish effective size, weighting design effect and scale factors', () => {
  it('weights 1, 1, 2, 2: effective size 36/10 and 1 + CV² = 10/9 (by hand, Kish 1965 §11.7)', () => {
    const w = { n: 4, sum: 6, sumSquares: 10 };
    expect(kishEffectiveSize(w)).toBeCloseTo(3.6, 12);
    expect(weightingDesignEffect(w)).toBeCloseTo(10 / 9, 12);
    expect(weightScaleFactors(w)).toEqual({ size: 4 / 6, effective: 0.6 });
  });

  it('agrees with numpy on six unequal weights', () => {
    // numpy 2.4.6: w = np.array([0.8, 1.3, 2.7, 4.1, 0.5, 1.9]); w.sum()**2 / (w**2).sum() = 4.215582701,
    // len(w) * (w**2).sum() / w.sum()**2 = 1.423290782, len(w) / w.sum() = 0.5309734513, w.sum() / (w**2).sum() = 0.373060416
    const w = [0.8, 1.3, 2.7, 4.1, 0.5, 1.9];
    const sums = { n: 6, sum: w.reduce((a, b) => a + b, 0), sumSquares: w.reduce((a, b) => a + b * b, 0) };
    expect(kishEffectiveSize(sums)).toBeCloseTo(4.215582701, 8);
    expect(weightingDesignEffect(sums)).toBeCloseTo(1.423290782, 8);
    const f = weightScaleFactors(sums);
    expect(f.size).toBeCloseTo(0.5309734513, 9);
    expect(f.effective).toBeCloseTo(0.373060416, 8);
    // the scaled weights sum to the group size and to the effective size
    expect(f.size * sums.sum).toBeCloseTo(6, 12);
    expect(f.effective * sums.sum).toBeCloseTo(kishEffectiveSize(sums), 12);
  });

  it('no weight or a zero sum gives NaN, not a number that misleads', () => {
    expect(kishEffectiveSize({ n: 0, sum: 0, sumSquares: 0 })).toBeNaN();
    expect(weightScaleFactors({ n: 2, sum: 0, sumSquares: 0 }).size).toBeNaN();
  });
});

describe('MDES of a level-2 predictor and power', () => {
  const base = { icc: 0.1, groups: 40, meanSize: 20, sizeCv: 0, predictorVariance: 0.25, alpha: 0.05, power: 0.8 };

  it('matches scipy for equal and unequal group sizes', () => {
    // scipy 1.17.1: df = J − 2; M = stats.t.ppf(1 − α/2, df) + stats.t.ppf(power, df);
    // de = 1 + ((cv**2 + 1)·n − 1)·ρ; se = sqrt(de / (P(1−P)·J·n)); MDES = M·se
    // (ρ .1, J 40, n 20, P .5): df 38, M 2.87557692, de 2.9, MDES 0.3462653146; with cv .5: de 3.4, MDES 0.3749293595
    const equal = plannedPrecision(base);
    expect(equal.df).toBe(38);
    expect(equal.multiplier).toBeCloseTo(2.87557692, 7);
    expect(equal.designEffect).toBeCloseTo(2.9, 12);
    expect(equal.mdes).toBeCloseTo(0.3462653146, 8);
    expect(equal.mdesEqual).toBeCloseTo(equal.mdes, 12);
    const unequal = plannedPrecision({ ...base, sizeCv: 0.5 });
    expect(unequal.designEffect).toBeCloseTo(3.4, 12);
    expect(unequal.mdes).toBeCloseTo(0.3749293595, 8);
    expect(unequal.mdesEqual).toBeCloseTo(0.3462653146, 8);
    // (ρ .2, J 12, n 8, P .25, power .9, cv .3): df 10, M 3.600322493, de 2.544, MDES 1.353516968
    const small = plannedPrecision({
      icc: 0.2,
      groups: 12,
      meanSize: 8,
      sizeCv: 0.3,
      predictorVariance: 0.25 * 0.75,
      alpha: 0.05,
      power: 0.9,
    });
    expect(small.multiplier).toBeCloseTo(3.600322493, 7);
    expect(small.mdes).toBeCloseTo(1.353516968, 7);
  });

  it('the multiplier tends to Bloom’s 2.8 with many groups (z .975 + z .80 = 2.8016)', () => {
    // Bloom (2005): for a two-sided .05 test with power .80 the multiplier approaches 2.8 as J grows (recalled from memory);
    // scipy 1.17.1: stats.norm.ppf(.975) + stats.norm.ppf(.8) = 2.8015852181
    expect(plannedPrecision({ ...base, groups: 100_000 }).multiplier).toBeCloseTo(2.8015852, 3);
  });

  it('Eldridge et al. design effect reduces to 1 + (n − 1)ρ at CV 0 (Eldridge, Ashby & Kerry 2006, eq. 2)', () => {
    expect(unequalSizeDesignEffect(0.05, 30, 0)).toBeCloseTo(1 + 29 * 0.05, 12);
    expect(unequalSizeDesignEffect(0.1, 20, 0.5)).toBeCloseTo(3.4, 12);
  });

  it('power: shifted central t, close to the exact noncentral t; at the MDES it is the power asked for', () => {
    const p = plannedPrecision({ ...base, sizeCv: 0.5 });
    // scipy 1.17.1, df 38, λ = 0.4 / 0.1303840481, crit = stats.t.ppf(.975, 38):
    // shifted: stats.t.cdf(λ − crit, 38) + stats.t.cdf(−crit − λ, 38) = 0.8483421377;
    // noncentral: 1 − stats.nct.cdf(crit, 38, λ) + stats.nct.cdf(−crit, 38, λ) = 0.8483808918
    expect(p.standardError).toBeCloseTo(0.1303840481, 9);
    const power = shiftedTPower(0.4, p.standardError, p.df, 0.05);
    expect(power).toBeCloseTo(0.8483421377, 8);
    expect(Math.abs(power - 0.8483808918)).toBeLessThan(1e-4);
    expect(shiftedTPower(p.mdes, p.standardError, p.df, 0.05)).toBeCloseTo(0.8, 3);
  });

  it('too few groups for a t test gives NaN', () => {
    expect(plannedPrecision({ ...base, groups: 2 }).mdes).toBeNaN();
    expect(shiftedTPower(0.5, 0.1, 0, 0.05)).toBeNaN();
  });
});
