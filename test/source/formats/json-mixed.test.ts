import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../../rules/index.js';
import { audit } from '../../../src/audit.js';
import { problemRows } from '../../../src/problem-rows.js';
import { parseRoles } from '../../../src/roles/load.js';
import { toCsv } from '../../helpers/delivery.js';
import { expectSameAudit } from './same.js';

// 12 groups of 5; the JSON writes some group IDs, names and outcomes as strings and others as
// numbers (as a document assembled from several sources does); the CSV holds the same records
const records: Record<string, string | number | null>[] = [];
for (let g = 1; g <= 12; g++) {
  for (let i = 0; i < 5; i++) {
    const n = records.length;
    records.push({
      school: n % 3 === 0 ? String(g) : g,
      pupil: `p${n}`,
      name: n % 4 === 0 ? 1000 + n : `Pupil ${n}`,
      score: n === 7 ? 'absent' : n % 2 ? String(40 + ((n * 7) % 23)) : 40 + ((n * 7) % 23),
      size: n % 5 === 0 ? String(20 + g) : 20 + g,
    });
  }
}
records[11].pupil = 'p10'; // a duplicate unit ID, for problem rows

const csvRecords = records.map((r) => Object.fromEntries(Object.entries(r).map(([k, v]) => [k, v === null ? null : String(v)])));
const dir = mkdtempSync(join(tmpdir(), 'nestready-json-'));
const files = {
  csv: join(dir, 'pupils.csv'),
  json: join(dir, 'pupils.json'),
  ndjson: join(dir, 'pupils.ndjson'),
};
writeFileSync(files.csv, toCsv(csvRecords));
writeFileSync(files.json, JSON.stringify(records, null, 1));
writeFileSync(files.ndjson, `${records.map((r) => JSON.stringify(r)).join('\n')}\n`);
const roles = parseRoles('group: school\nunit: pupil\noutcomes: [score]\nlevel1: [name]\nlevel2: [size]\n', 'roles.yaml', catalogue);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('JSON with numbers and strings mixed in one column reads as the CSV of the same records', () => {
  it.each(['json', 'ndjson'] as const)('%s: findings, statistics and problem rows equal', async (kind) => {
    const csv = await audit(files.csv, roles, { threads: 1 });
    const got = await audit(files[kind], roles, { threads: 1 });
    expectSameAudit(got, csv);
    // 7 and "7" are one group: 12 groups, no split
    expect(got.groups.count).toBe(12);
    // a value that kept its JSON quotes would show as "\"absent\"" (a backslash in the raw text)
    expect(got.findings.find((f) => f.rule === 'non-numeric-values')?.values).toEqual(['"absent" ×1 (records 8)']);
    expect(JSON.stringify(got.findings)).not.toContain('\\\\');
    const want = await problemRows(files.csv, roles.roles, csv.findings);
    const rows = await problemRows(files[kind], roles.roles, got.findings);
    expect(want.rows.length).toBeGreaterThan(0);
    expect(rows).toEqual(want);
    expect(JSON.stringify(rows)).not.toContain('\\\\');
  });
});
