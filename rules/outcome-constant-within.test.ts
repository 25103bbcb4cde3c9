import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

// 10 groups of 4; in G003 and G007 every record has the same outcome
const rows = groupedRows(10, 4, (j, i) => ({ y: j === 2 || j === 6 ? 50 : 40 + i + j }));

describe('outcome-constant-within', () => {
  it('names the groups with no within-group variation of the outcome', async () => {
    const f = onlyFinding(await auditRows(rows, { group: 'g', outcome: 'y' }), 'outcome-constant-within');
    expect(f.severity).toBe('warning'); // 2 of 10 groups ≥ 10%
    expect(f.count).toBe(2);
    expect(f.groups).toEqual(['G003', 'G007']);
    expect(f.values).toEqual(['G003: 50 ×4', 'G007: 50 ×4']);
    expectMessage(f, 'constant', { count: 2, groups: 10, share: '20.0%' });
    const note = await auditRows(rows, { group: 'g', outcome: 'y', rules: { 'outcome-constant-within': { warn_share: 0.5 } } });
    expect(onlyFinding(note, 'outcome-constant-within').severity).toBe('note');
  });

  it('is silent when outcomes vary in every group, for singletons, and for 0/1 outcomes', async () => {
    const varied = groupedRows(10, 4, (j, i) => ({ y: 40 + i + j }));
    expect(findingsOf(await auditRows(varied, { group: 'g', outcome: 'y' }), 'outcome-constant-within')).toEqual([]);
    const singles = groupedRows(10, 1, (j) => ({ y: j }));
    expect(findingsOf(await auditRows(singles, { group: 'g', outcome: 'y' }), 'outcome-constant-within')).toEqual([]);
    const binary = groupedRows(10, 4, (j, i) => ({ y: j < 3 ? 1 : i % 2 }));
    expect(findingsOf(await auditRows(binary, { group: 'g', outcome: 'y' }), 'outcome-constant-within')).toEqual([]);
  });
});
