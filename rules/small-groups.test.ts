import { describe, expect, it } from 'vitest';
import { checkRule, profileOfGroups } from '../test/helpers/check-rule.js';
import { expectMessage } from '../test/helpers/messages.js';

// 10 groups of 2 and 10 of 20: half of the groups are small (the rule reads only the group sizes)
const mixed = () => profileOfGroups(Array.from({ length: 20 }, (_, j) => (j < 10 ? 2 : 20)));
const check = async (rules?: Record<string, unknown>, profile = mixed()) =>
  checkRule('small-groups', await profile, { group: 'g', ...(rules && { rules: { 'small-groups': rules } }) });

describe('small-groups', () => {
  it('reports the share of groups below the size and the size distribution', async () => {
    const [f, ...more] = await check();
    expect(more).toEqual([]);
    expect(f.severity).toBe('note');
    expect(f.count).toBe(10);
    expect(f.groups).toHaveLength(10);
    expect(f.groups?.[0]).toBe('G001');
    expectMessage(f, 'small', { count: 10, groups: 20, share: '50.0%', size: 5, distribution: '2: 10, 10–29: 10' });
  });

  it('size and shares come from the role map; a warning above warn_share', async () => {
    const all = await check({ size_below: 25, warn_share: 0.9 });
    expect(all).toHaveLength(1);
    expect(all[0]).toMatchObject({ severity: 'warning', count: 20 });
    expect(await check({ note_share: 0.6 })).toEqual([]);
  });

  it('is silent when groups are large enough', async () => {
    expect(await check(undefined, profileOfGroups(Array(10).fill(6)))).toEqual([]);
  });
});
