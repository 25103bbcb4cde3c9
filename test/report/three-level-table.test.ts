import { describe, expect, it } from 'vitest';
import { renderMarkdown } from '../../src/report/markdown.js';
import { threeLevelLines, threeLevelTable } from '../../src/report/three-level-table.js';
import type { ThreeLevelStats } from '../../src/stats/types.js';
import { demoReport } from './fixtures/reports.js';

const level = (tau2Parent: number, tau2Group: number, sigma2: number) => {
  const total = tau2Parent + tau2Group + sigma2;
  return {
    tau2Parent,
    tau2Group,
    sigma2,
    mean: 50,
    logLik: -1000,
    shares: { parent: tau2Parent / total, group: tau2Group / total, residual: sigma2 / total },
  };
};
const threeLevel: ThreeLevelStats = {
  parents: 6,
  groups: 60,
  n: 3000,
  reml: level(10, 30, 60),
  ml: level(8, 30, 62),
  groupsOnly: { tau2: 39, sigma2: 60, logLik: -1010 },
  parentTest: { statistic: 12, p: 0.0003 },
  excludedGroups: 2,
};

describe('three-level table', () => {
  it('shows each level with its share, the two-level τ², the test and the groups left out', () => {
    const report = demoReport();
    const name = Object.keys(report.outcomes)[0];
    expect(threeLevelTable(name, report.outcomes[name])).toBeNull();
    report.outcomes[name] = { ...report.outcomes[name], threeLevel };
    const t = threeLevelTable(name, report.outcomes[name])!;
    expect(t.rows[0]).toEqual(['REML', '10.0000 (10.0%)', '30.0000 (30.0%)', '60.0000 (60.0%)', '50.000', '-1000.00']);
    expect(t.caption).toContain('2 under several parents or none left out');
    expect(t.caption).toContain('p < .001');
    expect(renderMarkdown(report)).toContain('three-level null model (60 groups in 6 parents');
    expect(threeLevelLines(report.outcomes[name]).join('\n')).toContain('parent tau2 10.0000 (10.0%)');
  });
});
