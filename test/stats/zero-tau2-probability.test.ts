import { describe, expect, it } from 'vitest';
import { remlComponents } from '../../src/stats/index.js';
import { momentsFromValues } from '../../src/stats/moments-from-values.js';
import { zeroTau2Probability } from '../../src/stats/zero-tau2-probability.js';
import { expectRel, mulberry32, normalGenerator } from './helpers.js';

describe('probability that REML puts τ² at zero', () => {
  it('is P(F(J − 1, N − J) ≤ 1/F_obs)', () => {
    // scipy 1.17.1: scipy.stats.f.cdf(1/1.794678, 5, 18) = 0.26877767079757847 (Shrout & Fleiss 1979 data, F 1.794678)
    expectRel(zeroTau2Probability(1.794678, 5, 18), 0.26877767079757847, 1e-9);
    // scipy 1.17.1: scipy.stats.f.cdf(1/10.4293, 159, 7025) = 1.8648356509409153e-51 (HSB mathach)
    expectRel(zeroTau2Probability(10.4293, 159, 7025), 1.8648356509409153e-51, 1e-6);
    expect(zeroTau2Probability(0.8, 5, 18)).toBe(1);
    expect(zeroTau2Probability(2, 0, 18)).toBeNaN();
  });

  it('matches the share of zero REML fits on simulated balanced data', () => {
    // J = 10 groups of 5, true λ = 0.1: P(τ̂² = 0) = P(F(9, 40) ≤ 1/1.5) = 0.2664655777981588
    // (scipy 1.17.1, scipy.stats.f.cdf(1/1.5, 9, 40)); 1,000 replicates give a standard error of 0.014
    const normal = normalGenerator(mulberry32(11));
    let zeros = 0;
    const reps = 1000;
    for (let r = 0; r < reps; r++) {
      const groups = Array.from({ length: 10 }, () => {
        const u = Math.sqrt(0.1) * normal();
        return Array.from({ length: 5 }, () => u + normal());
      });
      if (remlComponents(momentsFromValues(groups)).tau2 === 0) zeros++;
    }
    expect(Math.abs(zeros / reps - 0.2664655777981588)).toBeLessThan(0.045);
  });
});
