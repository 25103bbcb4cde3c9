import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { mulberry32 } from '../test/helpers/prng.js';

const bounded = { group: 'g', outcome: 'y', types: { y: { bounded: { lower: 0, upper: 10 } } } };

describe('bounded-floor-ceiling', () => {
  it('finds a planted ceiling effect and names the groups where it is largest', async () => {
    const rand = mulberry32(5);
    // 20 groups of 10 on a 0–10 scale; groups G001–G006 are at the ceiling on 9 records of 10
    const rows = groupedRows(20, 10, (j, i) => ({ y: j < 6 && i < 9 ? 10 : 1 + Math.floor(rand() * 9) }));
    const f = onlyFinding(await auditRows(rows, bounded), 'bounded-floor-ceiling');
    expect(f.severity).toBe('warning');
    expect(f.count).toBe(54);
    expect(f.groups).toEqual(['G001', 'G002', 'G003', 'G004', 'G005']);
    expectMessage(f, 'piled', {
      column: 'y',
      records: 200,
      floor: 0,
      ceiling: 10,
      floorShare: '0.0%',
      ceilingShare: '27.0%',
      maxShare: '15.0%',
      model: 'a censored (tobit) or beta model',
    });
    expect(f.data.list).toBe('G001 (90.0% of 10), G002 (90.0% of 10), G003 (90.0% of 10), G004 (90.0% of 10), G005 (90.0% of 10)');
  });

  it('reads an ordinal outcome at its lowest category seen', async () => {
    const rows = groupedRows(10, 10, (j, i) => ({ y: i < 3 ? 1 : 2 + ((i + j) % 4) }));
    const f = onlyFinding(await auditRows(rows, { group: 'g', outcome: 'y', types: { y: 'ordinal' } }), 'bounded-floor-ceiling');
    expectMessage(f, 'piled', { floor: 1, ceiling: 5, floorShare: '30.0%', model: 'an ordinal (cumulative logit) model' });
  });

  it('a clean bounded delivery, and an outcome of another kind, yield nothing', async () => {
    const rand = mulberry32(6);
    const rows = groupedRows(20, 10, () => ({ y: 1 + Math.floor(rand() * 9) }));
    expect(findingsOf(await auditRows(rows, bounded), 'bounded-floor-ceiling')).toEqual([]);
    const piled = groupedRows(5, 4, (_, i) => ({ y: i < 3 ? 0 : 4 }));
    expect(findingsOf(await auditRows(piled, { group: 'g', outcome: 'y' }), 'bounded-floor-ceiling')).toEqual([]);
  });
});
