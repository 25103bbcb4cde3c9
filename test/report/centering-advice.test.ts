import { describe, expect, it } from 'vitest';
import { centeringAdvice } from '../../src/report/centering-advice.js';
import { predictorSharesChart } from '../../src/report/charts/predictor-shares.js';
import { predictorsTable } from '../../src/report/stat-tables.js';
import { demoReport } from './fixtures/reports.js';

describe('centering advice', () => {
  it('by the between-group share', () => {
    expect(centeringAdvice(0.265, 0.05, 0.267)).toMatch(/^27% between groups: centre within groups/);
    expect(centeringAdvice(0.01, 0.05, 0.012)).toMatch(/grand-mean centring is enough$/);
    expect(centeringAdvice(Number.NaN, 0.05, Number.NaN)).toMatch(/^not estimable/);
  });

  it('a predictor without variation within groups is a group-level variable, not one to centre within groups', () => {
    // REML's share is just under 1 then; ANOVA ICC(1) is exactly 1 (no within-group mean square)
    const advice = centeringAdvice(0.99999, 0.05, 1);
    expect(advice).toMatch(/group-level variable/);
    expect(advice).not.toMatch(/centre within groups/);
  });

  it('the predictors table and the chart say so for that predictor alone', () => {
    const report = demoReport();
    report.plots!.predictorShares = { ses: { reml: 0.265, anova: 0.267 }, staff: { reml: 0.99999, anova: 1 } };
    const rows = predictorsTable(report)!.rows;
    expect(rows[0][3]).toMatch(/centre within groups/);
    expect(rows[1][3]).toMatch(/group-level variable/);
    expect(rows[1][3]).not.toMatch(/centre within groups/);
    expect(predictorSharesChart(report.plots!)!.description).toContain('(group-level variables, nothing to centre): staff.');
  });
});
