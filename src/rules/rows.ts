import type { Roles } from '../roles/types.js';
import type { FoundRecord, RecordQueries, RecordQuery } from '../source/lookups/records.js';
import type { RejectedLine } from '../source/types.js';
import type { Finding } from './types.js';

export type { FoundRecord, RecordQueries, RecordQuery } from '../source/lookups/records.js';
export type { RejectedLine } from '../source/types.js';

/** What a rule's `rows` part gets: the role map, its params and the delivery's record queries. */
export interface RowsContext<P> {
  roles: Roles;
  params: P;
  /** query builders over the opened delivery (src/source/lookups/records.ts): no SQL in rules */
  records: RecordQueries;
  /** the lines the delivery's full read could not read (file line numbers) */
  rejected: readonly RejectedLine[];
  /** raw values may be quoted in reasons (false under --no-values; IDs and record numbers always stay) */
  includeValues: boolean;
}

/**
 * The records a finding covers, and why: a record query with the reason for each record it
 * finds, or unreadable lines with the reason for each. A rule without a `rows` part (or one that
 * returns null) sends back the records its finding lists, with the rule's title as the reason.
 */
export type FindingRecords =
  | { query: RecordQuery; reason(record: FoundRecord): string }
  | { lines: readonly RejectedLine[]; reason(line: RejectedLine): string };

/** A rule's optional rows part: which records a finding covers and why (the problem-rows file). */
export type RowsPart<P> = (finding: Finding, ctx: RowsContext<P>) => FindingRecords | null | Promise<FindingRecords | null>;

/**
 * The records a finding lists, each read with its value of `column` for the reason: the usual
 * rows part of a rule that names records by one column (null when the finding lists none or the
 * delivery lacks the column).
 */
export function listedRecords(
  finding: Finding,
  records: RecordQueries,
  column: string | undefined,
  reason: (record: FoundRecord) => string,
): FindingRecords | null {
  if (column === undefined || !finding.rows?.length || !records.has(column)) return null;
  return { query: records.listed(finding.rows, column), reason };
}
