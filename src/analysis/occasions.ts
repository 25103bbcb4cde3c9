import type { OccasionSummary } from '../source/lookups/lookup.js';

/**
 * Shared timing: the delivery holds no more distinct times than twice the most one person has
 * (a heuristic: a common schedule with some off-schedule times), and at most the occasions listed.
 */
export function sharedTiming(s: OccasionSummary): boolean {
  return s.occasions <= 2 * s.most && s.occasions <= s.byOccasion.length;
}

/**
 * Dropouts' last observed outcome against completers' at the same occasion: the dropout-weighted
 * mean of the differences of means, over the completers' pooled within-occasion SD (a standardised
 * mean difference, Cohen 1988). Occasions with fewer than two completers are left out.
 */
export function dropoutDifference(s: OccasionSummary): { dropouts: number; difference: number } | undefined {
  let dropouts = 0;
  let diff = 0;
  let variance = 0;
  for (const o of s.byOccasion) {
    if (!o.dropouts || o.completers < 2) continue;
    const mean = o.completerSum / o.completers;
    const v = (o.completerSquares - o.completers * mean * mean) / (o.completers - 1);
    dropouts += o.dropouts;
    diff += o.dropoutSum - o.dropouts * mean;
    variance += o.dropouts * Math.max(0, v);
  }
  if (!dropouts || !(variance > 0)) return undefined;
  return { dropouts, difference: diff / dropouts / Math.sqrt(variance / dropouts) };
}
