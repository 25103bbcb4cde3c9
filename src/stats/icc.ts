/**
 * Intraclass correlation of the random-intercept model, ICC = τ² / (τ² + σ²): the share of the
 * total variance that lies between groups.
 *
 * Source: Raudenbush & Bryk (2002), *Hierarchical Linear Models* (2nd ed.), ch. 4 (one-way
 * ANOVA with random effects); Snijders & Bosker (2012), *Multilevel Analysis* (2nd ed.), §3.3.
 *
 * @param tau2 between-group variance τ²
 * @param sigma2 within-group variance σ²
 * @returns the ICC, NaN when both components are 0
 */
export function iccFromComponents(tau2: number, sigma2: number): number {
  return tau2 / (tau2 + sigma2);
}
