import { ident, literal } from '../sql.js';
import type { Source } from '../types.js';

/** How many examples of each kind of change come back (IDs, record numbers, groups). */
const EXAMPLES = 20;

/**
 * Each record's unit ID and group (and record number when `numbered`). Not grouped by unit: an ID
 * on several records (the audit's duplicate-unit-id and unit-in-several-groups report those)
 * joins once per pair of records, which costs less than grouping a million IDs first.
 */
function unitsQuery(source: Source, unit: string, group: string, numbered: boolean): string {
  const rec = numbered ? '__rec' : 'NULL';
  const from = numbered ? source.numbered : source.view;
  return `SELECT ${ident(unit)} AS u, ${ident(group)} AS g, ${rec} AS r FROM ${from} WHERE ${ident(unit)} IS NOT NULL`;
}

/**
 * Keep the delivery's unit IDs with their groups in a Parquet file, so that the
 * next delivery, opened in another DuckDB instance, can join them (unitMoves). The file holds
 * IDs only; it is the caller's to delete.
 */
export async function exportUnits(source: Source, unit: string, group: string, file: string): Promise<void> {
  await source.session((db) => db.run(`COPY (${unitsQuery(source, unit, group, false)}) TO ${literal(file)} (FORMAT parquet)`));
}

export interface UnitMoveRows {
  moved: { count: number; units: string[]; rows: number[]; groups: string[] };
  left: { count: number; units: string[]; groups: string[] };
  joined: { count: number; units: string[]; rows: number[]; groups: string[] };
}

/**
 * One join of this delivery's unit IDs with the previous delivery's (exportUnits): units in both
 * whose group differs, units only in the previous delivery and units only in this one, each with
 * its count and the first examples in record order. DuckDB only (it reads the Parquet file).
 */
export async function unitMoves(source: Source, unit: string, group: string, previousFile: string): Promise<UnitMoveRows> {
  return source.session(async (db) => {
    await db.run(
      'CREATE TEMP TABLE nr_unit_moves AS SELECT p.u AS pu, c.u AS cu, p.g AS pg, c.g AS cg, p.r AS pr, c.r AS cr ' +
        `FROM read_parquet(${literal(previousFile)}) AS p FULL OUTER JOIN (${unitsQuery(source, unit, group, true)}) AS c ON p.u = c.u ` +
        'WHERE p.u IS NULL OR c.u IS NULL OR p.g IS DISTINCT FROM c.g',
    );
    try {
      type Row = { u: string; g: string | null; r: bigint | number | null };
      const pick = (where: string, u: string, g: string, r: string, order: string) =>
        db.all<Row>(`SELECT ${u} AS u, ${g} AS g, ${r} AS r FROM nr_unit_moves WHERE ${where} ORDER BY ${order}, ${u} LIMIT ${EXAMPLES}`);
      const [counts] = await db.all<{ moved: bigint; left: bigint; joined: bigint }>(
        'SELECT count(*) FILTER (WHERE pu IS NOT NULL AND cu IS NOT NULL) AS moved, count(*) FILTER (WHERE cu IS NULL) AS "left", ' +
          'count(*) FILTER (WHERE pu IS NULL) AS joined FROM nr_unit_moves',
      );
      const moved = await pick('pu IS NOT NULL AND cu IS NOT NULL', 'cu', 'cg', 'cr', 'cr');
      const left = await pick('cu IS NULL', 'pu', 'pg', 'pr', 'pu');
      const joined = await pick('pu IS NULL', 'cu', 'cg', 'cr', 'cr');
      const ids = (rows: Row[]) => rows.map((x) => String(x.u));
      const groups = (rows: Row[]) => [...new Set(rows.flatMap((x) => (x.g === null ? [] : [String(x.g)])))];
      const recs = (rows: Row[]) => rows.map((x) => Number(x.r));
      return {
        moved: { count: Number(counts.moved), units: ids(moved), rows: recs(moved), groups: groups(moved) },
        left: { count: Number(counts.left), units: ids(left), groups: groups(left) },
        joined: { count: Number(counts.joined), units: ids(joined), rows: recs(joined), groups: groups(joined) },
      };
    } finally {
      await db.run('DROP TABLE IF EXISTS nr_unit_moves');
    }
  });
}
