import fCdf from '@stdlib/stats-base-dists-f-cdf';

/**
 * Upper-tail probability P(F > f) of an F(df1, df2) variable.
 *
 * Computed as P(F(df2, df1) < 1/f), which is the same probability, because 1 − cdf would lose
 * every significant digit once p drops below about 1e−16 (large F with many groups is common).
 * Source: Johnson, Kotz & Balakrishnan (1995), *Continuous Univariate Distributions* vol. 2,
 * ch. 27 (reciprocal of an F variable); the cdf is @stdlib's.
 *
 * @param f observed F statistic (≥ 0)
 * @param df1 numerator degrees of freedom
 * @param df2 denominator degrees of freedom
 * @returns the p-value of the F test
 */
export function fUpperTail(f: number, df1: number, df2: number): number {
  return fCdf(1 / f, df2, df1);
}
