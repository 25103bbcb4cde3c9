import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const RULE = 'variable-without-statistics';

// 5 groups of 8 records; y a number with a decimal comma ("12,5"), quoted in a file separated by commas
const comma = groupedRows(5, 8, (j, i) => ({ y: `${10 + i},${j + 1}`, x: `${i},5`, kind: i % 2 ? 'Public' : 'Catholic', z: i + j }));

describe('variable-without-statistics', () => {
  it('an outcome written with decimal commas blocks and says so; a level-1 variable so written warns', async () => {
    const report = await auditRows(comma, { group: 'g', outcome: 'y', level1: ['x', 'z'], level2: 'kind' });
    expect(report.outcomes).toEqual({});
    const f = onlyFinding(report, RULE, 'y');
    expect(f.severity).toBe('blocker');
    expect(f.count).toBe(40);
    expectMessage(f, 'decimalComma', { column: 'y', role: 'an outcome', numbers: 'none', present: 40 });
    expect(f.values?.[0]).toMatch(/^"1\d,\d" ×1$/);
    const x = onlyFinding(report, RULE, 'x');
    expect(x.severity).toBe('warning');
    expectMessage(x, 'decimalComma', { column: 'x', role: 'a level-1 variable', numbers: 'none', present: 40 });
    // a level-2 variable of two categories and a numeric level-1 variable are no finding
    expect(findingsOf(report, RULE).map((g) => g.column)).toEqual(['y', 'x']);
  });

  it('an outcome that is partly numbers (below the share that reads as numbers) names the others', async () => {
    const rows = groupedRows(5, 8, (j, i) => ({ y: i < 2 ? 'n/a' : String(i + j) }));
    const f = onlyFinding(await auditRows(rows, { group: 'g', outcome: 'y' }), RULE);
    expect(f).toMatchObject({ severity: 'blocker', count: 10 });
    expectMessage(f, 'notNumbers', { column: 'y', numbers: 30, present: 40, kinds: 'missing codes' });
  });

  it('an outcome missing everywhere, or typed categorical, blocks; a level-1 variable missing everywhere: missing-by-group', async () => {
    const rows = groupedRows(4, 5, (j, i) => ({ y: null, w: null, c: String(i + j) }));
    const empty = await auditRows(rows, { group: 'g', outcomes: ['y', 'c'], level1: 'w', types: { c: 'categorical' } });
    expectMessage(onlyFinding(empty, RULE, 'y'), 'allMissing', { column: 'y', role: 'an outcome', records: 20 });
    expectMessage(onlyFinding(empty, RULE, 'c'), 'categorical', { column: 'c' });
    expect(findingsOf(empty, RULE).map((f) => [f.column, f.severity])).toEqual([
      ['c', 'blocker'],
      ['y', 'blocker'],
    ]);
    expect(findingsOf(empty, 'missing-by-group').some((f) => f.column === 'w')).toBe(true);
  });

  it('is silent when every declared variable yields statistics', async () => {
    const rows = groupedRows(5, 8, (j, i) => ({ y: `${10 + i}.${j}`, x: i }));
    expect(findingsOf(await auditRows(rows, { group: 'g', outcome: 'y', level1: 'x' }), RULE)).toEqual([]);
    // a delivery without records is an input error before any rule runs
    await expect(auditRows('g,y\n', { group: 'g', outcome: 'y' })).rejects.toThrow(/no records/);
  });
});
