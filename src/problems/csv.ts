import { csvField } from '../util/csv-field.js';
import type { ProblemRows } from './types.js';

// shared with the weight-factors file (src/report/weight-factors-csv.ts)
export { csvField };

/** Columns of the problem-rows file, in order. */
export const PROBLEM_COLUMNS = ['record', 'group', 'unit', 'rule', 'severity', 'column', 'reason'] as const;

/**
 * The problem rows as CSV: a header, one line per row (CRLF line ends), and, when rows were
 * left out by the bound, a last line starting with `#` that says how many. Record numbers are
 * numbers and written as such; every text field is neutralised against formula injection.
 */
export function problemsCsv(result: ProblemRows): string {
  const lines = [PROBLEM_COLUMNS.join(',')];
  for (const r of result.rows) {
    lines.push([r.record, r.group, r.unit, r.rule, r.severity, r.column, r.reason].map(csvField).join(','));
  }
  if (result.omitted > 0) {
    lines.push(`# ${result.omitted} more problem rows of ${result.total} not written (at most ${result.maxRows}; raise --max-rows)`);
  }
  return `${lines.join('\r\n')}\r\n`;
}
