import type { PairMoments } from './pair-moments.js';

/** The spread of per-group OLS slopes and what it says about a random slope's variance. */
export interface SlopeMomentEstimate {
  /** groups with an OLS slope and a residual degree of freedom (n_j ≥ 3, x varying) */
  groups: number;
  /** unweighted mean of the per-group OLS slopes */
  meanSlope: number;
  /** variance of the per-group OLS slopes across groups (J − 1 denominator) */
  observedVariance: number;
  /** mean sampling variance of those slopes, mean of σ̂²/Σ(x − x̄_j)² */
  meanSamplingVariance: number;
  /** pooled within-group residual variance σ̂² of the per-group regressions */
  sigma2: number;
  /** moment estimate τ̂₁₁ = observed − mean sampling variance; ≤ 0 says the data show no slope variance */
  tau11: number;
  /** mean over groups of τ₁₁/(τ₁₁ + v_j), with a non-positive τ̂₁₁ taken as 0 (so reliability 0) */
  reliability: number;
}

/**
 * Moment estimate of the variance of a random slope from per-group OLS regressions of y on x.
 *
 * Each group with n_j ≥ 3 and x not constant gives b_j = S_xy/S_xx and a residual sum of squares
 * S_yy − S_xy²/S_xx on n_j − 2 df; σ̂² pools them. The observed variance of the b_j overstates τ₁₁
 * by their average sampling variance v_j = σ̂²/S_xx,j, so τ̂₁₁ = var(b_j) − mean(v_j), and the slope
 * reliability is the mean of τ₁₁/(τ₁₁ + v_j). Sources: Swamy, P. A. V. B. (1970), Efficient inference
 * in a random coefficient regression model, *Econometrica* 38(2), 311–323 (with a pooled σ̂², as
 * for a common level-1 variance); Raudenbush & Bryk (2002), *Hierarchical Linear Models* (2nd ed.),
 * ch. 3 (OLS slopes, their reliability). With balanced data (the same x values in every group)
 * this equals the REML estimate whenever the full moment covariance matrix is positive definite.
 *
 * @param pairs per-group pair moments
 * @returns the estimate; NaN fields when fewer than two groups have a slope
 */
export function slopeMomentEstimate(pairs: readonly PairMoments[]): SlopeMomentEstimate {
  const used = pairs.filter((g) => g.n >= 3 && g.sxx > 0);
  const j = used.length;
  let rss = 0;
  let df = 0;
  for (const g of used) {
    rss += Math.max(0, g.syy - (g.sxy * g.sxy) / g.sxx);
    df += g.n - 2;
  }
  const sigma2 = rss / df;
  const slopes = used.map((g) => g.sxy / g.sxx);
  const v = used.map((g) => sigma2 / g.sxx);
  const meanSlope = slopes.reduce((a, b) => a + b, 0) / j;
  const observedVariance = slopes.reduce((a, b) => a + (b - meanSlope) ** 2, 0) / (j - 1);
  const meanSamplingVariance = v.reduce((a, b) => a + b, 0) / j;
  const tau11 = j >= 2 ? observedVariance - meanSamplingVariance : NaN;
  const kept = Math.max(0, tau11);
  const reliability = j >= 2 ? v.reduce((a, vj) => a + (kept > 0 ? kept / (kept + vj) : 0), 0) / j : NaN;
  return { groups: j, meanSlope, observedVariance, meanSamplingVariance, sigma2, tau11, reliability };
}
