/** Limits for {@link secantRefine}. */
export interface SecantOptions {
  /** first trial step from `x` */
  step: number;
  /** the answer may not move further than this from `x` */
  maxShift: number;
  maxIterations?: number;
}

/**
 * Polish an approximate zero of `g` near `x` by secant steps, keeping the visited point with
 * the smallest |g| and never leaving [x − maxShift, x + maxShift].
 *
 * Used after a derivative-free minimiser: its answer is already in the right basin, so the
 * secant's fast local convergence is safe, and the shift limit discards a step that runs off.
 * Source: Brent (1973), *Algorithms for Minimization without Derivatives*, ch. 3 (successive
 * linear interpolation, i.e. the secant method, and its superlinear convergence).
 *
 * @param g function whose zero is wanted
 * @param x starting point, already close to the zero
 * @param options first step, shift limit and iteration cap
 * @returns the best point found (`x` itself if nothing improved)
 */
export function secantRefine(g: (x: number) => number, x: number, options: SecantOptions): number {
  const maxIterations = options.maxIterations ?? 20;
  let best = x;
  let gBest = g(x);
  let a = x;
  let ga = gBest;
  let b = x + options.step;
  let gb = g(b);
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    if (Math.abs(gb) < Math.abs(gBest)) {
      best = b;
      gBest = gb;
    }
    if (gBest === 0 || gb === ga) break;
    const next = b - (gb * (b - a)) / (gb - ga);
    if (!Number.isFinite(next) || Math.abs(next - x) > options.maxShift) break;
    // Steps below a few ulps cannot improve anything further.
    if (Math.abs(next - b) <= 4 * Number.EPSILON * Math.max(1, Math.abs(b))) break;
    a = b;
    ga = gb;
    b = next;
    gb = g(b);
  }
  return best;
}
