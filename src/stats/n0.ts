import { totalCount } from './sums.js';
import type { GroupMoments } from './types.js';

/**
 * Effective group size of an unbalanced one-way design, n0 = (N − Σ n_j²/N) / (J − 1), the
 * coefficient of τ² in E[MSB] = σ² + n0 τ².
 *
 * With unequal groups n0 < n̄, so using n̄ in ICC(1) would understate the between-group share.
 * Source: Searle (1971), *Linear Models*, ch. 9; Snedecor & Cochran (1989), *Statistical
 * Methods* (8th ed.); Bliese (2000).
 *
 * @param groups non-empty per-group moments (J ≥ 2)
 * @returns n0, equal to the common n when the design is balanced
 */
export function effectiveGroupSize(groups: readonly GroupMoments[]): number {
  const n = totalCount(groups);
  const sumSquares = groups.reduce((sum, g) => sum + g.n * g.n, 0);
  return (n - sumSquares / n) / (groups.length - 1);
}
