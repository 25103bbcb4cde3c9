import type { LogisticNullModel } from './logistic-null-model.js';
import type { EffectPrecision } from './planned-precision.js';
import type { PoissonFit } from './poisson-null-model.js';
import type { PooledDispersion } from './pooled-dispersion.js';
import type { SlopeMomentEstimate } from './slope-moment-estimate.js';
import type { ThreeLevelModel } from './three-level-model.js';

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
  /** per planned random slope (role map `slopes`, outcomes not binary): the moment estimate of its variance */
  slopes?: Record<string, SlopeMomentEstimate>;
  /** outcomes declared `count` only: the random-intercept Poisson null model and its checks */
  poisson?: PoissonOutcome;
  /** with a parent declared: the three-level null model (groups within parents) */
  threeLevel?: ThreeLevelStats;
  /** with `detect` in the role map: the MDES (and power) for the planned level-2 predictor */
  precision?: EffectPrecision;
}

/** A count outcome: the Poisson null model (ML, adaptive Gauss–Hermite), its latent ICC, dispersion and zeros. */
export interface PoissonOutcome extends PoissonFit {
  /** τ² / (τ² + ln(1 + 1/λ)), λ = exp(β0 + τ²/2) (Nakagawa et al. 2017, lognormal approximation) */
  latentIcc: number;
  /** the index of dispersion within groups, pooled, against χ² on its df */
  dispersion: PooledDispersion;
  /** records whose value is 0, and how many the fitted model expects */
  zeros: { observed: number; expected: number };
  /** records whose value is not a whole number ≥ 0 (the model is then not fitted: its fields are NaN) */
  nonCounts: number;
}

/** The three-level null model of an outcome and the groups it had to leave out. */
export interface ThreeLevelStats extends ThreeLevelModel {
  /** groups under more than one parent, or none: not in the fit */
  excludedGroups: number;
}
