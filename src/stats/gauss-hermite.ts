/** Nodes and weights of an n-point Gauss–Hermite rule. */
export interface QuadratureRule {
  /** abscissas x_k, in decreasing order */
  nodes: Float64Array;
  /** weights w_k for the weight function e^{−x²} */
  weights: Float64Array;
}

// π^{−1/4}: the value of the orthonormal Hermite polynomial of degree 0
const PI_TO_MINUS_QUARTER = 0.7511255444649425;
const NEWTON_TOLERANCE = 3e-14;
const MAX_NEWTON_STEPS = 100;

const cache = new Map<number, QuadratureRule>();

/**
 * Gauss–Hermite quadrature, ∫ e^{−x²} f(x) dx ≈ Σ_k w_k f(x_k), exact for polynomials f of
 * degree up to 2n − 1.
 *
 * The roots of the degree-n Hermite polynomial are found by Newton's method on the
 * orthonormal three-term recurrence, started from asymptotic approximations of the largest
 * roots and then from the roots already found; the weights are 2 / (p'_n(x_k))² in the
 * orthonormal scaling. Source: Press, W. H., Teukolsky, S. A., Vetterling, W. T., & Flannery,
 * B. P. (2007). *Numerical Recipes* (3rd ed.), §4.6.2, routine `gauher`. O(n²) work; the rule
 * for each n is computed once and cached.
 *
 * @param n number of points, 1 ≤ n ≤ 100
 * @returns the nodes and weights
 * @throws when n is not an integer in [1, 100]
 * @example
 * gaussHermite(3); // nodes ±√1.5 and 0, weights √π/6, 2√π/3, √π/6
 */
export function gaussHermite(n: number): QuadratureRule {
  if (!Number.isInteger(n) || n < 1 || n > 100) throw new Error('gaussHermite requires an integer n in [1, 100]');
  const hit = cache.get(n);
  if (hit) return hit;
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  const half = Math.floor((n + 1) / 2);
  let z = 0;
  for (let i = 0; i < half; i++) {
    // starting values for the i-th largest root (Numerical Recipes, gauher)
    if (i === 0) z = Math.sqrt(2 * n + 1) - 1.85575 * (2 * n + 1) ** -0.16667;
    else if (i === 1) z -= (1.14 * n ** 0.426) / z;
    else if (i === 2) z = 1.86 * z - 0.86 * nodes[0];
    else if (i === 3) z = 1.91 * z - 0.91 * nodes[1];
    else z = 2 * z - nodes[i - 2];
    let derivative = 0;
    for (let step = 0; step < MAX_NEWTON_STEPS; step++) {
      // p1 ends as the orthonormal Hermite polynomial of degree n at z, p2 as degree n − 1
      let p1 = PI_TO_MINUS_QUARTER;
      let p2 = 0;
      for (let j = 0; j < n; j++) {
        const p3 = p2;
        p2 = p1;
        p1 = z * Math.sqrt(2 / (j + 1)) * p2 - Math.sqrt(j / (j + 1)) * p3;
      }
      derivative = Math.sqrt(2 * n) * p2;
      const previous = z;
      z = previous - p1 / derivative;
      if (Math.abs(z - previous) <= NEWTON_TOLERANCE) break;
    }
    nodes[i] = z;
    nodes[n - 1 - i] = -z;
    weights[i] = 2 / (derivative * derivative);
    weights[n - 1 - i] = weights[i];
  }
  const rule = { nodes, weights };
  cache.set(n, rule);
  return rule;
}
