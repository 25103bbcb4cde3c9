import { groupStat } from '../profile/group-stats.js';
import type { Profile } from '../profile/types.js';
import type { Roles } from '../roles/types.js';
import type { AnyRule } from '../rules/define.js';
import { resolveParams } from '../rules/engine.js';
import { clusterSizeVariation } from '../stats/cluster-size-variation.js';
import type { EffectPrecision } from '../stats/planned-precision.js';
import { plannedPrecision, shiftedTPower } from '../stats/planned-precision.js';
import type { OutcomeStats } from '../stats/types.js';

/**
 * Each group's value of a level-2 predictor: its mean when it reads as numbers, else its one text
 * value (null where the group has none, or several).
 */
function groupValues(profile: Profile, column: string): (j: number) => number | string | null {
  if (profile.column(column).numericProfiled) {
    const n = groupStat(profile.groups, column, 'numericCount');
    const mean = groupStat(profile.groups, column, 'mean');
    return (j) => (n[j] ? (mean[j] as number) : null);
  }
  const lo = groupStat(profile.groups, column, 'textMin');
  const hi = groupStat(profile.groups, column, 'textMax');
  return (j) => (lo[j] !== null && lo[j] === hi[j] ? lo[j] : null);
}

/** The test's settings (the planned-effect-precision rule's params). */
export interface PrecisionSettings {
  alpha: number;
  power: number;
}

/**
 * The MDES (and, with an effect size, the power) for the role map's `detect` predictor on one
 * outcome, from the outcome's ICC and the groups holding both. O(groups) over the profile.
 *
 * @returns undefined without `detect`, when the predictor does not read as numbers or takes a
 *   single value, or when fewer than three groups hold both (no degrees of freedom)
 */
export function effectPrecision(
  profile: Profile,
  roles: Roles,
  outcome: string,
  stats: OutcomeStats,
  settings: PrecisionSettings,
): EffectPrecision | undefined {
  const detect = roles.detect;
  if (!detect) return undefined;
  const read = groupValues(profile, detect.predictor);
  const yCount = groupStat(profile.groups, outcome, 'numericCount');
  const sizes: number[] = [];
  const values: (number | string)[] = [];
  for (let j = 0; j < yCount.length; j++) {
    const v = read(j);
    if (!yCount[j] || v === null) continue;
    sizes.push(yCount[j]);
    values.push(v);
  }
  if (sizes.length < 3) return undefined;
  const distinct = [...new Set(values)].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  const binary = distinct.length === 2;
  // a text predictor with more than two values has no single contrast to plan for
  if (distinct.length < 2 || (!binary && typeof distinct[0] === 'string')) return undefined;
  const high = distinct[distinct.length - 1];
  const share = binary ? values.filter((v) => v === high).length / values.length : undefined;
  const spread = clusterSizeVariation(sizes);
  const design = {
    icc: Math.min(1, Math.max(0, stats.reml.icc)),
    groups: sizes.length,
    meanSize: spread.mean,
    sizeCv: Number.isFinite(spread.cv) ? spread.cv : 0,
    predictorVariance: share === undefined ? 1 : share * (1 - share),
    alpha: settings.alpha,
    power: settings.power,
  };
  const p = plannedPrecision(design);
  const effect = detect.effectSize;
  return {
    predictor: detect.predictor,
    kind: binary ? 'binary' : 'continuous',
    ...(binary && { category: String(high), share }),
    groups: design.groups,
    meanSize: design.meanSize,
    sizeCv: design.sizeCv,
    icc: design.icc,
    alpha: settings.alpha,
    targetPower: settings.power,
    df: p.df,
    multiplier: p.multiplier,
    designEffect: p.designEffect,
    mdesEqual: p.mdesEqual,
    mdes: p.mdes,
    ...(effect !== undefined && { effectSize: effect, power: shiftedTPower(effect, p.standardError, p.df, settings.alpha) }),
  };
}

/**
 * Each outcome's `precision` when the role map names a predictor to detect, with the settings the
 * planned-effect-precision rule runs with (none when the rule is off or not in the catalogue).
 */
export function addPrecision(outcomes: Record<string, OutcomeStats>, profile: Profile, roles: Roles, catalogue: readonly AnyRule[]): void {
  if (!roles.detect) return;
  const rule = catalogue.find((r) => r.meta.id === PRECISION_RULE);
  const params = rule ? resolveParams(rule, roles) : 'off';
  if (params === 'off') return;
  const settings = { alpha: params.alpha as number, power: params.power as number };
  for (const [name, stats] of Object.entries(outcomes)) {
    const precision = effectPrecision(profile, roles, name, stats, settings);
    if (precision) stats.precision = precision;
  }
}

/** The rule whose params set the test's α and power. */
const PRECISION_RULE = 'planned-effect-precision';
