import type { Profile } from '../profile/types.js';
import type { DistributionSketch } from '../report/snapshot.js';
import type { Roles } from '../roles/types.js';
import { exportUnits, unitMoves } from '../source/lookups/unit-moves.js';
import type { SketchPlan } from '../source/plan/sketch-query.js';
import type { Source } from '../source/types.js';
import { commonGroups } from './group-index.js';
import type { PlanCounts } from './sketch-counts.js';
import { sketchCounts } from './sketch-counts.js';
import { buildSnapshot, sketchPlans } from './snapshot.js';
import type { Baseline, InBoth, Measured } from './types.js';

export interface MeasureOptions {
  includeValues: boolean;
  /** `groups`: the snapshot also keeps each sketched column's bins per group (snapshot.groups.bins) */
  snapshot?: boolean | 'groups';
  baseline?: Baseline;
  /** keep the unit IDs with their groups in this file, for a comparison with the next delivery */
  keepUnits?: string;
}

/**
 * The one extra pass a snapshot needs (the columns' counts at their sketch edges), in which the
 * counts at the previous delivery's edges are taken too (per group, in a pass of their own, when
 * the groups present in both deliveries are compared); beside it, the export of the unit IDs for
 * the next delivery's comparison, or, when both deliveries are files with a unit ID, the join of
 * their unit IDs.
 */
export async function measure(source: Source, profile: Profile, roles: Roles, options: MeasureOptions): Promise<Measured> {
  const own = sketchPlans(profile, roles);
  const previous: SketchPlan[] = [];
  const prevColumns = options.baseline?.report.snapshot.columns ?? {};
  for (const [name, col] of Object.entries(prevColumns)) {
    const here = profile.header.includes(name) ? profile.column(name) : undefined;
    if (col.sketch && here?.numericProfiled) previous.push({ name, storage: here.storage, edges: col.sketch.edges });
  }
  const prevBins = options.baseline?.report.snapshot.groups.bins;
  const prevGrouped = prevBins !== undefined && previous.some((p) => prevBins[p.name]);
  const unit = roles.unit;
  const duck = source.dialect.name === 'duckdb';
  const unitSkipped: string[] = [];
  // every scan of the delivery here is started at once, each on a look-up connection of its own,
  // and all are let finish before an error is passed on
  const [counted, exported, joined] = await Promise.allSettled([
    countAll(source, roles.group, own, options.snapshot === 'groups', previous, prevGrouped),
    options.keepUnits && unit && duck ? exportUnits(source, unit, roles.group, options.keepUnits) : undefined,
    options.baseline ? unitsOf(source, roles, options.baseline, unitSkipped) : null,
  ]);
  if (exported.status === 'rejected') throw exported.reason;
  if (counted.status === 'rejected') throw counted.reason;
  if (joined.status === 'rejected') throw joined.reason;
  const counts = counted.value;
  const sketchOf = (i: number, plans: readonly SketchPlan[], c: PlanCounts): DistributionSketch => ({
    n: c.n,
    edges: [...plans[i].edges],
    atOrBelow: c.atOrBelow,
  });
  const sketches = new Map(own.map((p, i) => [p.name, sketchOf(i, own, counts[i])]));
  const atPreviousEdges = new Map(previous.map((p, i) => [p.name, sketchOf(i, previous, counts[own.length + i])]));
  const bins = options.snapshot === 'groups' ? new Map(own.map((p, i) => [p.name, counts[i].byGroup ?? new Map()])) : undefined;
  const snapshot = buildSnapshot(profile, roles, sketches, options.includeValues, bins);

  const skipped: string[] = [];
  let inBoth: Measured['inBoth'];
  if (options.baseline) {
    if (prevBins) inBoth = shiftInBoth(options.baseline, snapshot, previous, counts.slice(own.length));
    else if (previous.length)
      skipped.push(
        'distribution shift in the groups present in both: the previous report keeps each column’s distribution over the whole ' +
          'delivery only; compare the two files',
      );
  }
  skipped.push(...unitSkipped);
  return { snapshot, atPreviousEdges, ...(inBoth && { inBoth }), units: joined.value, skipped };
}

/**
 * The counts of the delivery's own plans and of the plans at the previous delivery's edges, in
 * that order: one pass when both are counted alike, else two at once. Only the previous edges are
 * counted per group for a comparison of two files (the groups present in both); counting the
 * delivery's own edges per group as well doubled the grouped pass's aggregates
 * (docs/performance.md, "compare").
 */
async function countAll(
  source: Source,
  group: string,
  own: readonly SketchPlan[],
  ownGrouped: boolean,
  previous: readonly SketchPlan[],
  prevGrouped: boolean,
): Promise<PlanCounts[]> {
  const by = (grouped: boolean) => (grouped ? group : undefined);
  if (ownGrouped === prevGrouped || !previous.length || !own.length) {
    return sketchCounts(source, [...own, ...previous], by(ownGrouped || prevGrouped));
  }
  const [a, b] = await Promise.allSettled([sketchCounts(source, own, by(ownGrouped)), sketchCounts(source, previous, by(prevGrouped))]);
  if (a.status === 'rejected') throw a.reason;
  if (b.status === 'rejected') throw b.reason;
  return [...a.value, ...b.value];
}

/** The unit join with the previous delivery, or null with the reason in `skipped`. */
async function unitsOf(source: Source, roles: Roles, baseline: Baseline, skipped: string[]): Promise<Measured['units']> {
  const unit = roles.unit;
  if (!unit) skipped.push('units moved, left or joined: the role map declares no unit ID');
  else if (!baseline.unitsFile)
    skipped.push('units moved, left or joined: the previous delivery was given as its report, which holds no unit ID');
  else if (source.dialect.name !== 'duckdb') skipped.push('units moved, left or joined: needs both deliveries as files');
  else return unitMoves(source, unit, roles.group, baseline.unitsFile);
  return null;
}

/**
 * Per column sketched in both: the bins of the groups present in both, summed on each side (the
 * previous delivery's bins from its snapshot, this delivery's counted at the previous edges),
 * and each such group's own pair of bins.
 */
function shiftInBoth(
  baseline: Baseline,
  current: Measured['snapshot'],
  previous: readonly SketchPlan[],
  counts: readonly PlanCounts[],
): Map<string, InBoth> {
  const before = baseline.report.snapshot;
  const common = commonGroups(before, current);
  const out = new Map<string, InBoth>();
  previous.forEach((plan, i) => {
    const prev = before.groups.bins?.[plan.name];
    const now = counts[i].byGroup;
    if (!prev || !now) return;
    const zero = () => [...plan.edges, 0].map(() => 0);
    const sum = { previous: zero(), current: zero() };
    const byGroup = common.map(({ id, before: at }) => {
      const pair = { id, previous: prev[at] ?? zero(), current: now.get(id) ?? zero() };
      pair.previous.forEach((c, k) => {
        sum.previous[k] += c;
      });
      pair.current.forEach((c, k) => {
        sum.current[k] += c;
      });
      return pair;
    });
    out.set(plan.name, { groups: common.length, ...sum, byGroup });
  });
  return out;
}
