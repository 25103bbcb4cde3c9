import type { GroupMoments, VarianceComponents } from './types.js';

/** One group's empirical-Bayes effect under the fitted null model. */
export interface EbGroupEffect {
  /** û_j = R_j (ȳ_j − μ̂), the shrunken group effect */
  effect: number;
  /** var(u_j | y) = τ²(1 − R_j), the conditional variance with μ taken as known */
  conditionalVariance: number;
  /** û_j over its diagnostic standard deviation √var(û_j): N(0, 1) under the model */
  z: number;
}

/**
 * Empirical-Bayes (BLUP) group effects of the random-intercept null model at its fitted
 * components, with R_j = τ²/(τ² + σ²/n_j): û_j = R_j (ȳ_j − μ̂), the conditional variance
 * τ²(1 − R_j) (what lme4 reports as condVar), and the standardisation by the diagnostic variance
 * var(û_j) = τ² R_j − R_j² var(μ̂), var(μ̂) = 1/Σ_k 1/(τ² + σ²/n_k), which includes the
 * uncertainty of μ̂. So z_j = (ȳ_j − μ̂)/√(τ² + σ²/n_j − var(μ̂)), the standardised residual of
 * the group mean, standard normal when the model holds; the comparative variance var(û_j − u_j)
 * = τ²(1 − R_j) + R_j² var(μ̂) suits comparing groups with each other, not finding outliers.
 * Sources: Raudenbush & Bryk (2002), *Hierarchical Linear Models* (2nd ed.), ch. 3 (empirical
 * Bayes estimates); Goldstein (2011), *Multilevel Statistical Models* (4th ed.), ch. 2 (diagnostic
 * and comparative variances of residuals); Langford & Lewis (1998), *JRSS A* 161(2), 121–160.
 *
 * @param groups per-group moments (n ≥ 1)
 * @param fit the REML components of the same groups (τ² > 0)
 * @returns one effect per group, in order; NaN z where τ² = 0 (every effect is then 0)
 */
export function ebGroupEffects(
  groups: readonly GroupMoments[],
  fit: Pick<VarianceComponents, 'tau2' | 'sigma2' | 'mean'>,
): EbGroupEffect[] {
  const { tau2, sigma2, mean } = fit;
  let precision = 0;
  for (const g of groups) precision += 1 / (tau2 + sigma2 / g.n);
  const meanVariance = 1 / precision;
  return groups.map((g) => {
    const total = tau2 + sigma2 / g.n;
    const r = tau2 / total;
    const residual = g.mean - mean;
    return {
      effect: r * residual,
      conditionalVariance: tau2 * (1 - r),
      z: tau2 > 0 ? residual / Math.sqrt(total - meanVariance) : NaN,
    };
  });
}
