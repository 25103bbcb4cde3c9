import { groupIds, groupSizes, groupStat } from '../profile/group-stats.js';
import type { Profile } from '../profile/types.js';
import type { Roles } from '../roles/types.js';
import type { WeightSums } from '../stats/kish-weights.js';
import { kishEffectiveSize, weightingDesignEffect, weightScaleFactors } from '../stats/kish-weights.js';
import type { GroupWeights, WeightScaling } from './weight-scaling.js';
import { weightScaling } from './weight-scaling.js';

export type { FactorSpread, GroupWeights, WeightScaling } from './weight-scaling.js';

/** Level-1 (record) weights: the whole delivery's and each group's. */
export interface Level1Weights {
  column: string;
  /** records with a weight that reads as a number */
  records: number;
  /** records without one */
  missing: number;
  /** groups holding a weight ≤ 0 (all of them, by ID) */
  nonPositiveGroups: string[];
  /** the smallest weight (a raw value: left out with --no-values) */
  min?: number | null;
  /** Kish's weighting design effect over all records, 1 + CV² */
  designEffect: number;
  /** Kish effective number of records */
  effectiveN: number;
  /** the scale factors of the groups with a weight: their spread and the most extreme groups (bounded) */
  scaling: WeightScaling;
}

/** Level-2 (group) weights: one value per group. */
export interface Level2Weights {
  column: string;
  /** groups with a weight */
  groups: number;
  /** groups without one */
  missing: number;
  /** groups whose weight is not one value (all of them, by ID) */
  varyingGroups: string[];
  nonPositiveGroups: string[];
  /** the smallest group weight (a raw value: left out with --no-values) */
  min?: number | null;
  /** Kish's weighting design effect over the groups, one weight each */
  designEffect: number;
  /** Kish effective number of groups */
  effectiveGroups: number;
}

/**
 * Whether the level-1 weights look conditional on the group (w_i|j) or total (w_j·w_i|j): a
 * heuristic, reported as such. Total weights carry the group's weight as a factor, so their group
 * means follow the level-2 weights across groups, and no record weight is below its group's.
 */
export interface WeightForm {
  form: 'conditional' | 'total' | 'unclear';
  /** correlation across groups of log(mean level-1 weight) with log(level-2 weight) */
  correlation: number;
  /** share of groups whose every level-1 weight is at least the group's level-2 weight */
  atLeastGroupWeight: number;
  /** groups compared (both weights positive) */
  groups: number;
}

export interface WeightsAudit {
  level1?: Level1Weights;
  level2?: Level2Weights;
  form?: WeightForm;
}

/** Relative tolerance for a level-2 weight to count as one value within its group (rounding in exports). */
const SAME_WEIGHT = 1e-9;

/**
 * The weights audit from the profile alone: Σw and Σw² of a group are n·mean and ss + n·mean² of
 * the profile's per-group moments, so no aggregate beyond the one pass is needed. O(groups).
 *
 * @param profile the profile (the weight columns are profiled as numbers)
 * @param roles the role map; nothing is computed without `weights`
 */
export function weightsAudit(profile: Profile, roles: Roles): WeightsAudit | undefined {
  const w = roles.weights;
  if (!w?.level1 && !w?.level2) return undefined;
  const out: WeightsAudit = {};
  if (w.level1) out.level1 = level1Weights(profile, w.level1);
  if (w.level2) out.level2 = level2Weights(profile, w.level2);
  if (w.level1 && w.level2) out.form = weightForm(profile, w.level1, w.level2);
  return out;
}

/**
 * Every group's level-1 weights and scale factors, in the group table's order (groups without a
 * weight left out): one entry per group, so the report carries them only when asked for.
 *
 * @param profile the profile (the weight column profiled as numbers)
 * @param column the level-1 weight column
 */
export function weightFactors(profile: Profile, column: string): GroupWeights[] {
  return groupSums(profile, column).map(({ id, sums }) => {
    const scale = weightScaleFactors(sums);
    return {
      group: id,
      n: sums.n,
      sum: sums.sum,
      effectiveSize: kishEffectiveSize(sums),
      sizeScale: scale.size,
      effectiveScale: scale.effective,
    };
  });
}

/** Σw and Σw² of each group with a weight, from the profile's moments (Σw² = ss + n·mean²). */
function groupSums(profile: Profile, column: string): { id: string; sums: WeightSums; lowest: number }[] {
  const ids = groupIds(profile.groups);
  const n = groupStat(profile.groups, column, 'numericCount');
  const mean = groupStat(profile.groups, column, 'mean');
  const ss = groupStat(profile.groups, column, 'ss');
  const lo = groupStat(profile.groups, column, 'numMin');
  const out: { id: string; sums: WeightSums; lowest: number }[] = [];
  for (let j = 0; j < ids.length; j++) {
    if (!n[j]) continue;
    const m = mean[j] as number;
    const sums: WeightSums = { n: n[j], sum: n[j] * m, sumSquares: Math.max(0, ss[j] as number) + n[j] * m * m };
    out.push({ id: ids[j], sums, lowest: lo[j] as number });
  }
  return out;
}

function level1Weights(profile: Profile, column: string): Level1Weights {
  const sizes = groupSizes(profile.groups);
  const perGroup = groupSums(profile, column);
  const all: WeightSums = { n: 0, sum: 0, sumSquares: 0 };
  for (const { sums } of perGroup) {
    all.n += sums.n;
    all.sum += sums.sum;
    all.sumSquares += sums.sumSquares;
  }
  const col = profile.column(column);
  return {
    column,
    records: all.n,
    missing: sizes.reduce((a, b) => a + b, 0) - all.n,
    nonPositiveGroups: perGroup.filter((g) => g.lowest <= 0).map((g) => g.id),
    min: col.numMin,
    designEffect: weightingDesignEffect(all),
    effectiveN: kishEffectiveSize(all),
    scaling: weightScaling(weightFactors(profile, column)),
  };
}

function level2Weights(profile: Profile, column: string): Level2Weights {
  const ids = groupIds(profile.groups);
  const n = groupStat(profile.groups, column, 'numericCount');
  const lo = groupStat(profile.groups, column, 'numMin');
  const hi = groupStat(profile.groups, column, 'numMax');
  const mean = groupStat(profile.groups, column, 'mean');
  const sums: WeightSums = { n: 0, sum: 0, sumSquares: 0 };
  const varyingGroups: string[] = [];
  const nonPositiveGroups: string[] = [];
  let min: number | null = null;
  for (let j = 0; j < ids.length; j++) {
    if (!n[j]) continue;
    const [a, b, m] = [lo[j] as number, hi[j] as number, mean[j] as number];
    if (b - a > SAME_WEIGHT * Math.max(1, Math.abs(a), Math.abs(b))) varyingGroups.push(ids[j]);
    if (a <= 0) nonPositiveGroups.push(ids[j]);
    if (min === null || a < min) min = a;
    // the group's weight: its mean (its one value when it is constant)
    sums.n += 1;
    sums.sum += m;
    sums.sumSquares += m * m;
  }
  return {
    column,
    groups: sums.n,
    missing: ids.length - sums.n,
    varyingGroups,
    nonPositiveGroups,
    min,
    designEffect: weightingDesignEffect(sums),
    effectiveGroups: kishEffectiveSize(sums),
  };
}

/** Correlation at or above which (with nearly every record weight ≥ its group's) level-1 weights look total (heuristic). */
const TOTAL_CORRELATION = 0.9;
const TOTAL_SHARE = 0.95;
/** Correlation below which level-1 weights look conditional (heuristic). */
const CONDITIONAL_CORRELATION = 0.5;

function weightForm(profile: Profile, level1: string, level2: string): WeightForm {
  const n1 = groupStat(profile.groups, level1, 'numericCount');
  const m1 = groupStat(profile.groups, level1, 'mean');
  const lo1 = groupStat(profile.groups, level1, 'numMin');
  const n2 = groupStat(profile.groups, level2, 'numericCount');
  const m2 = groupStat(profile.groups, level2, 'mean');
  const xs: number[] = [];
  const ys: number[] = [];
  let atLeast = 0;
  for (let j = 0; j < n1.length; j++) {
    const [a, b, low] = [m1[j] as number, m2[j] as number, lo1[j] as number];
    if (!n1[j] || !n2[j] || !(low > 0) || !(b > 0)) continue;
    xs.push(Math.log(a));
    ys.push(Math.log(b));
    if (low >= b * (1 - SAME_WEIGHT)) atLeast++;
  }
  const correlation = pearson(xs, ys);
  const atLeastGroupWeight = xs.length ? atLeast / xs.length : Number.NaN;
  const form =
    correlation >= TOTAL_CORRELATION && atLeastGroupWeight >= TOTAL_SHARE
      ? 'total'
      : correlation < CONDITIONAL_CORRELATION
        ? 'conditional'
        : 'unclear';
  return { form, correlation, atLeastGroupWeight, groups: xs.length };
}

/** Pearson's correlation; NaN when either variable does not vary (level-2 weights all equal tell nothing). */
function pearson(xs: readonly number[], ys: readonly number[]): number {
  const n = xs.length;
  if (n < 3) return Number.NaN;
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const my = ys.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxy += (xs[i] - mx) * (ys[i] - my);
    sxx += (xs[i] - mx) ** 2;
    syy += (ys[i] - my) ** 2;
  }
  const scale = Math.max(sxx, syy);
  return sxx <= 1e-12 * scale || syy <= 1e-12 * scale || scale === 0 ? Number.NaN : sxy / Math.sqrt(sxx * syy);
}
