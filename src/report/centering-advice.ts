import { formatNumber } from '../util/format.js';

/**
 * Whether a predictor's shares say it has no within-group variation: ANOVA ICC(1) is exactly 1
 * only when the within-group mean square is 0, i.e. every group holds one value.
 */
export function withoutWithinVariation(anovaShare: number): boolean {
  return anovaShare === 1;
}

/**
 * Centring advice for a level-1 predictor from the share of its variance between groups: with a
 * real between-group part, group-mean centring (or adding the group mean) separates the within-
 * and between-group effects (Enders & Tofighi 2007); with almost none, grand-mean centring does.
 * A predictor that does not vary within any group has no within-group part to centre: it is a
 * group-level variable (centred within groups it would be zero on every record).
 *
 * @param share the REML ICC of the predictor
 * @param threshold the share from which to advise within-group centring
 * @param anovaShare its ANOVA ICC(1), which tells a predictor without within-group variation
 */
export function centeringAdvice(share: number, threshold: number, anovaShare = Number.NaN): string {
  if (withoutWithinVariation(anovaShare))
    return 'no variation within groups: a group-level variable, declare it level-2 (nothing to centre)';
  if (!Number.isFinite(share)) return 'not estimable (too few groups or values)';
  if (share >= threshold) {
    return `${formatNumber(100 * share, 0)}% between groups: centre within groups and add the group mean as a level-2 predictor`;
  }
  return `almost all within groups (below ${threshold}): grand-mean centring is enough`;
}
