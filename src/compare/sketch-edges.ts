import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import type { GroupMoments } from '../stats/types.js';

/** Probabilities of the sketch's edges: 5 %, 10 %, …, 95 % (20 bins). */
const PROBABILITIES = Array.from({ length: 19 }, (_, i) => (i + 1) / 20);

/**
 * The sketch's edges for a column: mean + SD · Φ⁻¹(p), from its per-group moments. For a column
 * near normal the 20 bins hold about 5 % each; for any other the counts at the edges are still
 * exact, only less evenly spread. No edges for a column with fewer than two values or no spread.
 * Edges are rounded to 8 significant digits, so the report stays compact and reads back exactly.
 */
export function sketchEdges(moments: readonly GroupMoments[]): number[] {
  const n = moments.reduce((s, m) => s + m.n, 0);
  if (n < 2) return [];
  const mean = moments.reduce((s, m) => s + m.n * m.mean, 0) / n;
  const ss = moments.reduce((s, m) => s + m.ss + m.n * (m.mean - mean) ** 2, 0);
  const sd = Math.sqrt(ss / (n - 1));
  if (!(sd > 0) || !Number.isFinite(sd)) return [];
  const edges = PROBABILITIES.map((p) => Number((mean + sd * normalQuantile(p, 0, 1)).toPrecision(8)));
  return [...new Set(edges)];
}
