import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { compare } from '../../src/compare/compare.js';
import { renderJson } from '../../src/report/json.js';
import type { Report } from '../../src/report/types.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { HSB_ROLES } from './hsb-deliveries.js';

// HSB (fixtures/reference/hsb.csv) twice: the current delivery lacks three schools, and in twelve
// other schools of 44 to 62 pupils every pupil's mathach is 15 points higher (about two
// within-school SDs; a school of 25 pupils near the top of the scale can stay under the test at the
// bin edges, which bounds D from below). Over the
// whole delivery the shift is diluted by the 143 unchanged schools; within the groups present in
// both it must be found, and exactly the twelve schools named.
const SHIFTED = ['1224', '1296', '1317', '1436', '1462', '1477', '1499', '1906', '2030', '2336', '2458', '2467'];
const DROPPED = ['2208', '2277', '2305'];

const dir = mkdtempSync(join(tmpdir(), 'nestready-shift-test-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const options = { threads: 1, plotData: false };

let fromFile: Report;
let fromReport: Report;
beforeAll(async () => {
  const [header, ...lines] = readFileSync('fixtures/reference/hsb.csv', 'utf8').trim().split('\n');
  const cols = header.split(',');
  const [school, mathach] = [cols.indexOf('school'), cols.indexOf('mathach')];
  const current = lines
    .map((l) => l.split(','))
    .filter((r) => !DROPPED.includes(r[school]))
    .map((r) => (SHIFTED.includes(r[school]) ? r.map((v, k) => (k === mathach ? String(Number(v) + 15) : v)) : r));
  const paths = { previous: join(dir, 'previous.csv'), current: join(dir, 'current.csv'), roles: join(dir, 'roles.yaml') };
  writeFileSync(paths.previous, `${[header, ...lines].join('\n')}\n`);
  writeFileSync(paths.current, `${[cols, ...current].map((r) => r.join(',')).join('\n')}\n`);
  writeFileSync(paths.roles, HSB_ROLES);
  const roles = () => loadRoles(paths.roles, catalogue);
  const report = join(dir, 'previous.json');
  writeFileSync(report, renderJson(await audit(paths.previous, roles(), { ...options, snapshot: true })));
  fromFile = await compare(paths.previous, paths.current, roles(), options);
  fromReport = await compare(report, paths.current, roles(), options);
});

const shifts = (r: Report) => r.findings.filter((f) => f.rule === 'distribution-shifted');

describe('distribution shift in the groups present in both', () => {
  it('names exactly the schools whose mathach was shifted, when both deliveries are files', () => {
    const inBoth = shifts(fromFile).filter((f) => f.messageId === 'shifted-in-both');
    expect(inBoth.map((f) => f.column)).toEqual(['mathach']);
    const [f] = inBoth;
    expect([...(f.groups ?? [])].sort()).toEqual(SHIFTED);
    expect(f.count).toBe(12);
    expect(f.data).toMatchObject({ column: 'mathach', groups: 157, shifted: 12 });
    // pooled over 157 schools the 12 stay below the notes' bands (so no finding over the whole
    // delivery either): the groups' own tests are what find them
    expect(f.data.psi).toBeLessThan(0.1);
    expect(f.severity).toBe('note');
    expect(shifts(fromFile).filter((x) => x.messageId === 'shifted')).toEqual([]);
  });

  it('without the per-group bins (previous given as its report) says so instead', () => {
    expect(shifts(fromReport).filter((f) => f.messageId === 'shifted-in-both')).toEqual([]);
    expect(fromReport.changes?.skipped[0]).toMatch(/^distribution shift in the groups present in both: .*compare the two files$/);
    // the whole delivery's test runs from the report alike
    const overall = (r: Report) => shifts(r).filter((f) => f.messageId === 'shifted');
    expect(overall(fromReport)).toEqual(overall(fromFile));
  });
});
