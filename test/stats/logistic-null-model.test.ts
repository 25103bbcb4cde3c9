import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import type { BinaryGroup } from '../../src/stats/index.js';
import {
  chiSquareHomogeneity,
  clusterSizeVariation,
  gaussHermite,
  latentIcc,
  logisticMarginalLogLik,
  logisticNullModel,
  medianOddsRatio,
  momentsAreZeroOne,
} from '../../src/stats/index.js';
import { mulberry32 } from '../helpers/prng.js';

function simulate(seed: number, groups: number, size: (j: number) => number, beta: number, tau2: number): BinaryGroup[] {
  const rand = mulberry32(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const out: BinaryGroup[] = [];
  for (let j = 0; j < groups; j++) {
    const p = 1 / (1 + Math.exp(-(beta + Math.sqrt(tau2) * normal())));
    const n = size(j);
    let ones = 0;
    for (let i = 0; i < n; i++) if (rand() < p) ones++;
    out.push({ n, ones });
  }
  return out;
}

/** The marginal log-likelihood by brute force: the trapezoid rule on a fine grid of ±12τ (no quadrature nodes). */
function bruteForceLogLik(groups: readonly BinaryGroup[], beta: number, tau: number): number {
  const steps = 20000;
  const h = (24 * tau) / steps;
  let total = 0;
  for (const { n, ones } of groups) {
    let sum = 0;
    for (let k = 0; k <= steps; k++) {
      const u = -12 * tau + k * h;
      const eta = beta + u;
      const f = Math.exp(ones * eta - n * Math.log1p(Math.exp(eta)) - (u * u) / (2 * tau * tau)) / (Math.sqrt(2 * Math.PI) * tau);
      sum += (k === 0 || k === steps ? 0.5 : 1) * f;
    }
    total += Math.log(sum * h);
  }
  return total;
}

describe('gaussHermite (Press et al. 2007, §4.6.2)', () => {
  it('gives the 3-point rule in closed form', () => {
    // H3(x) = 8x³ − 12x: roots 0, ±√(3/2); weights √π/6, 2√π/3 (Abramowitz & Stegun 1964, Table 25.10)
    const { nodes, weights } = gaussHermite(3);
    expect(nodes[0]).toBeCloseTo(Math.sqrt(1.5), 14);
    expect(nodes[1]).toBeCloseTo(0, 14);
    expect(nodes[2]).toBeCloseTo(-Math.sqrt(1.5), 14);
    expect(weights[0]).toBeCloseTo(Math.sqrt(Math.PI) / 6, 14);
    expect(weights[1]).toBeCloseTo((2 * Math.sqrt(Math.PI)) / 3, 14);
  });

  it.each([1, 2, 5, 10, 25, 50, 100])('%i points integrate the even moments up to degree 2n − 1 exactly', (n) => {
    const { nodes, weights } = gaussHermite(n);
    // ∫ x^{2k} e^{−x²} dx = Γ(k + 1/2) = √π (2k − 1)!! / 2^k
    let expected = Math.sqrt(Math.PI);
    for (let k = 0; 2 * k <= Math.min(2 * n - 1, 12); k++) {
      const moment = nodes.reduce((s, x, i) => s + weights[i] * x ** (2 * k), 0);
      expect(Math.abs(moment - expected) / expected).toBeLessThan(1e-11);
      expected *= (2 * k + 1) / 2;
    }
    for (let i = 0; i < n; i++) expect(nodes[i] + nodes[n - 1 - i]).toBeCloseTo(0, 12);
  });

  it('refuses a bad n', () => {
    expect(() => gaussHermite(0)).toThrow(/integer n in \[1, 100\]/);
    expect(() => gaussHermite(2.5)).toThrow();
  });
});

describe('logisticMarginalLogLik: adaptive Gauss–Hermite against brute-force integration', () => {
  // the tolerance is looser where the integrand is far from Gaussian (a lone record, large τ)
  const cases: [BinaryGroup[], number, number, number][] = [
    [[{ n: 10, ones: 3 }], 0, 1, 1e-9],
    [
      [
        { n: 200, ones: 190 },
        { n: 3, ones: 0 },
      ],
      -1.2,
      0.3,
      1e-8,
    ],
    [
      [
        { n: 1, ones: 1 },
        { n: 50, ones: 0 },
        { n: 7, ones: 7 },
      ],
      0.8,
      2.5,
      1e-6,
    ],
    [[{ n: 40, ones: 12 }], -0.5, 0.05, 1e-9],
  ];
  it.each(cases)('groups %j at β0 = %d, τ = %d', (groups, beta, tau, tolerance) => {
    const exact = bruteForceLogLik(groups, beta, tau);
    expect(Math.abs(logisticMarginalLogLik(groups, beta, tau) - exact)).toBeLessThan(tolerance);
    // one point is the Laplace approximation: close, not exact
    expect(Math.abs(logisticMarginalLogLik(groups, beta, tau, 1) - exact)).toBeLessThan(0.1);
  });
});

describe('logisticNullModel', () => {
  // test/stats/reference/logistic-null-scipy.py: SciPy 1.17.1 integrate.quad (adaptive
  // Gauss–Kronrod) + optimize.minimize (Nelder–Mead then BFGS) on the same 24 groups
  const GROUPS: BinaryGroup[] = [
    [12, 3],
    [7, 0],
    [25, 11],
    [3, 1],
    [40, 9],
    [18, 10],
    [9, 2],
    [30, 21],
    [5, 0],
    [14, 4],
    [22, 6],
    [11, 11],
    [16, 5],
    [8, 3],
    [35, 14],
    [6, 2],
    [20, 4],
    [27, 15],
    [4, 1],
    [13, 9],
    [19, 3],
    [10, 6],
    [33, 8],
    [15, 7],
  ].map(([n, ones]) => ({ n, ones }));

  it('matches an independent SciPy fit', () => {
    const fit = logisticNullModel(GROUPS);
    // SciPy: b0 = -0.5410955190, tau2 = 0.6734481827, logLik = -256.7360059894
    expect(fit.converged).toBe(true);
    expect(fit.logLik).toBeCloseTo(-256.7360059894, 8);
    expect(fit.intercept).toBeCloseTo(-0.541095519, 6);
    expect(fit.tau2).toBeCloseTo(0.6734481827, 6);
    expect(fit.icc).toBeCloseTo(latentIcc(fit.tau2), 14);
    expect(fit.mor).toBeCloseTo(medianOddsRatio(fit.tau2), 14);
    // SciPy: logLik at (b0 = -0.5, tau = 1) = -257.078470591955
    expect(logisticMarginalLogLik(GROUPS, -0.5, 1)).toBeCloseTo(-257.078470591955, 9);
  });

  it('recovers a known τ² from a simulated delivery, within sampling error', () => {
    // 2000 groups of 25, β0 = −0.4, τ² = 0.8 (latent ICC 0.196)
    const groups = simulate(20240611, 2000, () => 25, -0.4, 0.8);
    const fit = logisticNullModel(groups);
    expect(fit.converged).toBe(true);
    // standard errors from the observed information: central differences of the log-likelihood in (β0, τ²)
    const f = (b: number, t2: number) => logisticMarginalLogLik(groups, b, Math.sqrt(t2));
    const [b, t] = [fit.intercept, fit.tau2];
    const [hb, ht] = [1e-3, 1e-3];
    const fbb = (f(b + hb, t) - 2 * f(b, t) + f(b - hb, t)) / hb ** 2;
    const ftt = (f(b, t + ht) - 2 * f(b, t) + f(b, t - ht)) / ht ** 2;
    const fbt = (f(b + hb, t + ht) - f(b + hb, t - ht) - f(b - hb, t + ht) + f(b - hb, t - ht)) / (4 * hb * ht);
    const det = fbb * ftt - fbt * fbt;
    const seTau2 = Math.sqrt(-fbb / det);
    const seBeta = Math.sqrt(-ftt / det);
    expect(seTau2).toBeGreaterThan(0.02);
    expect(seTau2).toBeLessThan(0.1);
    expect(Math.abs(fit.tau2 - 0.8)).toBeLessThan(3 * seTau2);
    expect(Math.abs(fit.intercept + 0.4)).toBeLessThan(3 * seBeta);
    expect(Math.abs(fit.icc - latentIcc(0.8))).toBeLessThan(0.03);
  });

  it('averages to the known τ² over replicate deliveries of unequal groups', () => {
    // 12 replicates × 300 groups of 5–60 records, β0 = 1, τ² = 0.5: the mean estimate is within 0.06
    const estimates = Array.from(
      { length: 12 },
      (_, r) => logisticNullModel(simulate(1000 + r, 300, (j) => 5 + ((j * 37) % 56), 1, 0.5)).tau2,
    );
    const mean = estimates.reduce((a, b) => a + b, 0) / estimates.length;
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.06);
  });

  it('gives τ² = 0 when every group has the same share of ones', () => {
    const groups = Array.from({ length: 30 }, () => ({ n: 10, ones: 4 }));
    const fit = logisticNullModel(groups);
    expect(fit).toMatchObject({ tau2: 0, icc: 0, mor: 1, converged: true });
    // the boundary is the ordinary logistic model: 300 records, 120 ones
    expect(fit.logLik).toBeCloseTo(120 * Math.log(0.4) + 180 * Math.log(0.6), 10);
    expect(fit.intercept).toBeCloseTo(Math.log(0.4 / 0.6), 12);
  });

  it('does not depend on the order of the groups or on how identical groups are shared', () => {
    const groups = simulate(7, 200, (j) => 3 + (j % 9), -1, 1.5);
    const a = logisticNullModel(groups);
    const b = logisticNullModel([...groups].reverse());
    expect(b.tau2).toBeCloseTo(a.tau2, 8);
    expect(b.logLik).toBeCloseTo(a.logLik, 8);
  });

  it('is undefined (NaN) when every record is 0, or with one group', () => {
    expect(
      logisticNullModel([
        { n: 5, ones: 0 },
        { n: 8, ones: 0 },
      ]).tau2,
    ).toBeNaN();
    expect(logisticNullModel([{ n: 5, ones: 2 }]).tau2).toBeNaN();
    expect(() => logisticNullModel([{ n: 3, ones: 4 }])).toThrow(/0 <= ones <= n/);
  });

  it('reports no convergence when τ² runs away (every group all 0 or all 1)', () => {
    const fit = logisticNullModel([
      { n: 10, ones: 0 },
      { n: 10, ones: 10 },
      { n: 12, ones: 0 },
      { n: 9, ones: 9 },
    ]);
    expect(fit.converged).toBe(false);
    expect(fit.tau2).toBeGreaterThan(100);
  });
});

describe('latentIcc, medianOddsRatio', () => {
  it('latent ICC: π²/3 ≈ 3.29 on level 1 (Snijders & Bosker 2012)', () => {
    expect(latentIcc((Math.PI * Math.PI) / 3)).toBeCloseTo(0.5, 14);
    expect(latentIcc(0)).toBe(0);
    expect(latentIcc(1)).toBeCloseTo(1 / (1 + 3.289868), 6);
  });

  it('MOR = exp(√(2τ²)·Φ⁻¹(0.75)) (Larsen & Merlo 2005)', () => {
    // the constant: P(χ²₁ ≤ z²) = 2Φ(z) − 1, so Φ(0.6744897501960817) = 0.75 via the kept chi-square library
    const z = 0.6744897501960817;
    expect((1 + chisquareCdf(z * z, 1)) / 2).toBeCloseTo(0.75, 12);
    expect(medianOddsRatio(0)).toBe(1);
    // MOR ≈ exp(0.954·√τ²) (Larsen & Merlo 2005): τ² = 1 gives about 2.6
    expect(medianOddsRatio(1)).toBeCloseTo(Math.exp(Math.SQRT2 * z), 12);
    expect(medianOddsRatio(1)).toBeCloseTo(2.596, 3);
  });
});

describe('momentsAreZeroOne', () => {
  it('accepts 0/1 groups and rejects others', () => {
    expect(
      momentsAreZeroOne([
        { n: 4, mean: 0.25, ss: 0.75 },
        { n: 2, mean: 1, ss: 0 },
      ]),
    ).toBe(true);
    // {0.5, 0.5}: Σx² = 0.5 ≠ Σx = 1
    expect(momentsAreZeroOne([{ n: 2, mean: 0.5, ss: 0 }])).toBe(false);
    expect(momentsAreZeroOne([{ n: 2, mean: 2, ss: 0 }])).toBe(false);
  });
});

describe('chiSquareHomogeneity (Pearson; p from @stdlib/stats-base-dists-chisquare-cdf)', () => {
  it('30/100 against 50/100 missing: X² = 25/3 on 1 df, between the handbook .005 and .001 points', () => {
    // by hand: pooled 0.4, expected 40/60 in each group: 2.5 + 1.667 + 2.5 + 1.667 = 8.333
    const t = chiSquareHomogeneity([
      { n: 100, events: 30 },
      { n: 100, events: 50 },
    ]);
    expect(t.statistic).toBeCloseTo(25 / 3, 12);
    expect(t.df).toBe(1);
    // handbook table of χ² upper points, 1 df: 7.879 at .005, 10.828 at .001 (e.g. Pearson & Hartley, Biometrika Tables, Table 8)
    expect(t.p).toBeLessThan(0.005);
    expect(t.p).toBeGreaterThan(0.001);
    expect(t.p).toBeCloseTo(0.003892, 5);
  });

  it('the kept library reproduces the handbook critical values', () => {
    // Biometrika Tables, Table 8: 3.841 (1 df) and 5.991 (2 df) at .05; 9.210 (2 df) at .01
    expect(1 - chisquareCdf(3.841, 1)).toBeCloseTo(0.05, 4);
    expect(1 - chisquareCdf(5.991, 2)).toBeCloseTo(0.05, 4);
    expect(1 - chisquareCdf(9.21, 2)).toBeCloseTo(0.01, 4);
  });

  it('equal rates give X² = 0, no variation gives p = 1, one group is undefined', () => {
    expect(
      chiSquareHomogeneity([
        { n: 10, events: 2 },
        { n: 20, events: 4 },
      ]).statistic,
    ).toBeCloseTo(0, 12);
    expect(
      chiSquareHomogeneity([
        { n: 10, events: 0 },
        { n: 20, events: 0 },
      ]).p,
    ).toBe(1);
    expect(chiSquareHomogeneity([{ n: 10, events: 2 }]).p).toBeNaN();
  });
});

describe('clusterSizeVariation (Eldridge et al. 2006)', () => {
  it('CV = SD/mean with the sample SD, and the max/min ratio', () => {
    expect(clusterSizeVariation([10, 10, 10]).cv).toBe(0);
    const v = clusterSizeVariation([10, 20, 30]);
    expect(v.sd).toBeCloseTo(10, 12);
    expect(v.cv).toBeCloseTo(0.5, 12);
    expect(v.ratio).toBe(3);
  });
});
