import { finiteDouble, ident } from '../sql.js';
import type { Source } from '../types.js';
import type { CrossTabCell, ExtremeShares, ValueFrequencies } from './types.js';

/** A column's numeric reading, as the profile reads it. */
function reading(source: Source, column: string): string {
  const c = ident(column);
  return source.storage.get(column) === 'double' ? finiteDouble(c) : source.dialect.numeric(c);
}

/**
 * How often each numeric value of a column occurs, smallest first: at most `limit` values, and
 * whether there were more. One GROUP BY over the column's values.
 */
export async function valueFrequencies(source: Source, column: string, limit: number): Promise<ValueFrequencies> {
  const rows = await source.all<{ x: number; k: bigint | number }>(
    `SELECT x, count(*) AS k FROM (SELECT ${reading(source, column)} AS x FROM ${source.view} AS d) AS v ` +
      `WHERE x IS NOT NULL GROUP BY x ORDER BY x LIMIT ${limit + 1}`,
  );
  return {
    values: rows.slice(0, limit).map((r) => ({ value: Number(r.x), count: Number(r.k) })),
    truncated: rows.length > limit,
  };
}

/**
 * Records and ones of a 0/1 outcome at each level of each predictor, in one pass (GROUPING SETS,
 * one set per predictor); records with the outcome or the predictor missing left out. A
 * predictor with more than `maxLevels` levels is not tabulated: it comes back as one cell without
 * a level, carrying its number of levels.
 */
export async function crossTabs(
  source: Source,
  outcome: string,
  predictors: readonly string[],
  maxLevels: number,
): Promise<CrossTabCell[]> {
  if (!predictors.length) return [];
  const d = source.dialect;
  const cols = predictors.map((_, i) => `c${i}`);
  const which = cols.map((c, i) => `WHEN grouping(${c}) = 0 THEN ${i}`).join(' ');
  const level = cols.map((c) => `WHEN grouping(${c}) = 0 THEN ${d.text(c)}`).join(' ');
  const inner = predictors.map((p, i) => `${ident(p)} AS c${i}`).join(', ');
  const sets =
    `SELECT CASE ${which} END AS v, CASE ${level} END AS lvl, count(*) AS n, sum(y) AS ones ` +
    `FROM (SELECT ${reading(source, outcome)} AS y, ${inner} FROM ${source.view} AS d) AS t WHERE y IS NOT NULL ` +
    `GROUP BY GROUPING SETS (${cols.map((c) => `(${c})`).join(', ')})`;
  const counted =
    'SELECT v, lvl, n, ones, count(*) OVER (PARTITION BY v) AS levels, ' +
    `row_number() OVER (PARTITION BY v ORDER BY ${d.ordered('lvl')}) AS r FROM (${sets}) AS s WHERE lvl IS NOT NULL`;
  const rows = await source.all<{ v: number; lvl: string; n: bigint | number; ones: number; levels: bigint | number }>(
    `SELECT v, lvl, n, ones, levels FROM (${counted}) AS c WHERE levels <= ${maxLevels} OR r = 1 ORDER BY v, r`,
  );
  return rows.map((r) => {
    const levels = Number(r.levels);
    const tabulated = levels <= maxLevels;
    return {
      predictor: predictors[Number(r.v)],
      level: tabulated ? String(r.lvl) : null,
      records: tabulated ? Number(r.n) : 0,
      ones: tabulated ? Number(r.ones) : 0,
      levels,
    };
  });
}

/**
 * Records at or below `lower` and at or above `upper`, over the delivery and in the `top` groups
 * where their share is largest (ties: the larger group first). One GROUP BY over the groups.
 */
export async function extremeShares(
  source: Source,
  group: string,
  column: string,
  bounds: { lower: number; upper: number },
  top: number,
): Promise<ExtremeShares> {
  const d = source.dialect;
  const g = ident(group);
  const byGroup =
    `SELECT ${d.text(g)} AS g, count(*) AS n, count(CASE WHEN x <= ${bounds.lower} THEN 1 END) AS f, ` +
    `count(CASE WHEN x >= ${bounds.upper} THEN 1 END) AS c ` +
    `FROM (SELECT ${g}, ${reading(source, column)} AS x FROM ${source.view} AS d) AS t ` +
    `WHERE x IS NOT NULL AND ${g} IS NOT NULL GROUP BY ${g}`;
  const ranked =
    'SELECT g, n, f, c, sum(n) OVER () AS tn, sum(f) OVER () AS tf, sum(c) OVER () AS tc, ' +
    `row_number() OVER (ORDER BY ${d.double('f')} / n DESC, n DESC, ${d.ordered('g')}) AS rf, ` +
    `row_number() OVER (ORDER BY ${d.double('c')} / n DESC, n DESC, ${d.ordered('g')}) AS rc FROM (${byGroup}) AS b`;
  const rows = await source.all<Record<string, unknown>>(
    `SELECT g, n, f, c, tn, tf, tc, rf, rc FROM (${ranked}) AS r WHERE rf <= ${top} OR rc <= ${top}`,
  );
  const num = (v: unknown) => Number(v ?? 0);
  const side = (count: 'f' | 'c', rank: 'rf' | 'rc') =>
    rows
      .filter((r) => num(r[rank]) <= top)
      .sort((a, b) => num(a[rank]) - num(b[rank]))
      .map((r) => ({ group: String(r.g), records: num(r.n), count: num(r[count]) }));
  return {
    records: num(rows[0]?.tn),
    floor: { count: num(rows[0]?.tf), groups: side('f', 'rf') },
    ceiling: { count: num(rows[0]?.tc), groups: side('c', 'rc') },
  };
}
