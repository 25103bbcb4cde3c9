import { describe, expect, it } from 'vitest';
import { audit } from '../src/audit.js';
import { parseRoles } from '../src/roles/load.js';
import { momentsFromValues } from '../src/stats/moments-from-values.js';
import { outcomeStats } from '../src/stats/outcome-stats.js';
import { checkRule, profileOfGroups } from '../test/helpers/check-rule.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { catalogue } from './index.js';

/** 10 groups of 4 with the values 1, 2, 3, 4 each: identical group means, so τ² = 0. */
const identicalMeans = groupedRows(10, 4, (_, i) => ({ y: i + 1 }));

/**
 * 20 groups of 50: group j's mean is c·(j − 9.5), records alternate ±1 around it (σ² ≈ 1).
 * c = 0.035 gives REML ICC ≈ 0.022 with F ≈ 2.10 on (19, 980), p ≈ 0.004 (small but real);
 * c = 0.03 gives ICC ≈ 0.011, p ≈ 0.064 (no evidence).
 */
const shifted = (c: number) => groupedRows(20, 50, (j, i) => ({ y: (c * (j - 9.5) + (i % 2 ? 1 : -1)).toFixed(6) }));

const roles = { group: 'g', outcome: 'y' };

/**
 * low-icc reads only the outcome's statistics: for the params cases they are computed from the
 * rows' group moments here, and the rule runs on them without a delivery.
 */
async function check(rows: Row[], rules: unknown) {
  const byGroup = new Map<string, number[]>();
  for (const r of rows) byGroup.set(String(r.g), [...(byGroup.get(String(r.g)) ?? []), Number(r.y)]);
  const outcomes = { y: outcomeStats(momentsFromValues([...byGroup.values()])) };
  const profile = await profileOfGroups([...byGroup.values()].map((v) => v.length));
  return checkRule('low-icc', profile, { ...roles, rules: { 'low-icc': rules } }, outcomes);
}

describe('low-icc', () => {
  it('identical group means (τ² = 0): warning, no evidence of between-group variance', async () => {
    const report = await auditRows(identicalMeans, roles);
    expect(report.outcomes.y.reml.tau2).toBe(0);
    const f = onlyFinding(report, 'low-icc');
    expect(f.severity).toBe('warning');
    expect(f.column).toBe('y');
    expectMessage(f, 'none', { column: 'y', icc: '0.000', f: '0.000', df1: 9, df2: 30, p: 'p = 1' });
    expect(f.rows).toBeUndefined();
    expect(f.groups).toBeUndefined();
  });

  it('small but significant ICC: a note that clustering still matters', async () => {
    const report = await auditRows(shifted(0.035), roles);
    const s = report.outcomes.y;
    expect(s.reml.icc).toBeGreaterThan(0.01);
    expect(s.reml.icc).toBeLessThan(0.05);
    expect(s.anova.p).toBeLessThan(0.05);
    const f = onlyFinding(report, 'low-icc');
    expect(f.severity).toBe('note');
    expectMessage(f, 'small', { column: 'y', limit: 0.05 });
    expect(f.data).toMatchObject({
      icc: expect.stringMatching(/^0\.02\d$/),
      f: expect.stringMatching(/^2\.10\d$/),
      p: expect.stringMatching(/^p = \.00\d$/),
    });
    expect(f.data.deff).toMatch(/^2\.0\d$/);
  });

  it('small and not significant: a warning', async () => {
    const report = await auditRows(shifted(0.03), roles);
    expect(report.outcomes.y.anova.p).toBeGreaterThan(0.05);
    const f = onlyFinding(report, 'low-icc');
    expect(f.severity).toBe('warning');
    expectMessage(f, 'none', { column: 'y', df1: 19, df2: 980 });
    expect(f.data).toMatchObject({
      icc: expect.stringMatching(/^0\.01\d$/),
      f: expect.stringMatching(/^1\.54\d$/),
      p: expect.stringMatching(/^p = \.06\d$/),
    });
  });

  it('HSB (Raudenbush & Bryk 2002): ICC ≈ 0.18 is strong clustering, no finding', async () => {
    const loaded = parseRoles('group: school\noutcome: mathach\nlevel1: [ses]\nlevel2: [sector, size]\n', 'hsb.roles.yaml', catalogue);
    const report = await audit('fixtures/reference/hsb.csv', loaded);
    expect(report.outcomes.mathach.reml.icc).toBeCloseTo(0.1803518, 4); // lme4 REML (fixtures/reference/README.md)
    expect(findingsOf(report, 'low-icc')).toEqual([]);
    expect(report.groups.count).toBe(160);
    // the catalogue still notes things about HSB (undeclared school-level columns, the ses between-school
    // share, unequal school sizes), but nothing that blocks or warns
    expect(report.findings.filter((f) => f.severity !== 'note')).toEqual([]);
  });

  it('icc_below and alpha come from the role map', async () => {
    // shifted(0.04) has ICC ≈ 0.034 (p < 0.001): below the limit 0.1, not below 0.03
    expect(await check(shifted(0.04), { icc_below: 0.03 })).toEqual([]);
    const loose = await check(shifted(0.04), { icc_below: 0.1 });
    expect(loose).toHaveLength(1);
    expectMessage(loose[0], 'small', { limit: 0.1 });
    // p ≈ 0.004 is not below alpha = 0.001: no evidence, so a warning
    expect((await check(shifted(0.035), { alpha: 0.001 })).map((f) => f.severity)).toEqual(['warning']);
  });

  it('off, and severity override', async () => {
    expect(await check(identicalMeans, 'off')).toEqual([]);
    expect((await check(identicalMeans, { severity: 'note' })).map((f) => f.severity)).toEqual(['note']);
  });

  it('only numeric outcomes, and only when the ICC is defined', async () => {
    const categorical = groupedRows(10, 4, (_, i) => ({ y: ['a', 'b', 'c', 'd'][i] }));
    expect(findingsOf(await auditRows(categorical, roles), 'low-icc')).toEqual([]);
    // one group: the variance components are not identifiable (NaN), nothing to say about the ICC
    const oneGroup = groupedRows(1, 5, (_, i) => ({ y: i }));
    const report = await auditRows(oneGroup, roles);
    expect(Number.isNaN(report.outcomes.y.reml.icc)).toBe(true);
    expect(findingsOf(report, 'low-icc')).toEqual([]);
  });

  it('one finding per outcome, in column order', async () => {
    const rows = groupedRows(10, 4, (_, i) => ({ b: i + 1, a: 5 - i }));
    const report = await auditRows(rows, { group: 'g', outcomes: ['b', 'a'] });
    expect(findingsOf(report, 'low-icc').map((f) => f.column)).toEqual(['a', 'b']);
  });
});
