import type { Roles } from '../roles/types.js';
import { pairKey } from '../source/plan/pair-aggregates.js';
import type { PairMoments } from '../stats/pair-moments.js';
import type { Profile } from './types.js';

/**
 * The most (outcome, level-1 variable) pairs the profiling pass computes co-moments for: each costs
 * six aggregates over every record, so a role map with many outcomes and level-1 variables would
 * otherwise multiply the pass. Planned random slopes come first, then the other level-1 variables in
 * role-map order; pairs past the limit get no within/between comparison.
 */
export const PAIR_LIMIT = 48;

/**
 * Which level-1 variables each outcome is paired with in the profiling pass: every outcome with
 * every level-1 variable (the planned slopes first; the others only when `allLevel1`), at most PAIR_LIMIT pairs. Columns that end up
 * without a numeric reading are skipped by the query itself.
 */
export function plannedPairs(roles: Roles, allLevel1 = true): Map<string, string[]> {
  const slopes = roles.slopes ?? [];
  const others = allLevel1 ? roles.level1.filter((c) => !slopes.includes(c)) : [];
  const all = [slopes, others].flatMap((vars) => roles.outcomes.flatMap((y) => vars.filter((x) => x !== y).map((x) => [y, x] as const)));
  const out = new Map<string, string[]>();
  for (const [y, x] of all.slice(0, PAIR_LIMIT)) out.set(y, [...(out.get(y) ?? []), x]);
  return out;
}

/**
 * Per group, the pair's count, means and co-moments over the records where both read as numbers
 * (groups where no record has both are left out); empty when the pass did not pair them.
 */
export function pairMoments(profile: Profile, outcome: string, variable: string): PairMoments[] {
  const names = profile.groups.columnNames();
  const read = (stat: Parameters<typeof pairKey>[2]) => {
    const k = pairKey(outcome, variable, stat);
    return names.includes(k) ? (profile.groups.array(k) as (number | null)[]) : null;
  };
  const n = read('n');
  const [meanX, meanY, sxx, syy, sxy] = (['meanX', 'meanY', 'sxx', 'syy', 'sxy'] as const).map(read);
  if (!n || !meanX || !meanY || !sxx || !syy || !sxy) return [];
  const out: PairMoments[] = [];
  for (let j = 0; j < n.length; j++) {
    const count = n[j] ?? 0;
    if (count <= 0) continue;
    out.push({
      n: count,
      meanX: meanX[j] as number,
      meanY: meanY[j] as number,
      sxx: Math.max(0, sxx[j] ?? 0),
      syy: Math.max(0, syy[j] ?? 0),
      sxy: sxy[j] ?? 0,
      index: j,
    });
  }
  return out;
}

/** Whether the pass computed the pair's co-moments (it did unless past PAIR_LIMIT or not numbers). */
export function hasPair(profile: Profile, outcome: string, variable: string): boolean {
  return profile.groups.columnNames().includes(pairKey(outcome, variable, 'n'));
}
