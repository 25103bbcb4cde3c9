import type { ColumnTable } from 'arquero';
import { key } from '../source/plan/profile-query.js';

/**
 * The per-group statistics the profiling pass computes for a column, by name and with the type of
 * one group's value. Text statistics exist for columns read as text (not the unit ID); number
 * statistics for numeric-profiled columns (`ColumnProfile.numericProfiled`).
 */
export interface GroupStatValues {
  /** non-missing values */
  nonMissing: number;
  /** smallest and largest value as text (equal ⇔ constant in the group) */
  textMin: string | null;
  textMax: string | null;
  /** values that read as numbers */
  numericCount: number;
  numMin: number | null;
  numMax: number | null;
  mean: number | null;
  /** within-group sum of squares */
  ss: number | null;
  /** text values that may be numbers written another way (src/profile/number-like.ts) */
  numberLike: number;
}

export type GroupStat = keyof GroupStatValues;

/** Each statistic's aggregate in the profiling query: the one place that knows the query's keys. */
const AGGREGATE: Record<GroupStat, string> = {
  nonMissing: 'nn',
  textMin: 'min',
  textMax: 'max',
  numericCount: 'num',
  numMin: 'nmin',
  numMax: 'nmax',
  mean: 'mean',
  ss: 'ss',
  numberLike: 'like',
};

export const GROUP_STATS = Object.keys(AGGREGATE) as GroupStat[];

/** Tables that hold one row per group (the profile's `groups`, or the raw result with the missing-ID group). */
type GroupTable = Pick<ColumnTable, 'array'>;

/**
 * One statistic of a column for every group, in the group table's order (a new array each call,
 * so callers may sort or change it).
 *
 * @param groups the profile's group table
 * @param column a profiled column (not the group ID)
 * @param stat which statistic
 */
export function groupStat<S extends GroupStat>(groups: GroupTable, column: string, stat: S): GroupStatValues[S][] {
  return groups.array(key(column, AGGREGATE[stat])) as GroupStatValues[S][];
}

/**
 * Per group, how many values of a count outcome read as 0, in the group table's order (profiled
 * only for outcomes declared `count`, see planColumns).
 */
export function groupZeros(groups: GroupTable, column: string): number[] {
  return groups.array(key(column, 'zeros')) as number[];
}

/** The group IDs as text, in the group table's order. */
export function groupIds(groups: GroupTable): string[] {
  return groups.array('group') as string[];
}

/** The records of each group, in the group table's order. */
export function groupSizes(groups: GroupTable): number[] {
  return groups.array('n') as number[];
}
