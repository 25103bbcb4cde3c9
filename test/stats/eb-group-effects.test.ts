import { afterAll, describe, expect, it } from 'vitest';
import { ebGroupEffects } from '../../src/stats/eb-group-effects.js';
import { momentsFromValues, remlComponents } from '../../src/stats/index.js';
import { leaveOneOutIcc, leaveOneOutIccs } from '../../src/stats/leave-one-out-icc.js';
import { seededUniform } from '../../src/stats/seeded-uniform.js';
import { expectRel, logRelativeErrors, readReferenceCsv } from './helpers.js';

afterAll(logRelativeErrors);

describe('empirical-Bayes group effects against lme4 (HSB mathach)', () => {
  const bySchool = new Map<string, number[]>();
  for (const r of readReferenceCsv('hsb.csv')) bySchool.set(r.school, [...(bySchool.get(r.school) ?? []), Number(r.mathach)]);
  const ids = [...bySchool.keys()];
  const groups = momentsFromValues([...bySchool.values()]);
  const fit = remlComponents(groups);
  const effects = ebGroupEffects(groups, fit);

  it('effects and conditional variances equal ranef(…, condVar = TRUE)', () => {
    // R 4.2.2 + lme4 1.1-31: m <- lmer(mathach ~ 1 + (1|school), hsb, REML = TRUE, control = lmerControl(optCtrl =
    // list(xtol_abs = 1e-14, ftol_abs = 1e-16, xtol_rel = 1e-14))); ranef(m, condVar = TRUE)$school and its "postVar"
    const lme4: [string, number, number][] = [
      ['1224', -2.6639347352, 0.7595020837],
      ['1288', 0.7394097786, 1.325053086],
      ['3499', 0.5712341096, 0.920168761],
      ['6415', -0.7164708645, 0.6686909121],
      ['9586', 2.0674659609, 0.6160751389],
      ['5762', -7.4028187764, 0.942317635],
    ];
    for (const [school, u, condVar] of lme4) {
      const e = effects[ids.indexOf(school)];
      expectRel(e.effect, u, 1e-6, `school ${school} effect`);
      expectRel(e.conditionalVariance, condVar, 1e-6, `school ${school} condVar`);
    }
  });

  it('z is the standardised residual of the group mean (diagnostic variance), about N(0, 1) across schools', () => {
    // checked by its definition: var(û_j) = τ²R_j − R_j² var(μ̂) (Goldstein 2011, ch. 2)
    const precision = groups.reduce((s, g) => s + 1 / (fit.tau2 + fit.sigma2 / g.n), 0);
    const j = ids.indexOf('5762');
    const r = fit.tau2 / (fit.tau2 + fit.sigma2 / groups[j].n);
    expect(effects[j].z).toBeCloseTo(effects[j].effect / Math.sqrt(fit.tau2 * r - (r * r) / precision), 10);
    const zs = effects.map((e) => e.z);
    const variance = zs.reduce((s, z) => s + z * z, 0) / zs.length;
    expect(variance).toBeGreaterThan(0.8);
    expect(variance).toBeLessThan(1.2);
  });

  it('τ² = 0: every effect is 0 and z is undefined', () => {
    const flat = ebGroupEffects(
      momentsFromValues([
        [1, 2],
        [1, 2],
      ]),
      { tau2: 0, sigma2: 0.5, mean: 1.5 },
    );
    expect(flat.map((e) => [e.effect, e.z])).toEqual([
      [0, NaN],
      [0, NaN],
    ]);
  });

  it('leave-one-out ICC equals a fit without that group', () => {
    const j = ids.indexOf('5762');
    const without = momentsFromValues([...bySchool.entries()].filter(([id]) => id !== '5762').map(([, v]) => v));
    expect(leaveOneOutIcc(groups, j)).toBe(remlComponents(without).icc);
    expect(leaveOneOutIcc(groups, j)).toBeLessThan(fit.icc);
  });
});

describe('leave-one-out ICCs over size classes', () => {
  it('equal a refit over the other groups, for many groups taken together by size', () => {
    const random = seededUniform(11);
    // 3,000 groups of 5 to 24 records: the fit runs over 20 size classes
    const groups = Array.from({ length: 3000 }, (_, j) => {
      const n = 5 + (j % 20);
      const mean = 10 + 2 * random() + (j % 7);
      return { n, mean, ss: (n - 1) * (1 + random()) };
    });
    // the only group of its size, as well as groups in classes of many
    groups.push({ n: 40, mean: 30, ss: 80 });
    const indices = [0, 1, 17, 2999, 3000];
    const fast = leaveOneOutIccs(groups, indices);
    for (const [k, j] of indices.entries()) {
      expect(Math.abs(fast[k] - leaveOneOutIcc(groups, j))).toBeLessThan(1e-12);
    }
  });
});
