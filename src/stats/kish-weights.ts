/** Sums of one group's (or a whole delivery's) weights: Σw and Σw² over n records. */
export interface WeightSums {
  /** records with a weight */
  n: number;
  /** Σ w */
  sum: number;
  /** Σ w² */
  sumSquares: number;
}

/**
 * Kish's effective sample size of a weighted sample, (Σw)² / Σw²: the number of equally weighted
 * records that give a mean the same variance as the weighted ones do.
 *
 * Source: Kish, L. (1965). *Survey Sampling*. New York: Wiley, §11.7 (effect of weighting).
 *
 * @param w the weights' sums
 * @returns the effective size; NaN without a weight or with Σw² = 0
 * @example
 * kishEffectiveSize({ n: 4, sum: 6, sumSquares: 10 }); // => 3.6 (weights 1, 1, 2, 2)
 */
export function kishEffectiveSize(w: WeightSums): number {
  return w.n > 0 && w.sumSquares > 0 ? w.sum ** 2 / w.sumSquares : Number.NaN;
}

/**
 * Kish's design effect of unequal weighting, n·Σw² / (Σw)² = 1 + CV²(w), the CV with divisor n:
 * how much weighting alone inflates the variance of a mean over equal weights.
 *
 * Source: Kish, L. (1965). *Survey Sampling*. New York: Wiley, §11.7; Kish, L. (1992). Weighting
 * for unequal Pi. *Journal of Official Statistics, 8*(2), 183–200.
 *
 * @param w the weights' sums
 * @returns the design effect (1 for equal weights); NaN without a weight
 * @example
 * weightingDesignEffect({ n: 4, sum: 6, sumSquares: 10 }); // => 1.1111 (1 + CV², CV = 1/3)
 */
export function weightingDesignEffect(w: WeightSums): number {
  return w.n / kishEffectiveSize(w);
}

/**
 * The two usual scalings of level-1 weights within a group, as factors λ_j that multiply each of
 * the group's weights: `size` makes them sum to the group's records n_j (λ = n_j / Σw), `effective`
 * to its Kish effective size (λ = Σw / Σw²). Pfeffermann et al. call them scaling methods 2 and 1;
 * Carle's simulations favour the first for point estimates and advise comparing both.
 *
 * Sources: Pfeffermann, D., Skinner, C. J., Holmes, D. J., Goldstein, H., & Rasbash, J. (1998).
 * Weighting for unequal selection probabilities in multilevel models. *Journal of the Royal
 * Statistical Society B, 60*(1), 23–40; Carle, A. C. (2009). Fitting multilevel models in complex
 * survey data with design weights: recommendations. *BMC Medical Research Methodology, 9*, 49.
 *
 * @param w one group's level-1 weights' sums
 * @returns both factors; NaN where Σw or Σw² is not positive
 * @example
 * weightScaleFactors({ n: 4, sum: 6, sumSquares: 10 }); // => { size: 0.6667, effective: 0.6 }
 */
export function weightScaleFactors(w: WeightSums): { size: number; effective: number } {
  if (!(w.sum > 0) || !(w.sumSquares > 0)) return { size: Number.NaN, effective: Number.NaN };
  return { size: w.n / w.sum, effective: w.sum / w.sumSquares };
}
