import gammaln from '@stdlib/math-base-special-gammaln';
import { groupZeros } from '../profile/group-stats.js';
import type { Profile } from '../profile/types.js';
import type { Lookup } from '../source/lookups/types.js';
import { poissonExpectedZeros } from '../stats/poisson-expected-zeros.js';
import { poissonLatentIcc } from '../stats/poisson-latent-icc.js';
import { countGroupsFromMoments, poissonNullModel } from '../stats/poisson-null-model.js';
import { pooledDispersion } from '../stats/pooled-dispersion.js';
import type { PoissonOutcome } from '../stats/types.js';

/**
 * Distinct values read for Σ log y!: a count outcome has few; past this many the log-likelihood
 * is left NaN (the fit does not need it).
 */
const VALUE_LIMIT = 100_000;

/**
 * The report's `poisson` statistics of an outcome declared `count`: the fit from the profile's
 * per-group sums, Σ log y! from one look-up of the value frequencies (which also finds values
 * that are not counts), the zeros from the profile's per-group counts.
 *
 * @param profile the profile (the column planned with `zeros`, see planColumns)
 * @param column the count outcome
 * @param lookup the delivery's look-ups
 */
export async function countOutcome(profile: Profile, column: string, lookup: Lookup): Promise<PoissonOutcome> {
  const moments = profile.moments(column);
  const frequencies = await lookup.valueFrequencies(column, VALUE_LIMIT);
  let nonCounts = 0;
  let logFactorials = 0;
  for (const { value, count } of frequencies.values) {
    if (Number.isInteger(value) && value >= 0) logFactorials += count * gammaln(value + 1);
    else nonCounts += count;
  }
  if (frequencies.truncated) logFactorials = NaN;
  const records = moments.reduce((s, g) => s + g.n, 0);
  const fit = nonCounts
    ? { intercept: NaN, tau2: NaN, logLik: NaN, quadraturePoints: 0, converged: false }
    : poissonNullModel(countGroupsFromMoments(moments), logFactorials);
  const observed = groupZeros(profile.groups, column).reduce((s, k) => s + (k ?? 0), 0);
  return {
    ...fit,
    latentIcc: poissonLatentIcc(fit.intercept, fit.tau2),
    dispersion: pooledDispersion(moments),
    zeros: { observed, expected: poissonExpectedZeros(records, fit.intercept, fit.tau2) },
    nonCounts,
  };
}
