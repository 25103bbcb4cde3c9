import type { DistributionSketch, Snapshot } from '../report/snapshot.js';
import type { Report } from '../report/types.js';
import type { Roles } from '../roles/types.js';
import type { Finding, FindingDraft, RuleMeta } from '../rules/types.js';
import type { OutcomeStats } from '../stats/types.js';

/** The previous delivery a comparison starts from: its report, which carries its snapshot. */
export interface Baseline {
  report: Report & { snapshot: Snapshot };
  from: 'delivery' | 'report';
  /** the previous delivery's unit and group per unit ID, kept in a temp file (only when it was a file) */
  unitsFile?: string;
}

/** Units of the same ID in both deliveries, found by one join in the engine (src/source/lookups/unit-moves.ts). */
export interface UnitChanges {
  moved: { count: number; units: string[]; rows: number[]; groups: string[] };
  left: { count: number; units: string[]; groups: string[] };
  joined: { count: number; units: string[]; rows: number[]; groups: string[] };
}

/** What the current delivery's pass measured for the comparison, beside its snapshot. */
export interface Measured {
  snapshot: Snapshot;
  /** per column sketched in the previous delivery: the current values at its edges */
  atPreviousEdges: Map<string, DistributionSketch>;
  /**
   * per column sketched in both deliveries, when the previous snapshot keeps its bins per group:
   * the shift within the groups present in both
   */
  inBoth?: Map<string, InBoth>;
  /** null when the unit check cannot run (say why in `skipped`) */
  units: UnitChanges | null;
  skipped: string[];
}

/** A column's bins (at the previous delivery's edges) in the groups present in both deliveries. */
export interface InBoth {
  groups: number;
  previous: number[];
  current: number[];
  /** each group present in both with its own bins on each side */
  byGroup: { id: string; previous: number[]; current: number[] }[];
}

/** What a change check reads. */
export interface ChangeContext<P> {
  params: P;
  roles: Roles;
  previous: Baseline;
  current: { snapshot: Snapshot; findings: readonly Finding[]; outcomes: Record<string, OutcomeStats> };
  measured: Measured;
}

/** A change check: the audit rules' meta (src/rules/types.ts), a check over two deliveries. */
export interface ChangeRule<P = Record<string, unknown>> {
  meta: RuleMeta;
  check(ctx: ChangeContext<P>): FindingDraft[];
}

// biome-ignore lint/suspicious/noExplicitAny: each check's params type differs; the catalogue is checked against its schemas
export type AnyChangeRule = ChangeRule<any>;

export function defineChange<P>(rule: ChangeRule<P>): ChangeRule<P> {
  return rule;
}
