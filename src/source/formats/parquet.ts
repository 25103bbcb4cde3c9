import type { DuckLayout } from '../engines/duckdb/layout.js';
import { typedSelect, typedStorage } from '../engines/duckdb/typed-select.js';
import { literal } from '../sql.js';
import { refuseNulNames } from './column-names.js';
import type { ReadContext } from './registry.js';

/**
 * Parquet and JSON/NDJSON are read by DuckDB's own readers (built into the binding): typed
 * columns, numbers as DOUBLE, everything else as text; text columns that hold only numbers are
 * settled by the profile (see Source.probe).
 */
async function typedFileLayout(
  { engine, display, roles, missing }: ReadContext,
  reader: string,
  format: 'parquet' | 'json' | 'ndjson',
): Promise<DuckLayout> {
  const described = await engine.all<{ column_name: string; column_type: string }>(`DESCRIBE SELECT * FROM ${reader}`);
  refuseNulNames(
    described.map((d) => d.column_name),
    display,
  );
  const columns = described.map((d) => ({ name: d.column_name, type: d.column_type }));
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

export function parquetLayout(ctx: ReadContext): Promise<DuckLayout> {
  return typedFileLayout(ctx, `read_parquet(${literal(ctx.file)})`, 'parquet');
}

/** A JSON column DuckDB cannot give one scalar type: mixed values (`7` and `"7"`), objects, arrays. */
const NOT_SCALAR = /^(JSON|STRUCT|MAP|UNION)\b|\[\d*\]$/;

/**
 * JSON: an array of objects (or one object per line for NDJSON), gzip allowed. A column that
 * mixes numbers and strings (or holds objects or arrays) is typed JSON by the reader, whose text
 * keeps the quotes of a string (`"7"` beside `7`): such columns are read as VARCHAR, which gives
 * a string's content and a number's text, as a CSV of the same records holds them.
 */
export async function jsonLayout(ctx: ReadContext, format: 'json' | 'ndjson'): Promise<DuckLayout> {
  const f = format === 'ndjson' ? 'newline_delimited' : 'auto';
  const args = `${literal(ctx.file)}, format = '${f}', records = true${ctx.gzip ? ", compression = 'gzip'" : ''}`;
  const described = await ctx.engine.all<{ column_name: string; column_type: string }>(`DESCRIBE SELECT * FROM read_json(${args})`);
  refuseNulNames(
    described.map((d) => d.column_name),
    ctx.display,
  );
  if (!described.some((d) => NOT_SCALAR.test(d.column_type))) return typedFileLayout(ctx, `read_json(${args})`, format);
  const columns = described.map((d) => `${literal(d.column_name)}: ${literal(NOT_SCALAR.test(d.column_type) ? 'VARCHAR' : d.column_type)}`);
  return typedFileLayout(ctx, `read_json(${args}, columns = {${columns.join(', ')}})`, format);
}
