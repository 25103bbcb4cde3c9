import { describe, expect, it } from 'vitest';
import { checkRule, profileOfGroups } from '../test/helpers/check-rule.js';
import { expectMessage } from '../test/helpers/messages.js';

// the rule reads how many groups there are and how many level-2 variables the role map declares
const check = async (groups: number, level2: string[], rules?: Record<string, unknown>) =>
  checkRule('groups-per-level2-predictor', await profileOfGroups(Array(groups).fill(3)), {
    group: 'g',
    ...(level2.length && { level2 }),
    ...(rules && { rules: { 'groups-per-level2-predictor': rules } }),
  });

describe('groups-per-level2-predictor', () => {
  it('warns below 10 groups per level-2 variable (heuristic) and gives the J − q − 1 df', async () => {
    const [f, ...more] = await check(20, ['a', 'b', 'c']);
    expect(more).toEqual([]);
    expect(f.severity).toBe('warning');
    expect(f.count).toBe(20);
    expectMessage(f, 'few', { groups: 20, q: 3, ratio: '6.7', limit: 10, df: 16 });
  });

  it('blocks when no degrees of freedom are left', async () => {
    const [f, ...more] = await check(3, ['a', 'b']);
    expect(more).toEqual([]);
    expect(f.severity).toBe('blocker');
    expectMessage(f, 'none', { groups: 3, q: 2, df: 0 });
  });

  it('is silent with enough groups, without level-2 variables, and follows per_predictor', async () => {
    expect(await check(30, ['a', 'b', 'c'])).toEqual([]);
    expect(await check(5, [])).toEqual([]);
    expect(await check(20, ['a', 'b', 'c'], { per_predictor: 5 })).toEqual([]);
  });
});
