import type { Severity } from '../roles/types.js';
import type { Encoding, InputFormat } from '../source/types.js';

/** One offending record (or unreadable line) for the file a data manager sends back. */
export interface ProblemRow {
  /** 1-based record number as in findings (header and unreadable lines not counted); null for an unreadable line */
  record: number | null;
  group: string | null;
  unit: string | null;
  rule: string;
  severity: Severity;
  column?: string;
  reason: string;
}

export interface ProblemRows {
  rows: ProblemRow[];
  /** problem rows found in all, written or not */
  total: number;
  /** rows left out because of `maxRows` (total − rows.length) */
  omitted: number;
  maxRows: number;
}

export interface ProblemOptions {
  /** at most this many rows in all (default DEFAULT_MAX_ROWS) */
  maxRows?: number;
  /** quote raw values in the reasons (default true); IDs and record numbers always stay */
  includeValues?: boolean;
  memoryLimit?: string;
  threads?: number;
  /** read the delivery as the audit did: the same format, encoding and sheet */
  format?: InputFormat;
  encoding?: Encoding;
  sheet?: string;
  /** CSV/TSV: numbers written with a decimal comma, as the audit was told */
  decimalComma?: boolean;
  /** what messages call a file input (default its path; the CLI passes "-" for a spooled stdin) */
  displayPath?: string;
}

/** Default bound of the problem-rows file (`--max-rows`). */
export const DEFAULT_MAX_ROWS = 10_000;
