import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { draftRoles } from '../../src/draft/draft.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { toCsv } from '../helpers/delivery.js';

const dir = mkdtempSync(join(tmpdir(), 'nr-draft-keys-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/**
 * 12 persons at waves 1–4: visits (whole numbers 0–6), score (decimals), a record weight w1
 * (1 to 2) and a person weight site_weight (2 to 13, one per person).
 */
function longitudinal(): string {
  const rows = [];
  for (let j = 0; j < 12; j++) {
    for (let t = 1; t <= 4; t++) {
      rows.push({
        person: `P${j}`,
        wave: t,
        visits: (j * t) % 7,
        w1: (1 + ((j + t) % 3) * 0.5).toFixed(1),
        site_weight: (2 + j).toFixed(2),
        score: (10 + (j % 3) + t * 1.3).toFixed(1),
      });
    }
  }
  return toCsv(rows);
}

describe('draft proposes the model-plan keys, commented out', () => {
  it('time, weights by level and count, each with its evidence; the draft loads and audits when they are taken', async () => {
    const file = join(dir, 'long.csv');
    writeFileSync(file, longitudinal());
    const { text, roles, plan } = await draftRoles(file);
    expect(text).toMatch(/^# time: wave +# 4 distinct values \(1 to 4\), varies within 12 of 12 groups; named like an occasion$/m);
    expect(text).toMatch(/^# {3}level1: w1 +# positive \(1 to 2\), named like a weight; varies within 12 of 12 groups$/m);
    expect(text).toMatch(/^# {3}level2: site_weight +# positive \(2 to 13\), named like a weight; constant within 12 of 12 groups$/m);
    expect(text).toMatch(/^# {3}visits: count +# whole numbers 0 to 6: a count, if it is the outcome$/m);
    // commented out: the draft as written declares none of them, and the weights play no other part
    expect(roles.time).toBeUndefined();
    expect(roles.weights).toBeUndefined();
    expect([...roles.level1, ...roles.level2]).not.toContain('w1');
    expect(plan.counts.map((c) => c.column)).toEqual(['visits']);

    // the analyst takes every proposal: the map still loads, and the audit runs the new rules
    const taken = text
      .replace(/^# time: /m, 'time: ')
      .replace(/^# weights:$/m, 'weights:')
      .replace(/^# {3}(level[12]: )/gm, '  $1')
      .replace(/^# types:$/m, 'types:')
      .replace(/^# {3}visits: count/m, '  visits: count')
      .replace(/^# outcomes:$/m, 'outcomes:')
      .replace(/^ {2}- score +# varies.*\n/m, '')
      .replace(/^# {3}- score/m, '  - score');
    const rolesFile = join(dir, 'long.yaml');
    writeFileSync(rolesFile, taken);
    const loaded = loadRoles(rolesFile, catalogue);
    expect(loaded.roles).toMatchObject({ time: 'wave', weights: { level1: 'w1', level2: 'site_weight' }, outcomes: ['score'] });
    expect(loaded.roles.types.visits).toBe('count');
    const report = await audit(file, loaded, { threads: 1, plotData: false });
    expect(report.weights?.level2?.varyingGroups).toEqual([]);
    expect(report.findings.some((f) => f.rule === 'occasions-per-person')).toBe(true);
  });
});
