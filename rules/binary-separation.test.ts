import { beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../src/report/types.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, groupedRows } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { mulberry32 } from '../test/helpers/prng.js';

const roles = {
  group: 'g',
  outcome: 'y',
  level1: ['kind', 'age'],
  level2: ['site'],
  types: { y: 'binary', kind: 'categorical', site: 'categorical' },
};

/** Groups of 0/1 records with a small group effect; `planted` may overwrite a record. */
function delivery(seed: number, groups: number, size: number, base: number, planted: (row: Row) => Row = (r) => r): Row[] {
  const rand = mulberry32(seed);
  const effects = Array.from({ length: groups }, () => 0.5 * (rand() - 0.5));
  return groupedRows(groups, size, (j) => {
    const kind = ['a', 'b', 'c'][Math.floor(rand() * 3)];
    const p = 1 / (1 + Math.exp(-(base + effects[j])));
    return planted({ y: rand() < p ? 1 : 0, kind, age: Math.round(20 + 40 * rand()), site: j % 2 ? 'urban' : 'rural' });
  });
}

describe('binary-separation', () => {
  let clean: Report;
  let planted: Report;
  beforeAll(async () => {
    clean = await auditRows(delivery(11, 60, 30, -0.4), roles);
    // level c of kind never has a 1; a rare level d has 3 records
    let d = 0;
    planted = await auditRows(
      delivery(11, 60, 30, -0.4, (r) => {
        if (r.kind === 'c') return { ...r, y: 0 };
        if (r.kind === 'b' && d < 3) return { ...r, kind: 'd', y: d++ === 0 ? 1 : 0 };
        return r;
      }),
      roles,
    );
  });

  it('a clean binary delivery yields nothing', () => {
    expect(clean.outcomes.y.logistic).toBeDefined();
    expect(findingsOf(clean, 'binary-separation')).toEqual([]);
  });

  it('finds planted quasi-complete separation and a sparse level', () => {
    const found = findingsOf(planted, 'binary-separation');
    expect(found.map((f) => f.messageId)).toEqual(['separation']);
    const [sep] = found;
    expect(sep.severity).toBe('warning');
    const records = Number(sep.data.records);
    expect(records).toBeGreaterThan(500);
    expect(sep.values).toEqual([`c (${records})`]);
    expectMessage(sep, 'separation', { column: 'y', predictor: 'kind', value: 0, levelCount: 1 });
  });

  it('reports sparse levels where nothing separates', async () => {
    let d = 0;
    const rows = delivery(12, 60, 30, -0.4, (r) => (r.kind === 'b' && d < 4 ? { ...r, kind: 'd', y: d++ % 2 } : r));
    const found = findingsOf(await auditRows(rows, roles), 'binary-separation');
    expect(found.map((f) => f.messageId)).toEqual(['sparseCells']);
    expect(found[0].severity).toBe('note');
    expect(found[0].values).toEqual(['d: 2 × 0, 2 × 1']);
    expectMessage(found[0], 'sparseCells', { predictor: 'kind', minCell: 5, levelCount: 1 });
  });

  it('lists groups that never vary, counts events per parameter and advises quadrature for small groups', async () => {
    const report = await auditRows(delivery(13, 40, 4, -2.6), { ...roles, level1: ['age'], types: { y: 'binary', site: 'categorical' } });
    const by = Object.fromEntries(findingsOf(report, 'binary-separation').map((f) => [f.messageId, f]));
    expect(Object.keys(by).sort(), JSON.stringify(by)).toEqual(['constantGroups', 'fewEvents', 'quadrature', 'sparseCells']);
    const constant = by.constantGroups;
    expect(constant.count).toBeGreaterThan(20);
    expect(constant.groups?.[0]).toMatch(/^G0\d\d$/);
    expectMessage(constant, 'constantGroups', { column: 'y', groups: 40, sizes: '4' });
    // intercept + age + site (2 levels) = 3 fixed effects, 1 variance component (Peduzzi et al. 1996: 10 per parameter)
    expectMessage(by.fewEvents, 'fewEvents', { column: 'y', rare: 1, parameters: 4, fixed: 3, variances: 1, minEpv: 10 });
    expect(by.fewEvents.severity).toBe('warning');
    // 11 events over two sites: fewer than 5 ones at a site
    expectMessage(by.sparseCells, 'sparseCells', { predictor: 'site' });
    expectMessage(by.quadrature, 'quadrature', { column: 'y', groups: 40, size: '4.0' });
  });
});
