import { describe, expect, it } from 'vitest';
import { audit } from '../src/audit.js';
import { parseRoles } from '../src/roles/load.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { catalogue } from './index.js';

describe('intercept-variance-at-zero', () => {
  it('the same values in every group: REML already puts τ² at zero', async () => {
    const f = onlyFinding(
      await auditRows(
        groupedRows(10, 4, (_, i) => ({ y: i })),
        { group: 'g', outcome: 'y' },
      ),
      'intercept-variance-at-zero',
    );
    expect(f.severity).toBe('warning');
    expectMessage(f, 'atZero', { column: 'y', f: '0.000', df1: 9, df2: 30 });
  });

  it('Shrout & Fleiss (1979) ratings by target: a zero estimate has probability 0.269', async () => {
    const roles = parseRoles('group: target\noutcome: rating\n', 'sf.yaml', catalogue);
    const report = await audit('fixtures/reference/shrout-fleiss-1979.csv', roles, { threads: 1, plotData: false });
    const f = onlyFinding(report, 'intercept-variance-at-zero', 'rating');
    expect(f.severity).toBe('note');
    // scipy 1.17.1: scipy.stats.f.cdf(1/1.794678, 5, 18) = 0.26877767 (F from fixtures/reference/README.md)
    expectMessage(f, 'likely', { column: 'rating', probability: '0.269', f: '1.795', df1: 5, df2: 18, n0: '4.0' });
  });

  it('clear group differences and binary outcomes give nothing', async () => {
    const rows = groupedRows(10, 4, (j, i) => ({ y: 10 * j + i, b: i % 2 }));
    const report = await auditRows(rows, { group: 'g', outcomes: ['y', 'b'], types: { b: 'binary' } });
    expect(findingsOf(report, 'intercept-variance-at-zero')).toEqual([]);
  });
});
