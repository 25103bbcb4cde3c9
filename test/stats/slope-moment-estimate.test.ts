import { describe, expect, it } from 'vitest';
import { type PairMoments, pairMomentsFromValues } from '../../src/stats/pair-moments.js';
import { slopeMomentEstimate } from '../../src/stats/slope-moment-estimate.js';
import { expectRel, mulberry32, normalGenerator, readReferenceCsv } from './helpers.js';

/** Pair moments per group of a reference CSV, groups in first-seen order. */
function referencePairs(name: string, group: string, x: string, y: string): PairMoments[] {
  const by = new Map<string, { xs: number[]; ys: number[] }>();
  for (const r of readReferenceCsv(name)) {
    const g = by.get(r[group]) ?? { xs: [], ys: [] };
    g.xs.push(Number(r[x]));
    g.ys.push(Number(r[y]));
    by.set(r[group], g);
  }
  return [...by.values()].map((g) => pairMomentsFromValues(g.xs, g.ys));
}

describe('moment estimate of a random slope variance', () => {
  it('equals the REML slope variance on balanced data (sleepstudy: 18 subjects × days 0–9)', () => {
    const s = slopeMomentEstimate(referencePairs('sleepstudy.csv', 'Subject', 'Days', 'Reaction'));
    expect(s.groups).toBe(18);
    // R 4.2.2 + lme4 1.1-31: as.data.frame(VarCorr(lmer(Reaction ~ Days + (Days|Subject), sleepstudy,
    // control = lmerControl(optimizer = "nloptwrap", optCtrl = list(xtol_abs = 1e-14, ftol_abs = 1e-14,
    // xtol_rel = 1e-14, ftol_rel = 1e-14, maxeval = 1e5))))) gives Days variance 35.07166023934 and residual
    // variance 654.94103279997 (the default tolerances stop at 35.071714451, 654.940008260, 1.5e-6 away);
    // fixef Days 10.46728596. Balanced and positive definite: the REML estimate is the moment estimate
    expectRel(s.tau11, 35.07166023934, 1e-7, 'sleepstudy slope variance');
    expectRel(s.sigma2, 654.94103279997, 1e-7, 'sleepstudy residual variance');
    expectRel(s.meanSlope, 10.46728596, 1e-7, 'sleepstudy mean slope');
    expect(s.reliability).toBeGreaterThan(0.5);
    expect(s.reliability).toBeLessThan(1);
  });

  it('recovers a true slope variance on simulated data, and finds none where there is none', () => {
    // 300 groups of 12 records, x ~ N(0, 1), y = 1 + (2 + b_j) x + e, Var(b_j) = 0.25, Var(e) = 1:
    // the estimate's standard error is about 0.03 here, so ±0.1 is a generous but failing bound
    const simulate = (tau11: number, seed: number) => {
      const normal = normalGenerator(mulberry32(seed));
      return Array.from({ length: 300 }, () => {
        const b = 2 + Math.sqrt(tau11) * normal();
        const xs = Array.from({ length: 12 }, () => normal());
        return pairMomentsFromValues(
          xs,
          xs.map((x) => 1 + b * x + normal()),
        );
      });
    };
    const s = slopeMomentEstimate(simulate(0.25, 7));
    expect(Math.abs(s.tau11 - 0.25)).toBeLessThan(0.1);
    expect(Math.abs(s.sigma2 - 1)).toBeLessThan(0.05);
    expect(Math.abs(s.meanSlope - 2)).toBeLessThan(0.1);
    const none = slopeMomentEstimate(simulate(0, 8));
    expect(Math.abs(none.tau11)).toBeLessThan(0.05);
    if (none.tau11 <= 0) expect(none.reliability).toBe(0);
  });

  it('leaves out groups without a slope or a residual degree of freedom', () => {
    const s = slopeMomentEstimate([
      pairMomentsFromValues([1, 2, 3], [1, 2, 4]),
      pairMomentsFromValues([1, 2, 3], [2, 2, 3]),
      pairMomentsFromValues([5, 5, 5], [1, 2, 3]),
      pairMomentsFromValues([1, 2], [1, 3]),
    ]);
    expect(s.groups).toBe(2);
    expect(slopeMomentEstimate([pairMomentsFromValues([1, 2, 3], [1, 2, 4])]).tau11).toBeNaN();
  });
});
