import fCdf from '@stdlib/stats-base-dists-f-cdf';

/**
 * Probability that a delivery of the same design puts the between-group variance at zero, if the
 * true variance ratio were the one observed.
 *
 * For balanced one-way data MSB/MSW ~ (1 + nλ)·F(J − 1, N − J), and REML's τ̂² is zero exactly when
 * MSB ≤ MSW (the ANOVA estimate would be negative), so P(τ̂² = 0) = P(F(J − 1, N − J) ≤ 1/(1 + nλ)).
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 3 (the probability of a
 * negative ANOVA estimate) and ch. 6 (balanced REML is the ANOVA estimate truncated at zero).
 * What is computed: λ is the ANOVA estimate (MSB − MSW)/(n·MSW), for which 1 + nλ equals the
 * observed F, so the probability is P(F(J − 1, N − J) ≤ 1/F_obs). For unbalanced data n is n0 and
 * both steps are approximations (MSB is then not exactly a scaled χ², and REML's zero is not
 * exactly MSB ≤ MSW): the stated approximation.
 *
 * @param f observed F = MSB/MSW
 * @param df1 J − 1
 * @param df2 N − J
 * @returns the probability; 1 when F ≤ 1 (the estimate is already at zero), NaN without df
 */
export function zeroTau2Probability(f: number, df1: number, df2: number): number {
  if (!(df1 >= 1 && df2 >= 1) || !Number.isFinite(f)) return NaN;
  if (f <= 1) return 1;
  return fCdf(1 / f, df1, df2);
}
