import { describe, expect, it } from 'vitest';
import { audit } from '../src/audit.js';
import { parseRoles } from '../src/roles/load.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { catalogue } from './index.js';

const HSB_LEVEL2 = ['disclim', 'himinty', 'meanses', 'pracad', 'sector', 'size'];

describe('undeclared-level2', () => {
  it('HSB: the school-level columns are flagged when the role map leaves them out', async () => {
    // fixtures/reference/README.md: meanses, size, sector, pracad, disclim, himinty are constant within school
    const report = await audit(
      'fixtures/reference/hsb.csv',
      parseRoles('group: school\noutcome: mathach\nlevel1: [ses]\n', 'hsb.yaml', catalogue),
    );
    const found = findingsOf(report, 'undeclared-level2');
    expect(found.map((f) => f.column)).toEqual(HSB_LEVEL2);
    for (const f of found) {
      expect(f.severity).toBe('note');
      expect(f.count).toBe(160);
      expectMessage(f, 'candidate', { groups: 160 });
    }
    // minority, sex, student vary within schools: not flagged
    expect(found.map((f) => f.column)).not.toContain('sex');
  });

  it('HSB: declared, the same columns are neither flagged here nor by level2-varies', async () => {
    const text = `group: school\nunit: student\noutcome: mathach\nlevel1: [ses]\nlevel2: [${HSB_LEVEL2.join(', ')}]\n`;
    const report = await audit('fixtures/reference/hsb.csv', parseRoles(text, 'hsb.yaml', catalogue));
    expect(findingsOf(report, 'undeclared-level2')).toEqual([]);
    expect(findingsOf(report, 'level2-varies')).toEqual([]);
  });

  it('ignores columns that vary within a group or are the same everywhere', async () => {
    const rows = groupedRows(5, 3, (j, i) => ({ region: `r${j}`, note: `n${i}`, same: 'x' }));
    const report = await auditRows(rows, { group: 'g' });
    expect(onlyFinding(report, 'undeclared-level2').column).toBe('region');
  });
});
