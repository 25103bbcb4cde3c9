import { readFileSync } from 'node:fs';
import gammaln from '@stdlib/math-base-special-gammaln';
import { describe, expect, it } from 'vitest';
import type { CountGroup, GroupMoments } from '../../src/stats/index.js';
import {
  poissonExpectedZeros,
  poissonLatentIcc,
  poissonMarginalLogLik,
  poissonNullModel,
  pooledDispersion,
} from '../../src/stats/index.js';
import { mulberry32 } from '../helpers/prng.js';

/** fixtures/reference/grouseticks.csv (lme4's grouseticks): counts by brood. */
function grouseticks(): { byBrood: Map<string, number[]>; logFactorials: number; saturated: number } {
  const lines = readFileSync(new URL('../../fixtures/reference/grouseticks.csv', import.meta.url), 'utf8')
    .trim()
    .split('\n');
  const byBrood = new Map<string, number[]>();
  let logFactorials = 0;
  let saturated = 0;
  for (const line of lines.slice(1)) {
    const [, ticks, brood] = line.split(',');
    const y = Number(ticks);
    byBrood.set(brood, [...(byBrood.get(brood) ?? []), y]);
    logFactorials += gammaln(y + 1);
    saturated += (y > 0 ? y * Math.log(y) : 0) - y - gammaln(y + 1);
  }
  return { byBrood, logFactorials, saturated };
}

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('poissonNullModel on grouseticks', () => {
  const { byBrood, logFactorials, saturated } = grouseticks();
  const groups: CountGroup[] = [...byBrood.values()].map((ys) => ({ n: ys.length, total: ys.reduce((a, b) => a + b, 0) }));
  const fit = poissonNullModel(groups, logFactorials);

  it('matches lme4 1.1-31 glmer(TICKS ~ 1 + (1|BROOD), family = poisson, nAGQ = 25) within 1e-3 relative', () => {
    // lme4 1.1-31 (R 4.2.2): intercept 0.515224601924, τ² 2.55087640263, logLik −571.609921916
    // (lme4's logLik for nAGQ > 1 is less the saturated model's, fixtures/reference/README.md)
    expect(fit.converged).toBe(true);
    expect(relative(fit.intercept, 0.515224601924)).toBeLessThan(1e-3);
    expect(relative(fit.tau2, 2.55087640263)).toBeLessThan(1e-3);
    expect(relative(fit.logLik - saturated, -571.609921916)).toBeLessThan(1e-6);
    // R integrate + optim by brute force (fixtures/reference/README.md): the maximum −1037.1092567979
    expect(fit.logLik).toBeCloseTo(-1037.1092567979, 4);
    expect(relative(fit.tau2, 2.5509031377)).toBeLessThan(1e-4);
  });

  it('gives the marginal log-likelihood R integrate gives at lme4 estimates', () => {
    // R 4.2.2 integrate (rel.tol 1e-12) per brood at lme4's (0.515224601924, τ² 2.55087640263): −1037.1092567999
    const at = (points: number) => poissonMarginalLogLik(groups, 0.515224601924, Math.sqrt(2.55087640263), points) - logFactorials;
    // 25 points (lme4's nAGQ = 25 too) leave 5e-6 on the broods with no tick, whose integrand is skewed; 50 points close it
    expect(Math.abs(at(25) - -1037.1092567999)).toBeLessThan(1e-5);
    expect(at(50)).toBeCloseTo(-1037.1092567999, 7);
    // one point is the Laplace approximation: close, not exact
    expect(Math.abs(at(1) - -1037.1092567999)).toBeLessThan(2);
  });

  it('latent ICC by the lognormal approximation (Nakagawa et al. 2017) on lme4 values', () => {
    // NumPy 2.4.6 on lme4's values: λ = exp(β0 + τ²/2) = 5.9934236108, ICC = 0.9429586194
    expect(poissonLatentIcc(0.515224601924, 2.55087640263)).toBeCloseTo(0.9429586194, 9);
    expect(poissonLatentIcc(0, 0)).toBe(0);
  });

  it('expected zeros under the fit against SciPy quad at lme4 values', () => {
    // SciPy 1.17.1 integrate.quad: 403 · E[exp(−e^{β0+u})] = 122.0199139000 (observed 126)
    expect(poissonExpectedZeros(403, 0.515224601924, 2.55087640263)).toBeCloseTo(122.0199139, 5);
  });

  it('pooled within-brood dispersion against NumPy/SciPy', () => {
    const moments: GroupMoments[] = [...byBrood.values()].map((ys) => {
      const mean = ys.reduce((a, b) => a + b, 0) / ys.length;
      return { n: ys.length, mean, ss: ys.reduce((s, y) => s + (y - mean) ** 2, 0) };
    });
    const d = pooledDispersion(moments);
    // NumPy 2.4.6 / SciPy 1.17.1 chi2.sf: D = 657.6603853974 on 257 df, p = 6.086130e-37
    expect(d.statistic).toBeCloseTo(657.6603853974, 8);
    expect(d.df).toBe(257);
    expect(d.ratio).toBeCloseTo(2.5589898264, 9);
    expect(d.p).toBeLessThan(1e-30);
  });
});

describe('poissonNullModel on simulated counts', () => {
  const rand = mulberry32(20240611);
  const normal = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const poisson = (lambda: number) => {
    // Knuth's multiplication method: fine for the small means simulated here
    const limit = Math.exp(-lambda);
    let k = 0;
    for (let p = rand(); p > limit; p *= rand()) k++;
    return k;
  };

  it('recovers β0 and τ² of 800 groups of 12 (β0 = 0.7, τ² = 0.4)', () => {
    const groups: CountGroup[] = Array.from({ length: 800 }, () => {
      const lambda = Math.exp(0.7 + Math.sqrt(0.4) * normal());
      let total = 0;
      for (let i = 0; i < 12; i++) total += poisson(lambda);
      return { n: 12, total };
    });
    const fit = poissonNullModel(groups, NaN);
    // sampling error of τ² here is about 0.025, of β0 about 0.025
    expect(Math.abs(fit.tau2 - 0.4)).toBeLessThan(0.08);
    expect(Math.abs(fit.intercept - 0.7)).toBeLessThan(0.08);
    expect(fit.logLik).toBeNaN();
  });

  it('puts τ² at zero when every group has the same counts, and is undefined with no count above 0', () => {
    const same = poissonNullModel(
      Array.from({ length: 20 }, () => ({ n: 5, total: 10 })),
      0,
    );
    expect(same).toMatchObject({ tau2: 0, converged: true });
    expect(same.intercept).toBeCloseTo(Math.log(2), 12);
    // the ordinary Poisson model: 200·log 2 − 200 (no log y! passed)
    expect(same.logLik).toBeCloseTo(200 * Math.log(2) - 200, 9);
    expect(
      poissonNullModel(
        [
          { n: 3, total: 0 },
          { n: 4, total: 0 },
        ],
        0,
      ).tau2,
    ).toBeNaN();
    expect(() => poissonNullModel([{ n: 3, total: -1 }], 0)).toThrow(/total >= 0/);
  });
});
