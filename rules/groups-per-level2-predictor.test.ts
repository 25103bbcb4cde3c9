import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const delivery = (groups: number) => groupedRows(groups, 3, (j, i) => ({ y: i, a: j, b: j % 3, c: `t${j % 2}` }));

describe('groups-per-level2-predictor', () => {
  it('warns below 10 groups per level-2 variable (heuristic) and gives the J − q − 1 df', async () => {
    const f = onlyFinding(await auditRows(delivery(20), { group: 'g', level2: ['a', 'b', 'c'] }), 'groups-per-level2-predictor');
    expect(f.severity).toBe('warning');
    expect(f.count).toBe(20);
    expectMessage(f, 'few', { groups: 20, q: 3, ratio: '6.7', limit: 10, df: 16 });
  });

  it('blocks when no degrees of freedom are left', async () => {
    const f = onlyFinding(await auditRows(delivery(3), { group: 'g', level2: ['a', 'b'] }), 'groups-per-level2-predictor');
    expect(f.severity).toBe('blocker');
    expectMessage(f, 'none', { df: 0 });
  });

  it('is silent with enough groups, without level-2 variables, and follows per_predictor', async () => {
    expect(findingsOf(await auditRows(delivery(30), { group: 'g', level2: ['a', 'b', 'c'] }), 'groups-per-level2-predictor')).toEqual([]);
    expect(findingsOf(await auditRows(delivery(5), { group: 'g' }), 'groups-per-level2-predictor')).toEqual([]);
    const rules = { 'groups-per-level2-predictor': { per_predictor: 5 } };
    expect(findingsOf(await auditRows(delivery(20), { group: 'g', level2: ['a', 'b', 'c'], rules }), 'groups-per-level2-predictor')).toEqual([]);
  });
});
