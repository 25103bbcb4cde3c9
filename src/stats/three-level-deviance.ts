import type { ParentBlocks } from './three-level-terms.js';
import { threeLevelTerms } from './three-level-terms.js';

/** A profiled three-level deviance (−2 log-likelihood, σ² profiled out) and its gradient. */
export interface ThreeLevelCriterion {
  deviance: number;
  /** ∂/∂λ_g and ∂/∂λ_p */
  dGroup: number;
  dParent: number;
  /** σ̂² at these ratios */
  sigma2: number;
  /** GLS grand mean at these ratios (on the centred scale of the blocks) */
  mu: number;
}

const LOG_2PI_PLUS_1 = 1 + Math.log(2 * Math.PI);

/**
 * Profiled ML or REML criterion of the three-level null model at (λ_g, λ_p):
 * ML −2ℓ = N log(Q/N) + log|V/σ²| + N(1 + log 2π), σ̂² = Q/N;
 * REML −2ℓ_R = (N−1) log(Q/(N−1)) + log|V/σ²| + log(σ²·1′V⁻¹1) + (N−1)(1 + log 2π), σ̂² = Q/(N−1),
 * the same forms as the two-level criteria with the nested determinant and quadratic form.
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6; Patterson & Thompson
 * (1971), *Biometrika* 58(3) for REML; lme4's profiled criteria (Bates et al. 2015).
 *
 * @param blocks groups by parent
 * @param lg λ_g = τ²_group/σ² ≥ 0
 * @param lp λ_p = τ²_parent/σ² ≥ 0
 * @param reml REML (true) or ML (false)
 * @returns the criterion, its gradient in (λ_g, λ_p), σ̂² and μ̂
 */
export function threeLevelCriterion(blocks: ParentBlocks, lg: number, lp: number, reml: boolean): ThreeLevelCriterion {
  const t = threeLevelTerms(blocks, lg, lp);
  const df = reml ? t.total - 1 : t.total;
  let deviance = df * Math.log(t.q / df) + t.logDet + df * LOG_2PI_PLUS_1;
  let dGroup = (df * t.dqGroup) / t.q + t.dLogDetGroup;
  let dParent = (df * t.dqParent) / t.q + t.dLogDetParent;
  if (reml) {
    deviance += Math.log(t.sumW);
    dGroup += t.dSumWGroup / t.sumW;
    dParent += t.dSumWParent / t.sumW;
  }
  return { deviance, dGroup, dParent, sigma2: t.q / df, mu: t.mu };
}
