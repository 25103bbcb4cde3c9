/**
 * Design effect of cluster sampling, deff = 1 + (n̄ − 1)·ICC: how much the clustering inflates
 * the variance of a mean relative to simple random sampling of the same N.
 *
 * Source: Kish (1965), *Survey Sampling*, ch. 5 (cluster sampling).
 *
 * @param meanGroupSize n̄ = N / J
 * @param icc intraclass correlation (the REML estimate in this tool)
 * @returns the design effect
 */
export function designEffect(meanGroupSize: number, icc: number): number {
  return 1 + (meanGroupSize - 1) * icc;
}

/**
 * Effective sample size N / deff: the number of independent observations carrying the same
 * information about the mean as the clustered sample.
 *
 * Source: Kish (1965), *Survey Sampling*, ch. 5 (cluster sampling).
 *
 * @param n total number of observations N
 * @param deff design effect
 * @returns the effective sample size
 */
export function effectiveSampleSize(n: number, deff: number): number {
  return n / deff;
}
