import { kolmogorovSurvival } from './kolmogorov-survival.js';

/** A two-sample Kolmogorov–Smirnov test: the largest gap between two distribution functions. */
export interface TwoSampleTest {
  /** D = max |F₁(x) − F₂(x)| over the points compared */
  d: number;
  /** the asymptotic p-value Q(√(n₁n₂/(n₁+n₂)) · D) */
  p: number;
  n1: number;
  n2: number;
}

/**
 * Two-sample Kolmogorov–Smirnov test from the two empirical distribution functions evaluated at
 * common points, with the asymptotic p-value Q_KS(√(n₁n₂/(n₁+n₂)) D) (Smirnov 1948; the series in
 * kolmogorov-survival.ts). Evaluated at every observed value, D is the usual statistic; at fewer
 * points (a sketch's bin edges) it is a lower bound of it, so the test is conservative. The
 * asymptotic p-value assumes continuous data and is rough below about n = 35 per sample.
 *
 * @param cdf1 F₁ at each point (fractions in [0, 1])
 * @param cdf2 F₂ at the same points
 * @param n1 size of sample 1
 * @param n2 size of sample 2
 */
export function ksFromDistributions(cdf1: readonly number[], cdf2: readonly number[], n1: number, n2: number): TwoSampleTest {
  let d = 0;
  for (let i = 0; i < cdf1.length; i++) d = Math.max(d, Math.abs(cdf1[i] - cdf2[i]));
  if (!(n1 > 0 && n2 > 0)) return { d, p: Number.NaN, n1, n2 };
  const effective = (n1 * n2) / (n1 + n2);
  return { d, p: kolmogorovSurvival(Math.sqrt(effective) * d), n1, n2 };
}

/**
 * The same test on two whole samples: both distribution functions at every observed value.
 *
 * @example
 * ksTwoSample([1, 2, 3], [1, 2, 3]).d; // => 0
 */
export function ksTwoSample(a: readonly number[], b: readonly number[]): TwoSampleTest {
  const x = [...a].sort((p, q) => p - q);
  const y = [...b].sort((p, q) => p - q);
  const points = [...new Set([...x, ...y])].sort((p, q) => p - q);
  const cdf = (sorted: number[]) => {
    const out: number[] = [];
    let i = 0;
    for (const t of points) {
      while (i < sorted.length && sorted[i] <= t) i++;
      out.push(i / sorted.length);
    }
    return out;
  };
  return ksFromDistributions(cdf(x), cdf(y), x.length, y.length);
}
