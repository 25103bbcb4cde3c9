/**
 * The p-quantile of a sample by linear interpolation between order statistics: with the sample
 * sorted, x₍₁₎ ≤ … ≤ x₍ₙ₎, h = (n − 1)·p and Q(p) = x₍⌊h⌋+1₎ + (h − ⌊h⌋)·(x₍⌊h⌋+2₎ − x₍⌊h⌋+1₎).
 * Definition 7 of Hyndman & Fan, the default of most statistics libraries, so a reader can
 * recompute the report's quartiles with theirs.
 *
 * Source: Hyndman, R. J., & Fan, Y. (1996). Sample quantiles in statistical packages. *The
 * American Statistician, 50*(4), 361–365, definition 7.
 *
 * @param sorted the sample in ascending order
 * @param p the probability, 0 ≤ p ≤ 1
 * @returns the quantile; NaN for an empty sample
 * @example
 * quantileLinear([1, 2, 4, 8], 0.25); // => 1.75
 */
export function quantileLinear(sorted: readonly number[], p: number): number {
  const n = sorted.length;
  if (n === 0) return Number.NaN;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  return lo + 1 < n ? sorted[lo] + (h - lo) * (sorted[lo + 1] - sorted[lo]) : sorted[n - 1];
}
