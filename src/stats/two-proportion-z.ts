import normalCdf from '@stdlib/stats-base-dists-normal-cdf';

/**
 * Two-sided z-test that two independent proportions are equal, with the pooled standard error:
 * z = (p₁ − p₂) / √(p̄(1 − p̄)(1/n₁ + 1/n₂)), p̄ = (x₁ + x₂)/(n₁ + n₂).
 * Source: Fleiss, J. L., Levin, B. & Paik, M. C. (2003). *Statistical Methods for Rates and
 * Proportions* (3rd ed.), Wiley, §2.5 (without continuity correction). The normal tail comes from
 * the kept library @stdlib/stats-base-dists-normal-cdf. Rough when n·p̄ or n·(1 − p̄) is below 5.
 *
 * @returns z and its two-sided p; p = 1 when both proportions are 0 or both 1, NaN with an empty sample
 * @example
 * twoProportionZ(10, 100, 10, 100).p; // => 1
 */
export function twoProportionZ(x1: number, n1: number, x2: number, n2: number): { z: number; p: number } {
  if (!(n1 > 0 && n2 > 0)) return { z: Number.NaN, p: Number.NaN };
  const pooled = (x1 + x2) / (n1 + n2);
  if (pooled === 0 || pooled === 1) return { z: 0, p: 1 };
  const z = (x1 / n1 - x2 / n2) / Math.sqrt(pooled * (1 - pooled) * (1 / n1 + 1 / n2));
  return { z, p: 2 * (1 - normalCdf(Math.abs(z), 0, 1)) };
}
