import { iccFromComponents } from './icc.js';
import { minimizeOverLambda } from './minimize-over-lambda.js';
import { glsMean, profiledQ } from './profile-terms.js';
import { asClasses, bySize } from './size-classes.js';
import { componentsEstimable, grandMean, totalCount } from './sums.js';
import type { GroupMoments, VarianceComponents } from './types.js';

/** A profiled deviance in λ = τ²/σ² together with its derivative. */
export interface ProfiledCriterion {
  deviance: (groups: readonly GroupMoments[], lambda: number) => number;
  derivative: (groups: readonly GroupMoments[], lambda: number) => number;
}

/**
 * Fit τ², σ² and μ of the one-way random-intercept model by minimising a profiled deviance over
 * λ = τ²/σ², then recovering σ̂² = Q(λ̂)/df and τ̂² = λ̂ σ̂².
 *
 * Undefined cases return NaN instead of throwing, so a report can still be written: with J < 2
 * or N − J < 1 the two components are confounded, and τ², σ², ICC and logLik are NaN (the
 * mean is still the grand mean, which is then the GLS mean for every λ). When every value is
 * identical the likelihood is unbounded: τ² = σ² = 0 and ICC and logLik are NaN.
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6.
 *
 * @param groups non-empty, validated per-group moments
 * @param criterion the profiled ML or REML deviance and its derivative in λ
 * @param residualDf N for ML, N − 1 for REML (the divisor of Q in σ̂²)
 * @returns the fitted components
 */
export function fitComponents(
  groups: readonly GroupMoments[],
  criterion: ProfiledCriterion,
  residualDf: (n: number) => number,
): VarianceComponents {
  const mean = grandMean(groups);
  const estimable = componentsEstimable(groups);
  // many groups are taken together by size: each likelihood evaluation then costs the number
  // of distinct sizes (exact up to rounding; fewer than 2,000 groups are used as they are)
  groups = asClasses(bySize(groups));
  if (!estimable) {
    return { tau2: NaN, sigma2: NaN, icc: NaN, mean, logLik: NaN };
  }
  const df = residualDf(totalCount(groups));
  // Q(0) is the total sum of squares; zero means no variation for either component to explain.
  if (profiledQ(groups, 0) === 0) {
    return { tau2: 0, sigma2: 0, icc: NaN, mean, logLik: NaN };
  }
  const optimum = minimizeOverLambda(
    (lambda) => criterion.deviance(groups, lambda),
    (lambda) => criterion.derivative(groups, lambda),
  );
  const sigma2 = profiledQ(groups, optimum.lambda) / df;
  const tau2 = optimum.lambda * sigma2;
  return {
    tau2,
    sigma2,
    icc: iccFromComponents(tau2, sigma2),
    mean: glsMean(groups, optimum.lambda),
    logLik: -optimum.deviance / 2,
  };
}
