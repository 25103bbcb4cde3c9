import { describe, expect, it } from 'vitest';
import { audit } from '../src/audit.js';
import { parseRoles } from '../src/roles/load.js';
import { auditRows, findingsOf, groupedRows } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { catalogue } from './index.js';

describe('level2-collinearity', () => {
  it('HSB: meanses is the school mean of ses', async () => {
    const yaml = 'group: school\noutcome: mathach\nlevel1: [ses]\nlevel2: [meanses, size, pracad, disclim, himinty]\n';
    const report = await audit('fixtures/reference/hsb.csv', parseRoles(yaml, 'hsb.yaml', catalogue), { threads: 1, plotData: false });
    const [meanses, ses] = findingsOf(report, 'level2-collinearity');
    // numpy 2.4.6, np.diag(np.linalg.inv(np.corrcoef(X, rowvar=False))) on one row per school: VIF 2.19e6 for both
    // (fixtures/reference/README.md gives the other five VIFs, all below 3)
    expect(meanses.severity).toBe('warning');
    expectMessage(meanses, 'high', {
      column: 'meanses',
      partner: 'ses (group mean)',
      vif: 'above 1000',
      r: '1.000',
      groups: 160,
      predictors: 6,
    });
    expectMessage(ses, 'high', { column: 'ses (group mean)', partner: 'meanses' });
    expect(findingsOf(report, 'level2-collinearity')).toHaveLength(2);
  });

  it('an exact linear function, and independent predictors', async () => {
    const wiggle = [3, 1, 4, 1, 5, 9, 2, 6, 5, 3, 5, 8, 9, 7, 9];
    const rows = groupedRows(15, 3, (j) => ({ a: j, b: 2 * j + 1, c: wiggle[j] }));
    const report = await auditRows(rows, { group: 'g', level2: ['a', 'b', 'c'] });
    const found = findingsOf(report, 'level2-collinearity');
    expect(found.map((f) => f.column)).toEqual(['a', 'b']);
    expectMessage(found[0], 'exact', { column: 'a', partner: 'b', r: '1.000', groups: 15 });
    const clean = await auditRows(rows, { group: 'g', level2: ['a', 'c'] });
    expect(findingsOf(clean, 'level2-collinearity')).toEqual([]);
  });
});
