import type { SketchPlan } from '../source/plan/sketch-query.js';
import { sketchKey, sketchQuery } from '../source/plan/sketch-query.js';
import type { Source } from '../source/types.js';

/** One plan's counts: over the delivery, and (when asked) per group as bins. */
export interface PlanCounts {
  n: number;
  atOrBelow: number[];
  /** per group ID: the counts in the plan's bins (edge k−1, edge k], the last above the last edge */
  byGroup?: Map<string, number[]>;
}

/**
 * Count every plan's values at its edges in one pass. Per group (one row each) when `group` is
 * given: the delivery's counts are then the groups' sums, records without a group ID included.
 */
export async function sketchCounts(source: Source, plans: readonly SketchPlan[], group?: string): Promise<PlanCounts[]> {
  if (!plans.length) return [];
  const rows = await source.all<Record<string, unknown>>(sketchQuery(source.view, plans, source.dialect, group));
  return plans.map((plan, i) => {
    // the column names once per plan, not once per group and edge (5,000 groups × 10 plans × 19
    // edges built 950,000 strings: 0.2 s of a compare)
    const keys = plan.edges.map((_, k) => sketchKey(i, k));
    const nKey = sketchKey(i, 'n');
    const cumulative = (row: Record<string, unknown>) => keys.map((key) => Number(row[key]));
    const atOrBelow = plan.edges.map(() => 0);
    let n = 0;
    const byGroup = group === undefined ? undefined : new Map<string, number[]>();
    for (const row of rows) {
      const at = cumulative(row);
      const rowN = Number(row[nKey]);
      n += rowN;
      at.forEach((c, k) => {
        atOrBelow[k] += c;
      });
      if (byGroup && row.group !== null && row.group !== undefined) byGroup.set(String(row.group), binsOf(at, rowN));
    }
    return { n, atOrBelow, ...(byGroup && { byGroup }) };
  });
}

/** Counts at or below each edge (and all values) as the counts in each bin. */
export function binsOf(atOrBelow: readonly number[], n: number): number[] {
  return [...atOrBelow, n].map((c, k, all) => c - (k ? all[k - 1] : 0));
}
