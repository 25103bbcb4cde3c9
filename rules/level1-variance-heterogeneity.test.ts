import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

// twelve values with mean 0 and within-group variance 1 (Σ e² = 11)
const E = [1, -1, 1, -1, 1, -1, 1, -1, 1, -1, 1, -1].map((v) => v * Math.sqrt(11 / 12));

describe('level1-variance-heterogeneity', () => {
  it('half the groups spread five times as wide', async () => {
    const rows = groupedRows(12, 12, (j, i) => ({ y: j + (j < 6 ? 1 : 5) * E[i] }));
    const f = onlyFinding(await auditRows(rows, { group: 'g', outcome: 'y' }), 'level1-variance-heterogeneity', 'y');
    expect(f.severity).toBe('note');
    // hand computation: ln s² is 0 or ln 25 = 3.218876, pooled 1.609438, each d_j² = 1.609438² · 11/2 = 14.24657,
    // H = 12 · 14.24657 = 170.959
    expectMessage(f, 'unequal', {
      column: 'y',
      h: '170.96',
      df: 11,
      p: 'p < .001',
      min: '1.000',
      max: '25.000',
      groups: 12,
      minRecords: 10,
    });
    expect(f.count).toBe(12);
  });

  it('equal spread, or groups too small for the test, give nothing', async () => {
    const equal = groupedRows(12, 12, (j, i) => ({ y: j + E[i] }));
    expect(findingsOf(await auditRows(equal, { group: 'g', outcome: 'y' }), 'level1-variance-heterogeneity')).toEqual([]);
    const small = groupedRows(12, 8, (j, i) => ({ y: j + (j < 6 ? 1 : 5) * E[i] }));
    expect(findingsOf(await auditRows(small, { group: 'g', outcome: 'y' }), 'level1-variance-heterogeneity')).toEqual([]);
  });
});
