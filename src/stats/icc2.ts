/**
 * Reliability of the group means from the ANOVA, ICC(2) = (MSB − MSW) / MSB.
 *
 * It is the Spearman–Brown step-up of ICC(1) to the average group size, used to judge whether
 * group means are stable enough to aggregate. Source: Bliese (2000), in Klein & Kozlowski
 * (eds.), *Multilevel Theory, Research, and Methods in Organizations*, pp. 349–381; Shrout &
 * Fleiss (1979), ICC(1,k).
 *
 * @param msb between-group mean square
 * @param msw within-group mean square
 * @returns ICC(2), negative when MSB < MSW
 */
export function icc2(msb: number, msw: number): number {
  return (msb - msw) / msb;
}
