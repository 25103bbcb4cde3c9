// Property tests on simulated data (seeded mulberry32 + Box–Muller from helpers.ts, so every
// run sees the same data sets).
import { describe, expect, it } from 'vitest';
import { anovaIcc, effectiveGroupSize, momentsFromValues, remlComponents, remlDeviance } from '../../src/stats/index.js';
import { mulberry32, randomSizes, simulateGroups } from './helpers.js';

// Large-sample standard error of an ICC estimate from J groups of size n:
// Var(ρ̂) ≈ 2(1 − ρ)²(1 + (n − 1)ρ)² / (n(n − 1)(J − 1)) (Fisher 1925; Donner 1986,
// *Int. Stat. Rev.* 54(1), for ICC(1)); with unequal groups n0 stands in for n, as usual.
// REML is at least as efficient as ANOVA, so this SE is if anything generous for REML.
function iccStandardError(icc: number, n: number, groups: number): number {
  const v = (2 * (1 - icc) ** 2 * (1 + (n - 1) * icc) ** 2) / (n * (n - 1) * (groups - 1));
  return Math.sqrt(v);
}

const PATTERNS: { name: string; sizes: (seed: number) => number[] }[] = [
  { name: 'balanced 50 × 20', sizes: () => Array<number>(50).fill(20) },
  { name: 'unbalanced 80 groups of 2..60', sizes: (seed) => randomSizes(80, 2, 60, seed) },
  { name: 'many small: 300 groups of 3..6', sizes: (seed) => randomSizes(300, 3, 6, seed) },
];

describe('REML ICC recovers the simulated ICC', () => {
  let seed = 1000;
  for (const pattern of PATTERNS) {
    for (const icc of [0.05, 0.2, 0.5]) {
      seed += 17;
      const scenarioSeed = seed;
      it(`${pattern.name}, ICC ${icc}`, () => {
        const groups = momentsFromValues(simulateGroups(pattern.sizes(scenarioSeed), icc, scenarioSeed + 1));
        const reml = remlComponents(groups);
        const se = iccStandardError(icc, effectiveGroupSize(groups), groups.length);
        // Within 3 sampling SEs. A fixed bound such as 0.06 would be too tight for ICC 0.5
        // with 50 × 20 (SE ≈ 0.054) and far too loose for ICC 0.05 (SE ≈ 0.019), so the bound
        // scales with the SE; at 3 SE a correct estimator fails about 0.3% of the time.
        expect(Math.abs(reml.icc - icc), `estimate ${reml.icc}, SE ${se}`).toBeLessThan(3 * se);
      });
    }
  }
});

describe('REML over many random data sets, including pure noise', () => {
  const uniform = mulberry32(77);
  const cases = Array.from({ length: 300 }, (_, k) => {
    const groupCount = 2 + Math.floor(uniform() * 59);
    const balanced = uniform() < 0.4;
    const common = 2 + Math.floor(uniform() * 15);
    const sizes = balanced ? Array<number>(groupCount).fill(common) : randomSizes(groupCount, 1, 20, 5000 + k);
    const icc = [0, 0, 0.02, 0.1, 0.4][k % 5];
    return { sizes, balanced, icc, seed: 9000 + k };
  });
  const fits = cases.map((c) => {
    const groups = momentsFromValues(simulateGroups(c.sizes, c.icc, c.seed));
    return { ...c, groups, reml: remlComponents(groups), anova: anovaIcc(groups) };
  });
  const estimable = fits.filter((f) => f.groups.length >= 2 && f.groups.some((g) => g.n > 1));

  it('τ² is never negative and σ² is always positive', () => {
    expect(estimable.length).toBeGreaterThan(250);
    for (const f of estimable) {
      expect(f.reml.tau2).toBeGreaterThanOrEqual(0);
      expect(f.reml.sigma2).toBeGreaterThan(0);
      expect(f.reml.icc).toBeGreaterThanOrEqual(0);
      expect(f.reml.icc).toBeLessThan(1);
      expect(Number.isFinite(f.reml.logLik)).toBe(true);
    }
  });

  it('the pure-noise sets hit the τ² = 0 boundary exactly in some cases', () => {
    const zeros = estimable.filter((f) => f.icc === 0 && f.reml.tau2 === 0);
    expect(zeros.length).toBeGreaterThan(20);
  });

  it('the reported λ is no worse than λ = 0 or a nearby λ', () => {
    for (const f of estimable) {
      const lambda = f.reml.tau2 / f.reml.sigma2;
      const best = remlDeviance(f.groups, lambda);
      expect(best).toBeLessThanOrEqual(remlDeviance(f.groups, 0) + 1e-9);
      for (const nearby of [lambda * 0.999, lambda * 1.001, lambda + 1e-4]) {
        expect(best).toBeLessThanOrEqual(remlDeviance(f.groups, nearby) + 1e-9);
      }
    }
  });

  it('on balanced data REML equals ANOVA when F > 1, and τ² = 0 when F ≤ 1', () => {
    // Known result: for balanced one-way data REML gives σ² = MSW and τ² = (MSB − MSW)/n when
    // that is ≥ 0, else τ² = 0 (Searle, Casella & McCulloch 1992, ch. 3 and 6).
    const balanced = estimable.filter((f) => f.balanced);
    expect(balanced.length).toBeGreaterThan(80);
    let compared = 0;
    for (const f of balanced) {
      if (f.anova.f > 1) {
        expect(Math.abs(f.reml.icc - f.anova.icc)).toBeLessThan(1e-8);
        compared++;
      } else {
        expect(f.reml.tau2).toBe(0);
      }
    }
    expect(compared).toBeGreaterThan(40);
  });
});
