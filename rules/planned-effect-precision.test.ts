import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Report } from '../src/report/types.js';
import type { OutcomeStats } from '../src/stats/types.js';
import { checkRule, profileOfGroups } from '../test/helpers/check-rule.js';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const HSB = readFileSync('fixtures/reference/hsb.csv', 'utf8');
const hsbRoles = (detect: Record<string, unknown>) => ({
  group: 'school',
  outcomes: ['mathach'],
  level2: ['sector'],
  types: { sector: 'categorical' },
  detect,
});

describe('planned-effect-precision on High School and Beyond (sector, 160 schools)', () => {
  let report: Report;
  beforeAll(async () => {
    report = await auditRows(HSB, hsbRoles({ predictor: 'sector', effect_size: 0.2 }), { plotData: false });
  });

  it('carries the MDES and the power in outcomes.mathach.precision', () => {
    // scipy 1.17.1 / numpy 2.4.6 on fixtures/reference/hsb.csv with ρ = 0.1803518 (lme4 1.1-31 REML ICC,
    // fixtures/reference/README.md): J = 160, n̄ = 44.90625, cv = sizes.std(ddof=1)/n̄ = 0.2639918974,
    // P = share of 'Public' schools = 0.5625, M = t.ppf(.975, 158) + t.ppf(.8, 158) = 2.818994168,
    // de = 1 + ((cv² + 1)n̄ − 1)ρ = 9.482999109, MDES = 0.2064445175 (equal sizes 0.2002064852);
    // power for 0.2 by the shifted central t 0.774586133 (exact noncentral t: 0.7746956413)
    const p = report.outcomes.mathach.precision;
    expect(p).toMatchObject({ predictor: 'sector', kind: 'binary', category: 'Public', groups: 160, df: 158, effectSize: 0.2 });
    expect(p?.share).toBeCloseTo(0.5625, 12);
    expect(p?.meanSize).toBeCloseTo(44.90625, 12);
    expect(p?.sizeCv).toBeCloseTo(0.2639918974, 9);
    expect(p?.multiplier).toBeCloseTo(2.818994168, 8);
    expect(p?.designEffect).toBeCloseTo(9.482999109, 5);
    expect(p?.mdes).toBeCloseTo(0.2064445175, 6);
    expect(p?.mdesEqual).toBeCloseTo(0.2002064852, 6);
    expect(p?.power).toBeCloseTo(0.774586133, 5);
  });

  it('--no-values leaves the category (a value of the delivery) out', async () => {
    const r = await auditRows(HSB, hsbRoles({ predictor: 'sector' }), { plotData: false, includeValues: false });
    expect(r.outcomes.mathach.precision).not.toHaveProperty('category');
    expect(r.outcomes.mathach.precision?.mdes).toBeCloseTo(0.2064445175, 6);
    expect(onlyFinding(r, 'planned-effect-precision').messageId).toBe('mdes');
  });

  it('an effect of 0.2 SD is underpowered: a warning naming the power and the MDES', () => {
    const f = onlyFinding(report, 'planned-effect-precision');
    expect(f.severity).toBe('warning');
    expect(f.column).toBe('mathach');
    expectMessage(f, 'underpowered', { predictor: 'sector', effect: 0.2, achieved: '0.77', groups: 160, power: '0.80', mdes: '0.206' });
  });
});

/** Outcome statistics carrying only what the rule reads. */
const withPrecision = (precision: OutcomeStats['precision']) => ({ y: { precision } as OutcomeStats });
const precision = {
  predictor: 'x',
  kind: 'continuous' as const,
  groups: 30,
  meanSize: 12,
  sizeCv: 0.4,
  icc: 0.08,
  alpha: 0.05,
  targetPower: 0.8,
  df: 28,
  multiplier: 2.9,
  designEffect: 2.1,
  mdesEqual: 0.3,
  mdes: 0.32,
};
const roles = { group: 'g', outcomes: ['y'], level2: ['x'], detect: { predictor: 'x' } };

describe('planned-effect-precision on given statistics', () => {
  it('without an effect size: a note with the MDES', async () => {
    const [f, ...more] = await checkRule('planned-effect-precision', await profileOfGroups([2, 2]), roles, withPrecision(precision));
    expect(more).toEqual([]);
    expect(f.severity).toBe('note');
    expectMessage(f, 'mdes', {
      column: 'y',
      predictor: 'x',
      groups: 30,
      size: '12.0',
      cv: '0.40',
      icc: '0.080',
      mdes: '0.320',
      equal: '0.300',
    });
  });

  it('a powered effect yields nothing; no precision says why; no detect yields nothing', async () => {
    const profile = await profileOfGroups([2, 2]);
    const powered = withPrecision({ ...precision, effectSize: 0.5, power: 0.97 });
    expect(await checkRule('planned-effect-precision', profile, roles, powered)).toEqual([]);
    const [f] = await checkRule('planned-effect-precision', profile, roles, { y: {} as OutcomeStats });
    expectMessage(f, 'notComputed', { column: 'y', predictor: 'x' });
    expect(await checkRule('planned-effect-precision', profile, { group: 'g', outcomes: ['y'] }, withPrecision(precision))).toEqual([]);
  });

  it('a continuous predictor is planned per SD across groups', async () => {
    const rows = [];
    for (let j = 0; j < 12; j++) for (let i = 0; i < 5; i++) rows.push({ g: `G${j + 10}`, x: j * 1.5, y: (j % 4) + i * 0.7 });
    const r = await auditRows(rows, roles, { plotData: false });
    expect(r.outcomes.y.precision).toMatchObject({ kind: 'continuous', groups: 12, df: 10, meanSize: 5, sizeCv: 0 });
    expect(findingsOf(r, 'planned-effect-precision').map((f) => f.messageId)).toEqual(['mdes']);
  });
});
