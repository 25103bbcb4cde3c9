// Public API of the pure statistics module; internal helpers stay unexported.

// one-way ANOVA
export { anovaIcc } from './anova-icc.js';
export type { BrentOptions, BrentResult } from './brent.js';
export { brentMinimize } from './brent.js';
export type { HomogeneityTest } from './chi-square-homogeneity.js';
export { chiSquareHomogeneity } from './chi-square-homogeneity.js';
export type { SizeVariation } from './cluster-size-variation.js';
// group sizes and missingness
export { clusterSizeVariation } from './cluster-size-variation.js';
// consequences of clustering
export { designEffect, effectiveSampleSize } from './design-effect.js';
export { fUpperTail } from './f-upper-tail.js';
export type { QuadratureRule } from './gauss-hermite.js';
// binary outcomes: random-intercept logistic null model
export { gaussHermite } from './gauss-hermite.js';
export { iccFromComponents } from './icc.js';
export { icc1 } from './icc1.js';
export { icc1Interval } from './icc1-interval.js';
export { icc2 } from './icc2.js';
export { LOGISTIC_LEVEL1_VARIANCE, latentIcc } from './latent-icc.js';
export type { BinaryGroup, LogisticNullModel, LogisticOptions } from './logistic-null-model.js';
export { binaryGroupsFromMoments, logisticMarginalLogLik, logisticNullModel, momentsAreZeroOne } from './logistic-null-model.js';
export { medianOddsRatio } from './median-odds-ratio.js';
// one-way random-intercept model (ML / REML)
export { mlComponents } from './ml-components.js';
export { mlDeviance, mlDevianceDerivative } from './ml-deviance.js';
// data preparation
export { momentsFromValues } from './moments-from-values.js';
export { effectiveGroupSize } from './n0.js';
export { nonEmptyGroups } from './non-empty-groups.js';
// everything for one outcome
export { outcomeStats } from './outcome-stats.js';
// count outcomes: random-intercept Poisson null model
export { poissonExpectedZeros } from './poisson-expected-zeros.js';
export { poissonLatentIcc } from './poisson-latent-icc.js';
export type { CountGroup, PoissonFit, PoissonOptions } from './poisson-null-model.js';
export { countGroupsFromMoments, poissonMarginalLogLik, poissonNullModel } from './poisson-null-model.js';
export type { PooledDispersion } from './pooled-dispersion.js';
export { pooledDispersion } from './pooled-dispersion.js';
export { groupMeanReliability, meanReliability } from './reliability.js';
export { remlComponents } from './reml-components.js';
export { remlDeviance, remlDevianceDerivative } from './reml-deviance.js';
export type { AnovaIcc, GroupMoments, OutcomeStats, VarianceComponents } from './types.js';
