import type { Roles } from '../../../roles/types.js';
import { ident, literal } from '../../sql.js';
import type { Storage } from '../../sql.js';
import { numericTokens } from '../../plan/sample-hints.js';
import { NUMERIC_TYPES } from './read-csv.js';

/**
 * The select list of a typed relation (Parquet, JSON, a staged table): each column as text or
 * DOUBLE per `storage`, missing tokens as NULL (text compared as written, numbers as numbers).
 */
export function typedSelect(
  columns: readonly { name: string; type: string }[],
  storage: Map<string, Storage>,
  missing: readonly string[],
): string {
  const tokens = missing.map(literal).join(', ');
  const nums = numericTokens(missing);
  return columns
    .map(({ name, type }) => {
      const c = ident(name);
      let expr: string;
      if (NUMERIC_TYPES.test(type)) {
        const value = storage.get(name) === 'double' ? `CAST(${c} AS DOUBLE)` : `CAST(${c} AS VARCHAR)`;
        expr = nums.length ? `CASE WHEN ${c} IN (${nums.join(', ')}) THEN NULL ELSE ${value} END` : value;
      } else {
        const t = type === 'VARCHAR' ? c : `CAST(${c} AS VARCHAR)`;
        const nulled = tokens ? `CASE WHEN ${t} IN (${tokens}) THEN NULL ELSE ${t} END` : t;
        expr = storage.get(name) === 'double' ? `TRY_CAST(${nulled} AS DOUBLE)` : nulled;
      }
      return `${expr} AS ${c}`;
    })
    .join(', ');
}

/** Storage of a typed relation's columns: numbers as DOUBLE (IDs always text), the rest text. */
export function typedStorage(columns: readonly { name: string; type: string }[], roles: Roles): Map<string, Storage> {
  const ids = new Set([roles.group, roles.unit, roles.parent]);
  const storage = new Map<string, Storage>();
  for (const { name, type } of columns) {
    const declared = roles.types[name];
    storage.set(name, !ids.has(name) && declared !== 'categorical' && NUMERIC_TYPES.test(type) ? 'double' : 'text');
  }
  return storage;
}

