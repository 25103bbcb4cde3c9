/**
 * ANOVA estimator of the intraclass correlation, ICC(1) = (MSB − MSW) / (MSB + (n0 − 1)·MSW).
 *
 * It is reported as is, negative when MSB < MSW: truncating at 0 would hide that the groups
 * differ less than chance predicts. Source: Searle (1971), *Linear Models*, ch. 9; Shrout &
 * Fleiss (1979), *Psychological Bulletin* 86(2), ICC(1,1); Bliese (2000).
 *
 * @param msb between-group mean square
 * @param msw within-group mean square
 * @param n0 effective group size
 * @returns ICC(1), in [−1/(n0 − 1), 1]
 */
export function icc1(msb: number, msw: number, n0: number): number {
  return (msb - msw) / (msb + (n0 - 1) * msw);
}
