import type { ValueType } from '../roles/types.js';

/**
 * A delivery's distribution of one numeric column in a few bins: the count of values at or below
 * each edge. The edges are the column's mean plus its standard deviation times the standard
 * normal's 5 %, 10 %, …, 95 % quantiles: they come from two aggregates, never from a record, so
 * the sketch holds no raw value and stays under `--no-values`.
 */
export interface DistributionSketch {
  /** values that read as numbers */
  n: number;
  edges: number[];
  /** values ≤ each edge */
  atOrBelow: number[];
}

/** One column of the delivery as the next delivery is compared with it. */
export interface SnapshotColumn {
  type: ValueType;
  storage: 'text' | 'double';
  missing: number;
  sketch?: DistributionSketch;
}

/**
 * The report's compact summary of a delivery for `nestready compare` against the next one: no
 * record and no unit ID, only what each group and column add up to (README: Snapshot).
 */
export interface Snapshot {
  /** `raw`: level-2 values as written; `hashed` (`--no-values`): each as a 64-bit hash of its text */
  values: 'raw' | 'hashed';
  rows: number;
  missingGroupRows: number;
  groups: {
    ids: string[];
    sizes: number[];
    /** per level-2 column and group: its one value, null when it has none, false when it varies */
    level2: Record<string, (string | null | false)[]>;
    /** per outcome and group: values, mean, variance (n − 1 denominator; null below two values) */
    outcomes: Record<string, { n: number[]; mean: (number | null)[]; variance: (number | null)[] }>;
    /** per column with a missing value in some group: the missing values per group */
    missing: Record<string, number[]>;
    /**
     * per sketched column and group: its values in the sketch's 20 bins (edge k−1, edge k], the
     * last above the last edge. Only when asked for (the previous delivery of `compare`, given as a
     * file): it would make a written report several times larger (docs/performance.md)
     */
    bins?: Record<string, number[][]>;
  };
  columns: Record<string, SnapshotColumn>;
}

/** One delivery's side of an outcome's comparison: ANOVA ICC(1) with its interval, REML components. */
export interface IccSide {
  icc: number | null;
  ci95: [number | null, number | null];
  tau2: number | null;
  sigma2: number | null;
}

/**
 * What a comparison with the previous delivery adds to the report (`compare`, `audit --baseline`).
 * Its findings are in the report's `findings`, marked `change: true`.
 */
export interface ChangesSummary {
  previous: { path: string; rows: number; groups: number; from: 'delivery' | 'report' };
  groups: { both: number; appeared: number; vanished: number };
  /** the audits' findings matched by rule, messageId and column */
  findings: { new: number; resolved: number; persisting: number };
  /** per outcome in both: each side's ICC and components, and the test of their difference */
  outcomes: Record<string, { previous: IccSide; current: IccSide; z: number | null; p: number | null }>;
  /** checks that could not run, and why */
  skipped: string[];
}
