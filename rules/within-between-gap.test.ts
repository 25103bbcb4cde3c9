import { describe, expect, it } from 'vitest';
import { audit } from '../src/audit.js';
import { parseRoles } from '../src/roles/load.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { catalogue } from './index.js';

describe('within-between-gap', () => {
  it('HSB: mathach on ses differs within and between schools', async () => {
    const roles = parseRoles('group: school\noutcome: mathach\nlevel1: [ses]\n', 'hsb.yaml', catalogue);
    const report = await audit('fixtures/reference/hsb.csv', roles, { threads: 1, plotData: false });
    const f = onlyFinding(report, 'within-between-gap', 'ses');
    expect(f.severity).toBe('note');
    // R 4.2.2 + lme4 1.1-31, lmer(mathach ~ I(ses - meanses_j) + meanses_j + (1|school)) (fixtures/reference/README.md):
    // 2.191171965 (se 0.1086672878) and 5.866173808 (se 0.3616993572); gap 3.675, its se √(0.1087² + 0.3617²) = 0.378
    expectMessage(f, 'gap', {
      outcome: 'mathach',
      column: 'ses',
      within: '2.191',
      seWithin: '0.109',
      between: '5.866',
      seBetween: '0.362',
      gap: '3.675',
      seGap: '0.378',
      z: '9.73',
      p: 'p < .001',
    });
  });

  it('one slope within and between groups gives nothing', async () => {
    // y = 2x plus a residual pattern with no within-group slope and no group mean
    const e = [1, -1, -1, 1];
    const rows = groupedRows(12, 4, (j, i) => ({ x: j + i, y: 2 * (j + i) + e[i] }));
    expect(findingsOf(await auditRows(rows, { group: 'g', outcome: 'y', level1: ['x'] }), 'within-between-gap')).toEqual([]);
  });
});
