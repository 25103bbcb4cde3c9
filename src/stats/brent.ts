/** Result of a one-dimensional minimisation. */
export interface BrentResult {
  /** abscissa of the minimum found */
  x: number;
  /** function value at `x` */
  fx: number;
  /** function evaluations used */
  evaluations: number;
  /** false when `maxIterations` ran out before the tolerance was met */
  converged: boolean;
}

/** Tolerances for {@link brentMinimize}; the stopping width is `relTol·|x| + absTol`. */
export interface BrentOptions {
  /** relative tolerance; Brent advises no less than √ε because f itself carries rounding noise */
  relTol?: number;
  /** absolute tolerance, needed when the minimum sits near x = 0 */
  absTol?: number;
  maxIterations?: number;
}

// (3 − √5)/2: the golden-section fraction; each fallback step shrinks the bracket by this much.
const GOLDEN_FRACTION = (3 - Math.sqrt(5)) / 2;

/**
 * Find a local minimum of `f` on [lower, upper] by Brent's method (golden section safeguarding
 * successive parabolic interpolation).
 *
 * Source: Brent, R. P. (1973). *Algorithms for Minimization without Derivatives*, ch. 5,
 * procedure `localmin`. The endpoints themselves are never evaluated, so a caller whose minimum
 * may lie on an endpoint must compare that value itself.
 *
 * @param f function to minimise
 * @param lower left end of the search interval
 * @param upper right end of the search interval (must exceed `lower`)
 * @param options stopping tolerances
 * @returns the minimiser, its value and the work done
 */
// biome-ignore lint/complexity/noExcessiveCognitiveComplexity: Brent's published localmin, kept whole to check step by step
export function brentMinimize(f: (x: number) => number, lower: number, upper: number, options: BrentOptions = {}): BrentResult {
  if (!(Number.isFinite(lower) && Number.isFinite(upper) && lower < upper)) {
    throw new Error('brent: lower and upper must be finite with lower < upper');
  }
  const relTol = options.relTol ?? Math.sqrt(Number.EPSILON);
  const absTol = options.absTol ?? 1e-12;
  const maxIterations = options.maxIterations ?? 500;

  // a, b bracket the minimum; x is the best point so far, w the second best, v the previous w.
  let a = lower;
  let b = upper;
  let x = a + GOLDEN_FRACTION * (b - a);
  let w = x;
  let v = x;
  let fx = f(x);
  let fw = fx;
  let fv = fx;
  let evaluations = 1;
  // d is the current step, e the step before last (the parabola must beat half of it).
  let d = 0;
  let e = 0;

  for (let iteration = 0; iteration < maxIterations; iteration++) {
    const midpoint = 0.5 * (a + b);
    const tol = relTol * Math.abs(x) + absTol;
    const tol2 = 2 * tol;
    if (Math.abs(x - midpoint) <= tol2 - 0.5 * (b - a)) {
      return { x, fx, evaluations, converged: true };
    }

    let takeGolden = true;
    if (Math.abs(e) > tol) {
      // Fit a parabola through (v, fv), (w, fw), (x, fx); the step to its vertex is p/q.
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      // Accept the parabolic step only if it is inside the bracket and shrinks faster than
      // bisection would, otherwise convergence could stall.
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        // f must not be evaluated too close to a or b.
        if (u - a < tol2 || b - u < tol2) d = x < midpoint ? tol : -tol;
        takeGolden = false;
      }
    }
    if (takeGolden) {
      e = (x < midpoint ? b : a) - x;
      d = GOLDEN_FRACTION * e;
    }

    // Never step by less than tol: points closer than that cannot be told apart reliably.
    const u = Math.abs(d) >= tol ? x + d : x + (d > 0 ? tol : -tol);
    const fu = f(u);
    evaluations++;

    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, fx, evaluations, converged: false };
}
