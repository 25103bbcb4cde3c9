import { describe, expect, it } from 'vitest';
import { informativeSize, sizeMeanCorrelation, weightingGap } from '../../src/stats/informative-size.js';
import { seededUniform } from '../../src/stats/seeded-uniform.js';

// seven groups: sizes and group means of the outcome
const sizes = [2, 3, 5, 8, 12, 4, 9];
const means = [1.0, 1.2, 1.1, 1.9, 2.4, 0.7, 1.3];

describe('informative group size', () => {
  it('correlation and weighting gap against numpy', () => {
    // numpy 2.4.6: np.corrcoef(n, y)[0, 1] and np.sum((n / n.sum() - 1 / len(n)) * y)
    expect(sizeMeanCorrelation(sizes, means)).toBeCloseTo(0.8391670096896333, 12);
    expect(weightingGap(sizes, means)).toBeCloseTo(0.2471760797342193, 12);
  });

  it('all 7! permutations enumerated: the exact p-value', () => {
    // Python 3 itertools.permutations over the sizes (numpy 2.4.6 for the gap): 83 of the 5,040
    // orderings give |gap| at least the observed one
    const r = informativeSize(sizes, means, { permutations: 5040, seed: 1 });
    expect(r).toMatchObject({ exact: true, permutations: 5040 });
    expect(r.p).toBe(83 / 5040);
  });

  it('seeded random permutations agree with the exact value within Monte Carlo error, and repeat', () => {
    const all = { permutations: 4000, seed: 20240611, stopAfterHits: Number.POSITIVE_INFINITY };
    const r = informativeSize(sizes, means, all);
    expect(r).toMatchObject({ exact: false, permutations: 4000 });
    const exact = 83 / 5040;
    expect(Math.abs(r.p - exact)).toBeLessThan(4 * Math.sqrt((exact * (1 - exact)) / 4000));
    expect(informativeSize(sizes, means, all).p).toBe(r.p);
  });

  it('stops after 20 exceedances with the sequential p-value h / L, unbiased over seeds', () => {
    // Besag & Clifford (1991): h / L estimates p; over 200 seeds its mean is within Monte Carlo
    // error of the exact 83/5040 (each stopped run draws about 20 / p ≈ 1,200 of its 5,000 permutations)
    const exact = 83 / 5040;
    const runs = Array.from({ length: 200 }, (_, seed) => informativeSize(sizes, means, { permutations: 5000, seed: seed + 1 }));
    for (const r of runs) expect(r.p).toBeCloseTo(20 / r.permutations, 15);
    const mean = runs.reduce((a, r) => a + r.p, 0) / runs.length;
    // h / L has a relative spread of about 1/√(h − 1): the mean of 200 within 4 standard errors
    expect(Math.abs(mean - exact)).toBeLessThan((4 * exact) / Math.sqrt(19 * 200));
  });

  it('equal sizes: no gap and p = 1', () => {
    const r = informativeSize([5, 5, 5, 5], [1, 2, 3, 4], { permutations: 100, seed: 1 });
    expect(r.gap).toBeCloseTo(0, 15);
    expect(r.p).toBe(1);
  });

  it('from 1,000 groups, the normal approximation matches random permutations within Monte Carlo error', () => {
    const random = seededUniform(7);
    const n = Array.from({ length: 1000 }, () => 2 + Math.floor(random() * 60));
    // a weak size effect: p of a few per cent, where the tail matters
    const y = n.map((k) => 0.0008 * k + random());
    const normal = informativeSize(n, y, { permutations: 5000, seed: 3 });
    expect(normal).toMatchObject({ normal: true, permutations: 0 });
    const drawn = informativeSize(n, y, { permutations: 5000, seed: 3, stopAfterHits: Number.POSITIVE_INFINITY, normalFrom: 1e9 });
    expect(drawn.normal).toBe(false);
    expect(drawn.p).toBeGreaterThan(0.002);
    expect(drawn.p).toBeLessThan(0.3);
    // the permutation p-value is itself an estimate with standard error √(p(1 − p)/B)
    expect(Math.abs(normal.p - drawn.p)).toBeLessThan(4 * Math.sqrt((drawn.p * (1 - drawn.p)) / 5000));
  });
});
