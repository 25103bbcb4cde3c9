/**
 * ICC of a random-intercept Poisson model on the latent (log) scale, by the lognormal
 * approximation of the level-1 variance: ρ = τ² / (τ² + ln(1 + 1/λ)) with λ = exp(β0 + τ²/2),
 * the mean count over groups.
 *
 * Source: Nakagawa, S., Johnson, P. C. D., & Schielzeth, H. (2017). The coefficient of
 * determination R² and intra-class correlation coefficient from generalized linear mixed-effects
 * models revisited and expanded. *Journal of the Royal Society Interface, 14*(134), 20170213:
 * the observation-level variance of the log link, lognormal approximation (their ln(1 + 1/λ)),
 * with λ from the intercept and half the random-effect variance.
 *
 * @param intercept β0 of the null model (log scale)
 * @param tau2 between-group variance of the intercept (log scale)
 * @returns the latent-scale ICC in [0, 1)
 */
export function poissonLatentIcc(intercept: number, tau2: number): number {
  const lambda = Math.exp(intercept + tau2 / 2);
  return tau2 / (tau2 + Math.log1p(1 / lambda));
}
