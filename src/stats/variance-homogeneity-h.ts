import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import type { GroupMoments } from './types.js';

/** The H test of equal level-1 variances across groups. */
export interface HomogeneityH {
  statistic: number;
  df: number;
  p: number;
  /** groups in the test: at least the minimum records and a within-group variance above zero */
  groups: number;
  /** groups left out for too few records or no within-group spread */
  excluded: number;
  /** smallest and largest within-group variance among the groups tested */
  minVariance: number;
  maxVariance: number;
}

/**
 * H = Σ d_j², d_j = (ln s_j² − Σ f_j ln s_j² / Σ f_j) / √(2/f_j), referred to χ² on J − 1 df, over
 * the groups with at least `minRecords` records; f_j = n_j − 1 (the null model's within-group
 * residual df) and s_j² = SS_j/f_j. ln s² has a sampling variance close to 2/f under normality,
 * so d_j is near standard normal when the variances are equal. Source: Raudenbush & Bryk (2002),
 * *Hierarchical Linear Models* (2nd ed.), ch. 9 (test of homogeneity of level-1 variance). The
 * χ² tail is @stdlib's. Sensitive to non-normal outcomes, as every test of variances is.
 *
 * @param groups per-group moments of the outcome
 * @param minRecords groups with fewer records are left out (the 2/f approximation needs moderate f)
 * @returns H, df, p; NaN with fewer than two groups in the test
 */
export function varianceHomogeneityH(groups: readonly GroupMoments[], minRecords: number): HomogeneityH {
  const kept = groups.filter((g) => g.n >= Math.max(2, minRecords) && g.ss > 0);
  const f = kept.map((g) => g.n - 1);
  const s2 = kept.map((g, i) => g.ss / f[i]);
  const logs = s2.map(Math.log);
  const sumF = f.reduce((a, b) => a + b, 0);
  const pooledLog = logs.reduce((a, l, i) => a + f[i] * l, 0) / sumF;
  const statistic = logs.reduce((a, l, i) => a + (l - pooledLog) ** 2 / (2 / f[i]), 0);
  const df = kept.length - 1;
  const ok = df >= 1;
  return {
    statistic: ok ? statistic : NaN,
    df,
    p: ok ? 1 - chisquareCdf(statistic, df) : NaN,
    groups: kept.length,
    excluded: groups.length - kept.length,
    minVariance: ok ? s2.reduce((a, b) => Math.min(a, b)) : NaN,
    maxVariance: ok ? s2.reduce((a, b) => Math.max(a, b)) : NaN,
  };
}
