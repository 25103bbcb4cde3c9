// Φ⁻¹(0.75), the upper quartile of the standard normal (a constant, checked in the tests
// against the kept chi-square distribution: P(χ²₁ ≤ z²) = 2Φ(z) − 1 = 0.5)
const NORMAL_UPPER_QUARTILE = 0.6744897501960817;

/**
 * Median odds ratio of a random-intercept logistic model, MOR = exp(√(2τ²) · Φ⁻¹(0.75)):
 * the median of the odds ratios between two randomly chosen groups (higher over lower).
 * MOR = 1 means no between-group heterogeneity.
 *
 * Source: Larsen, K., & Merlo, J. (2005). Appropriate assessment of neighborhood effects on
 * individual health: integrating random and fixed effects in multilevel logistic regression.
 * *American Journal of Epidemiology, 161*(1), 81–88.
 *
 * @param tau2 between-group variance of the intercept on the logit scale
 * @returns the MOR, ≥ 1
 * @example
 * medianOddsRatio(0); // => 1
 */
export function medianOddsRatio(tau2: number): number {
  return Math.exp(Math.sqrt(2 * tau2) * NORMAL_UPPER_QUARTILE);
}
