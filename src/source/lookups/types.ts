import type { OccasionSummary } from './occasions.js';

/** How many example rows or groups a finding lists (shared/design.md: first 20). */
export const EXAMPLE_LIMIT = 20;

/**
 * Small bounded queries that name offending records. Rules never scan the delivery
 * themselves; each method reads at most `limit` rows of output.
 */
export interface Lookup {
  /** record numbers whose group ID is missing */
  rowsMissingGroup(limit?: number): Promise<number[]>;
  /** record numbers where `column` is missing, in any group or none */
  rowsMissing(column: string, limit?: number): Promise<number[]>;
  /** record numbers in `groups` whose `column` value is not the group's first (most common) value */
  rowsInGroups(groups: readonly string[], limit?: number): Promise<number[]>;
  /** per group, the distinct values of `column` with their counts, most common first */
  valuesInGroups(column: string, groups: readonly string[], perGroup?: number): Promise<Map<string, { value: string; count: number }[]>>;
  /** record numbers in groups where `column` is outside the group's modal value (numeric: beyond tolerance) */
  rowsDeviating(column: string, groups: readonly string[], tolerance: number | null, limit?: number): Promise<number[]>;
  /** record numbers in `groups` where `column` is missing */
  rowsMissingIn(column: string, groups: readonly string[], limit?: number): Promise<number[]>;
  /**
   * Repeated, mobile and variant unit IDs: one aggregate over the unit column grouped by (a
   * hash of) the normalised ID (see normalizeId), then, only when some hash occurs more than
   * once, a second pass over those IDs alone. Memoised: the rules that need it share one result.
   */
  unitIds(unit: string): Promise<UnitIdSummary>;
  /** non-numeric tokens of a text column read as numbers: most frequent first, with their first records */
  nonNumericTokens(column: string, limit?: number): Promise<{ token: string; count: number; rows: number[] }[]>;
  /** how often each of `values` occurs in a numeric column, and the range of its other values */
  valueCounts(column: string, values: readonly number[]): Promise<ValueCounts>;
  /** record numbers where a numeric column equals `value` */
  rowsWithValue(column: string, value: number, limit?: number): Promise<number[]>;
  /** per (group, parent) pair in `groups`: records and, per column, whether it is constant and its value */
  parentSubsets(parent: string, groups: readonly string[], columns: readonly string[]): Promise<ParentSubset[]>;
  /** each numeric value of a column with its count, smallest first (at most `limit` values) */
  valueFrequencies(column: string, limit: number): Promise<ValueFrequencies>;
  /** records and ones of a 0/1 outcome per level of each predictor (predictors over `maxLevels` levels not tabulated) */
  crossTabs(outcome: string, predictors: readonly string[], maxLevels: number): Promise<CrossTabCell[]>;
  /** records at the floor and at the ceiling of a numeric column, overall and in the `top` groups where each share is largest */
  extremeShares(column: string, bounds: { lower: number; upper: number }, top: number): Promise<ExtremeShares>;
  /** per column: distinct values, non-missing values, groups with a value, values not whole numbers (one aggregate) */
  screenColumns(columns: readonly string[]): Promise<ColumnScreen[]>;
  /** per value of each column: its groups and the outcomes' moments (one query; bound it by the screen's counts) */
  columnValueStats(columns: readonly string[], outcomes: readonly string[]): Promise<ColumnValueStats[]>;
  /** longitudinal data, the group being the person: occasions per person and the pattern of the missing ones (one query) */
  occasions(time: string, outcome?: string): Promise<OccasionSummary>;
}

export interface ValueFrequencies {
  values: { value: number; count: number }[];
  /** more distinct values than asked for */
  truncated: boolean;
}

/** One level of one predictor against a 0/1 outcome. */
export interface CrossTabCell {
  predictor: string;
  /** the level as text; null for a predictor with too many levels to tabulate */
  level: string | null;
  records: number;
  ones: number;
  /** the predictor's number of levels */
  levels: number;
}

/** Records at the floor and at the ceiling, with the groups where each share is largest. */
export interface ExtremeShares {
  /** records with a numeric value */
  records: number;
  floor: { count: number; groups: { group: string; records: number; count: number }[] };
  ceiling: { count: number; groups: { group: string; records: number; count: number }[] };
}

/** What one aggregate says of a column before its values are grouped. */
export interface ColumnScreen {
  column: string;
  /** distinct values */
  values: number;
  nonMissing: number;
  /** groups in which it has a value */
  groups: number;
  /** values that are not whole numbers (a column read as numbers; 0 for text) */
  fractional: number;
}

/** One value of a column: how many groups it occurs in, and each outcome's moments among its records. */
export interface ColumnValueStats {
  column: string;
  groups: number;
  outcomes: { n: number; mean: number; ss: number }[];
}

/** A unit ID that needs a look: repeated, in several groups, or one of several spellings. */
export interface UnitIdExample {
  /** the ID as written */
  id: string;
  /** its normalised form (see normalizeId) */
  key: string;
  /** records carrying it */
  count: number;
  /** records that are exact copies of another record with this ID */
  copies: number;
  /** the groups it occurs in (at most 10) */
  groups: string[];
  /** group count (all of them) */
  groupCount: number;
  /** its first record numbers */
  rows: number[];
}

export interface UnitIdSummary {
  /** unit IDs (as written) on more than one record whose records differ in some column */
  conflicting: { ids: number; records: number; examples: UnitIdExample[] };
  /** unit IDs (as written) with records that are exact copies of each other; `copies` = records beyond the first of each content */
  copied: { ids: number; copies: number; examples: UnitIdExample[] };
  /** unit IDs (as written) that occur in more than one group, and their records */
  mobile: { ids: number; records: number; examples: UnitIdExample[] };
  /** normalised IDs written in more than one way: each set lists the spellings */
  variants: { sets: number; examples: { key: string; ids: UnitIdExample[] }[] };
}

export interface ValueCounts {
  /** count per value asked about (as numbers, in the order asked) */
  counts: number[];
  /** non-missing numeric values that are none of them */
  others: number;
  otherMin: number | null;
  otherMax: number | null;
}

export interface ParentSubset {
  group: string;
  parent: string;
  count: number;
  /** per column asked about: the value when the subset agrees on one, else null */
  constant: (string | null)[];
}
