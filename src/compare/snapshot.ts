import { groupIds, groupSizes, groupStat } from '../profile/group-stats.js';
import type { Profile } from '../profile/types.js';
import type { DistributionSketch, Snapshot, SnapshotColumn } from '../report/snapshot.js';
import type { Roles } from '../roles/types.js';
import type { SketchPlan } from '../source/plan/sketch-query.js';
import { hashText } from '../util/hash-text.js';
import { sketchEdges } from './sketch-edges.js';

/** Statistics rounded to this many significant digits: enough to compare, a third of the bytes. */
const DIGITS = 8;
const round = (x: number | null) => (x === null || !Number.isFinite(x) ? null : Number(x.toPrecision(DIGITS)));

/** The numeric columns a snapshot sketches (not the IDs), with their edges. */
export function sketchPlans(profile: Profile, roles: Roles): SketchPlan[] {
  const ids = new Set([roles.group, roles.unit, roles.parent]);
  return profile.header.flatMap((name) => {
    if (ids.has(name)) return [];
    const col = profile.column(name);
    if (!col.numericProfiled || col.numericCount < 2) return [];
    const edges = sketchEdges(profile.moments(name));
    return edges.length ? [{ name, storage: col.storage, edges }] : [];
  });
}

/**
 * The snapshot of a profiled delivery (src/report/snapshot.ts): per group its size, level-2
 * values, outcome moments and missing counts; per column its type, missing count and sketch.
 *
 * @param sketches the sketch of each planned column, by name (one query: sketch-query.ts)
 * @param includeValues false: level-2 values are kept as hashes
 */
export function buildSnapshot(
  profile: Profile,
  roles: Roles,
  sketches: ReadonlyMap<string, DistributionSketch>,
  includeValues: boolean,
  bins?: ReadonlyMap<string, ReadonlyMap<string, number[]>>,
): Snapshot {
  const groups = profile.groups;
  const sizes = groupSizes(groups);
  const level2: Snapshot['groups']['level2'] = {};
  for (const name of roles.level2) level2[name] = groupValues(profile, name, includeValues);
  const outcomes: Snapshot['groups']['outcomes'] = {};
  for (const name of roles.outcomes) {
    if (!profile.column(name).numericProfiled) continue;
    const n = groupStat(groups, name, 'numericCount');
    const mean = groupStat(groups, name, 'mean');
    const ss = groupStat(groups, name, 'ss');
    outcomes[name] = {
      n,
      mean: mean.map(round),
      variance: n.map((k, i) => (k > 1 ? round(Math.max(0, ss[i] as number) / (k - 1)) : null)),
    };
  }
  const missing: Snapshot['groups']['missing'] = {};
  const columns: Record<string, SnapshotColumn> = {};
  for (const name of profile.header) {
    const col = profile.column(name);
    if (name !== roles.group) {
      const nonMissing = groupStat(groups, name, 'nonMissing');
      const perGroup = sizes.map((n, i) => n - nonMissing[i]);
      if (perGroup.some((m) => m > 0)) missing[name] = perGroup;
    }
    const sketch = sketches.get(name);
    columns[name] = { type: col.type, storage: col.storage, missing: col.missing, ...(sketch && { sketch }) };
  }
  const ids = groupIds(groups);
  const binned = bins && {
    bins: Object.fromEntries([...bins].map(([name, byGroup]) => [name, ids.map((id) => byGroup.get(String(id)) ?? [])])),
  };
  return {
    values: includeValues ? 'raw' : 'hashed',
    rows: profile.rows,
    missingGroupRows: profile.missingGroupRows,
    groups: { ids, sizes, level2, outcomes, missing, ...binned },
    columns,
  };
}

/** A level-2 column's one value in each group: null without a value, false when it varies. */
function groupValues(profile: Profile, name: string, includeValues: boolean): (string | null | false)[] {
  const col = profile.column(name);
  const keep = (v: string) => (includeValues ? v : hashText(v));
  if (col.storage === 'double') {
    const lo = groupStat(profile.groups, name, 'numMin');
    const hi = groupStat(profile.groups, name, 'numMax');
    return lo.map((a, i) => (a === null ? null : a === hi[i] ? keep(String(a)) : false));
  }
  const lo = groupStat(profile.groups, name, 'textMin');
  const hi = groupStat(profile.groups, name, 'textMax');
  return lo.map((a, i) => (a === null ? null : a === hi[i] ? keep(a) : false));
}
