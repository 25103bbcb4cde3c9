import { describe, expect, it } from 'vitest';
import { checkRule, profileOfGroups } from '../test/helpers/check-rule.js';
import { expectMessage } from '../test/helpers/messages.js';

describe('unbalanced-groups', () => {
  it('reports the CV of group sizes and the largest/smallest ratio (Eldridge et al. 2006)', async () => {
    // sizes 10, 10, 10, 40: mean 17.5, sample SD 15, CV 0.857
    const profile = await profileOfGroups([10, 10, 10, 40]);
    const [f, ...more] = await checkRule('unbalanced-groups', profile);
    expect(more).toEqual([]);
    expect(f.severity).toBe('note');
    expectMessage(f, 'unbalanced', { cv: '0.86', min: 10, max: 40, ratio: '4.0', mean: '17.5', limit: 0.23 });
    const warn = await checkRule('unbalanced-groups', profile, { group: 'g', rules: { 'unbalanced-groups': { warn_cv: 0.5 } } });
    expect(warn.map((w) => w.severity)).toEqual(['warning']);
  });

  it('is silent below a CV of 0.23', async () => {
    // sizes 10, 11, 12: CV 0.09
    expect(await checkRule('unbalanced-groups', await profileOfGroups([10, 11, 12]))).toEqual([]);
  });
});
