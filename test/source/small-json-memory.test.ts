import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { parseRoles } from '../../src/roles/load.js';
import { mulberry32 } from '../helpers/prng.js';

// A delivery that fits in memory many times over must never fail on memory. DuckDB's JSON
// readers hold 32 MiB buffers however small the file, and the audit scans the delivery on three
// connections at once (the profile, the unit-ID check, a look-up): at the CLI's default limit
// such files ran out of memory now and then, depending on which scans overlapped.
const DEFAULT_LIMIT = '100MB'; // the CLI's --memory-limit default
const RUNS = 8;

const roles = parseRoles(
  'group: site\nunit: id\nparent: region\noutcomes: [score]\nlevel1: [age, band, note]\nlevel2: [kind, staff]\n',
  'roles.yaml',
  catalogue,
);

/** 3,201 records in 550 groups, about 1.4 MB as a JSON array (as in the report that found it). */
function records(): Record<string, unknown>[] {
  const rand = mulberry32(11);
  return Array.from({ length: 3201 }, (_, i) => {
    const g = i < 550 ? i : Math.floor(rand() * 550);
    return {
      id: `R${String(i + 1).padStart(6, '0')}`,
      site: `S${String(g).padStart(4, '0')}`,
      region: `region-${g % 17}`,
      score: Math.round(rand() * 1000) / 10,
      age: Math.floor(18 + rand() * 60),
      band: ['low', 'mid', 'high'][Math.floor(rand() * 3)],
      note: 'x'.repeat(Math.floor(250 + rand() * 100)),
      kind: g % 3 === 0 ? 'fixed' : 'mobile',
      staff: 3 + (g % 9),
    };
  });
}

describe.sequential(`small JSON deliveries audit at the default --memory-limit (${DEFAULT_LIMIT}), every time`, () => {
  let dir: string;
  const files: Record<string, string> = {};
  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'nestready-small-json-'));
    const recs = records();
    files.json = join(dir, 'delivery.json');
    writeFileSync(files.json, JSON.stringify(recs, null, 1));
    files.ndjson = join(dir, 'delivery.ndjson');
    writeFileSync(files.ndjson, `${recs.map((r) => JSON.stringify(r)).join('\n')}\n`);
    files.one = join(dir, 'one.ndjson');
    writeFileSync(files.one, `${JSON.stringify(recs[0])}\n`);
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('the generated JSON array is the size of the one reported (about 1.4 MB)', () => {
    expect(statSync(files.json).size).toBeGreaterThan(1.2e6);
    expect(statSync(files.json).size).toBeLessThan(1.6e6);
  });

  it.each([
    ['a JSON array of 3,201 records in 550 groups', 'json', 3201, 550],
    ['the same records as NDJSON', 'ndjson', 3201, 550],
    ['an NDJSON file of one record', 'one', 1, 1],
  ])(
    `%s: ${RUNS} audits, none out of memory`,
    async (_, which, records, groups) => {
      // two at a time, as a shared machine would run them
      for (let run = 0; run < RUNS; run += 2) {
        const reports = await Promise.all(
          [0, 1].map(() => audit(files[which as string], roles, { memoryLimit: DEFAULT_LIMIT, threads: 2, plotData: false })),
        );
        for (const report of reports) {
          expect(report.input.rows).toBe(records);
          expect(report.groups.count).toBe(groups);
        }
      }
    },
    120_000,
  );
});
