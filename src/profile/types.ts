import type { ColumnTable } from 'arquero';
import type { ValueType } from '../roles/types.js';
import type { RejectedLine } from '../source/open.js';
import type { Storage } from '../source/sql.js';
import type { GroupMoments } from '../stats/types.js';

/** A column's part in the role map; `weight` is a sampling weight (roles.weights), profiled as numbers. */
export type ColumnRole = 'group' | 'unit' | 'parent' | 'outcome' | 'level1' | 'level2' | 'weight' | 'other';

/** Whole-delivery summary of one column, derived from the group table (no extra scan). */
export interface ColumnProfile {
  name: string;
  role: ColumnRole;
  type: ValueType;
  /** whether per-group numeric statistics were computed for this column */
  numericProfiled: boolean;
  /** how the reader holds it: text, or DOUBLE when every value is a number */
  storage: Storage;
  nonMissing: number;
  missing: number;
  /** non-missing values that read as numbers (only when numericProfiled) */
  numericCount: number;
  /** smallest and largest value read as text (null for the unit ID: its per-group range is not profiled) */
  min: string | null;
  max: string | null;
  numMin: number | null;
  numMax: number | null;
  mean: number | null;
  /**
   * text values that may be numbers written another way (src/profile/number-like.ts); null where
   * not counted (counted for level-1 and level-2 text columns the role map leaves untyped)
   */
  numberLike: number | null;
}

/** The one profiling pass: every rule and statistic reads only this (plus bounded look-ups). */
export interface Profile {
  /** records read (rejected lines excluded) */
  rows: number;
  rejected: RejectedLine[];
  header: string[];
  /** records whose group ID is missing (they are not in `groups`) */
  missingGroupRows: number;
  /**
   * One row per group with a non-missing ID, ordered by ID. Read it with `groupIds`, `groupSizes`
   * and `groupStat` (src/profile/group-stats.ts), not by its column names.
   */
  groups: ColumnTable;
  /** one row per column, the fields of ColumnProfile */
  columns: ColumnTable;
  column(name: string): ColumnProfile;
  /** per-group moments of a numeric-profiled column, groups with no value dropped */
  moments(name: string): GroupMoments[];
}
