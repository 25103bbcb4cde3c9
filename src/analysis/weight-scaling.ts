import { quantileLinear } from '../stats/quantile-linear.js';

/** One group's level-1 weights and the factors that scale them (Pfeffermann et al. 1998; Carle 2009). */
export interface GroupWeights {
  group: string;
  /** records with a weight */
  n: number;
  /** Σ w */
  sum: number;
  /** Kish effective size (Σw)² / Σw² */
  effectiveSize: number;
  /** factor scaling the weights to sum to n (Σ λw = n) */
  sizeScale: number;
  /** factor scaling the weights to sum to the effective size (Σ λw = (Σw)²/Σw²) */
  effectiveScale: number;
}

/** How one scaling's factors spread over the groups: the quartiles (Hyndman & Fan definition 7) and the range. */
export interface FactorSpread {
  min: number;
  q1: number;
  median: number;
  q3: number;
  max: number;
}

/**
 * The scale factors of the level-1 weights in a bounded form: how each scaling's factors spread
 * over the groups and the groups whose factors lie furthest from the typical one. The report
 * holds this, not one entry per group, so that it stays small with thousands of groups; the
 * per-group factors are the report object's `weightFactors` when asked for (README: Sampling weights).
 */
export interface WeightScaling {
  /** groups whose weights can be scaled (Σw and Σw² positive) */
  groups: number;
  /** λ = n_j / Σw (the weights sum to the group's records) */
  size: FactorSpread;
  /** λ = Σw / Σw² (the weights sum to the group's Kish effective size) */
  effective: FactorSpread;
  /**
   * at most EXTREME_GROUPS groups, furthest first: by the larger of |log(λ / median λ)| over the two
   * scalings, so a group weighted far above or far below the others by either one is listed
   */
  extreme: GroupWeights[];
}

/** Groups the report lists with their factors (a bounded report: the rest are in `weightFactors`). */
export const EXTREME_GROUPS = 20;

/** The scale factors of every group summarised: spreads and the most extreme groups. O(J log J). */
export function weightScaling(groups: readonly GroupWeights[]): WeightScaling {
  const scaled = groups.filter((g) => g.sizeScale > 0 && g.effectiveScale > 0);
  const size = spread(scaled.map((g) => g.sizeScale));
  const effective = spread(scaled.map((g) => g.effectiveScale));
  // a factor's distance from the typical group's, in ratio terms: 2× and ½× are equally far
  const distance = (g: GroupWeights) =>
    Math.max(Math.abs(Math.log(g.sizeScale / size.median)), Math.abs(Math.log(g.effectiveScale / effective.median)));
  const extreme = scaled
    .map((g, k) => ({ g, k, d: distance(g) }))
    .sort((a, b) => b.d - a.d || a.k - b.k)
    .slice(0, EXTREME_GROUPS)
    .map((e) => e.g);
  return { groups: scaled.length, size, effective, extreme };
}

function spread(values: number[]): FactorSpread {
  const sorted = values.sort((a, b) => a - b);
  const q = (p: number) => quantileLinear(sorted, p);
  return { min: q(0), q1: q(0.25), median: q(0.5), q3: q(0.75), max: q(1) };
}
