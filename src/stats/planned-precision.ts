import tCdf from '@stdlib/stats-base-dists-t-cdf';
import tQuantile from '@stdlib/stats-base-dists-t-quantile';

/** The design a level-2 effect is estimated from, and the test's settings. */
export interface PrecisionDesign {
  /** intraclass correlation of the outcome (clamped to [0, 1]) */
  icc: number;
  /** groups J */
  groups: number;
  /** mean records per group n̄ */
  meanSize: number;
  /** coefficient of variation of the group sizes (0: equal sizes) */
  sizeCv: number;
  /**
   * the predictor's spread across groups: P(1 − P) for a binary predictor with a share P of
   * groups in its higher category, 1 for a continuous predictor in standard-deviation units
   */
  predictorVariance: number;
  /** two-sided type I error rate */
  alpha: number;
  /** the power the detectable effect is defined for */
  power: number;
  /** level-2 covariates in the planned model besides the predictor (g) */
  covariates?: number;
}

/** Precision for the planned level-2 effect on one outcome (report: `outcomes.<name>.precision`). */
export interface EffectPrecision {
  predictor: string;
  /** binary: two values across groups (P(1 − P) enters); continuous: per SD of the predictor across groups */
  kind: 'binary' | 'continuous';
  /** binary: the value whose groups make the share P */
  category?: string;
  /** binary: the share P of groups with `category` */
  share?: number;
  /** groups with the outcome and the predictor (J) */
  groups: number;
  meanSize: number;
  sizeCv: number;
  /** the outcome's REML ICC (clamped to [0, 1]) */
  icc: number;
  alpha: number;
  targetPower: number;
  df: number;
  multiplier: number;
  /** Eldridge et al.'s design effect for unequal sizes */
  designEffect: number;
  mdesEqual: number;
  mdes: number;
  /** the effect the study must detect (role map `detect.effect_size`) */
  effectSize?: number;
  /** the power to detect it (shifted central t) */
  power?: number;
}

export interface PlannedPrecision {
  /** degrees of freedom J − g − 2 */
  df: number;
  /** the multiplier M = t(1 − α/2; df) + t(power; df) */
  multiplier: number;
  /** Eldridge et al.'s design effect for unequal sizes, 1 + ((CV² + 1)·n̄ − 1)·ρ */
  designEffect: number;
  /** the standard error of the effect in outcome-SD units, unequal sizes allowed for */
  standardError: number;
  /** the minimum detectable effect size with equal groups of n̄ records */
  mdesEqual: number;
  /** the minimum detectable effect size, unequal sizes allowed for */
  mdes: number;
}

/**
 * Design effect of a cluster design with unequal cluster sizes, 1 + ((CV² + 1)·n̄ − 1)·ρ: with
 * CV = 0 it is Kish's 1 + (n̄ − 1)·ρ.
 *
 * Source: Eldridge, S. M., Ashby, D., & Kerry, S. (2006). Sample size for cluster randomized
 * trials: effect of coefficient of variation of cluster size and analysis method. *International
 * Journal of Epidemiology, 35*(5), 1292–1300, eq. (2).
 *
 * @example
 * unequalSizeDesignEffect(0.1, 20, 0.5); // => 1 + (1.25·20 − 1)·0.1 = 3.4
 */
export function unequalSizeDesignEffect(icc: number, meanSize: number, sizeCv: number): number {
  return 1 + ((sizeCv ** 2 + 1) * meanSize - 1) * icc;
}

/**
 * The minimum detectable effect size (in outcome standard deviations) of a level-2 predictor in a
 * two-level design, MDES = M · sqrt(ρ/(P(1−P)J) + (1−ρ)/(P(1−P)J·n̄)), M = t(1−α/2; J−g−2) +
 * t(power; J−g−2); the same with the bracket times n̄ replaced by Eldridge et al.'s design effect
 * for unequal sizes. A continuous predictor enters with variance 1 (an effect per standard
 * deviation of the predictor across groups).
 *
 * Sources: Bloom, H. S. (2005). Randomizing groups to evaluate place-based programs. In H. S. Bloom
 * (Ed.), *Learning More from Social Experiments* (pp. 115–172). Russell Sage; Raudenbush, S. W.
 * (1997). Statistical analysis and optimal design for cluster randomized trials. *Psychological
 * Methods, 2*(2), 173–185; Eldridge, Ashby & Kerry (2006), see unequalSizeDesignEffect.
 *
 * @param d the design and the test's settings
 * @returns the multiplier, design effect, standard error and both MDES; NaN when df < 1
 */
export function plannedPrecision(d: PrecisionDesign): PlannedPrecision {
  const df = d.groups - (d.covariates ?? 0) - 2;
  const icc = Math.min(1, Math.max(0, d.icc));
  const multiplier = df >= 1 ? tQuantile(1 - d.alpha / 2, df) + tQuantile(d.power, df) : Number.NaN;
  const perRecord = d.predictorVariance * d.groups * d.meanSize;
  const designEffect = unequalSizeDesignEffect(icc, d.meanSize, d.sizeCv);
  const standardError = Math.sqrt(designEffect / perRecord);
  const equalError = Math.sqrt(unequalSizeDesignEffect(icc, d.meanSize, 0) / perRecord);
  return { df, multiplier, designEffect, standardError, mdesEqual: multiplier * equalError, mdes: multiplier * standardError };
}

/**
 * Power of the two-sided t test of a level-2 effect `effect` (outcome-SD units) with standard error
 * `se` on `df` degrees of freedom, by the shifted central t: P(T > t(1−α/2) − δ/se) + P(T <
 * −t(1−α/2) − δ/se), T ~ t(df). This is the approximation the MDES multiplier rests on (power at the
 * MDES equals the power it was asked for); the exact noncentral t gives slightly different values
 * at small df.
 *
 * Source: Bloom, H. S. (2005), as for plannedPrecision (the multiplier M = t(1−α/2) + t(1−β)).
 *
 * @param effect the standardised effect to detect
 * @param se its standard error (plannedPrecision's standardError)
 * @param df degrees of freedom
 * @param alpha two-sided type I error rate
 * @returns the power; NaN when df < 1
 */
export function shiftedTPower(effect: number, se: number, df: number, alpha: number): number {
  if (!(df >= 1)) return Number.NaN;
  const critical = tQuantile(1 - alpha / 2, df);
  const shift = Math.abs(effect) / se;
  return tCdf(shift - critical, df) + tCdf(-critical - shift, df);
}
