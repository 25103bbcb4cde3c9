import { ident } from '../sql.js';
import type { Source } from '../types.js';

/** One column's cheap statistics over the whole delivery. */
export interface ColumnCensus {
  name: string;
  nonMissing: number;
  /** distinct non-missing values (approximate when the census is: a HyperLogLog sketch) */
  distinct: number;
  /** values that read as numbers with a fractional part */
  fractional: number;
}

export interface Census {
  rows: number;
  columns: ColumnCensus[];
  /** distinct counts are exact (else sketched) */
  exact: boolean;
}

/** Distinct values of an expression: sketched where the engine can and `exact` is not asked for. */
function distinctOf(source: Source, expr: string, exact: boolean): string {
  return !exact && source.dialect.name === 'duckdb' ? `approx_count_distinct(${expr})` : `count(DISTINCT ${expr})`;
}

/**
 * One aggregate over every column: records, non-missing and distinct values, and how many
 * values are numbers with a fractional part. It tells which columns repeat their values (group
 * candidates), which are unique (unit candidates) and which hold measurements rather than codes.
 */
export async function columnCensus(source: Source, exact: boolean): Promise<Census> {
  const aggs = ['count(*) AS n'];
  source.header.forEach((name, i) => {
    const c = ident(name);
    aggs.push(`count(${c}) AS n${i}`, `${distinctOf(source, c, exact)} AS d${i}`);
    // text that reads as numbers ("12.5" beside "n/a") is judged by its numbers; text with none is not cast
    const x = source.storage.get(name) === 'double' ? c : source.textOnly.has(name) ? null : source.dialect.numeric(c);
    aggs.push(x ? `count(*) FILTER (WHERE ${x} <> floor(${x})) AS f${i}` : `0 AS f${i}`);
  });
  const row = firstRow(await source.columns(`SELECT ${aggs.join(', ')} FROM ${source.view} AS nr_census`));
  return {
    rows: Number(row.n),
    exact: exact || source.dialect.name !== 'duckdb',
    columns: source.header.map((name, i) => ({
      name,
      nonMissing: Number(row[`n${i}`]),
      distinct: Number(row[`d${i}`]),
      fractional: Number(row[`f${i}`]),
    })),
  };
}

/** A full read's one-row result (by column, as `Source.columns` gives it) as a record. */
function firstRow(result: Record<string, unknown[]>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(result).map(([k, v]) => [k, v[0]]));
}

/**
 * Exact distinct non-missing values of one column, on a session of its own (it may run beside
 * another full read); the engine may raise its memory for the hash table of a million IDs.
 */
export async function distinctCount(source: Source, column: string): Promise<number> {
  return source.session(async (db) => {
    await db.run(`CREATE TEMP TABLE nr_draft_distinct AS SELECT count(DISTINCT ${ident(column)}) AS d FROM ${source.view} AS v`);
    const [row] = await db.all<{ d: unknown }>('SELECT d FROM nr_draft_distinct');
    await db.run('DROP TABLE nr_draft_distinct');
    return Number(row.d);
  });
}

/** How one group candidate's groups hold the other columns. */
export interface CandidateScreen {
  group: string;
  /** its groups (a missing ID is none) */
  groups: number;
  /** groups of two records or more */
  multiGroups: number;
  /** per other column: groups of two records or more with a value of it, and those where it is constant */
  columns: { column: string; groups: number; constant: number }[];
}

/**
 * Screen several group candidates in one pass: one GROUPING SETS aggregate groups the delivery by
 * each candidate in turn and keeps each column's lowest and highest value per group (equal ⇔
 * constant there, as in the profile; text is compared by a 64-bit hash of it, far cheaper to
 * keep than the text itself); the outer query counts, per candidate and column, the groups of
 * two records or more where the column is constant. A profiling pass per candidate would read
 * the delivery once for each.
 */
export async function screenCandidates(
  source: Source,
  candidates: readonly string[],
  columns: readonly string[],
): Promise<CandidateScreen[]> {
  if (!candidates.length) return [];
  const d = source.dialect;
  const values = columns.map((name, j) => {
    const c = ident(name);
    return `${source.storage.get(name) === 'double' ? c : `CASE WHEN ${c} IS NOT NULL THEN ${d.keyHash('NULL', c)} END`} AS v${j}`;
  });
  const rows = `SELECT ${[...candidates.map((g, i) => `${ident(g)} AS k${i}`), ...values].join(', ')} FROM ${source.view} AS nr_rows`;
  const flags = candidates.map((_, i) => `s${i}`);
  const inner =
    `SELECT ${[...candidates.map((_, i) => `k${i}`), ...flags.map((s, i) => `GROUPING(k${i}) AS ${s}`), 'count(*) AS n'].join(', ')}, ` +
    `${columns.map((_, j) => `min(v${j}) AS lo${j}, max(v${j}) AS hi${j}`).join(', ')} ` +
    `FROM (${rows}) AS nr_values GROUP BY GROUPING SETS (${candidates.map((_, i) => `(k${i})`).join(', ')})`;
  const counts = columns.flatMap((_, j) => [
    `count(*) FILTER (WHERE n >= 2 AND lo${j} IS NOT NULL) AS g${j}`,
    `count(*) FILTER (WHERE n >= 2 AND lo${j} = hi${j}) AS c${j}`,
  ]);
  // each row of the inner result belongs to one set: the candidate whose GROUPING() is 0
  const own = candidates.map((_, i) => `(s${i} = 0 AND k${i} IS NOT NULL)`).join(' OR ');
  const byColumn = await source.columns(
    `SELECT ${[...flags, 'count(*) AS groups', 'count(*) FILTER (WHERE n >= 2) AS multi', ...counts].join(', ')} ` +
      `FROM (${inner}) AS nr_sets WHERE ${own} GROUP BY ${flags.join(', ')}`,
  );
  const result = (byColumn.groups ?? []).map((_, r) => Object.fromEntries(Object.entries(byColumn).map(([k, v]) => [k, v[r]])));
  return candidates.flatMap((group, i) => {
    const row = result.find((r) => Number(r[`s${i}`]) === 0);
    if (!row) return [];
    return [
      {
        group,
        groups: Number(row.groups),
        multiGroups: Number(row.multi),
        columns: columns.map((column, j) => ({ column, groups: Number(row[`g${j}`]), constant: Number(row[`c${j}`]) })),
      },
    ];
  });
}
