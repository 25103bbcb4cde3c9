import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import type { Report } from '../../src/report/types.js';
import { parseRoles } from '../../src/roles/load.js';
import { toCsv } from '../helpers/delivery.js';
import { expectSameAudit } from '../source/formats/same.js';
import { dropTables, loadCsv } from './load.js';

const url = process.env.NESTREADY_PG_URL;
if (!url && process.env.CI) throw new Error('CI: NESTREADY_PG_URL is not set (.ci/run starts PostgreSQL for test/postgres)');

const ROLES = `group: person
outcomes: [score]
level2: [arm]
time: wave
weights: { level1: w1, level2: w2 }
detect: { predictor: arm, effect_size: 0.5 }
`;

/** 30 persons at waves 1–4 with dropouts and gaps, record and person weights, a two-arm person-level predictor. */
function longitudinal(): string {
  const rows = [];
  for (let j = 0; j < 30; j++) {
    const waves = j % 5 === 0 ? [1, 2] : j % 7 === 0 ? [1, 3, 4] : [1, 2, 3, 4];
    for (const t of waves) {
      rows.push({
        person: `P${j}`,
        wave: t,
        score: (j % 4) + t * 0.8 + (j % 5 === 0 ? -2 : 0),
        w1: 1 + ((j + t) % 3) / 2,
        w2: 1 + (j % 6),
        arm: j % 2,
      });
    }
  }
  return toCsv(rows);
}

describe.skipIf(!url)('PostgreSQL: the model-plan rules give the file’s report', () => {
  const dir = mkdtempSync(join(tmpdir(), 'nr-pg-plan-'));
  const csv = join(dir, 'long.csv');
  let file: Report;
  const roles = parseRoles(ROLES, 'roles.yaml', catalogue);
  beforeAll(async () => {
    writeFileSync(csv, longitudinal());
    await loadCsv(url!, csv, 'nr_test_plan');
    file = await audit(csv, roles, { threads: 1 });
  });
  afterAll(async () => {
    await dropTables(url!, ['nr_test_plan']);
    rmSync(dir, { recursive: true, force: true });
  });

  it('occasions (one look-up in the dialect), weights and precision agree', async () => {
    const db = await audit({ url: url!, table: 'nr_test_plan' }, roles, { threads: 1 });
    expectSameAudit(db, file);
    expect(db.weights).toEqual(file.weights);
    // the ICC may differ in its last digits between engines (sums in another order): the precision with it
    const [a, b] = [db.outcomes.score.precision ?? {}, file.outcomes.score.precision ?? {}];
    expect(Object.keys(a)).toEqual(Object.keys(b));
    for (const [k, v] of Object.entries(b)) {
      const got = (a as Record<string, unknown>)[k];
      if (typeof v === 'number') expect(got as number, k).toBeCloseTo(v, 12);
      else expect(got, k).toBe(v);
    }
    expect(db.findings.filter((f) => f.rule === 'occasions-per-person').map((f) => f.messageId)).toEqual(
      file.findings.filter((f) => f.rule === 'occasions-per-person').map((f) => f.messageId),
    );
    expect(file.findings.some((f) => f.rule === 'occasions-per-person' && f.messageId === 'missingOccasions')).toBe(true);
  });
});
