import { brentMinimize } from './brent.js';
import { secantRefine } from './secant-refine.js';

/** Where a profiled deviance is smallest over λ ≥ 0. */
export interface LambdaOptimum {
  /** variance ratio τ²/σ² at the optimum; exactly 0 on the boundary */
  lambda: number;
  /** deviance at `lambda` */
  deviance: number;
}

// log λ from −25 to 12 spans λ ≈ 1.4e−11 … 1.6e5: below the lower end τ² is negligible next to
// σ² (the λ = 0 boundary is evaluated separately), above the upper end σ² is negligible next to τ².
const LOG_LAMBDA_MIN = -25;
const LOG_LAMBDA_MAX = 12;
// Coarse scan spacing on log λ; Brent then only has to refine inside one cell pair.
const LOG_LAMBDA_STEP = 0.5;
// Brent leaves log λ within about 1e−6 of the optimum (the deviance's rounding floor), so a
// polish that moves further than this is not converging to the same optimum and is discarded.
const POLISH_MAX_SHIFT = 1e-3;

/**
 * Minimise a profiled deviance over λ ≥ 0: scan log λ, refine with Brent, polish with the
 * derivative, then compare against the boundary λ = 0 and keep whichever deviance is lower.
 *
 * Optimising on log λ makes the ratio positive by construction and evens out the curvature
 * across scales; the scan makes Brent (which only finds a local minimum) start in the basin of
 * the global one. A minimiser that sees only function values can place the optimum no closer
 * than about √ε relative, because the deviance is flat to rounding there, so secant steps on
 * the derivative finish the job. The boundary must be checked explicitly because λ = 0 is not
 * reachable on the log scale, yet τ̂² = 0 is a legitimate estimate. Source: Brent (1973),
 * *Algorithms for Minimization without Derivatives*, ch. 5 (and ch. 3 for the secant polish);
 * boundary handling as in lme4 (Bates, Mächler, Bolker & Walker 2015, *J. Stat. Softw.* 67(1)),
 * which constrains the relative covariance factor to be ≥ 0.
 *
 * @param deviance −2 × profiled log-likelihood as a function of λ
 * @param derivative d(deviance)/dλ
 * @returns the minimising λ and its deviance
 */
export function minimizeOverLambda(deviance: (lambda: number) => number, derivative: (lambda: number) => number): LambdaOptimum {
  const onLogScale = (logLambda: number): number => deviance(Math.exp(logLambda));

  const steps = Math.round((LOG_LAMBDA_MAX - LOG_LAMBDA_MIN) / LOG_LAMBDA_STEP);
  let bestIndex = 0;
  let bestValue = Infinity;
  for (let k = 0; k <= steps; k++) {
    const value = onLogScale(LOG_LAMBDA_MIN + k * LOG_LAMBDA_STEP);
    if (value < bestValue) {
      bestValue = value;
      bestIndex = k;
    }
  }
  const lower = LOG_LAMBDA_MIN + Math.max(bestIndex - 1, 0) * LOG_LAMBDA_STEP;
  const upper = LOG_LAMBDA_MIN + Math.min(bestIndex + 1, steps) * LOG_LAMBDA_STEP;
  const refined = brentMinimize(onLogScale, lower, upper);

  // Brent never evaluates the bracket ends, so the scan point can still be the better one.
  const start = refined.fx <= bestValue ? refined.x : LOG_LAMBDA_MIN + bestIndex * LOG_LAMBDA_STEP;
  // On the log scale the derivative is λ·dD/dλ (chain rule); it has the same zeros for λ > 0.
  const polished = secantRefine((logLambda) => Math.exp(logLambda) * derivative(Math.exp(logLambda)), start, {
    step: 1e-7 * Math.max(1, Math.abs(start)),
    maxShift: POLISH_MAX_SHIFT,
  });
  const interior: LambdaOptimum = { lambda: Math.exp(polished), deviance: onLogScale(polished) };

  const boundary = deviance(0);
  return boundary <= interior.deviance ? { lambda: 0, deviance: boundary } : interior;
}
