import type { Roles } from '../../roles/types.js';
import { SAMPLE_ROWS } from '../plan/sample-hints.js';
import { ident, literal } from '../sql.js';

/** A number written with a decimal comma ("12,5", "-0,75"). */
export const DECIMAL_COMMA = String.raw`^\s*-?[0-9]+,[0-9]+\s*$`;
/** A whole number: it reads the same whichever the decimal separator. */
const WHOLE = String.raw`^\s*-?[0-9]+\s*$`;

/** Sniffed types that hold a decimal point: a file that has them does not write decimal commas. */
const POINT_TYPES = /^(FLOAT|DOUBLE|DECIMAL)/;

/**
 * The columns that the first records show written with decimal commas, when the evidence is
 * clear: the fields are not separated by commas, no column was sniffed with decimal points, and a
 * column's every value in the first records is a decimal-comma number or a whole number, at least
 * one of them with a comma. A "1,234" alone could be a thousands separator; beside whole numbers
 * in a file separated by semicolons or tabs it is the writing of a locale with decimal commas.
 *
 * @param sample a relation of the first records with every column read as text
 */
export async function decimalCommaColumns(
  all: <T>(sql: string) => Promise<T[]>,
  sample: string,
  delim: string,
  sniffed: readonly { column_name: string; column_type: string }[],
  roles: Roles,
): Promise<string[]> {
  if (delim === ',' || sniffed.some((c) => POINT_TYPES.test(c.column_type))) return [];
  const ids = new Set([roles.group, roles.unit, roles.parent]);
  const candidates = sniffed
    .filter((c) => c.column_type === 'VARCHAR' && !ids.has(c.column_name) && roles.types[c.column_name] !== 'categorical')
    .map((c) => c.column_name);
  if (!candidates.length) return [];
  const aggs = candidates.map((name, i) => {
    const c = ident(name);
    return (
      `count(${c}) AS n${i}, count(${c}) FILTER (WHERE regexp_matches(${c}, ${literal(DECIMAL_COMMA)})) AS k${i}, ` +
      `count(${c}) FILTER (WHERE regexp_matches(${c}, ${literal(WHOLE)})) AS w${i}`
    );
  });
  const [row] = await all<Record<string, unknown>>(
    `SELECT ${aggs.join(', ')} FROM (SELECT * FROM ${sample} LIMIT ${SAMPLE_ROWS}) AS nr_sample`,
  );
  return candidates.filter((_, i) => {
    const [n, k, w] = [row[`n${i}`], row[`k${i}`], row[`w${i}`]].map(Number);
    return k > 0 && k + w === n;
  });
}
