import type { Roles } from '../../roles/types.js';
import { literal } from '../sql.js';
import { typedSelect, typedStorage } from '../duck.js';
import type { DuckEngine, DuckLayout } from '../duck.js';

/**
 * Parquet and JSON/NDJSON are read by DuckDB's own readers (built into the binding): typed
 * columns, numbers as DOUBLE, everything else as text; text columns that hold only numbers are
 * settled by the profile (see Source.probe).
 */
export async function typedFileLayout(
  engine: DuckEngine,
  reader: string,
  display: string,
  format: 'parquet' | 'json' | 'ndjson',
  roles: Roles,
  missing: readonly string[],
): Promise<DuckLayout> {
  const columns = (await engine.all<{ column_name: string; column_type: string }>(`DESCRIBE SELECT * FROM ${reader}`)).map(
    (d) => ({ name: d.column_name, type: d.column_type }),
  );
  const storage = typedStorage(columns, roles);
  return {
    path: display,
    format,
    header: columns.map((c) => c.name),
    storage,
    numbering: 'window',
    typedReader: false,
    relation: (s) => `(SELECT ${typedSelect(columns, s, missing)} FROM ${reader})`,
    rejects: async () => [],
  };
}

export function parquetReader(file: string): string {
  return `read_parquet(${literal(file)})`;
}

/** JSON: an array of objects (or one object per line for NDJSON), gzip allowed. */
export function jsonReader(file: string, format: 'json' | 'ndjson', gzip: boolean): string {
  const f = format === 'ndjson' ? 'newline_delimited' : 'auto';
  return `read_json(${literal(file)}, format = '${f}', records = true${gzip ? ", compression = 'gzip'" : ''})`;
}
