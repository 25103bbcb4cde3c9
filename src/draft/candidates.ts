import type { Census, ColumnCensus } from '../source/plan/census.js';

/** At most this many group candidates get a profiling pass each. */
export const MAX_CANDIDATES = 5;

/** A unit ID repeats no value: the sketch's distinct count may be a tenth or more below the true one. */
const UNIT_SKETCH_SHARE = 0.8;

/**
 * Whether a column's values could be codes (text, or whole numbers) rather than measurements:
 * identifiers are written as codes, a fractional number is a measurement.
 */
export function codeLike(column: ColumnCensus): boolean {
  return column.fractional === 0;
}

/**
 * The columns worth a profiling pass as the group ID: codes with at least three values, each
 * value on two records or more on average, present on most records. The finest first (most
 * values), then header order; at most `limit`.
 */
export function groupCandidates(census: Census, exclude: readonly string[], limit = MAX_CANDIDATES) {
  return census.columns
    .map((column, position) => ({ column, position }))
    .filter(
      ({ column }) =>
        !exclude.includes(column.name) &&
        codeLike(column) &&
        column.distinct >= 3 &&
        column.distinct <= column.nonMissing / 2 &&
        column.nonMissing >= census.rows / 2,
    )
    .sort((a, b) => b.column.distinct - a.column.distinct || a.position - b.position)
    .slice(0, limit)
    .map(({ column }) => column);
}

/** The column most likely to identify records: codes, present on (almost) every record, (almost) no value repeated. */
export function unitCandidate(census: Census): ColumnCensus | undefined {
  return census.columns
    .filter((c) => codeLike(c) && c.nonMissing >= 0.95 * census.rows && c.distinct >= UNIT_SKETCH_SHARE * c.nonMissing)
    .reduce<ColumnCensus | undefined>((best, c) => (!best || c.distinct > best.distinct ? c : best), undefined);
}
