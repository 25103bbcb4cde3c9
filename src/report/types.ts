import type { FitAdvice } from '../analysis/fit-advice.js';
import type { PlotData, RuleRun } from '../analysis/types.js';
import type { GroupWeights, WeightsAudit } from '../analysis/weights.js';
import type { Grade, Verdict } from '../grade.js';
import type { Roles } from '../roles/types.js';
import type { Finding } from '../rules/types.js';
import type { ValueReading } from '../source/types.js';
import type { OutcomeStats } from '../stats/types.js';
import type { ChangesSummary, Snapshot } from './snapshot.js';

export const REPORT_SCHEMA = 'nestready/report@1';

/** The report object: every renderer is a pure function of it (shared/design.md, "Report"). */
export interface Report {
  schema: typeof REPORT_SCHEMA;
  tool: { name: string; version: string };
  /**
   * `reading`: how values were read where the delivery's writing asked for it (absent when plainly);
   * `notes`: what the reading of the delivery needs said (which Excel sheet was read, other sheets with its header)
   */
  input: { path: string; rows: number; rowsRejected: number; columns: string[]; reading?: ValueReading; notes?: string[] };
  roles: Roles;
  groups: { count: number; singletons: number; sizes: { min: number; median: number; mean: number; max: number } };
  outcomes: Record<string, OutcomeStats>;
  findings: Finding[];
  /** the "how to fit" section: estimation advice with sources (guidance; absent in reports built by hand) */
  fitAdvice?: FitAdvice;
  /** with `weights` in the role map: Kish figures and how the factors of the two usual scalings spread over the groups */
  weights?: WeightsAudit;
  /**
   * Every group's level-1 weight scale factors, when the audit was asked for them (`weightFactors`,
   * `--weight-factors`): one entry per group, so `--format json` leaves it out unless `--with-plot-data`.
   */
  weightFactors?: GroupWeights[];
  score: number;
  grade: Grade;
  verdict: Verdict;
  /**
   * What the HTML plots need, computed before rendering so that no renderer goes back to the data
   * (src/analysis, buildPlotData).
   * Not one of the stable JSON fields: `--format json` leaves it out unless `--with-plot-data`.
   */
  plots?: PlotData;
  /**
   * The rules of the catalogue that ran (not switched off), in catalogue order: the JUnit
   * renderer writes a passing test case for each one without a finding. Left out of
   * `--format json` like `plots`.
   */
  rulesRun?: RuleRun[];
  /** compact per-group summary for comparing the next delivery with this one (README: Snapshot) */
  snapshot?: Snapshot;
  /** the comparison with the previous delivery (`compare`, `audit --baseline`) */
  changes?: ChangesSummary;
}

export type { GroupMean, GroupMeans, PlotData, RuleRun } from '../analysis/types.js';
