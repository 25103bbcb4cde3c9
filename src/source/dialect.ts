import { MAX_MAGNITUDE, numericExpr } from './sql.js';

/**
 * The SQL dialect layer: the profiling query and the bounded look-ups are written once, and
 * the few constructs that differ between engines go through a Dialect. DuckDB is the default
 * (embedded, for files); PostgreSQL runs the same queries where a delivery already lives.
 *
 * Identifier and string quoting are the same in both ("col", 'text'); count/min/max/avg/
 * var_pop, `count(*) FILTER (WHERE …)`, DISTINCT ON and window functions exist in both.
 */

export type DialectName = 'duckdb' | 'postgres';

export interface Dialect {
  name: DialectName;
  /** cast to a double-precision float (DuckDB DOUBLE, PostgreSQL double precision) */
  double(expr: string): string;
  /** cast to text */
  text(expr: string): string;
  /** the numeric reading of a text expression: NULL when it is not a number (never an error) */
  numeric(expr: string): string;
  /** a text expression as min/max/ORDER BY compare it: byte order in both engines */
  ordered(expr: string): string;
  /** the first `limit` values of `expr` in `order`, as an array */
  firstValues(expr: string, order: string, limit: number): string;
  /** a hash of a record's columns, for telling exact copies apart */
  rowHash(exprs: readonly string[]): string;
  /**
   * a 64-bit integer hash of a normalised ID's key, for grouping on a narrow key: `number` (a
   * double) where it is not NULL, else `text`
   */
  keyHash(number: string, text: string): string;
  /** whether a text expression holds a match of a regular expression (written for both engines; no quotes in it) */
  matches(expr: string, pattern: string): string;
  /**
   * an extra output of the profile's inner query that keeps the engine from merging it into the
   * outer one, so that each record's numeric readings are computed once, not once per aggregate
   */
  fence?: string;
}

/**
 * A number as both engines' double casts accept it (no hex, no thousands separators). No bounded
 * repetition of the digits: PostgreSQL's regular expressions expand `{1,250}` into as many
 * states, which made every match many times dearer (docs/performance.md); the numeric cast's
 * limits are kept by a length guard instead (postgres.numeric).
 */
const NUMBER_RE = String.raw`^\s*[-+]?([0-9]+(\.[0-9]*)?|\.[0-9]+)([eE][-+]?[0-9]{1,3})?\s*$`;
/**
 * A plain decimal (no exponent) short enough to lie within ±MAX_MAGNITUDE and far above double
 * precision's underflow: cast directly, without the numeric casts that guard the general form.
 */
const PLAIN_RE = String.raw`^\s*[-+]?([0-9]+(\.[0-9]*)?|\.[0-9]+)\s*$`;
const PLAIN_LENGTH = 100;
/** The most digits PostgreSQL's numeric type takes after the point (a longer text fails its cast). */
const NUMERIC_DIGITS = 16383;

export const duckdb: Dialect = {
  name: 'duckdb',
  double: (e) => `${e}::DOUBLE`,
  text: (e) => `CAST(${e} AS VARCHAR)`,
  numeric: (e) => numericExpr(e),
  ordered: (e) => e,
  firstValues: (e, order, limit) => `list(${e} ORDER BY ${order})[1:${limit}]`,
  rowHash: (exprs) => `hash(${exprs.join(', ')})`,
  keyHash: (number, text) => `hash(${number}, ${text})`,
  matches: (e, pattern) => `regexp_matches(${e}, '${pattern}')`,
};

export const postgres: Dialect = {
  name: 'postgres',
  double: (e) => `CAST(${e} AS double precision)`,
  text: (e) => `CAST(${e} AS text)`,
  // PostgreSQL has no TRY_CAST before version 16's pg_input_is_valid: a regular expression and
  // the length guard the cast to numeric; the bounds keep what is read inside double precision's range
  numeric: (e) =>
    `(CASE WHEN length(${e}) <= ${PLAIN_LENGTH} AND ${e} ~ '${PLAIN_RE}' THEN CAST(${e} AS double precision) ` +
    `WHEN length(${e}) <= ${NUMERIC_DIGITS} AND ${e} ~ '${NUMBER_RE}' ` +
    `THEN CASE WHEN abs(CAST(${e} AS numeric)) > ${MAX_MAGNITUDE} THEN NULL ` +
    // below double precision's normal range the cast fails where DuckDB reads 0 (or a subnormal)
    `WHEN abs(CAST(${e} AS numeric)) <= 1e-307 THEN 0 ELSE CAST(${e} AS double precision) END END)`,
  // min/max of text follow the database collation in PostgreSQL; "C" is byte order, as DuckDB
  ordered: (e) => `(${e} COLLATE "C")`,
  firstValues: (e, order, limit) => `(array_agg(${e} ORDER BY ${order}))[1:${limit}]`,
  rowHash: (exprs) => `md5(CAST(ROW(${exprs.join(', ')}) AS text))`,
  // each part by its own type's hash: hashing the pair's text form formatted every double, most
  // of the unit-ID check's time (docs/performance.md); a number's hash that meets a text's only
  // brings both to stage 2, which tells them apart
  keyHash: (number, text) => `coalesce(hashfloat8extended(${number}, 0), hashtextextended(${text}, 0))`,
  matches: (e, pattern) => `(${e} ~ '${pattern}')`,
  // PostgreSQL merges a plain subquery into its parent and then computes a column's numeric
  // reading once per aggregate that reads it; a volatile output keeps the subquery whole (it is
  // never merged), and clock_timestamp() is volatile yet parallel safe, so the plan stays parallel
  fence: 'clock_timestamp() AS nr_fence',
};
