import { gaussHermite } from './gauss-hermite.js';
import { latentIcc } from './latent-icc.js';
import { medianOddsRatio } from './median-odds-ratio.js';
import type { GroupFamily, GroupPair } from './random-intercept-quadrature.js';
import { distinctPairs, fitRandomIntercept, LOG_TAU_MIN, marginal } from './random-intercept-quadrature.js';
import type { GroupMoments } from './types.js';

/** One group of a 0/1 variable: its size and how many records are 1. */
export interface BinaryGroup {
  n: number;
  ones: number;
}

/** Maximum-likelihood fit of the random-intercept logistic null model (report `outcomes[name].logistic`). */
export interface LogisticNullModel {
  /** between-group variance of the intercept on the logit scale */
  tau2: number;
  /** τ² / (τ² + π²/3): the ICC on the latent scale */
  icc: number;
  /** median odds ratio exp(√(2τ²)·Φ⁻¹(0.75)) */
  mor: number;
  /** maximised log-likelihood of the 0/1 records (no binomial coefficients) */
  logLik: number;
  /** β0, the logit of the probability of a 1 in a typical group (u_j = 0) */
  intercept: number;
  /** adaptive Gauss–Hermite points per group */
  quadraturePoints: number;
  /** false when the optimiser stopped at its search limit (e.g. every group all 0 or all 1) */
  converged: boolean;
}

export interface LogisticOptions {
  /** points of the adaptive Gauss–Hermite rule per group (default 25) */
  points?: number;
}

const UNDEFINED_FIT = { tau2: NaN, icc: NaN, mor: NaN, logLik: NaN, intercept: NaN, converged: false };

/**
 * Per-group counts of a 0/1 variable from its moments: n_j and the number of ones n_j·ȳ_j
 * (the sufficient statistics of the logistic null model).
 *
 * @param groups per-group moments of a variable whose values are all 0 or 1
 * @returns n and the (rounded) count of ones per group, groups with n = 0 dropped
 */
export function binaryGroupsFromMoments(groups: readonly GroupMoments[]): BinaryGroup[] {
  return groups.filter((g) => g.n > 0).map((g) => ({ n: g.n, ones: Math.round(g.n * g.mean) }));
}

/**
 * Whether per-group moments can only come from 0/1 values: each group's mean in [0, 1] and
 * Σx² = Σx (x(1 − x) is ≥ 0 on [0, 1] and zero only at 0 and 1), with an integral count of ones.
 * Values outside [0, 1] can balance ones inside it, so callers also check the column's range.
 *
 * @param groups per-group moments
 * @returns true when every group is consistent with 0/1 values
 */
export function momentsAreZeroOne(groups: readonly GroupMoments[]): boolean {
  return groups.every((g) => {
    const sum = g.n * g.mean;
    const squares = g.ss + g.n * g.mean * g.mean;
    return g.mean >= 0 && g.mean <= 1 && Math.abs(squares - sum) <= 1e-9 * Math.max(1, g.n) && Math.abs(sum - Math.round(sum)) < 1e-6;
  });
}

/**
 * Maximum-likelihood fit of the random-intercept ("null") logistic model
 * logit P(y_ij = 1) = β0 + u_j, u_j ~ N(0, τ²), with its latent-scale ICC and median odds ratio.
 *
 * Each group's marginal likelihood ∫ p^{y_j} (1 − p)^{n_j − y_j} φ(u; 0, τ²) du, p = expit(β0 + u),
 * is integrated by adaptive Gauss–Hermite quadrature: the rule is centred at the mode of the
 * integrand and scaled by its curvature there (Liu, Q., & Pierce, D. A. (1994). A note on
 * Gauss–Hermite quadrature. *Biometrika, 81*(3), 624–629; Pinheiro, J. C., & Bates, D. M.
 * (1995). Approximations to the log-likelihood function in the nonlinear mixed-effects model.
 * *Journal of Computational and Graphical Statistics, 4*(1), 12–35). With one point it is the
 * Laplace approximation; with the default 25 it is, for practical purposes, exact.
 * The likelihood is maximised over (β0, log τ) by Newton's method with the exact gradient and
 * Hessian of the quadrature sum and step halving; should that not settle, by Brent's method on
 * the profile over log τ with β0 maximised for each τ (concave in β0). τ² = 0 (the ordinary logistic
 * model) is a legitimate boundary answer.
 * Groups with the same (n_j, y_j) share one integral, so the cost grows with the number of
 * distinct pairs, not of groups.
 *
 * @param groups per group n_j and the number of ones y_j
 * @param options quadrature points
 * @returns τ², the latent ICC (Snijders & Bosker 2012), the MOR (Larsen & Merlo 2005), the
 *   log-likelihood and β0; NaN fields when fewer than two groups, or when every record is 0 or
 *   every record is 1 (β0 is then infinite)
 */
export function logisticNullModel(groups: readonly BinaryGroup[], options: LogisticOptions = {}): LogisticNullModel {
  const points = options.points ?? 25;
  const rule = gaussHermite(points);
  const pairs = logisticPairs(groups);
  const total = pairs.reduce((s, p) => s + p.count * p.n, 0);
  const ones = pairs.reduce((s, p) => s + p.count * p.y, 0);
  const groupCount = pairs.reduce((s, p) => s + p.count, 0);
  if (groupCount < 2 || ones === 0 || ones === total) return { ...UNDEFINED_FIT, quadraturePoints: points };

  const share = ones / total;
  // τ → 0: every group has the same probability, the ordinary logistic model
  const boundaryLogLik = ones * Math.log(share) + (total - ones) * Math.log(1 - share);
  const start = Math.log(share / (1 - share));
  const fit = fitRandomIntercept(pairs, LOGISTIC, rule, start);
  const { beta: intercept, logTau, logLik, converged } = fit;
  const tau = Math.exp(logTau);
  if (!(logLik > boundaryLogLik + 1e-9) || logTau <= LOG_TAU_MIN) {
    return { tau2: 0, icc: 0, mor: 1, logLik: boundaryLogLik, intercept: start, quadraturePoints: points, converged: true };
  }
  const tau2 = tau * tau;
  return { tau2, icc: latentIcc(tau2), mor: medianOddsRatio(tau2), logLik, intercept, quadraturePoints: points, converged };
}

/**
 * Marginal log-likelihood of the logistic null model at (β0, τ) by adaptive Gauss–Hermite
 * quadrature, with its first and second derivatives in β0 (exact for the quadrature sum).
 * Exported for tests; see {@link logisticNullModel} for the sources.
 *
 * @param groups per group n_j and y_j
 * @param beta β0
 * @param tau τ > 0
 * @param points quadrature points (default 25)
 * @returns the log-likelihood
 */
export function logisticMarginalLogLik(groups: readonly BinaryGroup[], beta: number, tau: number, points = 25): number {
  const pairs = logisticPairs(groups);
  return marginal(pairs, LOGISTIC, gaussHermite(points), tau, beta, new Float64Array(pairs.length)).logLik;
}

function logisticPairs(groups: readonly BinaryGroup[]): GroupPair[] {
  return distinctPairs(
    groups.map((g) => ({ n: g.n, y: g.ones })),
    true,
    'ones',
  );
}

/** log(1 + e^η) without overflow. */
function log1pExp(eta: number): number {
  return eta > 0 ? eta + Math.log1p(Math.exp(-eta)) : Math.log1p(Math.exp(eta));
}

function expit(eta: number): number {
  return eta >= 0 ? 1 / (1 + Math.exp(-eta)) : Math.exp(eta) / (1 + Math.exp(eta));
}

/** Bernoulli records with the logit link: y_j ones among n_j. */
const LOGISTIC: GroupFamily = {
  logLik: (n, y, eta) => y * eta - n * log1pExp(eta),
  mean: (n, eta) => n * expit(eta),
  information: (n, eta) => {
    const p = expit(eta);
    return n * p * (1 - p);
  },
};
