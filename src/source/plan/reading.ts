import type { Roles } from '../../roles/types.js';
import type { Dialect } from '../dialect.js';
import type { Storage } from '../sql.js';
import { ident, literal } from '../sql.js';
import type { BinaryWords } from '../types.js';
import { wordsAsDigits } from './binary-words.js';
import { numericTokens } from './sample-hints.js';

/**
 * The reading plan of a typed relation (Parquet, JSON, a staged table, a PostgreSQL table or
 * query), the same in every engine: how each column is read (text, or double), and the select
 * list that reads it so, with missing tokens as NULL. A CSV is read by a reader that does this
 * itself (typed columns, nullstr).
 */
export interface SourceColumn {
  name: string;
  /** the relation holds numbers in it */
  number: boolean;
  /** the relation holds text in it already (no cast needed) */
  text: boolean;
}

/** Numbers as double (IDs and categorical columns always text), the rest text. */
export function readingStorage(columns: readonly SourceColumn[], roles: Roles): Map<string, Storage> {
  const ids = new Set([roles.group, roles.unit, roles.parent]);
  const storage = new Map<string, Storage>();
  for (const { name, number } of columns) {
    storage.set(name, !ids.has(name) && roles.types[name] !== 'categorical' && number ? 'double' : 'text');
  }
  return storage;
}

/**
 * The select list: each column as text or double per `storage`, missing tokens as NULL (text
 * compared as written, numbers as numbers: "-999" matches -999.0). `blankGroup`: the group
 * column read as text with blank-looking IDs as NULL, for engines that cannot replace it in the
 * view afterwards. `words`: columns whose two words are read as "1" and "0" (wordsAsDigits).
 */
export function readingList(
  columns: readonly SourceColumn[],
  storage: Map<string, Storage>,
  missing: readonly string[],
  d: Dialect,
  blankGroup?: string,
  words: ReadonlyMap<string, BinaryWords> = new Map(),
): string {
  const tokens = missing.map(literal).join(', ');
  const nums = numericTokens(missing);
  return columns
    .map(({ name, number, text }) => {
      const c = ident(name);
      let expr: string;
      if (name === blankGroup) {
        const t = d.text(c);
        expr = `CASE WHEN trim(${t}) IN (${tokens}) THEN NULL ELSE ${t} END`;
      } else if (number) {
        const value = storage.get(name) === 'double' ? d.double(c) : d.text(c);
        expr = nums.length ? `CASE WHEN ${c} IN (${nums.join(', ')}) THEN NULL ELSE ${value} END` : value;
      } else {
        const t = text ? c : d.text(c);
        const nulled = tokens ? `CASE WHEN ${t} IN (${tokens}) THEN NULL ELSE ${t} END` : t;
        const w = words.get(name);
        expr = w ? wordsAsDigits(nulled, w) : storage.get(name) === 'double' ? d.numeric(nulled) : nulled;
      }
      return `${expr} AS ${c}`;
    })
    .join(', ');
}
