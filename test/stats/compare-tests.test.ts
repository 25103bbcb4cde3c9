import { describe, expect, it } from 'vitest';
import { iccDifference } from '../../src/stats/icc-difference.js';
import { kolmogorovSurvival } from '../../src/stats/kolmogorov-survival.js';
import { ksFromDistributions, ksTwoSample } from '../../src/stats/ks-two-sample.js';
import { populationStability } from '../../src/stats/population-stability.js';
import { twoProportionZ } from '../../src/stats/two-proportion-z.js';

const A = [0.61, 0.29, 0.06, 0.59, -1.73, -0.74, 0.51, -0.56, 0.39, 1.64, 0.05, -0.06, 0.64, -0.82, 0.37, 1.77, 1.09, -1.28, 2.36, 1.31];
const A2 = [...A, 1.05, -0.32, -0.4, 1.06, -2.47];
const B = [2.2, 1.66, 1.38, 0.2, 0.36, 0.0, 0.96, 1.56, 0.44, 1.5, -0.3, 0.66, 2.31, 3.29, -0.27, -0.37, 0.38, 0.7, 0.52, -1.0];
const B2 = [...B, 1.1, 2.1, 1.45, 0.9, 0.1, 1.2, 0.8, 1.9, 0.3, 1.7];

describe('two-sample Kolmogorov–Smirnov', () => {
  it('agrees with scipy 1.17.1', () => {
    // scipy 1.17.1: stats.ks_2samp(A2, B2, method='asymp').statistic = 0.31999999999999995;
    // the asymptotic p of the limiting distribution, stats.kstwobign.sf(sqrt(25*30/55) * D) = 0.12247970382110517
    // (ks_2samp's own 'asymp' p, 0.0895, uses kstwo.sf(D, round(n_e)), a finite-n distribution, not this formula)
    const t = ksTwoSample(A2, B2);
    expect(t.d).toBeCloseTo(0.32, 12);
    expect(t.p).toBeCloseTo(0.12247970382110517, 10);
  });

  it("Kolmogorov's tail agrees with scipy's kstwobign", () => {
    // scipy 1.17.1: stats.kstwobign.sf(1.0) = 0.26999967167735456, stats.kstwobign.sf(1.3581) = 0.0499996304316674
    expect(kolmogorovSurvival(1)).toBeCloseTo(0.26999967167735456, 12);
    expect(kolmogorovSurvival(1.3581)).toBeCloseTo(0.0499996304316674, 12);
    expect(kolmogorovSurvival(0)).toBe(1);
  });

  it('at a subset of points D is a lower bound, and equal distributions give D = 0', () => {
    expect(ksFromDistributions([0.2, 0.5], [0.2, 0.5], 100, 100)).toMatchObject({ d: 0, p: 1 });
    expect(ksFromDistributions([0.2, 0.5], [0.3, 0.9], 100, 100).d).toBeCloseTo(0.4, 12);
    expect(ksTwoSample(A, A).d).toBe(0);
  });
});

describe('population stability index', () => {
  it('agrees with numpy 2.4.6', () => {
    // numpy 2.4.6: e = np.array([.1,.2,.3,.4]); a = np.array([.15,.25,.25,.35]);
    // float(np.sum((a - e) * np.log(a / e))) = 0.04722308044204256
    expect(populationStability([10, 20, 30, 40], [15, 25, 25, 35])).toBeCloseTo(0.04722308044204256, 14);
  });

  it('is 0 for equal shares, skips bins empty in both and floors one-sided empty bins', () => {
    expect(populationStability([5, 0, 5], [50, 0, 50])).toBe(0);
    // hand-computed: shares (0.5, 0.5) against (1, 1e-4 floor): 0.5·ln 2 + (1e-4 − 0.5)·ln(1e-4/0.5)
    expect(populationStability([1, 1], [1, 0])).toBeCloseTo(0.5 * Math.log(2) + (1e-4 - 0.5) * Math.log(1e-4 / 0.5), 12);
  });
});

describe('two-proportion z-test', () => {
  it('agrees with scipy 1.17.1', () => {
    // hand formula with pooled SE; p from scipy 1.17.1 2 * stats.norm.sf(2.249919831824958) = 0.024454034789014437
    const t = twoProportionZ(30, 200, 50, 210);
    expect(t.z).toBeCloseTo(-2.249919831824958, 12);
    expect(t.p).toBeCloseTo(0.024454034789014437, 10);
    expect(twoProportionZ(0, 10, 0, 20)).toEqual({ z: 0, p: 1 });
  });
});

describe('difference of two ICC(1)s', () => {
  it("is ½ ln F apart for the ANOVA estimator (Fisher's z) and finds no change between equal ICCs", () => {
    // balanced, k = n0 = 10: r = (F − 1)/(F + k − 1) maps back to ½ ln F; F = 3 and F = 2 on (49, 450) df
    const r = (f: number) => (f - 1) / (f + 9);
    const a = { icc: r(3), n0: 10, df1: 49, df2: 450 };
    const b = { icc: r(2), n0: 10, df1: 49, df2: 450 };
    const t = iccDifference(a, b);
    expect(t.z).toBeCloseTo((0.5 * Math.log(2) - 0.5 * Math.log(3)) / Math.sqrt(1 / 49 + 1 / 450), 12);
    expect(iccDifference(a, a)).toEqual({ z: 0, p: 1 });
    expect(Number.isNaN(iccDifference({ ...a, icc: null }, b).p)).toBe(true);
  });
});
