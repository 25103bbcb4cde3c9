import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { renderJson } from '../src/report/json.js';
import { renderMarkdown } from '../src/report/markdown.js';
import { reportSchema } from '../src/report/report-schema.js';
import { renderText } from '../src/report/text.js';
import type { Report } from '../src/report/types.js';
import { createAjv } from '../src/util/ajv.js';
import { formatNumber } from '../src/util/format.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, groupedRows, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';
import { mulberry32 } from '../test/helpers/prng.js';

const roles = { group: 'g', outcome: 'y', types: { y: 'count' } };

/** `groups` groups of `size` Poisson counts with a log-scale group effect of variance τ², a share `inflate` of them set to 0. */
function countDelivery(seed: number, groups: number, size: number, tau2: number, inflate = 0): Row[] {
  const rand = mulberry32(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const effects = Array.from({ length: groups }, () => Math.sqrt(tau2) * normal());
  const poisson = (lambda: number) => {
    const limit = Math.exp(-lambda);
    let k = 0;
    for (let p = rand(); p > limit; p *= rand()) k++;
    return k;
  };
  return groupedRows(groups, size, (j) => ({ y: rand() < inflate ? 0 : poisson(Math.exp(1 + effects[j])) }));
}

describe('count-outcome on grouseticks (lme4)', () => {
  let report: Report;
  beforeAll(async () => {
    const csv = readFileSync(new URL('../fixtures/reference/grouseticks.csv', import.meta.url), 'utf8');
    report = await auditRows(csv, { group: 'BROOD', unit: 'INDEX', outcome: 'TICKS', level2: ['YEAR'], types: { TICKS: 'count' } });
  });

  it('carries the Poisson fit lme4 gives and calls the ticks overdispersed', () => {
    const p = report.outcomes.TICKS.poisson!;
    // lme4 1.1-31 glmer(TICKS ~ 1 + (1|BROOD), family = poisson, nAGQ = 25): 0.515224601924, τ² 2.55087640263
    expect(Math.abs(p.intercept / 0.515224601924 - 1)).toBeLessThan(1e-3);
    expect(Math.abs(p.tau2 / 2.55087640263 - 1)).toBeLessThan(1e-3);
    // R integrate + optim over brute-force integrals: −1037.1092567979 (fixtures/reference/README.md)
    expect(p.logLik).toBeCloseTo(-1037.10926, 4);
    // NumPy 2.4.6: D = 657.6603853974 on 257 df; 126 zeros in the data
    expect(p.dispersion.statistic).toBeCloseTo(657.6603853974, 6);
    expect(p.zeros.observed).toBe(126);
    expect(p.nonCounts).toBe(0);
    const findings = findingsOf(report, 'count-outcome');
    expect(findings.map((f) => f.messageId)).toEqual(['overdispersed', 'fit']);
    const [over, fit] = findings;
    expect(fit.severity).toBe('note');
    expect(fit.count).toBe(118);
    expectMessage(fit, 'fit', {
      column: 'TICKS',
      records: 403,
      zeros: 126,
      tau2: formatNumber(p.tau2, 3),
      icc: formatNumber(p.latentIcc, 3),
    });
    expect(over.severity).toBe('warning');
    expectMessage(over, 'overdispersed', { column: 'TICKS', ratio: '2.56', df: 257 });
  });

  it('is valid against the report schema and shown in the statistics of each renderer', () => {
    const validate = createAjv({ checkSchemas: true }).compile(reportSchema);
    expect(validate(JSON.parse(renderJson(report))), JSON.stringify(validate.errors)).toBe(true);
    const caption = 'random-intercept Poisson null model (ML, 25-point adaptive Gauss–Hermite)';
    expect(renderMarkdown(report)).toContain(`TICKS: ${caption}`);
    const text = renderText(report, { color: 0 });
    expect(text).toContain(caption);
    expect(text).toContain('zeros observed / expected: 126 / 122.0');
  });
});

describe('count-outcome on planted deliveries', () => {
  it('a clean Poisson delivery gets the fit alone', async () => {
    const report = await auditRows(countDelivery(3, 40, 15, 0.3), roles);
    const findings = findingsOf(report, 'count-outcome');
    expect(findings.map((f) => f.messageId)).toEqual(['fit']);
    const p = report.outcomes.y.poisson!;
    expect(p.dispersion.ratio).toBeGreaterThan(0.8);
    expect(p.dispersion.ratio).toBeLessThan(1.2);
    expect(Math.abs(p.zeros.observed - p.zeros.expected)).toBeLessThan(3 * Math.sqrt(p.zeros.expected) + 2);
  });

  it('finds planted zero inflation', async () => {
    const report = await auditRows(countDelivery(4, 40, 15, 0.3, 0.3), roles);
    const f = findingsOf(report, 'count-outcome').find((x) => x.messageId === 'excessZeros');
    expect(f?.severity).toBe('warning');
    const p = report.outcomes.y.poisson!;
    expectMessage(f!, 'excessZeros', { column: 'y', observed: p.zeros.observed, expected: formatNumber(p.zeros.expected, 1) });
    expect(p.zeros.observed).toBeGreaterThan(1.5 * p.zeros.expected);
  });

  it('reports values that are not counts instead of a fit, and all-zero counts as degenerate', async () => {
    const rows = groupedRows(6, 5, (j, i) => ({ y: i === 0 && j < 2 ? 1.5 : i }));
    const f = onlyFinding(await auditRows(rows, roles), 'count-outcome');
    expect(f.severity).toBe('warning');
    expectMessage(f, 'notCount', { column: 'y', count: 2, min: '0', max: '4' });
    const zero = onlyFinding(
      await auditRows(
        groupedRows(4, 3, () => ({ y: 0 })),
        roles,
      ),
      'count-outcome',
    );
    expectMessage(zero, 'degenerate', { column: 'y' });
  });

  it('costs nothing when no outcome is a count', async () => {
    const report = await auditRows(countDelivery(3, 10, 5, 0.3), { group: 'g', outcome: 'y' });
    expect(findingsOf(report, 'count-outcome')).toEqual([]);
    expect(report.outcomes.y.poisson).toBeUndefined();
  });
});
