import type { Roles } from '../../../roles/types.js';
import { duckdb } from '../../dialect.js';
import type { SourceColumn } from '../../plan/reading.js';
import { readingList, readingStorage } from '../../plan/reading.js';
import type { Storage } from '../../sql.js';
import { NUMERIC_TYPES } from './read-csv.js';

/** DuckDB's column types as the reading plan sees them. */
function sourceColumns(columns: readonly { name: string; type: string }[]): SourceColumn[] {
  return columns.map(({ name, type }) => ({ name, number: NUMERIC_TYPES.test(type), text: type === 'VARCHAR' }));
}

/** The select list of a typed relation (Parquet, JSON, a staged table): see readingList. */
export function typedSelect(
  columns: readonly { name: string; type: string }[],
  storage: Map<string, Storage>,
  missing: readonly string[],
): string {
  return readingList(sourceColumns(columns), storage, missing, duckdb);
}

/** Storage of a typed relation's columns: see readingStorage. */
export function typedStorage(columns: readonly { name: string; type: string }[], roles: Roles): Map<string, Storage> {
  return readingStorage(sourceColumns(columns), roles);
}
