import { formatNumber } from '../util/format.js';

/**
 * Centring advice for a level-1 predictor from the share of its variance between groups: with a
 * real between-group part, group-mean centring (or adding the group mean) separates the within-
 * and between-group effects (Enders & Tofighi 2007); with almost none, grand-mean centring does.
 */
export function centeringAdvice(share: number, threshold: number): string {
  if (!Number.isFinite(share)) return 'not estimable (too few groups or values)';
  if (share >= threshold) {
    return `${formatNumber(100 * share, 0)}% between groups: centre within groups and add the group mean as a level-2 predictor`;
  }
  return `almost all within groups (below ${threshold}): grand-mean centring is enough`;
}
