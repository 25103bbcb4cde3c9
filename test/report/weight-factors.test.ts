import { beforeAll, describe, expect, it } from 'vitest';
import { EXTREME_GROUPS } from '../../src/analysis/weight-scaling.js';
import { renderJson } from '../../src/report/json.js';
import { reportSchema } from '../../src/report/report-schema.js';
import type { Report } from '../../src/report/types.js';
import { WEIGHT_FACTOR_COLUMNS, weightFactorsCsv } from '../../src/report/weight-factors-csv.js';
import { createAjv } from '../../src/util/ajv.js';
import { auditRows, groupedRows } from '../helpers/delivery.js';
import { demoReport } from './fixtures/reports.js';

const validate = createAjv({ checkSchemas: true }).compile(reportSchema);
const roles = { group: 'g', outcomes: ['y'], weights: { level1: 'w' } };

/** 30 groups of 4 records; every weight of group j is j + 1, so both of its factors are 1 / (j + 1). */
const rows = () => groupedRows(30, 4, (j, i) => ({ y: i + (j % 5), w: j + 1 }));

describe('the scale factors of level-1 weights: bounded in the report, whole on request', () => {
  let report: Report;
  beforeAll(async () => {
    report = await auditRows(rows(), roles, { plotData: false, weightFactors: true });
  });

  it('the JSON report holds their spread and at most 20 extreme groups, and passes its schema', () => {
    const json = JSON.parse(renderJson(report));
    expect(json).not.toHaveProperty('weightFactors');
    expect(validate(json), JSON.stringify(validate.errors)).toBe(true);
    const scaling = json.weights.level1.scaling;
    expect(scaling.groups).toBe(30);
    // numpy 2.4.6: np.quantile(1 / np.arange(1, 31), [0, .25, .5, .75, 1])
    const numpy = [0.03333333333333333, 0.04397233201581027, 0.06458333333333333, 0.12152777777777778, 1];
    for (const s of [scaling.size, scaling.effective]) {
      for (const [k, x] of [s.min, s.q1, s.median, s.q3, s.max].entries()) expect(x).toBeCloseTo(numpy[k], 12);
    }
    expect(scaling.extreme).toHaveLength(EXTREME_GROUPS);
    expect(scaling.extreme[0].group).toBe('G001'); // factor 1 against the median 0.0646: the furthest
  });

  it('the extreme groups are those furthest from the median factor, furthest first', () => {
    const median = report.weights?.level1?.scaling.size.median ?? Number.NaN;
    const far = (g: { sizeScale: number }) => Math.abs(Math.log(g.sizeScale / median));
    const listed = report.weights?.level1?.scaling.extreme ?? [];
    const listedIds = new Set(listed.map((g) => g.group));
    const rest = (report.weightFactors ?? []).filter((g) => !listedIds.has(g.group));
    expect(rest).toHaveLength(10);
    const nearest = Math.min(...listed.map(far));
    for (const g of rest) expect(far(g)).toBeLessThanOrEqual(nearest);
    expect(listed.map(far)).toEqual([...listed.map(far)].sort((a, b) => b - a));
  });

  it('every group’s factors come with the whole report object and as CSV', () => {
    const whole = JSON.parse(renderJson(report, { withPlotData: true }));
    expect(validate(whole), JSON.stringify(validate.errors)).toBe(true);
    expect(whole.weightFactors).toHaveLength(30);
    const lines = weightFactorsCsv(report).split('\r\n');
    expect(lines[0]).toBe(WEIGHT_FACTOR_COLUMNS.join(','));
    expect(lines).toHaveLength(32); // header, 30 groups, the empty string after the last CRLF
    const [group, records, sum, effective, toSize, toEffective] = lines[7].split(',');
    expect([group, records, sum, effective].map(String)).toEqual(['G007', '4', '28', '4']);
    expect(Number(toSize)).toBeCloseTo(1 / 7, 15);
    expect(Number(toEffective)).toBeCloseTo(1 / 7, 15);
  });

  it('the CSV neutralises group IDs that a spreadsheet would run, and leaves what cannot be computed empty', () => {
    const r = demoReport();
    r.weightFactors = [{ group: '=cmd()', n: 2, sum: 0, effectiveSize: Number.NaN, sizeScale: Number.NaN, effectiveScale: Number.NaN }];
    expect(weightFactorsCsv(r).split('\r\n')[1]).toBe("'=cmd(),2,0,,,");
    expect(weightFactorsCsv(demoReport())).toBe(`${WEIGHT_FACTOR_COLUMNS.join(',')}\r\n`);
  });
});
