import { ident, literal } from '../sql.js';
import type { Source } from '../types.js';

/** How many examples of each kind of change come back (IDs, record numbers, groups). */
const EXAMPLES = 20;

/**
 * Each record's unit ID and group as text, with a 64-bit hash of each (and the record number when
 * `numbered`). The deliveries are joined on the hashes: a join of narrow integer keys fits the
 * memory limit where one of a million text IDs spilled; two IDs that share a hash (about one
 * chance in 10^7 at ten million IDs) would count as one unit. Not grouped by unit: an ID on
 * several records (the audit's duplicate-unit-id and unit-in-several-groups report those) joins
 * once per pair of records, which costs less than grouping a million IDs first.
 */
function unitsQuery(source: Source, unit: string, group: string, numbered: boolean): string {
  const u = source.dialect.text(ident(unit));
  const g = source.dialect.text(ident(group));
  const rec = numbered ? '__rec AS r, ' : '';
  const from = numbered ? source.numbered : source.view;
  return `SELECT ${rec}hash(${u}) AS hu, hash(${g}) AS hg, ${u} AS u, ${g} AS g FROM ${from} WHERE ${ident(unit)} IS NOT NULL`;
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
 * One join of this delivery's unit IDs with the previous delivery's (exportUnits), aggregated as
 * it streams: units in both whose group differs, units only in the previous delivery and units
 * only in this one, each with its count and the first examples (in record order; those that left
 * by ID). DuckDB only (it reads the Parquet file).
 */
export async function unitMoves(source: Source, unit: string, group: string, previousFile: string): Promise<UnitMoveRows> {
  type Example = { u: string; g: string | null; r?: bigint | number };
  type Row = { moved: bigint; left: bigint; joined: bigint; me: Example[] | null; le: Example[] | null; je: Example[] | null };
  const moved = 'p.hu IS NOT NULL AND c.hu IS NOT NULL';
  const first = (side: 'p' | 'c', where: string, order: string) =>
    `min_by({'u': ${side}.u, 'g': ${side}.g${side === 'c' ? ", 'r': c.r" : ''}}, ${order}, ${EXAMPLES}) FILTER (WHERE ${where})`;
  const [row] = await source.session((db) =>
    db.all<Row>(
      `SELECT count(*) FILTER (WHERE ${moved}) AS moved, count(*) FILTER (WHERE c.hu IS NULL) AS "left", ` +
        'count(*) FILTER (WHERE p.hu IS NULL) AS joined, ' +
        `${first('c', moved, 'c.r')} AS me, ${first('p', 'c.hu IS NULL', "{'u': p.u, 'g': p.g}")} AS le, ` +
        `${first('c', 'p.hu IS NULL', 'c.r')} AS je ` +
        `FROM read_parquet(${literal(previousFile)}) AS p FULL OUTER JOIN (${unitsQuery(source, unit, group, true)}) AS c ` +
        'ON p.hu = c.hu WHERE p.hu IS NULL OR c.hu IS NULL OR p.hg <> c.hg',
    ),
  );
  const ids = (rows: Example[]) => rows.map((x) => String(x.u));
  const groups = (rows: Example[]) => [...new Set(rows.flatMap((x) => (x.g === null ? [] : [String(x.g)])))];
  const recs = (rows: Example[]) => rows.map((x) => Number(x.r));
  const [me, le, je] = [row.me ?? [], row.le ?? [], row.je ?? []];
  return {
    moved: { count: Number(row.moved), units: ids(me), rows: recs(me), groups: groups(me) },
    left: { count: Number(row.left), units: ids(le), groups: groups(le) },
    joined: { count: Number(row.joined), units: ids(je), rows: recs(je), groups: groups(je) },
  };
}
