import { gaussHermite } from './gauss-hermite.js';

// enough points for the step-like integrand exp(−e^{β0 + u}) at the τ a count outcome shows
const POINTS = 100;

/**
 * Zeros a random-intercept Poisson model expects among N records, N · E_u[exp(−e^{β0 + u})],
 * u ~ N(0, τ²): each record's marginal probability of a 0, integrated over the group effect by
 * Gauss–Hermite quadrature (∫ f(u) φ(u; 0, τ²) du = π^{−1/2} Σ_k w_k f(√2 τ x_k)). More zeros
 * observed than expected point at zero inflation or level-1 overdispersion.
 *
 * Source: the model's own probability of a zero, P(y = 0 | u) = e^{−λ(u)}; Gauss–Hermite:
 * Press, W. H., et al. (2007). *Numerical Recipes* (3rd ed.), §4.6.2.
 *
 * @param records N
 * @param intercept β0 (log scale)
 * @param tau2 τ²
 * @returns the expected number of zeros
 */
export function poissonExpectedZeros(records: number, intercept: number, tau2: number): number {
  const { nodes, weights } = gaussHermite(POINTS);
  const scale = Math.SQRT2 * Math.sqrt(tau2);
  let sum = 0;
  for (let k = 0; k < nodes.length; k++) sum += weights[k] * Math.exp(-Math.exp(intercept + scale * nodes[k]));
  return (records * sum) / Math.sqrt(Math.PI);
}
