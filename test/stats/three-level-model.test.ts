import { afterAll, describe, expect, it } from 'vitest';
import { momentsFromValues, remlComponents } from '../../src/stats/index.js';
import { threeLevelCriterion } from '../../src/stats/three-level-deviance.js';
import { threeLevelModel } from '../../src/stats/three-level-model.js';
import type { ParentBlocks } from '../../src/stats/three-level-terms.js';
import { expectRel, logRelativeErrors, readReferenceCsv, referenceMoments } from './helpers.js';

const TOL = 1e-6;
afterAll(logRelativeErrors);

/** The records of pastes.csv, grouped by sample (cask within batch) and by batch. */
function pastesBlocks(drop: readonly number[] = []): ParentBlocks {
  const rows = readReferenceCsv('pastes.csv').filter((r) => !drop.includes(Number(r.row)));
  const byParent = new Map<string, Map<string, number[]>>();
  for (const r of rows) {
    const groups = byParent.get(r.batch) ?? new Map<string, number[]>();
    groups.set(r.sample, [...(groups.get(r.sample) ?? []), Number(r.strength)]);
    byParent.set(r.batch, groups);
  }
  const moments = [...byParent.values()].map((groups) => momentsFromValues([...groups.values()]));
  const flat = moments.flat();
  const start = [0];
  for (const m of moments) start.push(start[start.length - 1] + m.length);
  return {
    n: Float64Array.from(flat, (g) => g.n),
    mean: Float64Array.from(flat, (g) => g.mean),
    ss: Float64Array.from(flat, (g) => g.ss),
    start: Int32Array.from(start),
  };
}

// the unbalanced variant: these `row` numbers of pastes.csv left out (batch B loses cask b, batch F cask c)
const DROPPED = [2, 9, 10, 23, 35, 36, 47];

describe('three-level null model against lme4 (fixtures/reference/README.md, pastes.csv)', () => {
  it('balanced Pastes, REML and ML', () => {
    const fit = threeLevelModel(pastesBlocks())!;
    expect([fit.parents, fit.groups, fit.n]).toEqual([10, 30, 60]);
    // R 4.2.2 + lme4 1.1-31: lmer(strength ~ 1 + (1|batch/cask), data = Pastes, REML = TRUE,
    // control = lmerControl(optCtrl = list(xtol_abs = 1e-14, ftol_abs = 1e-16, xtol_rel = 1e-14)))
    expectRel(fit.reml.tau2Group, 8.433666668567, TOL, 'pastes reml cask:batch');
    expectRel(fit.reml.tau2Parent, 1.657308893971, TOL, 'pastes reml batch');
    expectRel(fit.reml.sigma2, 0.67799998905, TOL, 'pastes reml residual');
    expectRel(fit.reml.mean, 60.053333333335, TOL, 'pastes reml mean');
    expectRel(fit.reml.logLik, -123.495372926743, TOL, 'pastes reml logLik');
    // balanced: REML equals the ANOVA estimates (R anova(lm(strength ~ batch/cask)), mean squares
    // 27.4891851852, 17.5453333333, 0.678): σ² = 0.678, (17.545333 − 0.678)/2, (27.489185 − 17.545333)/6
    expectRel(fit.reml.sigma2, 0.678, TOL, 'pastes anova residual');
    expectRel(fit.reml.tau2Group, 8.433666666667, TOL, 'pastes anova cask');
    expectRel(fit.reml.tau2Parent, 1.657308641975, TOL, 'pastes anova batch');
    // same call with REML = FALSE
    expectRel(fit.ml.tau2Group, 8.433666711439, TOL, 'pastes ml cask:batch');
    expectRel(fit.ml.tau2Parent, 1.199155595702, TOL, 'pastes ml batch');
    expectRel(fit.ml.sigma2, 0.677999994854, TOL, 'pastes ml residual');
    expectRel(fit.ml.logLik, -123.997232931212, TOL, 'pastes ml logLik');
    const s = fit.reml.shares;
    expect(s.parent + s.group + s.residual).toBeCloseTo(1, 12);
  });

  it('unbalanced Pastes (rows 2, 9, 10, 23, 35, 36, 47 left out), REML and ML', () => {
    const fit = threeLevelModel(pastesBlocks(DROPPED))!;
    expect([fit.parents, fit.groups, fit.n]).toEqual([10, 28, 53]);
    // R 4.2.2 + lme4 1.1-31: the same calls on Pastes[-c(2, 9, 10, 23, 35, 36, 47), ]
    expectRel(fit.reml.tau2Group, 8.570090703729, TOL, 'unbalanced reml cask:batch');
    expectRel(fit.reml.tau2Parent, 1.698573325876, TOL, 'unbalanced reml batch');
    expectRel(fit.reml.sigma2, 0.791254032688, TOL, 'unbalanced reml residual');
    expectRel(fit.reml.mean, 60.13628994026, TOL, 'unbalanced reml mean');
    expectRel(fit.reml.logLik, -112.761327841066, TOL, 'unbalanced reml logLik');
    expectRel(fit.ml.tau2Group, 8.537586482048, TOL, 'unbalanced ml cask:batch');
    expectRel(fit.ml.tau2Parent, 1.246035713467, TOL, 'unbalanced ml batch');
    expectRel(fit.ml.sigma2, 0.791308664572, TOL, 'unbalanced ml residual');
    expectRel(fit.ml.mean, 60.132788471716, TOL, 'unbalanced ml mean');
    expectRel(fit.ml.logLik, -113.302197504364, TOL, 'unbalanced ml logLik');
  });

  it('the analytic gradient agrees with central differences', () => {
    const blocks = pastesBlocks(DROPPED);
    for (const reml of [true, false]) {
      const at = threeLevelCriterion(blocks, 3.1, 0.7, reml);
      const h = 1e-6;
      const dg =
        (threeLevelCriterion(blocks, 3.1 + h, 0.7, reml).deviance - threeLevelCriterion(blocks, 3.1 - h, 0.7, reml).deviance) / (2 * h);
      const dp =
        (threeLevelCriterion(blocks, 3.1, 0.7 + h, reml).deviance - threeLevelCriterion(blocks, 3.1, 0.7 - h, reml).deviance) / (2 * h);
      expect(at.dGroup).toBeCloseTo(dg, 5);
      expect(at.dParent).toBeCloseTo(dp, 5);
    }
  });

  it('a parent level with no variance is put on the boundary, and the group level with none too', () => {
    // parents that differ by nothing beyond their groups: τ²_parent = 0 exactly
    const flatParent: ParentBlocks = {
      n: Float64Array.from([3, 3, 3, 3]),
      mean: Float64Array.from([0, 10, 10, 0]),
      ss: Float64Array.from([2, 2, 2, 2]),
      start: Int32Array.from([0, 2, 4]),
    };
    const a = threeLevelModel(flatParent)!;
    expect(a.reml.tau2Parent).toBe(0);
    expect(a.reml.tau2Group).toBeGreaterThan(0);
    expect(a.parentTest).toEqual({ statistic: 0, p: 1 });
    // groups that differ by nothing beyond their parent: τ²_group = 0
    const flatGroup: ParentBlocks = { ...flatParent, mean: Float64Array.from([0, 0, 10, 10]) };
    const b = threeLevelModel(flatGroup)!;
    expect(b.reml.tau2Group).toBe(0);
    expect(b.reml.tau2Parent).toBeGreaterThan(0);
  });

  it('is not identifiable with one parent, one group per parent, or one value per group', () => {
    const one = { n: Float64Array.from([2, 2]), mean: Float64Array.from([0, 1]), ss: Float64Array.from([1, 1]) };
    expect(threeLevelModel({ ...one, start: Int32Array.from([0, 2]) })).toBeNull();
    expect(threeLevelModel({ ...one, start: Int32Array.from([0, 1, 2]) })).toBeNull();
    const singles = { n: Float64Array.from([1, 1, 1, 1]), mean: Float64Array.from([0, 1, 2, 3]), ss: new Float64Array(4) };
    expect(threeLevelModel({ ...singles, start: Int32Array.from([0, 2, 4]) })).toBeNull();
  });

  it('one-way REML by batch alone (the share hidden-level reports for a column above the groups)', () => {
    const fit = remlComponents(referenceMoments('pastes.csv', 'batch', 'strength'));
    // R 4.2.2 + lme4 1.1-31: lmer(strength ~ 1 + (1|batch), data = Pastes), same control as above
    expectRel(fit.tau2, 3.3440418425879, TOL, 'pastes one-way batch tau2');
    expectRel(fit.sigma2, 7.42493337025452, TOL, 'pastes one-way batch sigma2');
  });
});
