import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import type { Report } from '../../src/report/types.js';
import { parseRoles } from '../../src/roles/load.js';
import type { Delivery } from '../helpers/delivery.js';
import { groupedRows, toYaml, writeDelivery } from '../helpers/delivery.js';
import { mulberry32 } from '../helpers/prng.js';
import { dropTables, loadCsv } from './load.js';

const url = process.env.NESTREADY_PG_URL;
const RULES = ['binary-separation', 'bounded-floor-ceiling', 'count-outcome'];

describe.skipIf(!url)('PostgreSQL: the outcome-kind look-ups (value frequencies, cross-tabulation, floor and ceiling)', () => {
  const yaml = toYaml({
    group: 'g',
    outcomes: ['c', 'b', 's'],
    level1: ['kind'],
    types: { c: 'count', b: 'binary', s: { bounded: { lower: 0, upper: 10 } }, kind: 'categorical' },
  });
  let d: Delivery;
  let file: Report;
  beforeAll(async () => {
    const rand = mulberry32(9);
    const rows = groupedRows(30, 8, (j, i) => {
      const kind = ['a', 'b', 'c'][(i + j) % 3];
      return { c: Math.floor(rand() * (1 + (j % 4))), b: kind === 'c' ? 0 : Number(rand() < 0.5), s: i < 2 ? 10 : i, kind };
    });
    d = writeDelivery(rows, yaml);
    await loadCsv(url!, d.csv, 'nr_test_kinds');
    file = await audit(d.csv, parseRoles(yaml, d.roles, catalogue), { threads: 1, plotData: false });
  });
  afterAll(async () => {
    await dropTables(url!, ['nr_test_kinds']);
    d.remove();
  });

  it('gives the findings and the Poisson statistics of the file', async () => {
    const db = await audit({ url: url!, table: 'nr_test_kinds' }, parseRoles(yaml, d.roles, catalogue), { plotData: false });
    const mine = (r: Report) => r.findings.filter((f) => RULES.includes(f.rule));
    expect(mine(file).map((f) => `${f.rule}/${f.messageId}`)).toEqual(
      expect.arrayContaining(['binary-separation/separation', 'bounded-floor-ceiling/piled', 'count-outcome/fit']),
    );
    expect(mine(db)).toEqual(mine(file));
    expect(db.outcomes.c.poisson).toEqual(file.outcomes.c.poisson);
  });
});
