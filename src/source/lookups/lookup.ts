import { finiteDouble, ident, literal } from '../sql.js';
import type { Source } from '../types.js';
import { columnValueStats, screenColumns } from './column-pairs.js';
import { modalValueSql } from './modal-value.js';
import { occasionSummary } from './occasions.js';
import { crossTabs, extremeShares, valueFrequencies } from './outcome-tables.js';
import type { Lookup, UnitIdSummary } from './types.js';
import { EXAMPLE_LIMIT } from './types.js';
import { unitIdSummary } from './unit-ids.js';

export { normalizedIdQuery, normalizeId } from './normalize-id.js';
export type { Occasion, OccasionSummary } from './occasions.js';
export type {
  ColumnScreen,
  ColumnValueStats,
  CrossTabCell,
  ExtremeShares,
  Lookup,
  ParentSubset,
  UnitIdExample,
  UnitIdSummary,
  ValueCounts,
  ValueFrequencies,
} from './types.js';
export { EXAMPLE_LIMIT } from './types.js';

/** The rules' look-ups over an opened delivery: bounded queries, in the source's dialect. */
export function createLookup(source: Source, group: string): Lookup {
  const g = ident(group);
  const inList = (ids: readonly string[]) => `(${ids.map(literal).join(', ')})`;
  const unitCache = new Map<string, Promise<UnitIdSummary>>();
  return {
    screenColumns: (columns) => screenColumns(source, group, columns),
    columnValueStats: (columns, outcomes) => columnValueStats(source, group, columns, outcomes),
    async rowsMissingGroup(limit = EXAMPLE_LIMIT) {
      const rows = await source.all<{ __rec: bigint }>(
        `SELECT __rec FROM ${source.numbered} WHERE ${g} IS NULL ORDER BY __rec LIMIT ${limit}`,
      );
      return rows.map((r) => Number(r.__rec));
    },
    async rowsMissing(column, limit = EXAMPLE_LIMIT) {
      const rows = await source.all<{ __rec: bigint }>(
        `SELECT __rec FROM ${source.numbered} WHERE ${ident(column)} IS NULL ORDER BY __rec LIMIT ${limit}`,
      );
      return rows.map((r) => Number(r.__rec));
    },
    async rowsInGroups(groups, limit = EXAMPLE_LIMIT) {
      if (!groups.length) return [];
      const rows = await source.all<{ __rec: bigint }>(
        `SELECT __rec FROM ${source.numbered} WHERE ${g} IN ${inList(groups)} ORDER BY __rec LIMIT ${limit}`,
      );
      return rows.map((r) => Number(r.__rec));
    },
    async valuesInGroups(column, groups, perGroup = 5) {
      const out = new Map<string, { value: string; count: number }[]>();
      if (!groups.length) return out;
      const c = ident(column);
      const rows = await source.all<{ g: string; v: string; k: bigint }>(
        `SELECT ${g} AS g, ${c} AS v, count(*) AS k FROM ${source.view} WHERE ${g} IN ${inList(groups)} AND ${c} IS NOT NULL ` +
          'GROUP BY 1, 2 ORDER BY 1, 3 DESC, 2',
      );
      for (const r of rows) {
        const list = out.get(r.g) ?? [];
        if (list.length < perGroup) list.push({ value: r.v, count: Number(r.k) });
        out.set(r.g, list);
      }
      return out;
    },
    async rowsDeviating(column, groups, tolerance, limit = EXAMPLE_LIMIT) {
      if (!groups.length) return [];
      const numeric = (e: string) => (source.storage.get(column) === 'double' ? e : source.dialect.numeric(e));
      const m = modalValueSql(source.view, group, column, tolerance, `${g} IN ${inList(groups)}`, source.dialect, numeric);
      const rows = await source.all<{ __rec: bigint }>(
        `WITH ${m.cte} SELECT d.__rec FROM ${source.numbered} d JOIN m ON d.${g} = m.g ` +
          `WHERE d.${ident(column)} IS NOT NULL AND ${m.differs('d')} ORDER BY d.__rec LIMIT ${limit}`,
      );
      return rows.map((r) => Number(r.__rec));
    },
    async rowsMissingIn(column, groups, limit = EXAMPLE_LIMIT) {
      if (!groups.length) return [];
      const rows = await source.all<{ __rec: bigint }>(
        `SELECT __rec FROM ${source.numbered} WHERE ${g} IN ${inList(groups)} AND ${ident(column)} IS NULL ORDER BY __rec LIMIT ${limit}`,
      );
      return rows.map((r) => Number(r.__rec));
    },
    unitIds(unit) {
      // a summary holds for the view it read (see Source.viewVersion)
      const key = `${source.viewVersion}\u0000${unit}`;
      let summary = unitCache.get(key);
      if (!summary) {
        // one session: its temp tables are its own while other look-ups run beside it
        summary = source.session((db) => unitIdSummary(source, db, group, unit));
        unitCache.set(key, summary);
      }
      return summary;
    },
    async nonNumericTokens(column, limit = EXAMPLE_LIMIT) {
      const c = ident(column);
      const d = source.dialect;
      const number = source.storage.get(column) === 'double' ? finiteDouble(c) : d.numeric(c);
      const rows = await source.all<{ token: string; k: bigint; recs: (bigint | number)[] }>(
        `SELECT ${d.text(c)} AS token, count(*) AS k, ${d.firstValues('__rec', '__rec', EXAMPLE_LIMIT)} AS recs FROM ` +
          `${source.numbered} AS d ` +
          `WHERE ${c} IS NOT NULL AND ${number} IS NULL GROUP BY ${c} ORDER BY 2 DESC, 1 LIMIT ${limit}`,
      );
      return rows.map((r) => ({ token: String(r.token), count: Number(r.k), rows: r.recs.map(Number) }));
    },
    async valueCounts(column, values) {
      const c = ident(column);
      const x = source.storage.get(column) === 'double' ? c : source.dialect.numeric(c);
      const list = values.map((v) => String(v)).join(', ');
      const per = values.map((v, i) => `count(*) FILTER (WHERE x = ${v}) AS k${i}`);
      const [row] = await source.all<Record<string, unknown>>(
        `SELECT ${per.join(', ')}, count(x) FILTER (WHERE x NOT IN (${list})) AS others, ` +
          `min(x) FILTER (WHERE x NOT IN (${list})) AS lo, max(x) FILTER (WHERE x NOT IN (${list})) AS hi ` +
          `FROM (SELECT ${x} AS x FROM ${source.view} AS d) AS v WHERE x IS NOT NULL`,
      );
      return {
        counts: values.map((_, i) => Number(row[`k${i}`])),
        others: Number(row.others),
        otherMin: row.lo === null ? null : Number(row.lo),
        otherMax: row.hi === null ? null : Number(row.hi),
      };
    },
    async rowsWithValue(column, value, limit = EXAMPLE_LIMIT) {
      const c = ident(column);
      const x = source.storage.get(column) === 'double' ? c : source.dialect.numeric(c);
      const rows = await source.all<{ __rec: bigint }>(
        `SELECT __rec FROM ${source.numbered} AS d WHERE ${x} = ${value} ORDER BY __rec LIMIT ${limit}`,
      );
      return rows.map((r) => Number(r.__rec));
    },
    occasions: (time, outcome) => occasionSummary(source, group, time, outcome),
    async parentSubsets(parent, groups, columns) {
      if (!groups.length) return [];
      const p = ident(parent);
      const d = source.dialect;
      const aggs = columns.map((column, i) => {
        // numbers stay numbers here (formatted in JS below), text compares in byte order
        if (source.storage.get(column) === 'double')
          return `CASE WHEN min(${ident(column)}) = max(${ident(column)}) THEN min(${ident(column)}) END AS c${i}`;
        const c = d.ordered(ident(column));
        return `CASE WHEN min(${c}) = max(${c}) THEN ${d.text(`min(${c})`)} END AS c${i}`;
      });
      const rows = await source.all<Record<string, unknown>>(
        `SELECT ${g} AS g, ${p} AS p, count(*) AS k${aggs.map((a) => `, ${a}`).join('')} FROM ${source.view} ` +
          `WHERE ${g} IN ${inList(groups)} AND ${p} IS NOT NULL GROUP BY ${g}, ${p} ORDER BY 1, 3 DESC, 2`,
      );
      return rows.map((r) => ({
        group: String(r.g),
        parent: String(r.p),
        count: Number(r.k),
        constant: columns.map((_, i) =>
          r[`c${i}`] === null ? null : typeof r[`c${i}`] === 'number' ? String(Number(r[`c${i}`])) : String(r[`c${i}`]),
        ),
      }));
    },
    valueFrequencies: (column, limit) => valueFrequencies(source, column, limit),
    crossTabs: (outcome, predictors, maxLevels) => crossTabs(source, outcome, predictors, maxLevels),
    extremeShares: (column, bounds, top) => extremeShares(source, group, column, bounds, top),
  };
}
