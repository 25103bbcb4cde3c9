import { beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../src/report/types.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const roles = { group: 'g', outcome: 'y' };
/** Group j has 4 + 3j records alternating ±1 around mean(j). */
const rows = (count: number, mean: (j: number) => number) =>
  groupedRows(
    count,
    (j) => 4 + 3 * j,
    (j, i) => ({ y: (mean(j) + (i % 2 ? 1 : -1)).toFixed(4) }),
  );

describe('informative-group-size', () => {
  let planted: Report;
  let clean: Report;
  let few: Report;
  beforeAll(async () => {
    [planted, clean, few] = await Promise.all([
      // larger groups score higher
      auditRows(
        rows(16, (j) => 0.2 * j + 0.3 * Math.sin(j * 2.1)),
        roles,
      ),
      // the same sizes with means that do not follow them
      auditRows(
        rows(16, (j) => Math.sin(j * 2.1)),
        roles,
      ),
      // five groups, mean rising with size: all 5! = 120 orderings enumerated
      auditRows(
        rows(5, (j) => j),
        roles,
      ),
    ]);
  });

  it('size that goes with the mean: a note with r, both means, the gap and the permutation p', () => {
    const f = onlyFinding(planted, 'informative-group-size');
    expect(f.severity).toBe('note');
    expect(f.column).toBe('y');
    expectMessage(f, 'informative', {
      column: 'y',
      how: '2000 permutations, seed 20240611',
      p: 'p < .001',
      recordMean: planted.outcomes.y.mean.toFixed(3),
    });
    expect(Number(f.data.r)).toBeGreaterThan(0.9);
    expect(Number(f.data.recordMean) - Number(f.data.groupMean)).toBeCloseTo(Number(f.data.gap), 2);
    expect(f.groups).toBeUndefined();
  });

  it('few groups: every permutation enumerated, p = 2/120 (the identity and the reversal)', () => {
    // the gap is a linear form in the sizes; only the sorted and reversed orders reach the observed |gap|
    const f = onlyFinding(few, 'informative-group-size');
    expectMessage(f, 'informative', { how: 'all 120 permutations', p: 'p = .017' });
  });

  it('sizes that say nothing about the outcome: nothing', () => {
    expect(findingsOf(clean, 'informative-group-size')).toEqual([]);
  });
});
