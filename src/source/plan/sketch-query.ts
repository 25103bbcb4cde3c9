import type { Dialect } from '../dialect.js';
import type { Storage } from '../sql.js';
import { finiteDouble, ident } from '../sql.js';

/** A numeric column and the points at which to count its values (one or more sets of edges). */
export interface SketchPlan {
  name: string;
  storage: Storage;
  edges: readonly number[];
}

/** A double as a literal both engines read back to the same double (the shortest round-trip text). */
function doubleLiteral(x: number, d: Dialect): string {
  return d.double(`'${String(x)}'`);
}

/** Key of the count of plan `i`'s values at or below its edge `k` (and `n`: its values that read as numbers). */
export function sketchKey(i: number, k: number | 'n'): string {
  return `s${i}_${k}`;
}

/**
 * One pass over the delivery counting, for each plan, the values at or below each of its edges:
 * the distribution sketches of the snapshot and, against a previous delivery, the current values
 * at the previous delivery's edges. One row comes back; the number of aggregates is bounded by
 * the plans' edges, not by the rows.
 */
export function sketchQuery(view: string, plans: readonly SketchPlan[], d: Dialect): string {
  const inner: string[] = [];
  const aggs: string[] = [];
  const reading = new Map<string, string>();
  for (const [i, plan] of plans.entries()) {
    let x = reading.get(plan.name);
    if (!x) {
      x = `x${reading.size}`;
      reading.set(plan.name, x);
      const c = ident(plan.name);
      inner.push(`${plan.storage === 'double' ? finiteDouble(c) : d.numeric(c)} AS ${x}`);
    }
    aggs.push(`${d.double(`count(${x})`)} AS ${ident(sketchKey(i, 'n'))}`);
    for (const [k, edge] of plan.edges.entries()) {
      aggs.push(`${d.double(`count(CASE WHEN ${x} <= ${doubleLiteral(edge, d)} THEN 1 END)`)} AS ${ident(sketchKey(i, k))}`);
    }
  }
  return `SELECT ${aggs.join(', ')} FROM (SELECT ${inner.join(', ')} FROM ${view}) AS nr_rows`;
}
