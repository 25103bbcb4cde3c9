import { mostlyNumbers } from '../../profile/reads-as-numbers.js';
import type { ValueType } from '../../roles/types.js';
import { isNumberKind } from '../../roles/types.js';
import { ident } from '../sql.js';
import type { Source } from '../types.js';
import { modalValueSql } from './modal-value.js';

/**
 * The records behind one finding, as a bounded query over the numbered delivery `d`: what a
 * rule's `rows` part returns for the problem-rows file. Built here, so that no SQL is written
 * in the rules' room; run by the problem-rows stage (counted, then read up to its bound).
 */
export interface RecordQuery {
  /** common table expressions, or '' */
  with: string;
  /** `FROM nr_numbered d … WHERE …` */
  from: string;
  /** extra columns after rec, grp, unit (`value` and `expected` of deviating records) */
  extra: string;
}

/** One record a RecordQuery found. */
export interface FoundRecord {
  rec: bigint | number | string;
  grp: string | null;
  unit: string | null;
  /** deviating records, and listed ones asked with a column: the value the record holds */
  value?: unknown;
  /** deviating records: the value most records of its group hold */
  expected?: unknown;
}

/** The record queries a rule's `rows` part may ask for, over one opened delivery. */
export interface RecordQueries {
  /** whether the delivery has this column */
  has(column: string): boolean;
  /** records whose group ID is missing */
  missingGroup(): RecordQuery;
  /** records whose `column` is missing */
  missing(column: string): RecordQuery;
  /** the record of every group that has only one */
  singletons(): RecordQuery;
  /**
   * Records of a column that disagree with their group's most common value (ties: the smaller
   * value), in every group where the column is not constant: beyond `tolerance` when compared as
   * numbers, any other value when `tolerance` is null (compared as written).
   */
  deviating(column: string, tolerance: number | null): RecordQuery;
  /** the records with these numbers; with a column, its value in each (as `value`) */
  listed(rows: readonly number[], column?: string): RecordQuery;
  /**
   * the records with these numbers, each with its value of `column` (as `value`) and its group's
   * most common value of it, compared as written (as `expected`; null when the group has none)
   */
  listedWithGroupValue(rows: readonly number[], column: string): RecordQuery;
  /**
   * Whether a column reads as numbers as the profile reads it: its declared type, else read as
   * numbers, else when at least 95% of its values are numbers (one count over the delivery).
   */
  readsAsNumber(column: string, declared: ValueType | undefined): Promise<boolean>;
}

export function recordQueries(source: Source, group: string): RecordQueries {
  const g = ident(group);
  const { view, numbered, dialect: d } = source;
  const numeric = (column: string) => (e: string) => (source.storage.get(column) === 'double' ? e : d.numeric(e));
  return {
    has: (column) => source.header.includes(column),
    missingGroup: () => ({ with: '', from: `FROM ${numbered} d WHERE d.${g} IS NULL`, extra: '' }),
    missing: (column) => ({ with: '', from: `FROM ${numbered} d WHERE d.${ident(column)} IS NULL`, extra: '' }),
    singletons: () => ({
      with: `WITH s AS (SELECT ${g} AS g FROM ${view} WHERE ${g} IS NOT NULL GROUP BY 1 HAVING count(*) = 1)`,
      from: `FROM ${numbered} d JOIN s ON d.${g} = s.g`,
      extra: '',
    }),
    deviating(column, tolerance) {
      const c = ident(column);
      const read = (e: string) => (tolerance === null ? e : numeric(column)(e));
      const v = read(c);
      const varies = tolerance === null ? `min(${v}) <> max(${v})` : `max(${v}) - min(${v}) > ${Number(tolerance)}`;
      const m = modalValueSql(view, group, column, tolerance, `${g} IN (SELECT g FROM bad)`, d, numeric(column));
      return {
        with: `WITH bad AS (SELECT ${g} AS g FROM ${view} WHERE ${g} IS NOT NULL GROUP BY 1 HAVING ${varies}), ${m.cte}`,
        from: `FROM ${numbered} d JOIN m ON d.${g} = m.g WHERE d.${c} IS NOT NULL AND ${m.differs('d')}`,
        extra: `, d.${c} AS value, m.v AS expected`,
      };
    },
    listed(rows, column) {
      const list = rows.filter((r) => Number.isSafeInteger(r)).map(String);
      const extra = column === undefined ? '' : `, d.${ident(column)} AS value`;
      return { with: '', from: `FROM ${numbered} d WHERE d.__rec IN (${list.length ? list.join(', ') : 'NULL'})`, extra };
    },
    listedWithGroupValue(rows, column) {
      const list = rows.filter((r) => Number.isSafeInteger(r)).map(String);
      const recs = `(${list.length ? list.join(', ') : 'NULL'})`;
      const m = modalValueSql(view, group, column, null, `${g} IN (SELECT ${g} FROM ${numbered} WHERE __rec IN ${recs})`, d);
      return {
        with: `WITH ${m.cte}`,
        from: `FROM ${numbered} d LEFT JOIN m ON d.${g} = m.g WHERE d.__rec IN ${recs}`,
        extra: `, d.${ident(column)} AS value, m.v AS expected`,
      };
    },
    async readsAsNumber(column, declared) {
      if (declared === 'categorical') return false;
      if (isNumberKind(declared) || declared === 'binary' || source.storage.get(column) === 'double') return true;
      // the profile's own test (a level-2 variable is a declared variable)
      const c = ident(column);
      const [{ nn, num }] = await source.all<{ nn: unknown; num: unknown }>(
        `SELECT count(${c}) AS nn, count(${d.numeric(c)}) AS num FROM ${view}`,
      );
      return mostlyNumbers(Number(num), Number(nn), true);
    },
  };
}

/** The rows of a record query: record number, group and unit ID as text, at most `limit`, in record order. */
export function selectRecordsSql(source: Source, q: RecordQuery, group: string, unit: string | undefined, limit: number): string {
  const d = source.dialect;
  const u = unit ? d.text(`d.${ident(unit)}`) : 'NULL';
  const grp = d.text(`d.${ident(group)}`);
  return `${q.with} SELECT d.__rec AS rec, ${grp} AS grp, ${u} AS unit${q.extra} ${q.from} ORDER BY d.__rec LIMIT ${limit}`;
}

/** How many rows a record query has in all. */
export function countRecordsSql(q: RecordQuery): string {
  return `${q.with} SELECT count(*) AS k ${q.from}`;
}
