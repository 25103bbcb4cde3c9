import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { problemRows } from '../../src/problem-rows.js';
import { csvField, PROBLEM_COLUMNS, problemsCsv } from '../../src/problems/csv.js';
import type { ProblemRows } from '../../src/problems/types.js';
import type { Report } from '../../src/report/types.js';
import { parseRoles } from '../../src/roles/load.js';
import type { Roles } from '../../src/roles/types.js';
import type { Delivery, Row } from '../helpers/delivery.js';
import { toYaml, writeDelivery } from '../helpers/delivery.js';
import { parentRows } from '../helpers/parent-rows.js';

/** What a spreadsheet-safe field holds: a leading quote before formula starters. */
const neutral = (s: string) => (/^[=+\-@\t\r]/.test(s) ? `'${s}` : s);

const FORMULA_GROUP = `=cmd|' /C calc'!A0`;
const rows: Row[] = [
  { u: '+1', g: FORMULA_GROUP, site: 'a,b', y: 1 },
  { u: '-2', g: FORMULA_GROUP, site: 'a,b', y: 2 },
  { u: '@SUM(A1)', g: FORMULA_GROUP, site: 'say "hi"\nthere', y: 3 },
  { u: 'plain', g: 'G2', site: 'x', y: 4 },
  { u: 'q"uote', g: 'G2', site: 'x', y: 5 },
  { u: 'u6', g: '\tTAB', site: 'x', y: 6 },
  { u: '=1+1', g: '', site: 'x', y: 7 },
  { u: 'u8', g: 'G2', site: 'x', y: 8 },
  { u: 'u9', g: '', site: 'x', y: 9 },
  { u: 'new\nline, comma', g: 'G4', site: 'x', y: 10 },
];
const roleMap = { group: 'g', unit: 'u', outcomes: ['y'], level2: ['site'], types: { site: 'categorical' } };

let d: Delivery;
let roles: Roles;
let report: Report;
beforeAll(async () => {
  d = writeDelivery(rows, roleMap);
  roles = parseRoles(toYaml(roleMap), d.roles, catalogue).roles;
  report = await audit(d.csv, roles, { threads: 1 });
});
afterAll(() => d.remove());

function readBack(text: string): Record<string, string>[] {
  return parse(text, { columns: true, comment: '#', comment_no_infix: true });
}

describe('problemRows', () => {
  it('lists every offending record per finding with group, unit, rule and reason', async () => {
    const found = await problemRows(d.csv, roles, report.findings);
    const byRule = (rule: string) => found.rows.filter((r) => r.rule === rule);
    expect(byRule('missing-group-id').map((r) => [r.record, r.group, r.unit])).toEqual([
      [7, null, '=1+1'],
      [9, null, 'u9'],
    ]);
    expect(byRule('singleton-groups').map((r) => [r.record, r.group])).toEqual([
      [6, '\tTAB'],
      [10, 'G4'],
    ]);
    // site: "a,b" is the group's modal value, so the third record is the one that deviates
    expect(byRule('level2-varies').map((r) => [r.record, r.group, r.unit, r.column])).toEqual([[3, FORMULA_GROUP, '@SUM(A1)', 'site']]);
    expect(byRule('level2-varies')[0].reason).toBe('site is "say "hi"\nthere" here but "a,b" in most records of the group');
    // the records match what the findings list
    for (const f of report.findings.filter((f) => f.rows?.length)) {
      expect(found.rows.filter((r) => r.rule === f.rule && r.column === f.column).map((r) => r.record)).toEqual(f.rows);
    }
    expect(found.omitted).toBe(0);
    expect(found.total).toBe(found.rows.length);
  });

  it('withholds raw values in reasons when asked', async () => {
    const found = await problemRows(d.csv, roles, report.findings, { includeValues: false });
    const reason = found.rows.find((r) => r.rule === 'level2-varies')!.reason;
    expect(reason).not.toContain('a,b');
    expect(reason).toContain('values withheld');
  });

  it('is bounded by maxRows and counts what it left out', async () => {
    const found = await problemRows(d.csv, roles, report.findings, { maxRows: 2 });
    expect(found.rows).toHaveLength(2);
    expect(found.total).toBe(5);
    expect(found.omitted).toBe(3);
    const text = problemsCsv(found);
    expect(text.trimEnd().split('\r\n').at(-1)).toBe('# 3 more problem rows of 5 not written (at most 2; raise --max-rows)');
    expect(readBack(text)).toHaveLength(2);
  });
});

describe('problemsCsv', () => {
  it('round-trips through a CSV parser with formula starters neutralised', async () => {
    const found = await problemRows(d.csv, roles, report.findings);
    const back = readBack(problemsCsv(found));
    expect(Object.keys(back[0])).toEqual([...PROBLEM_COLUMNS]);
    expect(back).toHaveLength(found.rows.length);
    back.forEach((b, i) => {
      const r = found.rows[i];
      expect(b.record).toBe(r.record === null ? '' : String(r.record));
      expect(b.group).toBe(r.group === null ? '' : neutral(r.group));
      expect(b.unit).toBe(r.unit === null ? '' : neutral(r.unit));
      expect(b.rule).toBe(r.rule);
      expect(b.reason).toBe(neutral(r.reason));
    });
    for (const b of back) for (const v of Object.values(b)) expect(v).not.toMatch(/^[=+\-@\t\r]/);
    expect(back.find((b) => b.unit === "'@SUM(A1)")).toBeDefined();
    expect(back.find((b) => b.group === "'\tTAB")).toBeDefined();
  });

  it('csvField quotes commas, quotes and line breaks and neutralises formula starters', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('one\ntwo')).toBe('"one\ntwo"');
    expect(csvField('one\r\ntwo')).toBe('"one\r\ntwo"');
    expect(csvField('=1+1')).toBe("'=1+1");
    expect(csvField('+1')).toBe("'+1");
    expect(csvField('-1')).toBe("'-1");
    expect(csvField('@A1')).toBe("'@A1");
    expect(csvField('\tx')).toBe("'\tx");
    expect(csvField('\rx')).toBe('"\'\rx"');
    expect(csvField('=HYPERLINK("x","y")')).toBe('"\'=HYPERLINK(""x"",""y"")"');
    expect(csvField(12)).toBe('12');
    expect(csvField(null)).toBe('');
    expect(csvField(undefined)).toBe('');
  });

  it('writes a header only when there is nothing to report', () => {
    const empty: ProblemRows = { rows: [], total: 0, omitted: 0, maxRows: 10 };
    expect(problemsCsv(empty)).toBe(`${PROBLEM_COLUMNS.join(',')}\r\n`);
  });
});

/** Audit a delivery, then collect its problem rows: the report and the rows of one rule. */
async function reportAndRows(data: readonly Row[] | string, map: Record<string, unknown>, rule: string) {
  const dd = writeDelivery(data, map);
  try {
    const r = parseRoles(toYaml(map), dd.roles, catalogue).roles;
    const report = await audit(dd.csv, r, { threads: 1 });
    const found = await problemRows(dd.csv, r, report.findings);
    return { report, rows: found.rows.filter((x) => x.rule === rule) };
  } finally {
    dd.remove();
  }
}

describe('problemRows on other shapes', () => {
  it('names unreadable lines by line number (no record number)', async () => {
    const csv = 'g,u,y\nA,a1,1\nA,a2,2,extra\nB,b1,3\nB,b2,4\n';
    const { report: rep, rows: lines } = await reportAndRows(csv, { group: 'g', unit: 'u', outcomes: ['y'] }, 'unreadable-lines');
    expect(rep.findings.map((f) => f.rule)).toContain('unreadable-lines');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatchObject({ record: null, group: null, unit: null });
    expect(lines[0].reason).toMatch(/^line 3 \(the header is line 1\) could not be read: /);
  });

  it('compares a numeric level-2 column as numbers, within the rule tolerance', async () => {
    const data: Row[] = [
      { g: 'A', u: 'a1', y: 1, staff: '4' },
      { g: 'A', u: 'a2', y: 2, staff: '4.0' },
      { g: 'A', u: 'a3', y: 3, staff: '4.05' },
      { g: 'A', u: 'a4', y: 3, staff: '7' },
      { g: 'B', u: 'b1', y: 3, staff: '2' },
      { g: 'B', u: 'b2', y: 4, staff: '2' },
    ];
    const map = { group: 'g', unit: 'u', outcomes: ['y'], level2: ['staff'], rules: { 'level2-varies': { tolerance: 0.1 } } };
    const { rows: varies } = await reportAndRows(data, map, 'level2-varies');
    expect(varies.map((x) => [x.record, x.unit])).toEqual([[4, 'a4']]);
    expect(varies[0].reason).toBe('staff is 7 here but 4 in most records of the group');
  });

  it('names the same records as the report when a numeric column read as text ties for its mode', async () => {
    // "n/a" makes the column text; declared numeric, it is compared as numbers. The tie 9 / 10
    // goes to the smaller number (9), not to the first in text order ("10")
    const data: Row[] = [
      { g: 'A', u: 'a1', y: 1, staff: '9' },
      { g: 'A', u: 'a2', y: 2, staff: '9' },
      { g: 'A', u: 'a3', y: 3, staff: '10' },
      { g: 'A', u: 'a4', y: 3, staff: '10' },
      { g: 'B', u: 'b1', y: 3, staff: 'n/a' },
      { g: 'B', u: 'b2', y: 4, staff: '2' },
      { g: 'B', u: 'b3', y: 5, staff: '2' },
    ];
    const map = {
      group: 'g',
      unit: 'u',
      outcomes: ['y'],
      level2: ['staff'],
      types: { staff: 'numeric' },
      rules: { 'level2-varies': { tolerance: 0.5 } },
    };
    const { report, rows: varies } = await reportAndRows(data, map, 'level2-varies');
    const finding = report.findings.find((f) => f.rule === 'level2-varies')!;
    expect(finding.rows).toEqual([3, 4]);
    expect(varies.map((x) => x.record)).toEqual(finding.rows);
    expect(varies[0].reason).toBe('staff is "10" here but 9 in most records of the group');
  });

  it('names the spelling, the repeated ID and the value that is not a number', async () => {
    const data: Row[] = [
      { g: 'W-014', u: 'a1', y: 1, visits: '3' },
      { g: 'W-014', u: 'a2', y: 2, visits: '4' },
      { g: 'W-014', u: 'a3', y: 3, visits: 'lots' },
      { g: 'w-014 ', u: 'a4', y: 3, visits: '5' },
      { g: 'B', u: 'a1', y: 3, visits: '2' },
      { g: 'B', u: 'b2', y: 4, visits: '2' },
      { g: 'B', u: 'b3', y: 5, visits: '1' },
    ];
    const map = { group: 'g', unit: 'u', outcomes: ['y'], level1: ['visits'], types: { visits: 'numeric' } };
    const dd = writeDelivery(data, map);
    try {
      const r = parseRoles(toYaml(map), dd.roles, catalogue).roles;
      const rep = await audit(dd.csv, r, { threads: 1 });
      const found = await problemRows(dd.csv, r, rep.findings);
      const reasons = (rule: string) => found.rows.filter((x) => x.rule === rule).map((x) => [x.record, x.reason]);
      expect(reasons('id-variants')).toEqual([[4, 'g "w-014 " is "W-014" written another way']]);
      expect(reasons('duplicate-unit-id')).toEqual([
        [1, 'u "a1" is on more than one record of the delivery'],
        [5, 'u "a1" is on more than one record of the delivery'],
      ]);
      expect(reasons('non-numeric-values')).toEqual([[3, 'visits holds "lots", which does not read as a number']]);
      const withheld = await problemRows(dd.csv, r, rep.findings, { includeValues: false });
      expect(withheld.rows.find((x) => x.rule === 'non-numeric-values')?.reason).toBe(
        'visits holds a value that does not read as a number (values withheld)',
      );
      // IDs are what the sender fixes: they stay under --no-values
      expect(withheld.rows.find((x) => x.rule === 'id-variants')?.reason).toContain('"w-014 "');
    } finally {
      dd.remove();
    }
  });

  it('names the group value, the code, the moved unit and the parent, and withholds only values', async () => {
    // parentRows: A is split across north (5) and south (1), B is one code reused by both;
    // two records added to C (16, 17): 16 lacks site (C's others have "x"), both hold y = -999;
    // unit a1 is in A (record 1) and in C (record 16)
    const data: Row[] = [
      ...parentRows.map((r, i) => ({ ...r, u: i === 0 ? 'a1' : `r${i + 1}`, site: r.g === 'C' ? 'x' : 'm' })),
      { g: 'C', p: 'east', size: 5, y: -999, u: 'a1', site: null },
      { g: 'C', p: 'east', size: 5, y: -999, u: 'c5', site: 'x' },
    ];
    const map = { group: 'g', unit: 'u', parent: 'p', outcomes: ['y'], level2: ['size', 'site'], types: { site: 'categorical' } };
    const dd = writeDelivery(data, map);
    try {
      const r = parseRoles(toYaml(map), dd.roles, catalogue).roles;
      const rep = await audit(dd.csv, r, { threads: 1 });
      const found = await problemRows(dd.csv, r, rep.findings);
      const reasons = (rule: string) => found.rows.filter((x) => x.rule === rule).map((x) => [x.record, x.reason]);
      expect(reasons('group-in-several-parents')).toEqual([
        ...[1, 2, 3, 4, 5].map((k) => [k, 'g "A" is under p "north" here and under another p on other records']),
        [6, 'g "A" is under p "south" here and under another p on other records'],
      ]);
      expect(reasons('group-code-reused')).toEqual([
        ...[7, 8, 9].map((k) => [k, 'g "B" under p "north" here: another p uses the same code for a different group']),
        ...[10, 11, 12].map((k) => [k, 'g "B" under p "south" here: another p uses the same code for a different group']),
      ]);
      expect(reasons('level2-partly-missing')).toEqual([
        [16, 'site is missing here; the other records of the group have "x" (the most common value)'],
      ]);
      expect(reasons('sentinel-values')).toEqual([
        [16, 'y holds -999, far outside its other values: probably a missing-value code'],
        [17, 'y holds -999, far outside its other values: probably a missing-value code'],
      ]);
      expect(reasons('unit-in-several-groups')).toEqual([
        [1, 'u "a1" is in g "A" here and in another g on other records'],
        [16, 'u "a1" is in g "C" here and in another g on other records'],
      ]);
      // every record a finding lists has its row
      for (const f of rep.findings.filter((f) => f.rows?.length)) {
        expect(found.rows.filter((x) => x.rule === f.rule && x.column === f.column).map((x) => x.record)).toEqual(f.rows);
      }
      // no generic reason left for a finding that lists records
      expect(found.rows.filter((x) => x.reason.includes('one of the records the report lists'))).toEqual([]);
      const withheld = await problemRows(dd.csv, r, rep.findings, { includeValues: false });
      const first = (rule: string) => withheld.rows.find((x) => x.rule === rule)?.reason;
      expect(first('level2-partly-missing')).toBe('site is missing here but present on other records of the group (values withheld)');
      expect(first('sentinel-values')).toBe(
        'y holds a value far outside its other values, probably a missing-value code (values withheld)',
      );
      // IDs are what the sender fixes: they stay under --no-values
      expect(first('unit-in-several-groups')).toContain('"a1"');
      expect(first('group-code-reused')).toContain('p "north"');
      expect(withheld.rows.map((x) => x.reason).join('\n')).not.toContain('999');
    } finally {
      dd.remove();
    }
  });
});
