import { describe, expect, it } from 'vitest';
import { fitAdvice } from '../../src/analysis/fit-advice.js';
import type { Roles } from '../../src/roles/types.js';
import type { OutcomeStats } from '../../src/stats/types.js';

const roles = (extra: Partial<Roles> = {}): Roles => ({
  group: 'g',
  outcomes: ['y'],
  level1: [],
  level2: [],
  missing: [],
  types: {},
  rules: {},
  ...extra,
});
const linear = { y: {} as OutcomeStats };
const binary = { y: { logistic: {} } as OutcomeStats };
const topics = (a: ReturnType<typeof fitAdvice>) => a.items.map((i) => i.topic);

describe('fitAdvice (hand-made findings, read by rule id)', () => {
  it('few groups: REML with a small-sample df correction, and no reliance on cluster-robust errors', () => {
    const a = fitAdvice({ roles: roles(), groups: 20, meanSize: 30, outcomes: linear, findings: [] });
    expect(topics(a)).toEqual(['small-sample-inference', 'cluster-robust-errors']);
    expect(a.items[0].advice).toMatch(/Kenward–Roger or Satterthwaite/);
    expect(a.items[0].source).toMatch(/McNeish.*Stapleton.*2016/);
    expect(a.items[1].source).toMatch(/Cameron.*Miller.*2015/);
    expect(a.note).toMatch(/analysis plan decides/);
  });

  it('many groups: REML only; the line is 50 groups', () => {
    expect(topics(fitAdvice({ roles: roles(), groups: 50, meanSize: 30, outcomes: linear, findings: [] }))).toEqual([
      'small-sample-inference',
    ]);
    expect(topics(fitAdvice({ roles: roles(), groups: 49, meanSize: 30, outcomes: linear, findings: [] }))).toContain(
      'cluster-robust-errors',
    );
  });

  it('a binary outcome in small groups, or with separation found, asks for quadrature', () => {
    const small = fitAdvice({ roles: roles(), groups: 80, meanSize: 6, outcomes: binary, findings: [] });
    expect(topics(small)).toContain('quadrature');
    const large = fitAdvice({ roles: roles(), groups: 80, meanSize: 40, outcomes: binary, findings: [] });
    expect(topics(large)).not.toContain('quadrature');
    const separated = fitAdvice({
      roles: roles(),
      groups: 80,
      meanSize: 40,
      outcomes: binary,
      findings: [{ rule: 'binary-separation', messageId: 'x' }],
    });
    expect(separated.items.find((i) => i.topic === 'quadrature')?.rules).toEqual(['binary-separation']);
    const count = fitAdvice({ roles: roles({ types: { y: 'count' } }), groups: 80, meanSize: 4, outcomes: linear, findings: [] });
    expect(count.items.find((i) => i.topic === 'quadrature')?.because).toMatch(/y is count/);
  });

  it('findings of the other rules add their advice; rules that found nothing add none', () => {
    const findings = [
      { rule: 'intercept-variance-at-zero', messageId: 'a' },
      { rule: 'slope-support', messageId: 'b' },
      { rule: 'hidden-level', messageId: 'c' },
      { rule: 'within-between-gap', messageId: 'd' },
      { rule: 'level1-variance-heterogeneity', messageId: 'e' },
      { rule: 'weights-audit', messageId: 'looksTotal' },
      { rule: 'occasions-per-person', messageId: 'fewOccasions' },
    ];
    const r = roles({ weights: { level1: 'w' }, time: 't' });
    const a = fitAdvice({ roles: r, groups: 100, meanSize: 5, outcomes: linear, findings });
    expect(topics(a)).toEqual(['small-sample-inference', 'random-part', 'levels', 'centring', 'level1-variance', 'weights', 'time']);
    expect(a.items.find((i) => i.topic === 'random-part')?.rules).toEqual(['intercept-variance-at-zero', 'slope-support']);
    expect(a.items.find((i) => i.topic === 'weights')?.because).toMatch(/look total/);
    expect(a.items.find((i) => i.topic === 'time')?.advice).toMatch(/three or more occasions/);
    for (const item of a.items) expect(item.source.length).toBeGreaterThan(20);
  });
});
