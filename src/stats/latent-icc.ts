/** Variance of the standard logistic distribution, π²/3 ≈ 3.29: the level-1 variance on the latent scale. */
export const LOGISTIC_LEVEL1_VARIANCE = (Math.PI * Math.PI) / 3;

/**
 * ICC of a random-intercept logistic model on the latent (threshold) scale,
 * ρ = τ² / (τ² + π²/3).
 *
 * Source: Snijders, T. A. B., & Bosker, R. J. (2012). *Multilevel Analysis* (2nd ed.), chapter
 * on discrete dependent variables (threshold model); Goldstein, H., Browne, W., & Rasbash, J.
 * (2002). Partitioning variation in multilevel models. *Understanding Statistics, 1*(4), 223–231
 * (method D, latent variable).
 *
 * @param tau2 between-group variance of the intercept on the logit scale
 * @returns the latent-scale ICC in [0, 1)
 * @example
 * latentIcc(LOGISTIC_LEVEL1_VARIANCE); // => 0.5
 */
export function latentIcc(tau2: number): number {
  return tau2 / (tau2 + LOGISTIC_LEVEL1_VARIANCE);
}
