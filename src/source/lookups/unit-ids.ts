import { ident, literal } from '../sql.js';
import type { Session, Source } from '../types.js';
import { normalizedIdQuery } from './normalize-id.js';
import type { UnitIdExample, UnitIdSummary } from './types.js';
import { EXAMPLE_LIMIT } from './types.js';

/**
 * Stage 1 scans the unit column once, grouped by a hash of the normalised ID, and keeps only the hashes
 * seen on more than one record (on a clean delivery: none). Stage 2, only when stage 1 kept
 * keys, re-reads the records of those keys to split them by spelling, group and exact copies.
 */
export async function unitIdSummary(source: Source, db: Session, group: string, unit: string): Promise<UnitIdSummary> {
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
      `CREATE TEMP TABLE nr_unit_keys AS SELECT ${d.keyHash('kd', 'ks')} AS h, count(*) AS n ` +
        `FROM (${normalizedIdQuery(source.view, '1 AS one', u, d)}) AS keyed GROUP BY 1 HAVING count(*) > 1`,
    );
    const [{ keys }] = await db.all<{ keys: bigint }>('SELECT count(*) AS keys FROM nr_unit_keys');
    if (Number(keys) === 0) return empty;
    // per spelling and group: records, distinct contents (every column but the record number), first records
    const content = d.rowHash(source.header.map(ident));
    await db.run(
      'CREATE TEMP TABLE nr_unit_cells AS SELECT r.kd, r.ks, r.u, r.g, count(*) AS n, count(DISTINCT r.h) AS dh, ' +
        `${d.firstValues('r.__rec', 'r.__rec', EXAMPLE_LIMIT)} AS recs ` +
        `FROM (${normalizedIdQuery(source.numbered, `__rec, ${u} AS u, ${g} AS g, ${content} AS h`, u, d)}) AS r ` +
        `JOIN nr_unit_keys k ON ${d.keyHash('r.kd', 'r.ks')} = k.h GROUP BY r.kd, r.ks, r.u, r.g`,
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
          groups: own
            .filter((c) => c.g !== null)
            .map((c) => String(c.g))
            .slice(0, 10),
          groupCount: Number(r.groups),
          rows: own
            .flatMap((c) => c.recs.map(Number))
            .sort((a, b) => a - b)
            .slice(0, EXAMPLE_LIMIT),
        };
      });
    };
    const [t] = await db.all<Record<string, bigint | number | string>>(
      'SELECT count(*) FILTER (WHERE distinct_rows > 1) AS conflicting, coalesce(sum(n) FILTER (WHERE distinct_rows > 1), 0) AS ' +
        'conflicting_records, ' +
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
