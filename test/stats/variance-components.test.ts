import { afterAll, describe, expect, it } from 'vitest';
import {
  mlComponents,
  mlDeviance,
  mlDevianceDerivative,
  momentsFromValues,
  remlComponents,
  remlDeviance,
  remlDevianceDerivative,
} from '../../src/stats/index.js';
import { expectRel, logRelativeErrors, referenceMoments, simulateGroups } from './helpers.js';

const TOL = 1e-6;
afterAll(logRelativeErrors);

describe('REML and ML against lme4 (fixtures/reference/README.md)', () => {
  const mathach = referenceMoments('hsb.csv', 'school', 'mathach');

  it('HSB mathach REML', () => {
    const reml = remlComponents(mathach);
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md
    expectRel(reml.tau2, 8.614025, TOL, 'hsb mathach reml tau2');
    expectRel(reml.sigma2, 39.148322, TOL, 'hsb mathach reml sigma2');
    expectRel(reml.mean, 12.636974, TOL, 'hsb mathach reml mean');
    expectRel(reml.icc, 0.1803518, TOL, 'hsb mathach reml icc');
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md (2 decimals: absolute 0.01)
    expect(Math.abs(reml.logLik - -23558.4)).toBeLessThanOrEqual(0.01);
  });

  it('HSB mathach ML', () => {
    const ml = mlComponents(mathach);
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md
    expectRel(ml.tau2, 8.553464, TOL, 'hsb mathach ml tau2');
    expectRel(ml.sigma2, 39.1484, TOL, 'hsb mathach ml sigma2');
    expectRel(ml.mean, 12.63707, TOL, 'hsb mathach ml mean');
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md (2 decimals: absolute 0.01)
    expect(Math.abs(ml.logLik - -23557.91)).toBeLessThanOrEqual(0.01);
  });

  it('HSB mathach matches Raudenbush & Bryk (2002) Table 4.2 at its rounding', () => {
    const reml = remlComponents(mathach);
    // Raudenbush & Bryk 2002, Table 4.2, quoted from memory per fixtures/reference/README.md
    expect(reml.mean.toFixed(2)).toBe('12.64');
    expect(reml.tau2.toFixed(2)).toBe('8.61');
    expect(reml.sigma2.toFixed(2)).toBe('39.15');
    expect(reml.icc.toFixed(2)).toBe('0.18');
  });

  it('HSB ses REML', () => {
    const reml = remlComponents(referenceMoments('hsb.csv', 'school', 'ses'));
    // R 4.2.2 + lme4 1.1-31, per fixtures/reference/README.md
    expectRel(reml.tau2, 0.16081679, TOL, 'hsb ses reml tau2');
    expectRel(reml.sigma2, 0.44624439, TOL, 'hsb ses reml sigma2');
    expectRel(reml.icc, 0.2649104, TOL, 'hsb ses reml icc');
  });

  it('Shrout & Fleiss (1979) REML equals the balanced ANOVA estimates', () => {
    const groups = referenceMoments('shrout-fleiss-1979.csv', 'target', 'rating');
    const reml = remlComponents(groups);
    // fixtures/reference/README.md: balanced, so REML tau2 = 1.244444, sigma2 = 6.263889
    expectRel(reml.tau2, 1.244444, TOL, 'sf reml tau2');
    expectRel(reml.sigma2, 6.263889, TOL, 'sf reml sigma2');
    // fixtures/reference/README.md: same ICC as ANOVA ICC(1) = 0.1657418
    expectRel(reml.icc, 0.1657418, TOL, 'sf reml icc');
  });
});

describe('the τ² = 0 boundary', () => {
  // Four groups with the same mean (2) but spread inside: MSB = 0 < MSW, so the likelihood is
  // largest at τ² = 0 and the model collapses to one normal sample.
  const values = [
    [1, 2, 3],
    [0, 2, 4],
    [3, 1, 2, 2],
    [2.5, 1.5],
  ];
  const groups = momentsFromValues(values);
  const all = values.flat();
  const n = all.length;
  const mean = all.reduce((a, b) => a + b, 0) / n;
  const ssTotal = all.reduce((a, y) => a + (y - mean) ** 2, 0);

  it('REML returns exactly zero τ² and the single-level REML log-likelihood', () => {
    const reml = remlComponents(groups);
    expect(reml.tau2).toBe(0);
    expect(reml.icc).toBe(0);
    expect(reml.mean).toBeCloseTo(mean, 14);
    // single-level REML: σ² = SS/(N−1), ℓ_R = −½[(N−1)(1 + log 2πσ²) + log N]
    // (Patterson & Thompson 1971 with X = 1, so log|X′X| = log N)
    const s2 = ssTotal / (n - 1);
    expect(reml.sigma2).toBeCloseTo(s2, 14);
    const singleLevel = -0.5 * ((n - 1) * (1 + Math.log(2 * Math.PI * s2)) + Math.log(n));
    expect(reml.logLik).toBeCloseTo(singleLevel, 10);
  });

  it('ML returns exactly zero τ² and the single-level normal log-likelihood', () => {
    const ml = mlComponents(groups);
    expect(ml.tau2).toBe(0);
    expect(ml.icc).toBe(0);
    expect(ml.sigma2).toBeCloseTo(ssTotal / n, 14);
    // normal log-likelihood at the MLE: −N/2 · (1 + log(2π·SS/N))
    expect(ml.logLik).toBeCloseTo((-n / 2) * (1 + Math.log((2 * Math.PI * ssTotal) / n)), 10);
  });
});

// Direct −2 log-likelihood of y ~ N(μ1, V), V = blockdiag σ²(I + λ11′), from the raw values.
// Per group: log|V_j| = n log σ² + log(1 + nλ) (matrix determinant lemma) and
// r′V_j⁻¹r = (Σr² − λ(Σr)²/(1 + nλ))/σ² (Sherman–Morrison); 1′V_j⁻¹1 likewise for REML.
function directTerms(values: number[][], mu: number, tau2: number, sigma2: number) {
  const lambda = tau2 / sigma2;
  let logDet = 0;
  let quad = 0;
  let info = 0;
  let n = 0;
  for (const group of values) {
    const m = group.length;
    const r = group.map((y) => y - mu);
    const sum = r.reduce((a, b) => a + b, 0);
    const sumSq = r.reduce((a, b) => a + b * b, 0);
    logDet += m * Math.log(sigma2) + Math.log(1 + m * lambda);
    quad += (sumSq - (lambda * sum * sum) / (1 + m * lambda)) / sigma2;
    info += (m - (lambda * m * m) / (1 + m * lambda)) / sigma2;
    n += m;
  }
  return { logDet, quad, info, n };
}

function directMlLogLik(values: number[][], mu: number, tau2: number, sigma2: number): number {
  const t = directTerms(values, mu, tau2, sigma2);
  return -0.5 * (t.logDet + t.quad + t.n * Math.log(2 * Math.PI));
}

// REML (Patterson & Thompson 1971; Harville 1977): the ML kernel at the GLS mean plus
// −½ log|X′V⁻¹X|, with (N − 1) instead of N in the 2π constant, as in lme4.
function directRemlLogLik(values: number[][], tau2: number, sigma2: number): number {
  const lambda = tau2 / sigma2;
  let num = 0;
  let den = 0;
  for (const g of values) {
    const w = g.length / (1 + g.length * lambda);
    num += (w * g.reduce((a, b) => a + b, 0)) / g.length;
    den += w;
  }
  const t = directTerms(values, num / den, tau2, sigma2);
  return -0.5 * (t.logDet + t.quad + Math.log(t.info) + (t.n - 1) * Math.log(2 * Math.PI));
}

describe('singleton groups mixed with larger groups', () => {
  // 40 groups: half singletons, the rest 2..30 values, true ICC 0.3.
  const sizes = Array.from({ length: 40 }, (_, j) => (j % 2 === 0 ? 1 : 2 + ((j * 7) % 29)));
  const values = simulateGroups(sizes, 0.3, 20240601);
  const groups = momentsFromValues(values);
  const reml = remlComponents(groups);
  const ml = mlComponents(groups);

  it('gives finite, positive components', () => {
    for (const fit of [reml, ml]) {
      expect(Number.isFinite(fit.tau2) && fit.tau2 > 0).toBe(true);
      expect(Number.isFinite(fit.sigma2) && fit.sigma2 > 0).toBe(true);
      expect(fit.icc).toBeGreaterThan(0);
      expect(fit.icc).toBeLessThan(1);
    }
  });

  it('ML log-likelihood equals the directly computed multivariate normal one', () => {
    const direct = directMlLogLik(values, ml.mean, ml.tau2, ml.sigma2);
    expect(Math.abs(ml.logLik - direct)).toBeLessThan(1e-8);
  });

  it('REML log-likelihood equals the directly computed restricted one', () => {
    const direct = directRemlLogLik(values, reml.tau2, reml.sigma2);
    expect(Math.abs(reml.logLik - direct)).toBeLessThan(1e-8);
  });

  it('no nearby (τ², σ²) has a higher direct likelihood', () => {
    // brute force over a multiplicative grid around the reported optimum, plus τ² = 0
    for (const a of [0.9, 0.99, 0.999, 1, 1.001, 1.01, 1.1]) {
      for (const b of [0.9, 0.99, 0.999, 1, 1.001, 1.01, 1.1]) {
        const t2 = reml.tau2 * a;
        const s2 = reml.sigma2 * b;
        expect(directRemlLogLik(values, t2, s2)).toBeLessThanOrEqual(reml.logLik + 1e-9);
        const mt = ml.tau2 * a;
        const ms = ml.sigma2 * b;
        for (const mu of [ml.mean - 0.01, ml.mean, ml.mean + 0.01]) {
          expect(directMlLogLik(values, mu, mt, ms)).toBeLessThanOrEqual(ml.logLik + 1e-9);
        }
      }
    }
    expect(directRemlLogLik(values, 0, reml.sigma2)).toBeLessThan(reml.logLik);
  });

  it('the profiled deviances are lowest at the reported λ on a fine grid', () => {
    const remlLambda = reml.tau2 / reml.sigma2;
    const mlLambda = ml.tau2 / ml.sigma2;
    const remlBest = remlDeviance(groups, remlLambda);
    const mlBest = mlDeviance(groups, mlLambda);
    for (let k = 0; k <= 4000; k++) {
      const lambda = k * 0.001; // λ ∈ [0, 4]
      expect(remlDeviance(groups, lambda)).toBeGreaterThanOrEqual(remlBest - 1e-9);
      expect(mlDeviance(groups, lambda)).toBeGreaterThanOrEqual(mlBest - 1e-9);
    }
    for (const factor of [1 - 1e-4, 1 + 1e-4]) {
      expect(remlDeviance(groups, remlLambda * factor)).toBeGreaterThan(remlBest);
      expect(mlDeviance(groups, mlLambda * factor)).toBeGreaterThan(mlBest);
    }
  });
});

describe('deviance derivatives', () => {
  const groups = momentsFromValues(simulateGroups([1, 3, 5, 8, 13, 2, 2, 40], 0.25, 31337));

  it('agree with central finite differences of the deviances', () => {
    // (D(λ + h) − D(λ − h)) / 2h has error O(h²) plus rounding O(ε|D|/h); h = 1e-5 keeps both
    // well below the 1e-6 relative tolerance used here
    for (const lambda of [0.01, 0.1, 0.5, 2, 10]) {
      const h = 1e-5 * lambda;
      for (const [deviance, derivative] of [
        [remlDeviance, remlDevianceDerivative],
        [mlDeviance, mlDevianceDerivative],
      ] as const) {
        const numeric = (deviance(groups, lambda + h) - deviance(groups, lambda - h)) / (2 * h);
        const analytic = derivative(groups, lambda);
        expect(Math.abs(analytic - numeric)).toBeLessThan(1e-6 * Math.max(1, Math.abs(analytic)));
      }
    }
  });

  it('vanish at the fitted λ', () => {
    const reml = remlComponents(groups);
    const ml = mlComponents(groups);
    expect(Math.abs(remlDevianceDerivative(groups, reml.tau2 / reml.sigma2))).toBeLessThan(1e-9);
    expect(Math.abs(mlDevianceDerivative(groups, ml.tau2 / ml.sigma2))).toBeLessThan(1e-9);
  });
});

describe('degenerate designs', () => {
  it('a single group gives NaN components but keeps the mean', () => {
    const reml = remlComponents(momentsFromValues([[1, 2, 6]]));
    expect(reml.tau2).toBeNaN();
    expect(reml.sigma2).toBeNaN();
    expect(reml.icc).toBeNaN();
    expect(reml.logLik).toBeNaN();
    expect(reml.mean).toBe(3);
  });

  it('all singleton groups (N − J = 0) give NaN components', () => {
    const ml = mlComponents(momentsFromValues([[1], [2], [6]]));
    expect(ml.tau2).toBeNaN();
    expect(ml.sigma2).toBeNaN();
    expect(ml.mean).toBe(3);
  });

  it('a constant outcome gives zero components and NaN ICC', () => {
    const reml = remlComponents(
      momentsFromValues([
        [4, 4],
        [4, 4, 4],
      ]),
    );
    expect(reml.tau2).toBe(0);
    expect(reml.sigma2).toBe(0);
    expect(reml.icc).toBeNaN();
  });

  it('constant groups with different means put nearly all variance between groups', () => {
    const reml = remlComponents(
      momentsFromValues([
        [1, 1],
        [3, 3, 3],
        [8, 8],
      ]),
    );
    expect(reml.icc).toBeGreaterThan(0.9999);
  });

  it('rejects invalid moments', () => {
    expect(() =>
      remlComponents([
        { n: 3, mean: 1, ss: -1 },
        { n: 2, mean: 0, ss: 1 },
      ]),
    ).toThrow('groups[0].ss must be a finite number >= 0');
  });
});
