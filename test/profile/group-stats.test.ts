import { describe, expect, it } from 'vitest';
import { GROUP_STATS, groupIds, groupSizes, groupStat } from '../../src/profile/group-stats.js';
import { mostlyNumbers, readsAsNumbers } from '../../src/profile/reads-as-numbers.js';
import { writeDelivery } from '../helpers/delivery.js';
import { profileOf } from '../helpers/profile-of.js';

describe("the profile's group statistics by name", () => {
  it('reads every statistic of a text column read as numbers, per group in ID order', async () => {
    const rows = [
      { g: 'B', x: '4' },
      { g: 'A', x: '1' },
      { g: 'A', x: '3' },
      { g: 'A', x: 'n/a' },
      { g: 'B', x: '' },
    ];
    const d = writeDelivery(rows, 'group: g\n');
    try {
      const { profile } = await profileOf(d.csv, 'group: g\nlevel1: [x]\n');
      expect(profile.column('x').storage).toBe('text');
      expect(groupIds(profile.groups)).toEqual(['A', 'B']);
      expect(groupSizes(profile.groups)).toEqual([3, 2]);
      const got = Object.fromEntries(GROUP_STATS.map((s) => [s, groupStat(profile.groups, 'x', s)]));
      expect(got).toEqual({
        nonMissing: [3, 1],
        textMin: ['1', '4'],
        textMax: ['n/a', '4'],
        numericCount: [2, 1],
        numMin: [1, 4],
        numMax: [3, 4],
        mean: [2, 4],
        ss: [2, 0],
        numberLike: [0, 0],
      });
    } finally {
      d.remove();
    }
  });
});

describe('reads as numbers', () => {
  it("takes all numbers, or 95% of a declared variable's values", () => {
    expect(mostlyNumbers(20, 20, false)).toBe(true);
    expect(mostlyNumbers(19, 20, false)).toBe(false);
    expect(mostlyNumbers(19, 20, true)).toBe(true);
    expect(mostlyNumbers(18, 20, true)).toBe(false);
    expect(mostlyNumbers(0, 0, true)).toBe(false);
  });

  it('a profiled column reads as numbers when it has number statistics and a type that is not categorical', () => {
    expect(readsAsNumbers({ numericProfiled: true, type: 'numeric' })).toBe(true);
    expect(readsAsNumbers({ numericProfiled: true, type: 'binary' })).toBe(true);
    expect(readsAsNumbers({ numericProfiled: true, type: 'categorical' })).toBe(false);
    expect(readsAsNumbers({ numericProfiled: false, type: 'numeric' })).toBe(false);
  });
});
