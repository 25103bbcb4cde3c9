import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../rules/index.js';
import { audit } from '../src/audit.js';
import type { Report } from '../src/report/types.js';
import { loadRoles } from '../src/roles/load-file.js';
import { findingsOf, onlyFinding } from './helpers/delivery.js';
import { expectMessage } from './helpers/messages.js';

interface Defects {
  dataRows: number;
  missingGroup: { count: number; blank: { row: number }[]; NA: { row: number }[] };
  inconsistentLevel2: { workshop: string; column: string; rows: { row: number }[] }[];
  singletonGroups: { workshop: string; row: number }[];
  expected: { distinctWorkshopValues: number; singletonGroups: number };
}

const defects = JSON.parse(readFileSync('fixtures/demo/repairs-delivery.defects.json', 'utf8')) as Defects;
const ascending = (xs: number[]) => [...xs].sort((a, b) => a - b);

describe('demo: repairs-delivery.csv', () => {
  let report: Report;
  beforeAll(async () => {
    report = await audit('fixtures/demo/repairs-delivery.csv', loadRoles('fixtures/demo/repairs-delivery.roles.yaml', catalogue));
  });

  it('reads every record', () => {
    expect(report.input.rows).toBe(defects.dataRows);
    expect(report.input.rowsRejected).toBe(0);
    expect(findingsOf(report, 'unreadable-lines')).toEqual([]);
    // IDs as written: the W-014 variants are groups of their own
    expect(report.groups.count).toBe(defects.expected.distinctWorkshopValues);
    expect(report.groups.singletons).toBe(defects.expected.singletonGroups);
  });

  it('(a) missing group IDs: blank and NA, with their record numbers', () => {
    const f = onlyFinding(report, 'missing-group-id');
    const rows = ascending([...defects.missingGroup.blank, ...defects.missingGroup.NA].map((d) => d.row));
    expect(rows).toHaveLength(defects.missingGroup.count);
    expect(f).toMatchObject({ severity: 'blocker', column: 'workshop', count: defects.missingGroup.count, rows });
    expectMessage(f, 'missing', { count: defects.missingGroup.count, rows: defects.dataRows, column: 'workshop' });
  });

  it('(b) level-2 values that vary within a workshop: the groups and the odd records', () => {
    const byColumn = new Map<string, Defects['inconsistentLevel2']>();
    for (const d of defects.inconsistentLevel2) byColumn.set(d.column, [...(byColumn.get(d.column) ?? []), d]);
    const found = findingsOf(report, 'level2-varies');
    expect(found.map((f) => f.column).sort()).toEqual([...byColumn.keys()].sort());
    for (const [column, planted] of byColumn) {
      const f = onlyFinding(report, 'level2-varies', column);
      expect(f.severity).toBe('blocker');
      expect(f.count).toBe(planted.length);
      expect(f.groups).toEqual(planted.map((d) => d.workshop).sort());
      expect(f.rows).toEqual(ascending(planted.flatMap((d) => d.rows.map((r) => r.row))));
    }
    expect(onlyFinding(report, 'level2-varies', 'benches').values).toEqual(['W-052: 8 ×27 / 6 ×3']);
  });

  it('(c) singleton workshops: the groups (each ID finds its one record), noted (4 of 66 is under 10%)', () => {
    const f = onlyFinding(report, 'singleton-groups');
    expect(f.severity).toBe('note');
    expect(f.count).toBe(defects.singletonGroups.length);
    expect(f.groups).toEqual(defects.singletonGroups.map((d) => d.workshop).sort());
    expect(f.rows).toBeUndefined(); // the problem-rows file lists the records (test/report/problem-rows.test.ts)
  });

  it('nothing else from the foundation rules, and the gate fails', () => {
    expect(findingsOf(report, 'few-groups')).toEqual([]); // 66 groups
    expect(findingsOf(report, 'low-icc')).toEqual([]); // ICC ≈ 0.15
    expect(report.verdict).toBe('not-ready');
    expect(report.grade).toBe('F');
  });
});

describe('demo: repairs-clean.csv', () => {
  it('gives no blocker and no warning', async () => {
    const report = await audit('fixtures/demo/repairs-clean.csv', loadRoles('fixtures/demo/repairs-clean.roles.yaml', catalogue));
    expect(report.input.rows).toBe(3000);
    expect(report.groups.count).toBe(60);
    expect(report.findings.filter((f) => f.severity === 'blocker')).toEqual([]);
    expect(report.findings.filter((f) => f.severity === 'warning')).toEqual([]);
    expect(report.verdict).toBe('ready');
  });
});
