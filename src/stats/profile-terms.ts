import { multiplicity, spreadOf } from './size-classes.js';
import { withinSumOfSquares } from './sums.js';
import type { GroupMoments } from './types.js';

// Terms of the one-way random-intercept likelihood at a fixed variance ratio λ = τ²/σ².
// Group j's mean has variance σ²(1 + n_j λ)/n_j, so its precision weight (in units of 1/σ²)
// is w_j = n_j / (1 + n_j λ). Source: Searle, Casella & McCulloch (1992), *Variance
// Components*, ch. 3 (the one-way classification) and ch. 6 (ML and REML).

/**
 * Generalised-least-squares estimate of the grand mean at λ, μ̂(λ) = Σ w_j ȳ_j / Σ w_j.
 *
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 3.
 *
 * @param groups non-empty per-group moments
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns μ̂(λ)
 */
export function glsMean(groups: readonly GroupMoments[], lambda: number): number {
  let weighted = 0;
  let total = 0;
  for (const g of groups) {
    const w = (multiplicity(g) * g.n) / (1 + g.n * lambda);
    weighted += w * g.mean;
    total += w;
  }
  return weighted / total;
}

/**
 * Sum of the group-mean precision weights Σ w_j = Σ n_j / (1 + n_j λ), which is σ²·X′V⁻¹X.
 *
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 3.
 *
 * @param groups non-empty per-group moments
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns Σ w_j
 */
export function sumWeights(groups: readonly GroupMoments[], lambda: number): number {
  return groups.reduce((sum, g) => sum + (multiplicity(g) * g.n) / (1 + g.n * lambda), 0);
}

/**
 * Log-determinant of the scaled covariance, log|V/σ²| = Σ log(1 + n_j λ).
 *
 * Each group's covariance σ²(I + λ11′) has determinant σ^{2n_j}(1 + n_j λ); log1p keeps the
 * term accurate for the tiny λ the optimiser probes near the τ² = 0 boundary.
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 3.
 *
 * @param groups non-empty per-group moments
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns Σ log(1 + n_j λ)
 */
export function logDetRatio(groups: readonly GroupMoments[], lambda: number): number {
  return groups.reduce((sum, g) => sum + multiplicity(g) * Math.log1p(g.n * lambda), 0);
}

/**
 * Scaled residual quadratic form Q(λ) = W + Σ w_j (ȳ_j − μ̂(λ))², i.e. σ²·r′V⁻¹r at the GLS mean.
 *
 * Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 3; Q/σ² is the
 * Sherman–Morrison form of the quadratic per group.
 *
 * @param groups non-empty per-group moments
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns Q(λ)
 */
export function profiledQ(groups: readonly GroupMoments[], lambda: number): number {
  const mu = glsMean(groups, lambda);
  const between = groups.reduce((sum, g) => sum + (g.n / (1 + g.n * lambda)) * (spreadOf(g) + multiplicity(g) * (g.mean - mu) ** 2), 0);
  return withinSumOfSquares(groups) + between;
}

/**
 * Sum of squared precision weights Σ w_j², which is −d(Σ w_j)/dλ because dw_j/dλ = −w_j².
 *
 * Source: differentiation of w_j = n_j / (1 + n_j λ); Searle, Casella & McCulloch (1992),
 * *Variance Components*, ch. 6 (ML/REML score equations).
 *
 * @param groups non-empty per-group moments
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns Σ w_j²
 */
export function sumSquaredWeights(groups: readonly GroupMoments[], lambda: number): number {
  return groups.reduce((sum, g) => sum + multiplicity(g) * (g.n / (1 + g.n * lambda)) ** 2, 0);
}

/**
 * Derivative of the profiled quadratic form, dQ/dλ = −Σ w_j² (ȳ_j − μ̂(λ))².
 *
 * μ̂ minimises Q, so ∂Q/∂μ = 0 there and only the weights' own derivative −w_j² remains
 * (envelope theorem). Source: Searle, Casella & McCulloch (1992), *Variance Components*, ch. 6.
 *
 * @param groups non-empty per-group moments
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns dQ/dλ (≤ 0)
 */
export function profiledQDerivative(groups: readonly GroupMoments[], lambda: number): number {
  const mu = glsMean(groups, lambda);
  return -groups.reduce((sum, g) => sum + (g.n / (1 + g.n * lambda)) ** 2 * (spreadOf(g) + multiplicity(g) * (g.mean - mu) ** 2), 0);
}

/** Every sum the profiled deviances and their derivatives need at one λ. */
export interface LikelihoodTerms {
  /** μ̂(λ) */
  mu: number;
  /** Q(λ) */
  q: number;
  /** dQ/dλ */
  dq: number;
  /** Σ log(1 + n_j λ) */
  logDet: number;
  /** Σ w_j */
  sumW: number;
  /** Σ w_j² */
  sumW2: number;
  /** N = Σ n_j */
  total: number;
}

/**
 * The terms above (glsMean, profiledQ, profiledQDerivative, logDetRatio, sumWeights,
 * sumSquaredWeights) in two passes over the groups instead of one pass each: a fit evaluates
 * them a hundred times or more, over thousands of groups. Same formulas and sources as each of
 * those functions (Searle, Casella & McCulloch 1992, ch. 3 and 6); the test beside them checks
 * that the results agree.
 *
 * @param groups non-empty per-group moments
 * @param lambda variance ratio τ²/σ² (≥ 0)
 * @returns the sums at λ
 */
export function likelihoodTerms(groups: readonly GroupMoments[], lambda: number): LikelihoodTerms {
  let sumW = 0;
  let sumWY = 0;
  let sumW2 = 0;
  let logDet = 0;
  let within = 0;
  let total = 0;
  for (const g of groups) {
    const c = multiplicity(g);
    total += c * g.n;
    const w = g.n / (1 + g.n * lambda);
    sumW += c * w;
    sumWY += c * w * g.mean;
    sumW2 += c * w * w;
    logDet += c * Math.log1p(g.n * lambda);
    within += g.ss;
  }
  const mu = sumWY / sumW;
  let between = 0;
  let dq = 0;
  for (const g of groups) {
    const w = g.n / (1 + g.n * lambda);
    const d = spreadOf(g) + multiplicity(g) * (g.mean - mu) ** 2;
    between += w * d;
    dq -= w * w * d;
  }
  return { mu, q: within + between, dq, logDet, sumW, sumW2, total };
}
