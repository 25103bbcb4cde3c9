import { brentMinimize } from './brent.js';
import type { QuadratureRule } from './gauss-hermite.js';

/**
 * The outcome's distribution given the linear predictor η = β0 + u_j, as one group's sufficient
 * statistics (n_j records, y_j the sum of the outcome) enter it. A canonical link, so the score in
 * η is y_j − mean and the information does not depend on y_j.
 */
export interface GroupFamily {
  /** log f(y_j | η) up to terms free of η (e.g. y·η − n·log(1 + e^η) for 0/1, y·η − n·e^η for counts) */
  logLik(n: number, y: number, eta: number): number;
  /** E[y_j | η]: n·expit(η), n·e^η */
  mean(n: number, eta: number): number;
  /** −∂² logLik / ∂η²: n·p(1 − p), n·e^η */
  information(n: number, eta: number): number;
}

/** One distinct (n_j, y_j) pair and how many groups share it. */
export interface GroupPair {
  n: number;
  y: number;
  count: number;
}

/** Where the likelihood is maximised, in (β0, log τ). */
export interface QuadratureFit {
  beta: number;
  logTau: number;
  logLik: number;
  converged: boolean;
}

// search range for log τ: τ from about 0.001 to 33 on the link scale
export const LOG_TAU_MIN = -7;
const LOG_TAU_MAX = 3.5;
const HALF_LOG_2PI = 0.5 * Math.log(2 * Math.PI);

/**
 * Maximum-likelihood fit of a random-intercept model without covariates, η_ij = β0 + u_j,
 * u_j ~ N(0, τ²), for a canonical-link family. Each group's marginal likelihood is integrated by
 * adaptive Gauss–Hermite quadrature, the rule centred at the mode of the integrand and scaled by
 * its curvature there (Liu, Q., & Pierce, D. A. (1994). A note on Gauss–Hermite quadrature.
 * *Biometrika, 81*(3), 624–629; Pinheiro, J. C., & Bates, D. M. (1995). Approximations to the
 * log-likelihood function in the nonlinear mixed-effects model. *Journal of Computational and
 * Graphical Statistics, 4*(1), 12–35). The likelihood is maximised over (β0, log τ) by Newton's
 * method with the exact gradient and Hessian of the quadrature sum and step halving; should that
 * not settle, by Brent's method on the profile over log τ with β0 maximised for each τ.
 *
 * @param pairs distinct (n_j, y_j) with their multiplicity
 * @param family the outcome's distribution
 * @param rule the Gauss–Hermite rule
 * @param start β0 to start from (the link of the overall mean)
 * @returns the maximum; log τ below LOG_TAU_MIN means the boundary τ = 0
 */
export function fitRandomIntercept(pairs: readonly GroupPair[], family: GroupFamily, rule: QuadratureRule, start: number): QuadratureFit {
  const modes = new Float64Array(pairs.length);
  return newtonFit(pairs, family, rule, start, modes) ?? profileFit(pairs, family, rule, start, modes);
}

/**
 * Groups with the same (n_j, y_j) share one integral, so the cost grows with the number of
 * distinct pairs, not of groups.
 *
 * @param groups per group n_j and y_j (integers, 0 ≤ y_j, and y_j ≤ n_j when `bounded`)
 * @param bounded whether y_j cannot exceed n_j (0/1 outcomes)
 * @param name how the caller calls y_j, for the error
 * @throws on a group that breaks those limits
 */
export function distinctPairs(groups: readonly { n: number; y: number }[], bounded: boolean, name: string): GroupPair[] {
  const byKey = new Map<string, GroupPair>();
  groups.forEach((g, index) => {
    if (!Number.isInteger(g.n) || g.n < 0 || !Number.isInteger(g.y) || g.y < 0 || (bounded && g.y > g.n)) {
      const limit = bounded ? `0 <= ${name} <= n` : `n >= 0 and ${name} >= 0`;
      throw new Error(`groups[${index}] must have integers ${limit}, got n = ${g.n}, ${name} = ${g.y}`);
    }
    if (g.n === 0) return;
    const key = `${g.n}:${g.y}`;
    const pair = byKey.get(key);
    if (pair) pair.count++;
    else byKey.set(key, { n: g.n, y: g.y, count: 1 });
  });
  return [...byKey.values()];
}

/**
 * Newton's method in (β0, log τ) with the exact Hessian of the quadrature sum and step halving;
 * undefined when it does not settle (the caller then profiles), or when log τ runs below the
 * search range (the maximum is then on the boundary τ = 0).
 */
function newtonFit(
  pairs: readonly GroupPair[],
  family: GroupFamily,
  rule: QuadratureRule,
  start: number,
  modes: Float64Array,
): QuadratureFit | undefined {
  let beta = start;
  let logTau = Math.log(0.5);
  let current = marginal(pairs, family, rule, Math.exp(logTau), beta, modes);
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
    let next = marginal(pairs, family, rule, Math.exp(logTau + d2), beta + d1, modes);
    for (let halvings = 0; !(next.logLik >= current.logLik - 1e-10) && halvings < 40; halvings++) {
      d1 /= 2;
      d2 /= 2;
      next = marginal(pairs, family, rule, Math.exp(logTau + d2), beta + d1, modes);
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
function profileFit(
  pairs: readonly GroupPair[],
  family: GroupFamily,
  rule: QuadratureRule,
  start: number,
  modes: Float64Array,
): QuadratureFit {
  let beta = start;
  const profile = (logTau: number) => {
    beta = maximiseIntercept(pairs, family, rule, Math.exp(logTau), beta, modes);
    return -marginal(pairs, family, rule, Math.exp(logTau), beta, modes).logLik;
  };
  const best = brentMinimize(profile, LOG_TAU_MIN, LOG_TAU_MAX, { relTol: 1e-7, absTol: 1e-7 });
  const tau = Math.exp(best.x);
  const intercept = maximiseIntercept(pairs, family, rule, tau, beta, modes);
  const logLik = marginal(pairs, family, rule, tau, intercept, modes).logLik;
  return { beta: intercept, logTau: best.x, logLik, converged: best.converged && LOG_TAU_MAX - best.x > 1e-3 };
}

/** Newton's method on β0 for fixed τ, from `start` (the log-likelihood is concave in β0). */
function maximiseIntercept(
  pairs: readonly GroupPair[],
  family: GroupFamily,
  rule: QuadratureRule,
  tau: number,
  start: number,
  modes: Float64Array,
): number {
  let beta = start;
  let current = marginal(pairs, family, rule, tau, beta, modes);
  for (let iteration = 0; iteration < 100; iteration++) {
    // a non-negative curvature cannot happen for these models, but a bounded gradient step keeps it safe
    let step = current.hessian < 0 ? -current.gradient / current.hessian : Math.sign(current.gradient);
    step = Math.max(-5, Math.min(5, step));
    let next = marginal(pairs, family, rule, tau, beta + step, modes);
    // halve until the log-likelihood does not fall (guards against overshooting)
    for (let halvings = 0; next.logLik < current.logLik - 1e-12 && halvings < 50; halvings++) {
      step /= 2;
      next = marginal(pairs, family, rule, tau, beta + step, modes);
    }
    beta += step;
    current = next;
    if (Math.abs(step) < 1e-10 * (1 + Math.abs(beta))) break;
  }
  return beta;
}

/** Log-likelihood with its gradient and Hessian in (β0, log τ), exact for the quadrature sum. */
export interface Evaluation {
  logLik: number;
  gradient: number;
  hessian: number;
  /** ∂/∂ log τ */
  gradientLogTau: number;
  hessianCross: number;
  hessianLogTau: number;
}

/**
 * Σ_j log ∫ exp(h_j(u)) du / √(2πτ²) with h_j(u) = log f(y_j | β0 + u) − u²/(2τ²), each integral
 * by Gauss–Hermite points centred at the mode û_j and scaled by σ̂_j = (−h_j''(û_j))^{−1/2}.
 * Derivatives: with a = log f(y | β0 + u), u = τz, the Hessian of log ∫ e^a φ(z) dz is
 * E[∇²a] + Cov(∇a) under the group's posterior, which the same points give.
 *
 * @param modes each pair's mode from the last call (a warm start), updated in place
 */
export function marginal(
  pairs: readonly GroupPair[],
  family: GroupFamily,
  rule: QuadratureRule,
  tau: number,
  beta: number,
  modes: Float64Array,
): Evaluation {
  const precision = 1 / (tau * tau);
  const { nodes, weights } = rule;
  const points = nodes.length;
  const terms = new Float64Array(points);
  const means = new Float64Array(points);
  const infos = new Float64Array(points);
  const e: Evaluation = { logLik: 0, gradient: 0, hessian: 0, gradientLogTau: 0, hessianCross: 0, hessianLogTau: 0 };
  for (let k = 0; k < pairs.length; k++) {
    const { n, y, count } = pairs[k];
    const h = (u: number) => family.logLik(n, y, beta + u) - 0.5 * precision * u * u;
    // mode of the concave h by Newton, started from this group's previous mode
    let u = modes[k];
    let hu = h(u);
    for (let iteration = 0; iteration < 100; iteration++) {
      let step = (y - family.mean(n, beta + u) - precision * u) / (family.information(n, beta + u) + precision);
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
    const scale = Math.SQRT2 / Math.sqrt(family.information(n, beta + u) + precision);
    let largest = -Infinity;
    for (let q = 0; q < points; q++) {
      const x = nodes[q];
      const v = u + scale * x;
      const eta = beta + v;
      means[q] = family.mean(n, eta);
      infos[q] = family.information(n, eta);
      terms[q] = Math.log(weights[q]) + x * x + family.logLik(n, y, eta) - 0.5 * precision * v * v - hu;
      if (terms[q] > largest) largest = terms[q];
    }
    let sum = 0;
    for (let q = 0; q < points; q++) sum += Math.exp(terms[q] - largest);
    const logSum = largest + Math.log(sum);
    e.logLik += count * (hu + Math.log(scale) + logSum - HALF_LOG_2PI - Math.log(tau));
    // posterior moments of the score s = y − E[y | η], of s·u, and of the information
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
      const s = y - means[q];
      const info = infos[q];
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
