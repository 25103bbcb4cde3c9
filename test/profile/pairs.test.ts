import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { hasPair, PAIR_LIMIT, pairMoments, plannedPairs } from '../../src/profile/pairs.js';
import { parseRoles } from '../../src/roles/load.js';
import { pairMomentsFromValues } from '../../src/stats/pair-moments.js';
import { writeDelivery } from '../helpers/delivery.js';
import { profileOf } from '../helpers/profile-of.js';

describe('per-group co-moments of outcome × level-1 pairs in the one pass', () => {
  it('over the records where both are numbers, per group in ID order', async () => {
    const rows = [
      { g: 'B', x: '4', y: '1', z: 'a' },
      { g: 'A', x: '1', y: '2', z: 'b' },
      { g: 'A', x: '3', y: '7', z: 'a' },
      { g: 'A', x: 'n/a', y: '9', z: 'a' },
      { g: 'A', x: '6', y: '', z: 'b' },
      { g: 'A', x: '2', y: '3', z: 'a' },
      { g: 'B', x: '', y: '5', z: 'b' },
    ];
    const d = writeDelivery(rows, 'group: g\n');
    try {
      const { profile } = await profileOf(d.csv, 'group: g\noutcome: y\nlevel1: [x, z]\ntypes: { z: categorical }\n');
      const got = pairMoments(profile, 'y', 'x');
      const a = pairMomentsFromValues([1, 3, 2], [2, 7, 3]);
      expect(got).toHaveLength(2);
      expect(got[0].n).toBe(3);
      for (const k of ['meanX', 'meanY', 'sxx', 'syy', 'sxy'] as const) expect(got[0][k]).toBeCloseTo(a[k], 12);
      expect(got[1]).toMatchObject({ n: 1, meanX: 4, meanY: 1, sxx: 0, syy: 0, sxy: 0, index: 1 });
      // a categorical variable has no numeric reading, so no pair
      expect(hasPair(profile, 'y', 'z')).toBe(false);
      expect(pairMoments(profile, 'y', 'z')).toEqual([]);
    } finally {
      d.remove();
    }
  });

  it('plans slopes first and stops at the limit', () => {
    const level1 = Array.from({ length: 30 }, (_, i) => `v${i}`);
    const yaml = `group: g\noutcomes: [y1, y2]\nlevel1: [${level1.join(', ')}]\nslopes: [v29]\n`;
    const pairs = plannedPairs(parseRoles(yaml, 'roles.yaml', catalogue).roles);
    expect(pairs.get('y1')?.[0]).toBe('v29');
    expect(pairs.get('y2')?.[0]).toBe('v29');
    expect([...pairs.values()].reduce((a, v) => a + v.length, 0)).toBe(PAIR_LIMIT);
  });
});
