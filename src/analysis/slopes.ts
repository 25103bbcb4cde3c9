import { hasPair, pairMoments } from '../profile/pairs.js';
import type { Profile } from '../profile/types.js';
import { type SlopeMomentEstimate, slopeMomentEstimate } from '../stats/slope-moment-estimate.js';

/**
 * For an outcome, the moment estimate of each planned random slope's variance (role map `slopes`),
 * from the one pass's co-moments: what the report shows beside the slope-support rule's findings.
 * Slopes without co-moments (not numbers, past the pair limit) are left out; undefined when none is left.
 */
export function slopeStatistics(
  profile: Profile,
  outcome: string,
  slopes: readonly string[],
): Record<string, SlopeMomentEstimate> | undefined {
  const out: Record<string, SlopeMomentEstimate> = {};
  for (const column of slopes) {
    if (!hasPair(profile, outcome, column)) continue;
    const s = slopeMomentEstimate(pairMoments(profile, outcome, column));
    if (s.groups >= 2) out[column] = s;
  }
  return Object.keys(out).length ? out : undefined;
}
