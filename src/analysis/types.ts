import type { RuleLevel } from '../rules/types.js';

/** One rule that ran. */
export interface RuleRun {
  id: string;
  title: string;
  level: RuleLevel;
}

/** Sizes and counts for the plots, bounded in size however many groups the delivery has. */
export interface PlotData {
  /** histogram of group sizes, ascending by size: `count` groups hold `size` records */
  groupSizes: { size: number; count: number }[];
  /** per numeric outcome, group means with their standard errors (at most MAX_GROUP_MEANS points) */
  groupMeans: Record<string, GroupMeans>;
  /** per numeric level-1 column, the share of its variance between groups */
  predictorShares: Record<string, { reml: number; anova: number }>;
  /** groups below this many records count as small (marked on the size plot) */
  smallGroupThreshold?: number;
  /** the ICC below which low-icc speaks (marked on the ICC plots); absent when the rule is off */
  lowIccThreshold?: number;
}

/** Group means of one outcome, sorted by mean; a bounded sample when there are many groups. */
export interface GroupMeans {
  /** groups with at least one value of the outcome */
  total: number;
  /** σ² (REML) that the standard errors use: se_j = sqrt(σ² / n_j) */
  sigma2: number;
  /** the REML estimate of the overall mean μ */
  mean: number;
  points: GroupMean[];
}

export interface GroupMean {
  group: string;
  /** 1-based position among all `total` groups sorted by mean */
  rank: number;
  n: number;
  mean: number;
  se: number;
}
