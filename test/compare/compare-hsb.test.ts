import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { compare } from '../../src/compare/compare.js';
import { renderJson } from '../../src/report/json.js';
import { reportSchema } from '../../src/report/report-schema.js';
import type { Report } from '../../src/report/types.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { createAjv } from '../../src/util/ajv.js';
import { PLANTED, writeHsbDeliveries } from './hsb-deliveries.js';

const dir = mkdtempSync(join(tmpdir(), 'nestready-compare-test-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const paths = writeHsbDeliveries(dir);
const roles = () => loadRoles(paths.roles, catalogue);
const options = { threads: 1, plotData: false };

let previousJson: string;
let fromFile: Report;
let fromReport: Report;
let withheld: Report;
let same: Report;
beforeAll(async () => {
  previousJson = renderJson(await audit(paths.previous, roles(), { ...options, snapshot: true }));
  const reportFile = join(dir, 'previous.json');
  writeFileSync(reportFile, previousJson);
  fromFile = await compare(paths.previous, paths.current, roles(), options);
  fromReport = await compare(reportFile, paths.current, roles(), options);
  withheld = await compare(paths.previous, paths.current, roles(), { ...options, includeValues: false });
  same = await compare(paths.previous, paths.same, roles(), options);
});

/** rule, messageId, column, groups of each change finding */
const shape = (r: Report) => r.findings.map((f) => [f.rule, f.messageId, f.column ?? null, f.groups ?? null]);

// what both comparisons must find: each planted change, and what follows from it, nothing else
const PLANTED_FINDINGS = [
  // pupils moved between schools (and schools added and removed) shift minority's school means:
  // its within/between gap now passes the within-between-gap rule's test, new to the audit
  ['audit-findings-changed', 'new', 'minority', null],
  // blanking ses in two schools is new to the audit: missing-by-group's two findings on ses
  ['audit-findings-changed', 'new', 'ses', null],
  ['audit-findings-changed', 'new', 'ses', null],
  ['groups-vanished', 'vanished', null, PLANTED.vanished],
  ['level2-value-changed', 'changed', 'sector', [PLANTED.flipped]],
  ['missing-rate-changed', 'groups', 'ses', PLANTED.missingSes],
  ['columns-changed', 'added', 'homework', null],
  ['groups-appeared', 'appeared', null, PLANTED.appeared],
];

describe('compare two HSB deliveries with planted changes', () => {
  it('finds each planted change exactly when the previous delivery is its JSON report (no unit moves, and says so)', () => {
    expect(shape(fromReport)).toEqual(PLANTED_FINDINGS);
    expect(fromReport.changes?.skipped).toEqual([
      'distribution shift in the groups present in both: the previous report keeps each column’s distribution over the whole ' +
        'delivery only; compare the two files',
      'units moved, left or joined: the previous delivery was given as its report, which holds no unit ID',
    ]);
    expect(fromReport.input.notes?.at(-1)).toMatch(/^not checked: units moved/);
  });

  it('finds the same, and the units that moved, left or joined, when the previous delivery is the file', () => {
    const units = shape(fromFile).filter(([rule]) => String(rule).startsWith('units-'));
    expect(shape(fromFile).filter(([rule]) => !String(rule).startsWith('units-'))).toEqual(PLANTED_FINDINGS);
    expect(units).toEqual([
      ['units-moved', 'moved', null, [PLANTED.moved.to]],
      ['units-left-or-joined', 'joined', null, [PLANTED.appeared[0]]],
      ['units-left-or-joined', 'left', null, [PLANTED.vanished[0]]],
    ]);
    const moved = fromFile.findings.find((f) => f.rule === 'units-moved')!;
    expect(moved.data).toEqual({ count: 3, units: PLANTED.moved.students.join(', ') });
    expect(moved.severity).toBe('warning');
    const [joined, left] = fromFile.findings.filter((f) => f.rule === 'units-left-or-joined');
    // every pupil of the schools that appeared joined, every pupil of those that vanished left (counted in HSB)
    const hsb = (school: string[]) => readSchools().filter((s) => school.includes(s)).length;
    expect(joined.count).toBe(hsb(PLANTED.appeared));
    expect(left.count).toBe(hsb(PLANTED.vanished));
    expect(fromFile.changes?.skipped).toEqual([]);
  });

  it('says what changed in its data, severities and the summary', () => {
    const flipped = fromReport.findings.find((f) => f.rule === 'level2-value-changed')!;
    expect(flipped).toMatchObject({
      severity: 'warning',
      count: 1,
      data: { column: 'sector', count: 1 },
      values: ['1374: Public → Catholic'],
    });
    expect(fromReport.findings.every((f) => f.change === true)).toBe(true);
    expect(fromReport.changes).toMatchObject({
      previous: { rows: 7112, groups: 158, from: 'report' },
      groups: { both: 155, appeared: 2, vanished: 3 },
      findings: { new: 3, resolved: 0 },
    });
    const icc = fromReport.changes!.outcomes.mathach;
    expect(icc.p).toBeGreaterThan(0.5); // five schools out of 160 do not move the ICC beyond sampling
    expect(icc.previous.ci95[0]).toBeLessThan(icc.previous.icc!);
  });

  it('with --no-values keeps level-2 values as hashes and still finds the flipped sector', () => {
    expect(shape(withheld).filter(([rule]) => !String(rule).startsWith('units-'))).toEqual(PLANTED_FINDINGS);
    const text = renderJson(withheld);
    expect(text).not.toContain('Catholic');
    expect(text).not.toContain('Public');
    expect(withheld.snapshot?.values).toBe('hashed');
    expect(withheld.snapshot?.groups.level2.sector[0]).toMatch(/^[0-9a-f]{16}$/);
  });

  it('gives no change finding for two identical deliveries', () => {
    expect(same.findings).toEqual([]);
    expect(same.verdict).toBe('ready');
    expect(same.changes).toMatchObject({ groups: { appeared: 0, vanished: 0 }, findings: { new: 0, resolved: 0 } });
  });

  it('writes a report the JSON Schema accepts, with a snapshot free of unit IDs', () => {
    const validate = createAjv({ checkSchemas: true }).compile(reportSchema);
    for (const json of [previousJson, renderJson(fromFile)]) expect(validate(JSON.parse(json)), JSON.stringify(validate.errors)).toBe(true);
    const snapshot = JSON.parse(previousJson).snapshot;
    expect(snapshot.groups.ids).toHaveLength(158);
    expect(Object.keys(snapshot.columns)).toContain('student');
    expect(snapshot.columns.student.sketch).toBeUndefined();
    expect(JSON.stringify(snapshot)).not.toMatch(/"student"\s*:\s*\[/);
  });
});

function readSchools(): string[] {
  return readFileSync('fixtures/reference/hsb.csv', 'utf8')
    .trim()
    .split('\n')
    .slice(1)
    .map((l) => l.split(',')[1]);
}
