import { finiteDouble, ident } from '../sql.js';
import type { Source } from '../types.js';
import { EXAMPLE_LIMIT } from './types.js';

/** At most this many occasions are described one by one (beyond, timing is person-specific anyway). */
export const MAX_OCCASIONS = 50;

/** One occasion (a distinct time value) of the delivery, in time order. */
export interface Occasion {
  time: number;
  /** persons observed at it */
  persons: number;
  /** completers observed at it, and Σy, Σy² of their outcome there (each person's mean at the occasion) */
  completers: number;
  completerSum: number;
  completerSquares: number;
  /** monotone dropouts whose last occasion it is, and Σy of their outcome there */
  dropouts: number;
  dropoutSum: number;
}

/**
 * The occasions of longitudinal data, the group being the person: how many distinct time values
 * each person has and whether the missing ones are a monotone dropout (observed up to an occasion,
 * never after), a gap (an occasion missed between observed ones), a late entry, or none (a completer).
 */
export interface OccasionSummary {
  /** distinct time values in the delivery (K) */
  occasions: number;
  persons: number;
  /** persons with one, two, three or more distinct time values */
  one: number;
  two: number;
  threeOrMore: number;
  /** the most distinct time values of one person */
  most: number;
  complete: number;
  dropout: number;
  gap: number;
  late: number;
  /** persons with a record at time 0 */
  atZero: number;
  /** the first persons (by ID) with a gap */
  gapIds: string[];
  /** the first MAX_OCCASIONS occasions in time order */
  byOccasion: Occasion[];
}

/**
 * One query over the delivery: the person × occasion table (records with a group ID, a time that
 * reads as a number and, when an outcome is given, an outcome value) reduced to one row whatever
 * the delivery's size; the occasion list is cut at MAX_OCCASIONS.
 *
 * @param source the opened delivery
 * @param group the group (person) column
 * @param time the time column
 * @param outcome the outcome whose dropouts' last values are compared (optional)
 */
export async function occasionSummary(source: Source, group: string, time: string, outcome?: string): Promise<OccasionSummary> {
  const d = source.dialect;
  const number = (column: string) => (source.storage.get(column) === 'double' ? finiteDouble(ident(column)) : d.numeric(ident(column)));
  const y = outcome === undefined ? 'CAST(NULL AS DOUBLE PRECISION)' : number(outcome);
  // each CTE is read by several of the scalar subqueries below: MATERIALIZED makes both engines
  // compute it once instead of once per reader (the records are read once, into the person × time table)
  const observed = outcome === undefined ? '' : ' AND y IS NOT NULL';
  const sql = `WITH pt0 AS MATERIALIZED (SELECT g, t, avg(y) AS y FROM (SELECT ${ident(group)} AS g, ${number(time)} AS t, ${y} AS y
      FROM ${source.view} AS v) AS s WHERE g IS NOT NULL AND t IS NOT NULL${observed} GROUP BY g, t),
    o AS MATERIALIZED (SELECT t, dense_rank() OVER (ORDER BY t) AS k FROM (SELECT DISTINCT t FROM pt0) AS u),
    kk AS MATERIALIZED (SELECT count(*) AS kk FROM o),
    pt AS MATERIALIZED (SELECT pt0.g, o.k, pt0.t, pt0.y FROM pt0 JOIN o ON pt0.t = o.t),
    p AS (SELECT g, count(*) AS c, min(k) AS lo, max(k) AS hi FROM pt GROUP BY g),
    cls AS MATERIALIZED (SELECT p.g, p.c, p.lo, p.hi, CASE WHEN p.c = kk.kk THEN 'complete' WHEN p.hi - p.lo + 1 > p.c THEN 'gap'
      WHEN p.lo = 1 THEN 'dropout' ELSE 'late' END AS pattern FROM p CROSS JOIN kk),
    occ AS MATERIALIZED (SELECT o.k, o.t, count(*) AS persons,
      count(*) FILTER (WHERE cls.pattern = 'complete') AS nc,
      sum(pt.y) FILTER (WHERE cls.pattern = 'complete') AS sc,
      sum(pt.y * pt.y) FILTER (WHERE cls.pattern = 'complete') AS qc,
      count(*) FILTER (WHERE cls.pattern = 'dropout' AND cls.hi = o.k) AS nd,
      sum(pt.y) FILTER (WHERE cls.pattern = 'dropout' AND cls.hi = o.k) AS sd
      FROM pt JOIN cls ON pt.g = cls.g JOIN o ON pt.k = o.k WHERE o.k <= ${MAX_OCCASIONS} GROUP BY o.k, o.t)
  SELECT (SELECT kk FROM kk) AS occasions,
    (SELECT count(*) FROM cls) AS persons,
    (SELECT count(*) FROM cls WHERE c = 1) AS one,
    (SELECT count(*) FROM cls WHERE c = 2) AS two,
    (SELECT count(*) FROM cls WHERE c >= 3) AS three,
    (SELECT max(c) FROM cls) AS most,
    (SELECT count(*) FROM cls WHERE pattern = 'complete') AS complete,
    (SELECT count(*) FROM cls WHERE pattern = 'dropout') AS dropout,
    (SELECT count(*) FROM cls WHERE pattern = 'gap') AS gap,
    (SELECT count(*) FROM cls WHERE pattern = 'late') AS late,
    (SELECT count(*) FROM pt WHERE t = 0) AS at_zero,
    (SELECT ${d.firstValues(d.text('g'), d.ordered(d.text('g')), EXAMPLE_LIMIT)} FROM cls WHERE pattern = 'gap') AS gap_ids,
    (SELECT ${d.firstValues('t', 'k', MAX_OCCASIONS)} FROM occ) AS occ_t,
    (SELECT ${d.firstValues('persons', 'k', MAX_OCCASIONS)} FROM occ) AS occ_persons,
    (SELECT ${d.firstValues('nc', 'k', MAX_OCCASIONS)} FROM occ) AS occ_nc,
    (SELECT ${d.firstValues('coalesce(sc, 0)', 'k', MAX_OCCASIONS)} FROM occ) AS occ_sc,
    (SELECT ${d.firstValues('coalesce(qc, 0)', 'k', MAX_OCCASIONS)} FROM occ) AS occ_qc,
    (SELECT ${d.firstValues('nd', 'k', MAX_OCCASIONS)} FROM occ) AS occ_nd,
    (SELECT ${d.firstValues('coalesce(sd, 0)', 'k', MAX_OCCASIONS)} FROM occ) AS occ_sd`;
  const [row] = await source.all<Record<string, unknown>>(sql);
  const num = (k: string) => Number(row[k] ?? 0);
  const list = (k: string) => ((row[k] as unknown[] | null) ?? []).map(Number);
  const times = list('occ_t');
  const [persons, nc, sc, qc, nd, sd] = ['occ_persons', 'occ_nc', 'occ_sc', 'occ_qc', 'occ_nd', 'occ_sd'].map(list);
  return {
    occasions: num('occasions'),
    persons: num('persons'),
    one: num('one'),
    two: num('two'),
    threeOrMore: num('three'),
    most: num('most'),
    complete: num('complete'),
    dropout: num('dropout'),
    gap: num('gap'),
    late: num('late'),
    atZero: num('at_zero'),
    gapIds: ((row.gap_ids as unknown[] | null) ?? []).map(String),
    byOccasion: times.map((time, i) => ({
      time,
      persons: persons[i],
      completers: nc[i],
      completerSum: sc[i],
      completerSquares: qc[i],
      dropouts: nd[i],
      dropoutSum: sd[i],
    })),
  };
}
