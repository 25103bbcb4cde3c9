import type { Session, Source } from '../source/open.js';
import type { Dialect } from '../source/dialect.js';
import { modalValueSql } from '../source/modal-value.js';
import { ident, literal } from '../source/sql.js';

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
  /** record numbers in `groups` where `column` is missing */
  rowsMissingIn(column: string, groups: readonly string[], limit?: number): Promise<number[]>;
  /**
   * Repeated, mobile and variant unit IDs: one aggregate over the unit column grouped by (a
   * hash of) the normalised ID (see normalizeId), then, only when some hash occurs more than
   * once, a second pass over those IDs alone. Memoised: the rules that need it share one result.
   */
  unitIds(unit: string): Promise<UnitIdSummary>;
  /** non-numeric tokens of a text column read as numbers: most frequent first, with their first records */
  nonNumericTokens(column: string, limit?: number): Promise<{ token: string; count: number; rows: number[] }[]>;
  /** how often each of `values` occurs in a numeric column, and the range of its other values */
  valueCounts(column: string, values: readonly number[]): Promise<ValueCounts>;
  /** record numbers where a numeric column equals `value` */
  rowsWithValue(column: string, value: number, limit?: number): Promise<number[]>;
  /** per (group, parent) pair in `groups`: records and, per column, whether it is constant and its value */
  parentSubsets(parent: string, groups: readonly string[], columns: readonly string[]): Promise<ParentSubset[]>;
}

/** A unit ID that needs a look: repeated, in several groups, or one of several spellings. */
export interface UnitIdExample {
  /** the ID as written */
  id: string;
  /** its normalised form (see normalizeId) */
  key: string;
  /** records carrying it */
  count: number;
  /** records that are exact copies of another record with this ID */
  copies: number;
  /** the groups it occurs in (at most 10) */
  groups: string[];
  /** group count (all of them) */
  groupCount: number;
  /** its first record numbers */
  rows: number[];
}

export interface UnitIdSummary {
  /** unit IDs (as written) on more than one record whose records differ in some column */
  conflicting: { ids: number; records: number; examples: UnitIdExample[] };
  /** unit IDs (as written) with records that are exact copies of each other; `copies` = records beyond the first of each content */
  copied: { ids: number; copies: number; examples: UnitIdExample[] };
  /** unit IDs (as written) that occur in more than one group, and their records */
  mobile: { ids: number; records: number; examples: UnitIdExample[] };
  /** normalised IDs written in more than one way: each set lists the spellings */
  variants: { sets: number; examples: { key: string; ids: UnitIdExample[] }[] };
}

export interface ValueCounts {
  /** count per value asked about (as numbers, in the order asked) */
  counts: number[];
  /** non-missing numeric values that are none of them */
  others: number;
  otherMin: number | null;
  otherMax: number | null;
}

export interface ParentSubset {
  group: string;
  parent: string;
  count: number;
  /** per column asked about: the value when the subset agrees on one, else null */
  constant: (string | null)[];
}

/**
 * The key two IDs share when they are "the same ID written differently": surrounding spaces
 * removed; an ID that reads as a number of at most 15 characters becomes that number ("12",
 * "12.0", "012" → 12); otherwise case-folded with leading zeros stripped ("W-014 " → "w-014",
 * "007a" → "7a"). The SQL in unitIds applies the same rule (normalizedIdQuery).
 *
 * @param raw the ID as written
 * @returns its normalised key
 */
export function normalizeId(raw: string): string {
  const t = raw.replace(/^ +| +$/g, '');
  if (t.length <= 15 && NUMBER.test(t)) return `#${Number(t)}`;
  return t.toLowerCase().replace(/^0+/, '');
}
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/**
 * The SQL form of normalizeId: the records of `from` with a non-missing ID `expr`, their
 * `columns`, and the key as two columns: `kd`, the number an ID of at most 15 characters reads
 * as (the dialect's numeric reading: in DuckDB a TRY_CAST, no regular expression per record,
 * since this runs over every unit ID), else NULL; `ks`, the case-folded ID without leading zeros
 * when it is not a number. Keying on both avoids formatting numbers as text. Both numeric
 * readings skip surrounding spaces themselves, so the ID is trimmed only where the numeric
 * reading cannot tell (an ID over 15 characters with spaces around it) and for `ks`: on 10
 * million IDs, 3.2-3.3 s instead of 3.5-3.8 s with every ID trimmed first.
 */
export function normalizedIdQuery(from: string, columns: string, expr: string, d: Dialect): string {
  const ids = `SELECT ${columns}, ${expr} AS x FROM ${from} WHERE ${expr} IS NOT NULL`;
  const read = `SELECT *, CASE WHEN length(x) <= 15 OR length(trim(x)) <= 15 THEN ${d.numeric('x')} END AS kd FROM (${ids}) AS ids`;
  return `SELECT *, CASE WHEN kd IS NULL THEN ltrim(lower(trim(x)), '0') END AS ks FROM (${read}) AS read`;
}

export function createLookup(source: Source, group: string): Lookup {
  const g = ident(group);
  const inList = (ids: readonly string[]) => `(${ids.map(literal).join(', ')})`;
  const unitCache = new Map<string, Promise<UnitIdSummary>>();
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
      const rows = await source.all<{ token: string; k: bigint; recs: (bigint | number)[] }>(
        `SELECT ${d.text(c)} AS token, count(*) AS k, ${d.firstValues('__rec', '__rec', EXAMPLE_LIMIT)} AS recs FROM ${source.numbered} AS d ` +
          `WHERE ${c} IS NOT NULL AND ${d.numeric(c)} IS NULL GROUP BY ${c} ORDER BY 2 DESC, 1 LIMIT ${limit}`,
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
    async parentSubsets(parent, groups, columns) {
      if (!groups.length) return [];
      const p = ident(parent);
      const d = source.dialect;
      const aggs = columns.map((column, i) => {
        // numbers stay numbers here (formatted in JS below), text compares in byte order
        if (source.storage.get(column) === 'double') return `CASE WHEN min(${ident(column)}) = max(${ident(column)}) THEN min(${ident(column)}) END AS c${i}`;
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
        constant: columns.map((_, i) => (r[`c${i}`] === null ? null : typeof r[`c${i}`] === 'number' ? String(Number(r[`c${i}`])) : String(r[`c${i}`]))),
      }));
    },
  };
}

/**
 * Stage 1 scans the unit column once, grouped by a hash of the normalised ID, and keeps only the hashes
 * seen on more than one record (on a clean delivery: none). Stage 2, only when stage 1 kept
 * keys, re-reads the records of those keys to split them by spelling, group and exact copies.
 */
async function unitIdSummary(source: Source, db: Session, group: string, unit: string): Promise<UnitIdSummary> {
  const d = source.dialect;
  const g = ident(group);
  const u = ident(unit);
  const empty: UnitIdSummary = {
    conflicting: { ids: 0, records: 0, examples: [] },
    copied: { ids: 0, copies: 0, examples: [] },
    mobile: { ids: 0, records: 0, examples: [] },
    variants: { sets: 0, examples: [] },
  };
  // the session's temp tables are dropped when it ends, so its first query is the scan itself:
  // it starts as soon as a rule asks, while the other rules compute
  const drop = async () => {
    for (const t of ['nr_unit_ids', 'nr_unit_cells', 'nr_unit_keys']) await db.run(`DROP TABLE IF EXISTS ${t}`);
  };
  try {
    // grouped on a 64-bit hash of the key, not the key itself: the hash table of ten million IDs
    // then fits the memory limit. Two keys that share a hash only come to stage 2, which splits
    // them by the key itself, so no ID is reported for a collision
    await db.run(
      `CREATE TEMP TABLE nr_unit_keys AS SELECT ${d.keyHash(['kd', 'ks'])} AS h, count(*) AS n ` +
        `FROM (${normalizedIdQuery(source.view, '1 AS one', u, d)}) AS keyed GROUP BY 1 HAVING count(*) > 1`,
      { grow: true },
    );
    const [{ keys }] = await db.all<{ keys: bigint }>('SELECT count(*) AS keys FROM nr_unit_keys');
    if (Number(keys) === 0) return empty;
    // per spelling and group: records, distinct contents (every column but the record number), first records
    const content = d.rowHash(source.header.map(ident));
    await db.run(
      `CREATE TEMP TABLE nr_unit_cells AS SELECT r.kd, r.ks, r.u, r.g, count(*) AS n, count(DISTINCT r.h) AS dh, ` +
        `${d.firstValues('r.__rec', 'r.__rec', EXAMPLE_LIMIT)} AS recs ` +
        `FROM (${normalizedIdQuery(source.numbered, `__rec, ${u} AS u, ${g} AS g, ${content} AS h`, u, d)}) AS r ` +
        `JOIN nr_unit_keys k ON ${d.keyHash(['r.kd', 'r.ks'])} = k.h GROUP BY r.kd, r.ks, r.u, r.g`,
    );
    // an exact copy shares the group too, so distinct contents add up over the groups
    await db.run(
      'CREATE TEMP TABLE nr_unit_ids AS SELECT kd, ks, u, sum(n) AS n, sum(dh) AS distinct_rows, count(g) AS groups ' +
        'FROM nr_unit_cells GROUP BY kd, ks, u',
    );
    type Cell = { kd: number | null; ks: string | null; u: string; g: string | null; n: bigint; dh: bigint; recs: (bigint | number)[] };
    type Id = { kd: number | null; ks: string | null; u: string; n: bigint; distinct_rows: bigint; groups: bigint };
    const keyOf = (r: { kd: number | null; ks: string | null }) => (r.kd === null ? String(r.ks) : `#${Number(r.kd)}`);
    const withCells = async (ids: Id[]): Promise<UnitIdExample[]> => {
      if (!ids.length) return [];
      const cells = await db.all<Cell>(
        `SELECT * FROM nr_unit_cells WHERE u IN ${`(${ids.map((r) => literal(r.u)).join(', ')})`} ORDER BY u, g`,
      );
      return ids.map((r) => {
        const own = cells.filter((c) => c.u === r.u && keyOf(c) === keyOf(r));
        return {
          id: r.u,
          key: keyOf(r),
          count: Number(r.n),
          copies: Number(r.n) - Number(r.distinct_rows),
          groups: own.filter((c) => c.g !== null).map((c) => String(c.g)).slice(0, 10),
          groupCount: Number(r.groups),
          rows: own.flatMap((c) => c.recs.map(Number)).sort((a, b) => a - b).slice(0, EXAMPLE_LIMIT),
        };
      });
    };
    const [t] = await db.all<Record<string, bigint | number | string>>(
      'SELECT count(*) FILTER (WHERE distinct_rows > 1) AS conflicting, coalesce(sum(n) FILTER (WHERE distinct_rows > 1), 0) AS conflicting_records, ' +
        'count(*) FILTER (WHERE n > distinct_rows) AS copied, coalesce(sum(n - distinct_rows), 0) AS copies, ' +
        'count(*) FILTER (WHERE groups > 1) AS mobile, coalesce(sum(n) FILTER (WHERE groups > 1), 0) AS mobile_records FROM nr_unit_ids',
    );
    const examples = async (where: string) =>
      withCells(await db.all<Id>(`SELECT * FROM nr_unit_ids WHERE ${where} ORDER BY ${d.ordered('u')} LIMIT ${EXAMPLE_LIMIT}`));
    const conflicting = await examples('distinct_rows > 1');
    const copied = await examples('n > distinct_rows');
    const mobile = await examples('groups > 1');
    const variantKeys = 'SELECT kd, ks FROM nr_unit_ids GROUP BY kd, ks HAVING count(*) > 1';
    const [{ sets }] = await db.all<{ sets: bigint }>(`SELECT count(*) AS sets FROM (${variantKeys}) AS v`);
    const variantIds = await withCells(
      await db.all<Id>(
        `SELECT i.* FROM nr_unit_ids i JOIN (${variantKeys} ORDER BY kd, ${d.ordered('ks')} LIMIT ${EXAMPLE_LIMIT}) v ` +
          `ON i.kd IS NOT DISTINCT FROM v.kd AND i.ks IS NOT DISTINCT FROM v.ks ORDER BY i.kd, ${d.ordered('i.ks')}, ${d.ordered('i.u')}`,
      ),
    );
    const byKey = new Map<string, UnitIdExample[]>();
    for (const x of variantIds) byKey.set(x.key, [...(byKey.get(x.key) ?? []), x]);
    return {
      conflicting: { ids: Number(t.conflicting), records: Number(t.conflicting_records), examples: conflicting },
      copied: { ids: Number(t.copied), copies: Number(t.copies), examples: copied },
      mobile: { ids: Number(t.mobile), records: Number(t.mobile_records), examples: mobile },
      variants: { sets: Number(sets), examples: [...byKey].map(([key, ids]) => ({ key, ids })) },
    };
  } finally {
    await drop();
  }
}
