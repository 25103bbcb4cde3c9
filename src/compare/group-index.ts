import type { Snapshot } from '../report/snapshot.js';

/** Groups in both snapshots: each ID with its position in the previous and in the current snapshot. */
export function commonGroups(previous: Snapshot, current: Snapshot): { id: string; before: number; now: number }[] {
  const at = new Map(previous.groups.ids.map((id, i) => [id, i]));
  return current.groups.ids.flatMap((id, now) => {
    const before = at.get(id);
    return before === undefined ? [] : [{ id, before, now }];
  });
}

/** IDs of one snapshot's groups that the other lacks, in its order. */
export function groupsOnlyIn(one: Snapshot, other: Snapshot): string[] {
  const there = new Set(other.groups.ids);
  return one.groups.ids.filter((id) => !there.has(id));
}
