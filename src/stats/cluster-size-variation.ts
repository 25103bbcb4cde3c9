/** Summary of how unequal the group sizes are. */
export interface SizeVariation {
  /** coefficient of variation SD(n_j) / mean(n_j), SD with divisor J − 1 */
  cv: number;
  /** largest group size over smallest */
  ratio: number;
  mean: number;
  sd: number;
  min: number;
  max: number;
}

/**
 * Coefficient of variation of cluster sizes, CV = SD(n_j) / n̄, with the largest/smallest ratio.
 * The sample SD (divisor J − 1) is used, as in the sample-size formulas of Eldridge et al.
 *
 * Source: Eldridge, S. M., Ashby, D., & Kerry, S. (2006). Sample size for cluster randomized
 * trials: effect of coefficient of variation of cluster size and analysis method.
 * *International Journal of Epidemiology, 35*(5), 1292–1300 (CV < 0.23: the effect of unequal
 * sizes is negligible).
 *
 * @param sizes group sizes n_j (at least two, all positive)
 * @returns the CV, ratio, mean, SD, min and max; NaN CV and SD with fewer than two groups
 * @example
 * clusterSizeVariation([10, 10, 10]).cv; // => 0
 */
export function clusterSizeVariation(sizes: readonly number[]): SizeVariation {
  const count = sizes.length;
  const mean = sizes.reduce((a, b) => a + b, 0) / count;
  const squares = sizes.reduce((a, b) => a + (b - mean) ** 2, 0);
  const sd = count > 1 ? Math.sqrt(squares / (count - 1)) : NaN;
  // a loop, not Math.min(...sizes): a million groups overflow the call stack as arguments
  let min = Infinity;
  let max = -Infinity;
  for (const n of sizes) {
    if (n < min) min = n;
    if (n > max) max = n;
  }
  return { cv: sd / mean, ratio: max / min, mean, sd, min, max };
}
