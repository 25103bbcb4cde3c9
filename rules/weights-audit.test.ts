import { beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../src/report/types.js';
import type { Row } from '../test/helpers/delivery.js';
import { auditRows, findingsOf, groupedRows, groupId } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const roles = { group: 'g', outcomes: ['y'], weights: { level1: 'w1', level2: 'w2' } };
const byId = (report: Report, id: string) => findingsOf(report, 'weights-audit').find((f) => f.messageId === id);

/**
 * 12 groups of 6 records, conditional level-1 weights 1 or 2 (not following the group weight
 * j + 1), with planted slips: the group weight varies in G003, a zero weight in G005, a missing
 * one in G006, one dominant weight in G007 (Kish effective size 105² / 10005 = 1.10).
 */
function planted(): Row[] {
  return groupedRows(12, 6, (j, i) => ({
    y: (j % 3) + i,
    w1: j === 4 && i === 0 ? 0 : j === 5 && i === 0 ? null : j === 6 ? (i === 0 ? 100 : 1) : 1 + ((i + j) % 2),
    w2: j === 2 && i === 5 ? 9 : j + 1,
  }));
}

describe('weights-audit', () => {
  let report: Report;
  beforeAll(async () => {
    report = await auditRows(planted(), roles, { plotData: false });
  });

  it('finds each planted slip with its groups', () => {
    const ids = findingsOf(report, 'weights-audit').map((f) => f.messageId);
    expect(ids.sort()).toEqual(['designEffect', 'level2Varies', 'missing', 'nonPositive', 'smallEffective']);
    const varies = byId(report, 'level2Varies');
    expectMessage(varies as NonNullable<typeof varies>, 'level2Varies', { column: 'w2', count: 1, groups: 12 });
    expect(varies?.groups).toEqual(['G003']);
    const zero = byId(report, 'nonPositive');
    expect(zero).toMatchObject({ column: 'w1', count: 1, groups: ['G005'], values: ['0'], severity: 'warning' });
    expectMessage(byId(report, 'missing') as NonNullable<typeof zero>, 'missing', { column: 'w1', count: 1 });
    const small = byId(report, 'smallEffective');
    expect(small).toMatchObject({ severity: 'note', groups: ['G007'], count: 1 });
  });

  it('the report carries the scale factors bounded (spread, extreme groups) and the Kish figures', () => {
    const w = report.weights;
    const scaling = w?.level1?.scaling;
    expect(scaling?.groups).toBe(12);
    // G007 (weights 100, 1, 1, 1, 1, 1) is by far the most extreme; G005 (a zero weight) next
    const g7 = scaling?.extreme[0];
    expect(g7?.group).toBe('G007');
    // by hand: Σw 105, Σw² 10005; effective 11025 / 10005, scale 6/105 and 105/10005
    expect(g7?.effectiveSize).toBeCloseTo(11025 / 10005, 12);
    expect(g7?.sizeScale).toBeCloseTo(6 / 105, 12);
    expect(g7?.effectiveScale).toBeCloseTo(105 / 10005, 12);
    // G005 (0, 2, 1, 2, 1, 2): factor 6/8 against the median 6/9, |log| 0.118; G006 (5 weights, Σw 7): 5/7, |log| 0.069
    expect(scaling?.extreme.slice(1, 3).map((g) => g.group)).toEqual(['G005', 'G006']);
    expect(scaling?.extreme).toHaveLength(12); // at most 20: all 12 groups here, furthest first
    expect(scaling?.size.min).toBeCloseTo(6 / 105, 12);
    expect(scaling?.effective.min).toBeCloseTo(105 / 10005, 12);
    expect(report).not.toHaveProperty('weightFactors');
    expect(w?.level2).toMatchObject({ groups: 12, missing: 0, varyingGroups: ['G003'] });
    // the level-1 weights alternate 1, 2 whatever the group weight: not total
    expect(w?.form?.form).not.toBe('total');
    // the design effect note states the figure: n Σw² / (Σw)² over the 71 weights
    const all = planted().flatMap((r) => (r.w1 === null ? [] : [Number(r.w1)]));
    const sum = all.reduce((a, b) => a + b, 0);
    const deff = (all.length * all.reduce((a, b) => a + b * b, 0)) / sum ** 2;
    expectMessage(byId(report, 'designEffect') as NonNullable<ReturnType<typeof byId>>, 'designEffect', { deff: deff.toFixed(2) });
  });

  it("every group's factors only when asked for, equal to the extremes the report lists", async () => {
    const r = await auditRows(planted(), roles, { plotData: false, weightFactors: true });
    expect(r.weightFactors?.map((g) => g.group)).toEqual(Array.from({ length: 12 }, (_, j) => groupId(j)));
    for (const g of report.weights?.level1?.scaling.extreme ?? []) expect(r.weightFactors).toContainEqual(g);
    // G001: weights 1, 2, 1, 2, 1, 2: Σw 9, Σw² 15; factors 6/9 and 9/15 (by hand)
    expect(r.weightFactors?.[0]).toMatchObject({ group: 'G001', n: 6, sum: 9 });
    expect(r.weightFactors?.[0].sizeScale).toBeCloseTo(6 / 9, 12);
    expect(r.weightFactors?.[0].effectiveScale).toBeCloseTo(9 / 15, 12);
    expect(r.weights).toEqual(report.weights);
  });

  it('--no-values leaves the smallest weights out of the report and the finding', async () => {
    const r = await auditRows(planted(), roles, { plotData: false, includeValues: false });
    expect(r.weights?.level1).not.toHaveProperty('min');
    expect(r.weights?.level2).not.toHaveProperty('min');
    expect(r.weights?.level1?.designEffect).toBeCloseTo(report.weights?.level1?.designEffect ?? 0, 12);
    expect(byId(r, 'nonPositive')?.values).toBeUndefined();
    expect(report.weights?.level1?.min).toBe(0);
  });

  it('total level-1 weights (group weight × conditional) are flagged, as a heuristic', async () => {
    const rows = groupedRows(10, 4, (j, i) => ({ y: i + (j % 2), w1: (j + 1) * 2 * (1 + (i % 2) * 0.2), w2: (j + 1) * 2 }));
    const r = await auditRows(rows, roles, { plotData: false });
    const f = byId(r, 'looksTotal');
    expectMessage(f as NonNullable<typeof f>, 'looksTotal', { column: 'w1', level2: 'w2', correlation: '1.00', share: '100%' });
    expect(f?.severity).toBe('warning');
    expect(r.weights?.form?.form).toBe('total');
  });

  it('clean weights and a map without weights yield nothing', async () => {
    // numpy 2.4.6: np.corrcoef(log of the group means of w1, log(10 + j))[0, 1] = 0.0206: conditional by the heuristic
    const clean = groupedRows(8, 6, (j, i) => ({ y: i + (j % 3), w1: 1 + ((i * i + 3 * j * j) % 7) / 10, w2: 10 + j }));
    const r = await auditRows(clean, roles, { plotData: false });
    expect(findingsOf(r, 'weights-audit')).toEqual([]);
    expect(r.weights?.form).toMatchObject({ form: 'conditional', groups: 8 });
    expect(r.weights?.form?.correlation).toBeCloseTo(0.0206126, 6);
    const none = await auditRows(clean, { group: 'g', outcomes: ['y'] }, { plotData: false });
    expect(none.weights).toBeUndefined();
    expect(findingsOf(none, 'weights-audit')).toEqual([]);
    expect(groupId(0)).toBe('G001');
  });
});
