import { describe, expect, it } from 'vitest';
import { varianceInflation } from '../../src/stats/variance-inflation.js';
import { expectRel, readReferenceCsv } from './helpers.js';

describe('variance inflation factors', () => {
  // one row per school of hsb.csv, in first-seen order
  const schools = new Map<string, Record<string, string>>();
  const ses = new Map<string, number[]>();
  for (const r of readReferenceCsv('hsb.csv')) {
    if (!schools.has(r.school)) schools.set(r.school, r);
    ses.set(r.school, [...(ses.get(r.school) ?? []), Number(r.ses)]);
  }
  const column = (name: string) => [...schools.values()].map((r) => Number(r[name]));
  const level2 = ['size', 'pracad', 'disclim', 'himinty', 'meanses'].map(column);

  it('HSB school variables', () => {
    const v = varianceInflation(level2);
    // numpy 2.4.6: np.diag(np.linalg.inv(np.corrcoef(X, rowvar=False))), X = one row per school of
    // size, pracad, disclim, himinty, meanses
    const numpy = [1.2055279560304344, 2.6877345124694187, 1.6830231358153918, 1.3224953159120663, 2.2798071179391033];
    for (const [k, x] of v.vif.entries()) expectRel(x, numpy[k], 1e-9, `vif ${k}`);
    expect(v.partner[1]).toBe(4); // pracad correlates most with meanses
  });

  it('meanses is the school mean of ses: near-exact collinearity', () => {
    const means = [...ses.values()].map((xs) => xs.reduce((a, b) => a + b, 0) / xs.length);
    const v = varianceInflation([...level2, means]);
    // numpy 2.4.6, same call with the school mean of ses added: VIF 2194546.0 (meanses), 2194414.99 (mean of ses);
    // ill-conditioned, so only the order of magnitude is compared
    expect(v.vif[4]).toBeGreaterThan(1e6);
    expect(v.vif[5]).toBeGreaterThan(1e6);
    expect(v.partner[5]).toBe(4);
    expectRel(v.vif[0], 1.2180401317079939, 1e-4, 'size');
  });

  it('an exact linear dependence gives Infinity for the columns in it only', () => {
    const a = [1, 2, 3, 4, 5, 6];
    const b = [2, 1, 4, 3, 6, 5];
    const c = a.map((x, i) => x + 2 * b[i]);
    const d = [5, 3, 2, 6, 1, 4];
    const v = varianceInflation([a, b, c, d]);
    expect(v.vif.slice(0, 3)).toEqual([Infinity, Infinity, Infinity]);
    expect(Number.isFinite(v.vif[3])).toBe(true);
  });
});
