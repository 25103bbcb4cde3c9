import { anovaIcc } from './anova-icc.js';
import { designEffect, effectiveSampleSize } from './design-effect.js';
import { mlComponents } from './ml-components.js';
import { nonEmptyGroups } from './non-empty-groups.js';
import { meanReliability } from './reliability.js';
import { remlComponents } from './reml-components.js';
import { grandMean, totalCount } from './sums.js';
import type { GroupMoments, OutcomeStats } from './types.js';

/**
 * Every between/within statistic the report carries for one outcome: REML and ML variance
 * components, the ANOVA ICCs, the design effect, effective N and mean group-mean reliability.
 *
 * Groups with n = 0 are dropped first, and `n`/`groups` count what is left. When J < 2 or
 * N − J < 1 the variance components are not identifiable: the REML/ML/ANOVA fields, design
 * effect, effective N and reliability are NaN (the means stay defined when N > 0) instead of an
 * error, so that rules can flag the structure. The design effect and reliability use the REML
 * components. Sources: see remlComponents, mlComponents, anovaIcc, designEffect (Kish 1965)
 * and meanReliability (Raudenbush & Bryk 2002, eq. 3.58).
 *
 * @param groups per-group moments of the outcome
 * @returns the outcome's statistics
 * @throws on invalid moments, e.g. a negative ss or non-integer n (see nonEmptyGroups)
 */
export function outcomeStats(groups: readonly GroupMoments[]): OutcomeStats {
  const kept = nonEmptyGroups(groups);
  const n = totalCount(kept);
  const reml = remlComponents(kept);
  const deff = designEffect(n / kept.length, reml.icc);
  return {
    n,
    groups: kept.length,
    mean: grandMean(kept),
    reml,
    ml: mlComponents(kept),
    anova: anovaIcc(kept),
    designEffect: deff,
    effectiveN: effectiveSampleSize(n, deff),
    meanReliability: meanReliability(kept, reml.tau2, reml.sigma2),
  };
}
