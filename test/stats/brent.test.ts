import { describe, expect, it } from 'vitest';
import { brentMinimize } from '../../src/stats/index.js';
import { secantRefine } from '../../src/stats/secant-refine.js';

describe('brentMinimize', () => {
  it('finds the vertex of a parabola', () => {
    // (x − 2)² + 1 has its minimum 1 at x = 2 (calculus)
    const r = brentMinimize((x) => (x - 2) ** 2 + 1, -10, 10);
    expect(r.converged).toBe(true);
    expect(Math.abs(r.x - 2)).toBeLessThan(1e-7);
    expect(r.fx).toBeCloseTo(1, 12);
  });

  it('finds a non-polynomial minimum', () => {
    // cos has its minimum −1 at π on [0, 2π]
    const r = brentMinimize(Math.cos, 0, 2 * Math.PI);
    expect(Math.abs(r.x - Math.PI)).toBeLessThan(1e-7);
  });

  it('finds exp(x) − 2x at log 2', () => {
    // d/dx (eˣ − 2x) = eˣ − 2 = 0 at x = ln 2 (calculus)
    const r = brentMinimize((x) => Math.exp(x) - 2 * x, -5, 5);
    expect(Math.abs(r.x - Math.LN2)).toBeLessThan(1e-7);
  });

  it('approaches the end of the interval for a monotone function', () => {
    // x is increasing, so the infimum on [1, 3] is at the left end (within the tolerance)
    const r = brentMinimize((x) => x, 1, 3);
    expect(r.x - 1).toBeLessThan(1e-6);
  });

  it('is cheap on a smooth function', () => {
    // parabolic steps should converge in far fewer steps than golden section (≈ 45 here)
    const r = brentMinimize((x) => (x - 0.3) ** 4 + (x - 0.3) ** 2, -1, 1);
    expect(r.evaluations).toBeLessThan(30);
  });

  it('rejects an empty interval', () => {
    expect(() => brentMinimize((x) => x, 1, 1)).toThrow(/lower < upper/);
    expect(() => brentMinimize((x) => x, 0, Infinity)).toThrow(/finite/);
  });
});

describe('secantRefine', () => {
  it('polishes a zero to rounding level', () => {
    // zero of x² − 2 is √2; start 1e-4 away, as after a derivative-free minimiser
    const x = secantRefine((t) => t * t - 2, Math.SQRT2 + 1e-4, { step: 1e-7, maxShift: 1e-2 });
    expect(Math.abs(x - Math.SQRT2)).toBeLessThan(1e-15);
  });

  it('stays put when the secant would leave the allowed window', () => {
    // g has no zero near 0 (g = 1 + t²), so any step is a run-off and the start is kept
    const x = secantRefine((t) => 1 + t * t, 0, { step: 1e-7, maxShift: 1e-3 });
    expect(Math.abs(x)).toBeLessThanOrEqual(1e-3);
  });
});
