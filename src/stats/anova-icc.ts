import { fUpperTail } from './f-upper-tail.js';
import { icc1 } from './icc1.js';
import { icc1Interval } from './icc1-interval.js';
import { icc2 } from './icc2.js';
import { effectiveGroupSize } from './n0.js';
import { nonEmptyGroups } from './non-empty-groups.js';
import { betweenSumOfSquares, componentsEstimable, totalCount, withinSumOfSquares } from './sums.js';
import type { AnovaIcc, GroupMoments } from './types.js';

const UNDEFINED_ANOVA: AnovaIcc = {
  msb: NaN,
  msw: NaN,
  f: NaN,
  df1: NaN,
  df2: NaN,
  p: NaN,
  n0: NaN,
  icc: NaN,
  icc2: NaN,
  ci95: [NaN, NaN],
};

/**
 * One-way ANOVA of the groups with its F test, ICC(1) with a 95% F-interval, and ICC(2).
 *
 * MSB = Σ n_j (ȳ_j − ȳ)² / (J − 1), MSW = W / (N − J), F = MSB/MSW on (J − 1, N − J) df.
 * Source: Searle (1971), *Linear Models*, ch. 9; Shrout & Fleiss (1979); Bliese (2000).
 * Groups with n = 0 are dropped. With J < 2 or N − J < 1 one of the mean squares has no degrees
 * of freedom, so every field (df included) is NaN rather than an error.
 *
 * @param groups per-group moments
 * @returns the ANOVA decomposition and the ICCs it gives
 * @throws on invalid moments (see nonEmptyGroups)
 */
export function anovaIcc(groups: readonly GroupMoments[]): AnovaIcc {
  const kept = nonEmptyGroups(groups);
  if (!componentsEstimable(kept)) return { ...UNDEFINED_ANOVA, ci95: [NaN, NaN] };
  const df1 = kept.length - 1;
  const df2 = totalCount(kept) - kept.length;
  const msb = betweenSumOfSquares(kept) / df1;
  const msw = withinSumOfSquares(kept) / df2;
  const f = msb / msw;
  const n0 = effectiveGroupSize(kept);
  return {
    msb,
    msw,
    f,
    df1,
    df2,
    p: fUpperTail(f, df1, df2),
    n0,
    icc: icc1(msb, msw, n0),
    icc2: icc2(msb, msw),
    ci95: icc1Interval(f, df1, df2, n0),
  };
}
