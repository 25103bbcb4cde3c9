import { gaussHermite } from './gauss-hermite.js';
import type { GroupFamily } from './random-intercept-quadrature.js';
import { distinctPairs, fitRandomIntercept, LOG_TAU_MIN, marginal } from './random-intercept-quadrature.js';

/** One group of a count variable: its records and the sum of their counts (the sufficient statistics). */
export interface CountGroup {
  n: number;
  total: number;
}

/** Maximum-likelihood fit of the random-intercept Poisson null model. */
export interface PoissonFit {
  /** β0, the log of the mean count in a typical group (u_j = 0) */
  intercept: number;
  /** between-group variance of the intercept on the log scale */
  tau2: number;
  /** maximised log-likelihood of the records, Σ log y_ij! included (NaN when that constant is not known) */
  logLik: number;
  /** adaptive Gauss–Hermite points per group */
  quadraturePoints: number;
  /** false when the optimiser stopped at its search limit */
  converged: boolean;
}

export interface PoissonOptions {
  /** points of the adaptive Gauss–Hermite rule per group (default 25) */
  points?: number;
}

/** Poisson records with the log link: y_j the sum of n_j counts. */
const POISSON: GroupFamily = {
  logLik: (n, y, eta) => y * eta - n * Math.exp(eta),
  mean: (n, eta) => n * Math.exp(eta),
  information: (n, eta) => n * Math.exp(eta),
};

/**
 * Maximum-likelihood fit of the random-intercept ("null") Poisson model
 * log E[y_ij | u_j] = β0 + u_j, u_j ~ N(0, τ²), each group's marginal likelihood integrated by
 * adaptive Gauss–Hermite quadrature (Liu & Pierce 1994; Pinheiro & Bates 1995; see
 * fitRandomIntercept). A group enters through n_j and Σ_i y_ij only; the rest of the likelihood,
 * −Σ log y_ij!, does not depend on the parameters and is passed in to make the log-likelihood
 * complete. τ² = 0 (the ordinary Poisson model) is a legitimate boundary answer.
 *
 * @param groups per group n_j and Σ_i y_ij
 * @param logFactorials Σ_ij log y_ij! over the same records (NaN when unknown: the fit is the same)
 * @param options quadrature points
 * @returns β0, τ² and the log-likelihood; NaN fields when fewer than two groups or every count is 0
 */
export function poissonNullModel(groups: readonly CountGroup[], logFactorials: number, options: PoissonOptions = {}): PoissonFit {
  const points = options.points ?? 25;
  const pairs = countPairs(groups);
  const records = pairs.reduce((s, p) => s + p.count * p.n, 0);
  const total = pairs.reduce((s, p) => s + p.count * p.y, 0);
  const groupCount = pairs.reduce((s, p) => s + p.count, 0);
  if (groupCount < 2 || total === 0) {
    return { intercept: NaN, tau2: NaN, logLik: NaN, quadraturePoints: points, converged: false };
  }
  const start = Math.log(total / records);
  // τ → 0: one mean for every group, the ordinary Poisson model
  const boundaryLogLik = total * start - total;
  const fit = fitRandomIntercept(pairs, POISSON, gaussHermite(points), start);
  if (!(fit.logLik > boundaryLogLik + 1e-9) || fit.logTau <= LOG_TAU_MIN) {
    return { intercept: start, tau2: 0, logLik: boundaryLogLik - logFactorials, quadraturePoints: points, converged: true };
  }
  const tau2 = Math.exp(2 * fit.logTau);
  return { intercept: fit.beta, tau2, logLik: fit.logLik - logFactorials, quadraturePoints: points, converged: fit.converged };
}

/**
 * Marginal log-likelihood of the Poisson null model at (β0, τ) by adaptive Gauss–Hermite
 * quadrature, without the constant −Σ log y_ij!. Exported for tests.
 *
 * @param groups per group n_j and Σ_i y_ij
 * @param beta β0
 * @param tau τ > 0
 * @param points quadrature points (default 25)
 */
export function poissonMarginalLogLik(groups: readonly CountGroup[], beta: number, tau: number, points = 25): number {
  const pairs = countPairs(groups);
  return marginal(pairs, POISSON, gaussHermite(points), tau, beta, new Float64Array(pairs.length)).logLik;
}

/**
 * Per-group sizes and sums of a count variable from its moments (n_j and n_j·ȳ_j, rounded).
 *
 * @param groups per-group moments of a variable whose values are counts
 * @returns n and Σ y per group, groups with n = 0 dropped
 */
export function countGroupsFromMoments(groups: readonly { n: number; mean: number }[]): CountGroup[] {
  return groups.filter((g) => g.n > 0).map((g) => ({ n: g.n, total: Math.round(g.n * g.mean) }));
}

function countPairs(groups: readonly CountGroup[]) {
  return distinctPairs(
    groups.map((g) => ({ n: g.n, y: g.total })),
    false,
    'total',
  );
}
