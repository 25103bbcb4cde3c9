import type { Profile } from '../profile/types.js';
import type { DistributionSketch } from '../report/snapshot.js';
import type { Roles } from '../roles/types.js';
import { exportUnits, unitMoves } from '../source/lookups/unit-moves.js';
import type { SketchPlan } from '../source/plan/sketch-query.js';
import { sketchKey, sketchQuery } from '../source/plan/sketch-query.js';
import type { Source } from '../source/types.js';
import { buildSnapshot, sketchPlans } from './snapshot.js';
import type { Baseline, Measured } from './types.js';

export interface MeasureOptions {
  includeValues: boolean;
  baseline?: Baseline;
  /** keep the unit IDs with their groups in this file, for a comparison with the next delivery */
  keepUnits?: string;
}

/**
 * The one extra pass a snapshot needs (the columns' counts at their sketch edges), in which the
 * counts at the previous delivery's edges are taken too; then, when both deliveries are files with
 * a unit ID, the join of their unit IDs.
 */
export async function measure(source: Source, profile: Profile, roles: Roles, options: MeasureOptions): Promise<Measured> {
  const own = sketchPlans(profile, roles);
  const previous: SketchPlan[] = [];
  const prevColumns = options.baseline?.report.snapshot.columns ?? {};
  for (const [name, col] of Object.entries(prevColumns)) {
    const here = profile.header.includes(name) ? profile.column(name) : undefined;
    if (col.sketch && here?.numericProfiled) previous.push({ name, storage: here.storage, edges: col.sketch.edges });
  }
  const plans = [...own, ...previous];
  const counts = plans.length ? (await source.all<Record<string, number>>(sketchQuery(source.view, plans, source.dialect)))[0] : {};
  const sketchOf = (i: number): DistributionSketch => ({
    n: Number(counts[sketchKey(i, 'n')]),
    edges: [...plans[i].edges],
    atOrBelow: plans[i].edges.map((_, k) => Number(counts[sketchKey(i, k)])),
  });
  const sketches = new Map(own.map((p, i) => [p.name, sketchOf(i)]));
  const atPreviousEdges = new Map(previous.map((p, i) => [p.name, sketchOf(own.length + i)]));
  const snapshot = buildSnapshot(profile, roles, sketches, options.includeValues);

  const skipped: string[] = [];
  const unit = roles.unit;
  const duck = source.dialect.name === 'duckdb';
  if (options.keepUnits && unit && duck) await exportUnits(source, unit, roles.group, options.keepUnits);
  let units: Measured['units'] = null;
  if (options.baseline) {
    if (!unit) skipped.push('units moved, left or joined: the role map declares no unit ID');
    else if (!options.baseline.unitsFile)
      skipped.push('units moved, left or joined: the previous delivery was given as its report, which holds no unit ID');
    else if (!duck) skipped.push('units moved, left or joined: needs both deliveries as files');
    else units = await unitMoves(source, unit, roles.group, options.baseline.unitsFile);
  }
  return { snapshot, atPreviousEdges, units, skipped };
}
