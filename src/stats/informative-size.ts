import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import { seededUniform } from './seeded-uniform.js';

/** Whether group size goes with the group mean of the outcome. */
export interface InformativeSize {
  /** Pearson correlation of n_j with ȳ_j over the groups */
  correlation: number;
  /** record-weighted mean Σ n_j ȳ_j / N minus group-weighted mean Σ ȳ_j / J */
  gap: number;
  /** two-sided permutation p-value of the gap (sizes permuted over groups) */
  p: number;
  /** permutations drawn, or J! when every one was enumerated (0 with the normal approximation) */
  permutations: number;
  exact: boolean;
  /** p from the normal approximation to the permutation distribution (many groups) */
  normal: boolean;
}

/**
 * The difference between the record-weighted and the group-weighted mean of group means,
 * Σ n_j ȳ_j / N − Σ ȳ_j / J = Σ (n_j/N − 1/J) ȳ_j: zero in expectation when size says nothing
 * about the outcome; otherwise the average record and the average group differ (informative
 * cluster size). Source: Kahan, B. C., Li, F., Copas, A. J., & Harhay, M. O. (2023). Estimands in
 * cluster-randomized trials: choosing analyses that answer the right question. *International
 * Journal of Epidemiology*, 52(1), 107–118.
 *
 * @param sizes n_j
 * @param means ȳ_j
 */
export function weightingGap(sizes: readonly number[] | Float64Array, means: readonly number[]): number {
  let total = 0;
  for (const n of sizes) total += n;
  let gap = 0;
  for (let j = 0; j < sizes.length; j++) gap += (sizes[j] / total - 1 / sizes.length) * means[j];
  return gap;
}

/**
 * Pearson's correlation of group size with group mean.
 * Source: Pearson (1896); any statistics text, e.g. Snedecor & Cochran (1989), *Statistical
 * Methods* (8th ed.), §10.
 *
 * @param sizes n_j
 * @param means ȳ_j
 * @returns r, NaN when either varies not at all
 */
export function sizeMeanCorrelation(sizes: readonly number[], means: readonly number[]): number {
  const count = sizes.length;
  let mx = 0;
  let my = 0;
  for (let j = 0; j < count; j++) {
    mx += sizes[j] / count;
    my += means[j] / count;
  }
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let j = 0; j < count; j++) {
    sxy += (sizes[j] - mx) * (means[j] - my);
    sxx += (sizes[j] - mx) ** 2;
    syy += (means[j] - my) ** 2;
  }
  return sxx > 0 && syy > 0 ? sxy / Math.sqrt(sxx * syy) : NaN;
}

/** Exceedances after which the random permutations stop (Besag & Clifford 1991 take h of 10 to 20). */
export const STOP_AFTER_HITS = 20;

/**
 * Groups from which the permutation distribution is taken as normal: the permuted statistic is a
 * linear permutation statistic, asymptotically normal as J grows (Hoeffding's combinatorial
 * central limit theorem); from a thousand groups on, its tails match the permutations' to the
 * Monte Carlo error of a few thousand draws (test/stats/informative-size.test.ts), at the cost of
 * one pass instead of J × B products (common practice for the threshold).
 */
export const NORMAL_FROM_GROUPS = 1000;

/**
 * Permutation test of informative group size: the sizes are permuted over the groups and the
 * weighting gap recomputed; since Σ n_j, Σ n_j², Σ ȳ_j and Σ ȳ_j² do not change under a
 * permutation, the gap and the size–mean correlation give the same test. With J! no larger than
 * `permutations` every permutation is enumerated (exact p = share with |gap| ≥ observed);
 * otherwise p = (1 + hits)/(1 + B) from B seeded random permutations (Phipson & Smyth 2010,
 * *Stat. Appl. Genet. Mol. Biol.* 9(1), art. 39: never 0), or, once `stopAfterHits` permuted gaps
 * have reached the observed one, the sequential p = h / L after L permutations (Besag, J., &
 * Clifford, P. (1991). Sequential Monte Carlo p-values. *Biometrika*, 78(2), 301–304): a size
 * that says nothing about the outcome is then settled after a few dozen permutations, not B. Source: Good (2005), *Permutation,
 * Parametric and Bootstrap Tests of Hypotheses* (3rd ed.), ch. 3; Kahan et al. (2023), above.
 *
 * @param sizes n_j (J ≥ 2)
 * @param means ȳ_j
 * @param options random permutations to draw and the generator's seed
 */
export function informativeSize(
  sizes: readonly number[],
  means: readonly number[],
  options: { permutations: number; seed: number; stopAfterHits?: number; normalFrom?: number },
): InformativeSize {
  const observed = Math.abs(weightingGap(sizes, means));
  // permuted gaps equal to the observed one but for rounding count as at least as large
  const bar = observed * (1 - 1e-9);
  const count = sizes.length;
  const correlation = sizeMeanCorrelation(sizes, means);
  const shuffled = Float64Array.from(sizes);
  if (factorialAtMost(count, options.permutations)) {
    let hits = 0;
    let total = 0;
    permute(shuffled, count, () => {
      total++;
      if (Math.abs(weightingGap(shuffled, means)) >= bar) hits++;
    });
    return { correlation, gap: weightingGap(sizes, means), p: hits / total, permutations: total, exact: true, normal: false };
  }
  if (count >= (options.normalFrom ?? NORMAL_FROM_GROUPS)) {
    return {
      correlation,
      gap: weightingGap(sizes, means),
      p: permutationNormalP(sizes, means),
      permutations: 0,
      exact: false,
      normal: true,
    };
  }
  // Σ n_π(j) ȳ_j decides the test: N and Σ ȳ_j do not change under a permutation, so the
  // permuted gap is that sum over N minus the mean of the means (one product per group)
  const total = shuffled.reduce((a, b) => a + b, 0);
  const meanOfMeans = means.reduce((a, b) => a + b, 0) / count;
  const ys = Float64Array.from(means);
  const gapOf = (n: Float64Array) => {
    let sum = 0;
    for (let j = 0; j < count; j++) sum += n[j] * ys[j];
    return sum / total - meanOfMeans;
  };
  const limit = Math.abs(gapOf(shuffled)) * (1 - 1e-9);
  const random = seededUniform(options.seed);
  const enough = options.stopAfterHits ?? STOP_AFTER_HITS;
  let hits = 0;
  let drawn = 0;
  while (drawn < options.permutations && hits < enough) {
    for (let j = count - 1; j > 0; j--) {
      const k = Math.floor(random() * (j + 1));
      const t = shuffled[j];
      shuffled[j] = shuffled[k];
      shuffled[k] = t;
    }
    drawn++;
    if (Math.abs(gapOf(shuffled)) >= limit) hits++;
  }
  return {
    correlation,
    gap: weightingGap(sizes, means),
    // stopped at `enough` exceedances: Besag & Clifford's sequential p-value h / L; else (1 + hits)/(1 + B)
    p: hits >= enough ? hits / drawn : (1 + hits) / (1 + drawn),
    permutations: drawn,
    exact: false,
    normal: false,
  };
}

/**
 * Two-sided p of Σ n_π(j) ȳ_j under the normal approximation to its permutation distribution. Over
 * the J! orderings its mean is J n̄ ȳ̄ and its variance Σ(n_j − n̄)² Σ(ȳ_j − ȳ̄)² / (J − 1), so the
 * standardised statistic is z = r √(J − 1), r the size–mean correlation. Source: Hoeffding, W.
 * (1951). A combinatorial central limit theorem. Annals of Mathematical Statistics, 22(4),
 * 558–566 (recalled from memory; the moments are Wald & Wolfowitz's (1944), same journal, 15(4)).
 */
export function permutationNormalP(sizes: readonly number[], means: readonly number[]): number {
  const r = sizeMeanCorrelation(sizes, means);
  if (!Number.isFinite(r)) return 1;
  const z = r * Math.sqrt(sizes.length - 1);
  return 2 * normalCdf(-Math.abs(z), 0, 1);
}

function factorialAtMost(n: number, limit: number): boolean {
  let f = 1;
  for (let k = 2; k <= n; k++) {
    f *= k;
    if (f > limit) return false;
  }
  return true;
}

/** Every ordering of a[0 … k − 1] in turn (Heap's algorithm, Heap 1963, *Comput. J.* 6(3)). */
function permute(a: Float64Array, k: number, visit: () => void): void {
  if (k <= 1) {
    visit();
    return;
  }
  for (let i = 0; i < k - 1; i++) {
    permute(a, k - 1, visit);
    const j = k % 2 === 0 ? i : 0;
    const t = a[j];
    a[j] = a[k - 1];
    a[k - 1] = t;
  }
  permute(a, k - 1, visit);
}
