import { describe, expect, it } from 'vitest';
import { renderJson } from '../src/report/json.js';
import { renderMarkdown } from '../src/report/markdown.js';
import { reportSchema } from '../src/report/report-schema.js';
import { createAjv } from '../src/util/ajv.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

// a residual pattern orthogonal to x = 0…7 (Σ (x − 3.5)·e = 0, Σ e = 0): every group's OLS slope is
// exactly the one planted, and the pooled residual variance is 8·scale²/6
const E = [1, -1, -1, 1, 1, -1, -1, 1];
const rows = (slope: (j: number) => number, scale: number, groups = 20) =>
  groupedRows(groups, 8, (j, i) => ({ x: i, y: j + slope(j) * i + scale * E[i] }));
const roles = (extra: Record<string, unknown> = {}) => ({ group: 'g', outcome: 'y', level1: ['x'], slopes: ['x'], ...extra });

describe('slope-support', () => {
  it('slopes that differ no more than their sampling error: advise a fixed slope', async () => {
    const report = await auditRows(
      rows(() => 2, 1),
      roles(),
    );
    const f = onlyFinding(report, 'slope-support', 'x');
    expect(f.severity).toBe('warning');
    // every slope is 2, so their variance is 0; v_j = (8/6)/42 = 0.031746 (hand computation)
    expectMessage(f, 'noVariance', {
      column: 'x',
      outcome: 'y',
      informing: 20,
      groups: 20,
      observed: '0.0000',
      sampling: '0.0317',
      tau11: '-0.0317',
    });
    // the report carries the estimate for the planned slope, valid against its schema, and shows it
    expect(report.outcomes.y.slopes?.x.tau11).toBeCloseTo(-(8 / 6) / 42, 12);
    expect(report.outcomes.y.slopes?.x.groups).toBe(20);
    expect(createAjv().compile(reportSchema)(JSON.parse(renderJson(report)))).toBe(true);
    expect(renderMarkdown(report)).toContain('y: planned random slopes');
  });

  it('slopes that vary clearly give no finding; a low reliability does (min_reliability from the role map)', async () => {
    const varying = (j: number) => 2 + (j % 2 ? 2 : -2);
    expect(findingsOf(await auditRows(rows(varying, 1), roles()), 'slope-support')).toEqual([]);
    // noise × 10: v_j = (800/6)/42 = 3.1746, var(b_j) = 4·20/19 = 4.2105, τ̂ = 1.0359, reliability 0.246 (hand computation)
    const report = await auditRows(rows(varying, 10), roles({ rules: { 'slope-support': { min_reliability: 0.3 } } }));
    expectMessage(onlyFinding(report, 'slope-support', 'x'), 'lowReliability', {
      tau11: '1.0359',
      reliability: '0.246',
      minReliability: 0.3,
    });
  });

  it('a slope no group can inform, and one few groups can', async () => {
    // x constant within every group: a level-2 variable planned as a random slope
    const flat = groupedRows(12, 6, (j, i) => ({ x: j, y: i * j }));
    const f = onlyFinding(await auditRows(flat, roles()), 'slope-support', 'x');
    expect(f.severity).toBe('blocker');
    expectMessage(f, 'noSupport', { informing: 0, groups: 12, minRecords: 5 });
    expect(f.count).toBe(12);
    expect(f.groups?.slice(0, 2)).toEqual(['G001', 'G002']);
    // half the groups vary in x
    const half = groupedRows(12, 6, (j, i) => ({ x: j % 2 ? i : 0, y: i + j }));
    const few = onlyFinding(await auditRows(half, roles()), 'slope-support', 'x');
    expectMessage(few, 'fewGroups', { informing: 6, groups: 12, minGroups: 10 });
    expect(few.groups).toEqual(['G001', 'G003', 'G005', 'G007', 'G009', 'G011']);
  });

  it('no more records than random effects: a fitting library refuses', async () => {
    const pairs = groupedRows(10, 2, (j, i) => ({ x: i, y: i + j }));
    const f = onlyFinding(await auditRows(pairs, roles()), 'slope-support', 'x');
    expect(f.severity).toBe('blocker');
    expectMessage(f, 'tooFewRecords', { records: 20, groups: 10, coefficients: 2, effects: 20 });
  });

  it('without planned slopes it says nothing', async () => {
    expect(
      findingsOf(
        await auditRows(
          rows(() => 2, 1),
          { group: 'g', outcome: 'y', level1: ['x'] },
        ),
        'slope-support',
      ),
    ).toEqual([]);
  });
});
