import { describe, expect, it } from 'vitest';
import { audit } from '../src/audit.js';
import { parseRoles } from '../src/roles/load.js';
import { variableStats } from '../src/rules/variable-stats.js';
import { auditRows, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { profileOf } from '../test/helpers/profile-of.js';
import { catalogue } from './index.js';

describe('predictor-between-share', () => {
  it('HSB ses: 26.5% between schools, advise within-group centering plus the school mean', async () => {
    const report = await audit(
      'fixtures/reference/hsb.csv',
      parseRoles('group: school\noutcome: mathach\nlevel1: [ses, minority]\n', 'hsb.yaml', catalogue),
    );
    const f = onlyFinding(report, 'predictor-between-share', 'ses');
    // fixtures/reference/README.md (R 4.2.2 + lme4 1.1-31): ses REML ICC 0.2649104, ANOVA ICC(1) 0.2665809
    expect(f.severity).toBe('note');
    expectMessage(f, 'decompose', { column: 'ses', share: '26.5%', reml: '0.265', anova: '0.267' });
    // the same computation to more digits (src/rules/variable-stats.ts, shared with low-group-mean-reliability)
    const { profile } = await profileOf('fixtures/reference/hsb.csv', 'group: school\nlevel1: [ses]\n');
    const s = variableStats(profile, 'ses');
    expect(s.reml.icc).toBeCloseTo(0.2649104, 6); // R 4.2.2 + lme4 1.1-31 REML
    expect(s.anova.icc).toBeCloseTo(0.2665809, 6); // R anova(lm(ses ~ factor(school)))
  });

  it('a predictor with no between-group part: grand-mean centering loses little', async () => {
    // every group holds the same values 1, 2, 3, 4
    const rows = groupedRows(10, 4, (_, i) => ({ x: i + 1 }));
    const f = onlyFinding(await auditRows(rows, { group: 'g', level1: ['x'] }), 'predictor-between-share', 'x');
    expectMessage(f, 'small', { column: 'x', share: '0.0%', reml: '0.000', anova: '-0.333' });
  });

  it('decompose_from comes from the role map', async () => {
    const rows = groupedRows(10, 4, (j, i) => ({ x: i + (j % 2) * 2 }));
    const base = onlyFinding(await auditRows(rows, { group: 'g', level1: ['x'] }), 'predictor-between-share', 'x');
    expectMessage(base, 'decompose');
    const rules = { 'predictor-between-share': { decompose_from: 0.99 } };
    const high = onlyFinding(await auditRows(rows, { group: 'g', level1: ['x'], rules }), 'predictor-between-share', 'x');
    expectMessage(high, 'small');
  });

  it('a predictor constant within every group is a group-level variable, never "centre within groups"', async () => {
    // x is one value per group (0, 1, 2, … by group), so level1-constant-within warns about it too
    const rows = groupedRows(10, 4, (j, i) => ({ x: j, y: i + j }));
    const report = await auditRows(rows, { group: 'g', outcome: 'y', level1: ['x'] });
    expectMessage(onlyFinding(report, 'level1-constant-within', 'x'), 'between', { column: 'x', groups: 10 });
    const f = onlyFinding(report, 'predictor-between-share', 'x');
    // ANOVA ICC(1) is exactly 1 with no within-group mean square; REML's share is 1 to the printed digits
    expectMessage(f, 'groupLevel', { column: 'x', share: '100.0%', reml: '1.000', anova: '1.000' });
    expect(f.fix).not.toMatch(/centre \S+ within groups/i);
    expect(f.fix).toContain('level2');
  });

  it('one record that varies makes it a level-1 predictor again', async () => {
    const rows = groupedRows(10, 4, (j, i) => ({ x: j + (j === 0 && i === 0 ? 0.5 : 0) }));
    const f = onlyFinding(await auditRows(rows, { group: 'g', level1: ['x'] }), 'predictor-between-share', 'x');
    expectMessage(f, 'decompose', { column: 'x' });
  });
});
