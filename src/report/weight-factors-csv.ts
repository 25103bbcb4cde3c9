import { csvField } from '../util/csv-field.js';
import type { Report } from './types.js';

/** Columns of the weight-factors file, in order. */
export const WEIGHT_FACTOR_COLUMNS = [
  'group',
  'records',
  'weight_sum',
  'effective_size',
  'factor_to_size',
  'factor_to_effective_size',
] as const;

/**
 * Every group's level-1 weight scale factors as CSV (CRLF line ends, like the problem rows): a
 * header and one line per group, in the report's group order. A statistic that cannot be
 * computed (Σw² of 0) is an empty field. Numbers keep their full precision: the file is for
 * multiplying weights, not for reading.
 *
 * @param report a report whose audit was asked for the factors (`weightFactors`); without them only the header
 */
export function weightFactorsCsv(report: Report): string {
  const lines = [WEIGHT_FACTOR_COLUMNS.join(',')];
  const num = (x: number) => (Number.isFinite(x) ? x : null);
  for (const g of report.weightFactors ?? []) {
    lines.push([g.group, g.n, num(g.sum), num(g.effectiveSize), num(g.sizeScale), num(g.effectiveScale)].map(csvField).join(','));
  }
  return `${lines.join('\r\n')}\r\n`;
}
