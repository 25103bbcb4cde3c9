import type { Source } from '../source/open.js';
import { ident, literal, numericExpr } from '../source/sql.js';

/** How many example rows or groups a finding lists (shared/design.md: first 20). */
export const EXAMPLE_LIMIT = 20;

/**
 * Small bounded queries that name offending records. Rules never scan the delivery
 * themselves; each method reads at most `limit` rows of output.
 */
export interface Lookup {
  /** record numbers whose group ID is missing */
  rowsMissingGroup(limit?: number): Promise<number[]>;
  /** record numbers in `groups` whose `column` value is not the group's first (most common) value */
  rowsInGroups(groups: readonly string[], limit?: number): Promise<number[]>;
  /** per group, the distinct values of `column` with their counts, most common first */
  valuesInGroups(column: string, groups: readonly string[], perGroup?: number): Promise<Map<string, { value: string; count: number }[]>>;
  /** record numbers in groups where `column` is outside the group's modal value (numeric: beyond tolerance) */
  rowsDeviating(column: string, groups: readonly string[], tolerance: number | null, limit?: number): Promise<number[]>;
}

export function createLookup(source: Source, group: string): Lookup {
  const g = ident(group);
  const inList = (ids: readonly string[]) => `(${ids.map(literal).join(', ')})`;
  return {
    async rowsMissingGroup(limit = EXAMPLE_LIMIT) {
      const rows = await source.all<{ __rec: bigint }>(
        `SELECT __rec FROM ${source.numbered} WHERE ${g} IS NULL ORDER BY __rec LIMIT ${limit}`,
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
          `GROUP BY 1, 2 ORDER BY 1, 3 DESC, 2`,
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
      const c = ident(column);
      // the modal value per group (ties broken by the smaller value) is taken as the intended one
      const differs =
        tolerance === null ? `d.${c} <> m.v` : `abs(${numericExpr(`d.${c}`)} - ${numericExpr('m.v')}) > ${tolerance}`;
      const sql =
        `WITH m AS (SELECT ${g} AS g, arg_max(${c}, k) AS v FROM (SELECT ${g}, ${c}, count(*) AS k FROM ${source.view} ` +
        `WHERE ${g} IN ${inList(groups)} AND ${c} IS NOT NULL GROUP BY 1, 2 ORDER BY 2) GROUP BY 1) ` +
        `SELECT d.__rec FROM ${source.numbered} d JOIN m ON d.${g} = m.g WHERE d.${c} IS NOT NULL AND ${differs} ` +
        `ORDER BY d.__rec LIMIT ${limit}`;
      const rows = await source.all<{ __rec: bigint }>(sql);
      return rows.map((r) => Number(r.__rec));
    },
  };
}
