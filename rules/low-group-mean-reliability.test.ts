import { describe, expect, it } from 'vitest';
import { audit } from '../src/audit.js';
import { parseRoles } from '../src/roles/load.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { catalogue } from './index.js';

// 30 groups of 3: a group effect (SD about 1.3) under within-group noise (SD 1.5)
const noisy = groupedRows(30, 3, (j, i) => ({ x: ((j % 5) - 2) * 0.9 + [-1.5, 0, 1.5][(i + j) % 3] }));

describe('low-group-mean-reliability', () => {
  it('notes a level-1 variable whose group means are mostly noise', async () => {
    const report = await auditRows(noisy, { group: 'g', level1: ['x'] });
    const f = onlyFinding(report, 'low-group-mean-reliability', 'x');
    expect(f.severity).toBe('note');
    expectMessage(f, 'low', { column: 'x', limit: 0.7, size: '3.0' });
    expect(f.data.reliability).toMatch(/^0\.\d\d$/);
    expect(f.data.icc2).toMatch(/^-?\d\.\d\d$/);
  });

  it('HSB: mathach group means are reliable (0.90, Raudenbush & Bryk 2002 Table 4.2) and so are ses means', async () => {
    const report = await audit(
      'fixtures/reference/hsb.csv',
      parseRoles('group: school\noutcome: mathach\nlevel1: [ses]\n', 'hsb.yaml', catalogue),
    );
    // fixtures/reference/README.md: mean reliability 0.9013773 with the REML components
    expect(report.outcomes.mathach.meanReliability).toBeCloseTo(0.9013773, 5);
    expect(findingsOf(report, 'low-group-mean-reliability')).toEqual([]);
  });

  it('the threshold comes from the role map', async () => {
    const rules = { 'low-group-mean-reliability': { reliability_below: 0.01 } };
    expect(findingsOf(await auditRows(noisy, { group: 'g', level1: ['x'], rules }), 'low-group-mean-reliability')).toEqual([]);
  });
});
