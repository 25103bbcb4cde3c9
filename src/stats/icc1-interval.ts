import fQuantile from '@stdlib/stats-base-dists-f-quantile';

/**
 * Confidence interval for ICC(1) from the F distribution: F_L = F / F_{1−α/2}(J−1, N−J),
 * F_U = F · F_{1−α/2}(N−J, J−1), each bound (F_x − 1) / (F_x + n0 − 1).
 *
 * Exact for balanced groups (n0 = n); with unequal groups n0 stands in for n, which is the usual
 * approximation. Source: Searle (1971), *Linear Models*, ch. 9; Shrout & Fleiss (1979),
 * *Psychological Bulletin* 86(2), ICC(1,1); quantiles from @stdlib.
 *
 * @param f observed MSB/MSW
 * @param df1 J − 1
 * @param df2 N − J
 * @param n0 effective group size
 * @param level coverage, 0.95 unless given
 * @returns [lower, upper]
 */
export function icc1Interval(f: number, df1: number, df2: number, n0: number, level = 0.95): [number, number] {
  const upperProbability = 1 - (1 - level) / 2;
  const fLower = f / fQuantile(upperProbability, df1, df2);
  // F·F_{1−α/2}(df2, df1) equals F / F_{α/2}(df1, df2), the form in Shrout & Fleiss.
  const fUpper = f * fQuantile(upperProbability, df2, df1);
  const bound = (fx: number): number => (fx - 1) / (fx + n0 - 1);
  return [bound(fLower), bound(fUpper)];
}
