import type { LogisticNullModel } from './logistic-null-model.js';
import type { EffectPrecision } from './planned-precision.js';

/** Sufficient statistics of one group for one numeric variable. */
export interface GroupMoments {
  /** non-missing values in the group */
  n: number;
  /** group mean of those values */
  mean: number;
  /** within-group sum of squares about the group mean, Σ (y_ij − ȳ_j)² */
  ss: number;
}

/** Variance components of the one-way random-intercept ("null") model. */
export interface VarianceComponents {
  tau2: number;
  sigma2: number;
  icc: number;
  mean: number;
  logLik: number;
}

/** One-way ANOVA decomposition and the ICC(1) / ICC(2) it gives. */
export interface AnovaIcc {
  msb: number;
  msw: number;
  f: number;
  df1: number;
  df2: number;
  p: number;
  n0: number;
  icc: number;
  icc2: number;
  ci95: [number, number];
}

/** What the report carries for one outcome (shared/design.md, `outcomes`). */
export interface OutcomeStats {
  n: number;
  groups: number;
  mean: number;
  reml: VarianceComponents;
  ml: VarianceComponents;
  anova: AnovaIcc;
  designEffect: number;
  effectiveN: number;
  meanReliability: number;
  /** 0/1 outcomes only: the random-intercept logistic null model (ML, adaptive Gauss–Hermite) */
  logistic?: LogisticNullModel;
  /** with `detect` in the role map: the MDES (and power) for the planned level-2 predictor */
  precision?: EffectPrecision;
}
