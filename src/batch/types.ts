import type { Grade, Verdict } from '../grade.js';
import type { FailOn } from '../severity.js';

export const BATCH_SCHEMA = 'nestready/batch@1';

/** One delivery of a batch, before it is audited: its file, whose it is, and the folder its own reports go to. */
export interface BatchDelivery {
  /** the path as found (as the argument, the folder or the pattern gave it) */
  file: string;
  /** from the file name: the sender pattern's capture, else the name without its extensions */
  sender: string;
  /** the sender as a folder name, made distinct within the batch (see folderNames) */
  folder: string;
}

/**
 * How a delivery's audit ended: `audited` (a verdict), `unreadable` (an input error, exit 2 for a
 * single audit: not a delivery nestready can read against the role map) or `error` (a bug in
 * nestready, exit 3).
 */
export type DeliveryStatus = 'audited' | 'unreadable' | 'error';

/** Where a delivery's own files went (paths relative to the summary that names them). */
export interface DeliveryFiles {
  html: string;
  json: string;
  problems: string;
}

/** One row of the batch summary. Raw data values never appear in it. */
export interface BatchRow {
  file: string;
  sender: string;
  /** its folder under the reports folder (absent without one) */
  folder?: string;
  status: DeliveryStatus;
  /** the one-line error of an unreadable delivery (or a bug), as a single audit would print it */
  error?: string;
  /** whether the delivery fails the gate (`--fail-on`); an unreadable one always does */
  gate: 'pass' | 'fail';
  verdict?: Verdict;
  grade?: Grade;
  score?: number;
  blockers?: number;
  warnings?: number;
  notes?: number;
  records?: number;
  groups?: number;
  /** per outcome, the ICC of the null model by REML (null where the data leave it undefined) */
  icc?: Record<string, number | null>;
  files?: DeliveryFiles;
}

/** A file met in a folder or by a pattern that is not audited, and why. */
export interface SkippedFile {
  file: string;
  reason: string;
}

/** The batch summary: every renderer of the batch is a pure function of it. */
export interface BatchSummary {
  schema: typeof BATCH_SCHEMA;
  tool: { name: string; version: string };
  /** the role map every delivery was audited against */
  roles: string;
  failOn: FailOn;
  /** the batch's exit code (README, "Auditing a folder of deliveries") */
  exitCode: 0 | 1 | 2 | 3;
  counts: { deliveries: number; unreadable: number; notReady: number; caveats: number; ready: number; skipped: number };
  /** worst first: unreadable, not ready, caveats, ready; then most blockers, most warnings, file name */
  deliveries: BatchRow[];
  skipped: SkippedFile[];
}
