import type { Grade, Verdict } from '../grade.js';
import type { Roles } from '../roles/types.js';
import type { Finding } from '../rules/types.js';
import type { OutcomeStats } from '../stats/types.js';

export const REPORT_SCHEMA = 'nestready/report@1';

/** The report object: every renderer is a pure function of it (shared/design.md, "Report"). */
export interface Report {
  schema: typeof REPORT_SCHEMA;
  tool: { name: string; version: string };
  input: { path: string; rows: number; rowsRejected: number; columns: string[] };
  roles: Roles;
  groups: { count: number; singletons: number; sizes: { min: number; median: number; mean: number; max: number } };
  outcomes: Record<string, OutcomeStats>;
  findings: Finding[];
  score: number;
  grade: Grade;
  verdict: Verdict;
}
