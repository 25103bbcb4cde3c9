import { brentMinimize } from './brent.js';
import type { QuadratureRule } from './gauss-hermite.js';
import { gaussHermite } from './gauss-hermite.js';
import { latentIcc } from './latent-icc.js';
import { medianOddsRatio } from './median-odds-ratio.js';
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
// search range for log τ: τ from about 0.001 to 33 on the logit scale
const LOG_TAU_MIN = -7;
const LOG_TAU_MAX = 3.5;
const HALF_LOG_2PI = 0.5 * Math.log(2 * Math.PI);

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
  const pairs = distinctPairs(groups);
  const total = pairs.reduce((s, p) => s + p.count * p.n, 0);
  const ones = pairs.reduce((s, p) => s + p.count * p.ones, 0);
  const groupCount = pairs.reduce((s, p) => s + p.count, 0);
  if (groupCount < 2 || ones === 0 || ones === total) return { ...UNDEFINED_FIT, quadraturePoints: points };

  const share = ones / total;
  // τ → 0: every group has the same probability, the ordinary logistic model
  const boundaryLogLik = ones * Math.log(share) + (total - ones) * Math.log(1 - share);
  const modes = new Float64Array(pairs.length);
  const start = Math.log(share / (1 - share));
  const fit = newtonFit(pairs, rule, start, modes) ?? profileFit(pairs, rule, start, modes);
  const { beta: intercept, logTau, logLik, converged } = fit;
  const tau = Math.exp(logTau);
  if (!(logLik > boundaryLogLik + 1e-9) || logTau <= LOG_TAU_MIN) {
    return { tau2: 0, icc: 0, mor: 1, logLik: boundaryLogLik, intercept: start, quadraturePoints: points, converged: true };
  }
  const tau2 = tau * tau;
  return { tau2, icc: latentIcc(tau2), mor: medianOddsRatio(tau2), logLik, intercept, quadraturePoints: points, converged };
}

interface Fit {
  beta: number;
  logTau: number;
  logLik: number;
  converged: boolean;
}

/**
 * Newton's method in (β0, log τ) with the exact Hessian of the quadrature sum and step halving;
 * undefined when it does not settle (the caller then profiles), or when log τ runs below the
 * search range (the maximum is then on the boundary τ = 0).
 */
function newtonFit(pairs: Pair[], rule: QuadratureRule, start: number, modes: Float64Array): Fit | undefined {
  let beta = start;
  let logTau = Math.log(0.5);
  let current = marginal(pairs, rule, Math.exp(logTau), beta, modes);
  for (let iteration = 0; iteration < 60; iteration++) {
    const { gradient: g1, gradientLogTau: g2, hessian: h11, hessianCross: h12, hessianLogTau: h22 } = current;
    const det = h11 * h22 - h12 * h12;
    // an ascent direction: Newton's where the Hessian is negative definite, else the gradient
    let d1: number;
    let d2: number;
    if (h11 < 0 && det > 0) {
      d1 = -(h22 * g1 - h12 * g2) / det;
      d2 = -(h11 * g2 - h12 * g1) / det;
    } else {
      d1 = g1 / (Math.abs(h11) + 1);
      d2 = g2 / (Math.abs(h22) + 1);
    }
    const longest = Math.max(Math.abs(d1), Math.abs(d2));
    if (longest > 2) {
      d1 *= 2 / longest;
      d2 *= 2 / longest;
    }
    let next = marginal(pairs, rule, Math.exp(logTau + d2), beta + d1, modes);
    for (let halvings = 0; !(next.logLik >= current.logLik - 1e-10) && halvings < 40; halvings++) {
      d1 /= 2;
      d2 /= 2;
      next = marginal(pairs, rule, Math.exp(logTau + d2), beta + d1, modes);
    }
    beta += d1;
    logTau += d2;
    current = next;
    if (logTau < LOG_TAU_MIN) return { beta, logTau, logLik: current.logLik, converged: true };
    if (logTau > LOG_TAU_MAX) return undefined;
    if (Math.abs(d1) < 1e-9 && Math.abs(d2) < 1e-9) return { beta, logTau, logLik: current.logLik, converged: true };
  }
  return undefined;
}

/** Fallback: Brent's method on the profile over log τ, β0 by Newton for each τ. */
function profileFit(pairs: Pair[], rule: QuadratureRule, start: number, modes: Float64Array): Fit {
  let beta = start;
  const profile = (logTau: number) => {
    beta = maximiseIntercept(pairs, rule, Math.exp(logTau), beta, modes);
    return -marginal(pairs, rule, Math.exp(logTau), beta, modes).logLik;
  };
  const best = brentMinimize(profile, LOG_TAU_MIN, LOG_TAU_MAX, { relTol: 1e-7, absTol: 1e-7 });
  const tau = Math.exp(best.x);
  const intercept = maximiseIntercept(pairs, rule, tau, beta, modes);
  const logLik = marginal(pairs, rule, tau, intercept, modes).logLik;
  return { beta: intercept, logTau: best.x, logLik, converged: best.converged && LOG_TAU_MAX - best.x > 1e-3 };
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
  const pairs = distinctPairs(groups);
  return marginal(pairs, gaussHermite(points), tau, beta, new Float64Array(pairs.length)).logLik;
}

interface Pair extends BinaryGroup {
  count: number;
}

function distinctPairs(groups: readonly BinaryGroup[]): Pair[] {
  const byKey = new Map<string, Pair>();
  groups.forEach((g, index) => {
    if (!Number.isInteger(g.n) || g.n < 0 || !Number.isInteger(g.ones) || g.ones < 0 || g.ones > g.n) {
      throw new Error(`groups[${index}] must have integers 0 <= ones <= n, got n = ${g.n}, ones = ${g.ones}`);
    }
    if (g.n === 0) return;
    const key = `${g.n}:${g.ones}`;
    const pair = byKey.get(key);
    if (pair) pair.count++;
    else byKey.set(key, { n: g.n, ones: g.ones, count: 1 });
  });
  return [...byKey.values()];
}

/** log(1 + e^η) without overflow. */
function log1pExp(eta: number): number {
  return eta > 0 ? eta + Math.log1p(Math.exp(-eta)) : Math.log1p(Math.exp(eta));
}

function expit(eta: number): number {
  return eta >= 0 ? 1 / (1 + Math.exp(-eta)) : Math.exp(eta) / (1 + Math.exp(eta));
}

/** Newton's method on β0 for fixed τ, from `start` (the log-likelihood is concave in β0). */
function maximiseIntercept(pairs: Pair[], rule: QuadratureRule, tau: number, start: number, modes: Float64Array): number {
  let beta = start;
  let current = marginal(pairs, rule, tau, beta, modes);
  for (let iteration = 0; iteration < 100; iteration++) {
    // a non-negative curvature cannot happen for this model, but a bounded gradient step keeps it safe
    let step = current.hessian < 0 ? -current.gradient / current.hessian : Math.sign(current.gradient);
    step = Math.max(-5, Math.min(5, step));
    let next = marginal(pairs, rule, tau, beta + step, modes);
    // halve until the log-likelihood does not fall (guards against overshooting)
    for (let halvings = 0; next.logLik < current.logLik - 1e-12 && halvings < 50; halvings++) {
      step /= 2;
      next = marginal(pairs, rule, tau, beta + step, modes);
    }
    beta += step;
    current = next;
    if (Math.abs(step) < 1e-10 * (1 + Math.abs(beta))) break;
  }
  return beta;
}

/** Log-likelihood with its gradient and Hessian in (β0, log τ), exact for the quadrature sum. */
interface Evaluation {
  logLik: number;
  gradient: number;
  hessian: number;
  /** ∂/∂ log τ */
  gradientLogTau: number;
  hessianCross: number;
  hessianLogTau: number;
}

/**
 * Σ_j log ∫ exp(h_j(u)) du / √(2πτ²) with h_j(u) = y_j(β0 + u) − n_j log(1 + e^{β0+u}) − u²/(2τ²),
 * each integral by Gauss–Hermite points centred at the mode û_j and scaled by σ̂_j = (−h_j''(û_j))^{−1/2}.
 * Derivatives: with a = log f(y | β0 + u), u = τz, the Hessian of log ∫ e^a φ(z) dz is
 * E[∇²a] + Cov(∇a) under the group's posterior, which the same points give.
 */
function marginal(pairs: Pair[], rule: QuadratureRule, tau: number, beta: number, modes: Float64Array): Evaluation {
  const precision = 1 / (tau * tau);
  const { nodes, weights } = rule;
  const points = nodes.length;
  const terms = new Float64Array(points);
  const probs = new Float64Array(points);
  const e: Evaluation = { logLik: 0, gradient: 0, hessian: 0, gradientLogTau: 0, hessianCross: 0, hessianLogTau: 0 };
  for (let k = 0; k < pairs.length; k++) {
    const { n, ones, count } = pairs[k];
    const h = (u: number) => ones * (beta + u) - n * log1pExp(beta + u) - 0.5 * precision * u * u;
    // mode of the concave h by Newton, started from this group's previous mode
    let u = modes[k];
    let hu = h(u);
    for (let iteration = 0; iteration < 100; iteration++) {
      const p = expit(beta + u);
      let step = (ones - n * p - precision * u) / (n * p * (1 - p) + precision);
      let next = h(u + step);
      for (let halvings = 0; next < hu && halvings < 60; halvings++) {
        step /= 2;
        next = h(u + step);
      }
      u += step;
      hu = next;
      if (Math.abs(step) < 1e-10 * (1 + Math.abs(u))) break;
    }
    modes[k] = u;
    const pMode = expit(beta + u);
    const scale = Math.SQRT2 / Math.sqrt(n * pMode * (1 - pMode) + precision);
    let largest = -Infinity;
    for (let q = 0; q < points; q++) {
      const x = nodes[q];
      const v = u + scale * x;
      const eta = beta + v;
      probs[q] = expit(eta);
      terms[q] = Math.log(weights[q]) + x * x + ones * eta - n * log1pExp(eta) - 0.5 * precision * v * v - hu;
      if (terms[q] > largest) largest = terms[q];
    }
    let sum = 0;
    for (let q = 0; q < points; q++) sum += Math.exp(terms[q] - largest);
    const logSum = largest + Math.log(sum);
    e.logLik += count * (hu + Math.log(scale) + logSum - HALF_LOG_2PI - Math.log(tau));
    // posterior moments of the score s = y − n·p, of s·u, and of the information n·p(1 − p)
    let ms = 0;
    let mss = 0;
    let msu = 0;
    let msusu = 0;
    let mssu = 0;
    let mi = 0;
    let miu = 0;
    let miuu = 0;
    for (let q = 0; q < points; q++) {
      const weight = Math.exp(terms[q] - logSum);
      const v = u + scale * nodes[q];
      const p = probs[q];
      const s = ones - n * p;
      const info = n * p * (1 - p);
      ms += weight * s;
      mss += weight * s * s;
      msu += weight * s * v;
      msusu += weight * s * v * s * v;
      mssu += weight * s * s * v;
      mi += weight * info;
      miu += weight * info * v;
      miuu += weight * info * v * v;
    }
    e.gradient += count * ms;
    e.gradientLogTau += count * msu;
    e.hessian += count * (mss - ms * ms - mi);
    e.hessianCross += count * (mssu - ms * msu - miu);
    e.hessianLogTau += count * (msusu - msu * msu - miuu + msu);
  }
  return e;
}
