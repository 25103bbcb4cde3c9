import { describe, expect, it } from 'vitest';
import { logisticNullModel } from '../src/stats/logistic-null-model.js';
import { formatNumber } from '../src/util/format.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { mulberry32 } from '../test/helpers/prng.js';

/** `groups` groups of `size` 0/1 records with a logit-scale group effect of variance τ². */
function binaryDelivery(seed: number, groups: number, size: number, tau2: number): Row[] {
  const rand = mulberry32(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const effects = Array.from({ length: groups }, () => Math.sqrt(tau2) * normal());
  return groupedRows(groups, size, (j) => ({ y: rand() < 1 / (1 + Math.exp(-(-0.5 + effects[j]))) ? 1 : 0 }));
}

function counts(rows: Row[]): { n: number; ones: number }[] {
  const by = new Map<string, { n: number; ones: number }>();
  for (const r of rows) {
    const c = by.get(String(r.g)) ?? { n: 0, ones: 0 };
    c.n++;
    c.ones += Number(r.y);
    by.set(String(r.g), c);
  }
  return [...by.values()];
}

describe('binary-outcome', () => {
  const rows = binaryDelivery(42, 60, 60, 1);

  it('reports the latent-scale ICC, τ² and MOR of the logistic fit beside the linear ICC', async () => {
    const report = await auditRows(rows, { group: 'g', outcome: 'y' });
    const f = onlyFinding(report, 'binary-outcome');
    const fit = report.outcomes.y.logistic!;
    // the report carries the same ML fit as the stats function gives on the per-group counts
    const expected = logisticNullModel(counts(rows));
    expect(fit.tau2).toBeCloseTo(expected.tau2, 10);
    expect(fit.logLik).toBeCloseTo(expected.logLik, 8);
    expect(fit.converged).toBe(true);
    expect(fit.tau2).toBeGreaterThan(0.5);
    expect(fit.tau2).toBeLessThan(1.6);
    expect(f.severity).toBe('note');
    expect(f.count).toBe(60);
    expectMessage(f, 'fit', {
      column: 'y',
      groups: 60,
      icc: formatNumber(fit.icc, 3),
      tau2: formatNumber(fit.tau2, 3),
      mor: formatNumber(fit.mor, 2),
      linear: formatNumber(report.outcomes.y.reml.icc, 3),
    });
    // on the latent scale the level-1 variance is π²/3, larger than p(1 − p): the latent ICC is the larger one here
    expect(fit.icc).toBeGreaterThan(report.outcomes.y.reml.icc);
  });

  it('says when the delivery is below the guidance for multilevel logistic models (Moineddin et al. 2007)', async () => {
    const f = onlyFinding(await auditRows(binaryDelivery(7, 12, 20, 1), { group: 'g', outcome: 'y' }), 'binary-outcome');
    expectMessage(f, 'small', { column: 'y', groups: 12, size: '20.0', minGroups: 50, minSize: 50 });
  });

  it('a declared binary column with other values, and an outcome that is always 0', async () => {
    const coded = groupedRows(4, 3, (j, i) => ({ y: (i + j) % 3 }));
    const bad = onlyFinding(await auditRows(coded, { group: 'g', outcome: 'y', types: { y: 'binary' } }), 'binary-outcome');
    expect(bad).toMatchObject({ severity: 'warning', column: 'y' });
    expectMessage(bad, 'notBinary', { column: 'y', min: '0', max: '2' });
    const zeros = onlyFinding(
      await auditRows(
        groupedRows(4, 3, () => ({ y: 0 })),
        { group: 'g', outcome: 'y', types: { y: 'binary' } },
      ),
      'binary-outcome',
    );
    expectMessage(zeros, 'degenerate', { column: 'y', value: 0 });
  });

  it('is silent for numeric outcomes', async () => {
    const numeric = groupedRows(5, 4, (j, i) => ({ y: j + i / 2 }));
    const report = await auditRows(numeric, { group: 'g', outcome: 'y' });
    expect(findingsOf(report, 'binary-outcome')).toEqual([]);
    expect(report.outcomes.y.logistic).toBeUndefined();
  });
});
