import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';

describe('unbalanced-groups', () => {
  it('reports the CV of group sizes and the largest/smallest ratio (Eldridge et al. 2006)', async () => {
    // sizes 10, 10, 10, 40: mean 17.5, sample SD 15, CV 0.857
    const rows = groupedRows(4, (j) => (j === 3 ? 40 : 10), (j, i) => ({ y: i }));
    const f = onlyFinding(await auditRows(rows, { group: 'g' }), 'unbalanced-groups');
    expect(f.severity).toBe('note');
    expect(f.message).toBe('group sizes vary with CV 0.86 (sizes 10 to 40, ratio 4.0; mean 17.5): above the 0.23 below which unequal sizes are negligible');
    expect(f.fix).toMatch(/use n0/);
    const warn = await auditRows(rows, { group: 'g', rules: { 'unbalanced-groups': { warn_cv: 0.5 } } });
    expect(onlyFinding(warn, 'unbalanced-groups').severity).toBe('warning');
  });

  it('is silent below a CV of 0.23', async () => {
    // sizes 10, 11, 12: CV 0.09
    const rows = groupedRows(3, (j) => 10 + j);
    expect(findingsOf(await auditRows(rows, { group: 'g' }), 'unbalanced-groups')).toEqual([]);
  });
});
